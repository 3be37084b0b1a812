// The catalogue: GET /api/methods.
import { useQuery } from '@tanstack/react-query';
import { api } from './client.js';
import { CATALOGUE_URL } from './run-urls.js';
import type { MethodInfo } from './types.js';

export interface ConfigurationInfo {
  id: string;
  title: string;
  description: string;
  regime: string;
  lengthNote: string;
  propertyRule: string;
  dimensionalInputs: string[];
  /** What the dimensional inputs mean here (internal flow: fluid_temperature is the inlet). */
  conventions?: string;
  /** Dimensionless inputs the engine reads (emissivity, tubes_per_row). */
  engineInputs: string[];
  /** Outputs the dimensional engine adds (h, q, heat_rate, outlet_temperature, q_radiation …). */
  engineOutputs: string[];
}

export interface Catalogue {
  configurations: ConfigurationInfo[];
  methods: MethodInfo[];
}

export const catalogueQuery = { queryKey: ['methods'], queryFn: () => api<Catalogue>(CATALOGUE_URL), staleTime: Infinity };

export function useCatalogue() {
  return useQuery(catalogueQuery);
}
