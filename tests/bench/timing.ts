// Small timing helpers shared by the bench sections.
import { performance } from 'node:perf_hooks';

export interface BenchContext {
  dir: string;
  /** Write a study file into the bench folder and return its path. */
  study(name: string, yaml: string): string;
}

export function time<T>(fn: () => T): { value: T; seconds: number } {
  const t0 = performance.now();
  const value = fn();
  return { value, seconds: (performance.now() - t0) / 1000 };
}

export async function timeAsync<T>(fn: () => Promise<T>): Promise<{ value: T; seconds: number }> {
  const t0 = performance.now();
  const value = await fn();
  return { value, seconds: (performance.now() - t0) / 1000 };
}

export function fmt(x: number, digits = 3): string {
  return Number(x.toPrecision(digits)).toLocaleString('en-US', { maximumSignificantDigits: digits });
}

