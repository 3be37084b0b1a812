// The dashboard's chart request as plain data (what the run page asks GET /api/runs/:id/chart
// for), shared with the server, which resolves the default chart itself (chart/default).

export interface RangeFilter {
  name: string;
  /** Text as typed; empty means open. */
  min: string;
  max: string;
}

export type FlaggedFilter = 'any' | 'yes' | 'no';

export interface ChartQuery {
  x: string;
  y: string;
  /** `method` or the name of a second input. */
  series: string;
  methods: string[];
  flagged?: FlaggedFilter;
  filters: RangeFilter[];
  max: number;
  measurement?: number;
}
