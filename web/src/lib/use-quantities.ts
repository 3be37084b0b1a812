// The display rule for one run's names (units from its configuration's methods, the
// user's temperature unit), shared by the run's table, filters and charts.
import { useMemo } from 'react';
import { useCatalogue } from '../api/methods.js';
import { useTemperatureUnit } from './use-temperature-unit.js';
import { makeQuantities, type Quantities } from './units.js';

/** `configuration` undefined: every catalogue method's specs (names keep one unit across the catalogue). */
export function useQuantities(configuration: string | undefined): Quantities {
  const catalogue = useCatalogue();
  const [temperature] = useTemperatureUnit();
  return useMemo(
    () => makeQuantities(catalogue.data?.methods.filter((m) => configuration === undefined || m.configuration === configuration) ?? [], temperature),
    [catalogue.data, configuration, temperature],
  );
}
