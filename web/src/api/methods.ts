// The catalogue: GET /api/methods.
import { useQuery } from '@tanstack/react-query';
import { api } from './client.js';
import type { MethodInfo } from './types.js';

export interface ConfigurationInfo {
  id: string;
  title: string;
  description: string;
  regime: string;
  lengthNote: string;
  propertyRule: string;
  dimensionalInputs: string[];
}

export interface Catalogue {
  configurations: ConfigurationInfo[];
  methods: MethodInfo[];
}

export function useCatalogue() {
  return useQuery({
    queryKey: ['methods'],
    queryFn: () => api<Catalogue>('/api/methods'),
    staleTime: Infinity,
  });
}
