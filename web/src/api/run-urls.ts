// The run page's API addresses: one definition for the app's queries (runs.ts, methods.ts)
// and for the requests made before the app has loaded (early.ts), so both ask for the very
// same address and the app takes the early answer.
import { chartSearch, resultsSearch, type ChartQuery, type ResultQuery } from '../lib/result-query.js';

export const SESSION_URL = '/api/session';
export const CATALOGUE_URL = '/api/methods';
export const runUrl = (id: number) => `/api/runs/${id}`;
export const resultsUrl = (id: number, query: ResultQuery) => `/api/runs/${id}/results?${resultsSearch(query)}`;
export const chartUrl = (id: number, query: ChartQuery) => `/api/runs/${id}/chart?${chartSearch(query)}`;
export const chartAxesUrl = (id: number) => `/api/runs/${id}/chart/axes`;
