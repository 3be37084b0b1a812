// Bounded memo of solved similarity problems, plus counters that make re-use observable.

/** Least-recently-used map: a long sweep over many distinct parameters keeps memory bounded. */
export class LruCache<K, V> {
  private readonly map = new Map<K, V>();

  constructor(private readonly capacity: number) {}

  get(key: K): V | undefined {
    const v = this.map.get(key);
    if (v !== undefined) {
      this.map.delete(key);
      this.map.set(key, v);
    }
    return v;
  }

  set(key: K, value: V): void {
    this.map.delete(key);
    this.map.set(key, value);
    if (this.map.size > this.capacity) this.map.delete(this.map.keys().next().value as K);
  }

  clear(): void {
    this.map.clear();
  }

  get size(): number {
    return this.map.size;
  }
}

/** How often each solver actually ran (cache misses) and how often a cached result was reused. */
export interface SimilaritySolveCounts {
  momentumSolves: number;
  momentumCacheHits: number;
  thermalSolves: number;
  recoverySolves: number;
  freeConvectionSolves: number;
  freeConvectionCacheHits: number;
}

export const solveCounts: SimilaritySolveCounts = {
  momentumSolves: 0,
  momentumCacheHits: 0,
  thermalSolves: 0,
  recoverySolves: 0,
  freeConvectionSolves: 0,
  freeConvectionCacheHits: 0,
};

const clearers: (() => void)[] = [];

/** Registers a cache so `clearSimilarityCaches` can empty it. */
export function registerCache(clear: () => void): void {
  clearers.push(clear);
}

/** Empties every similarity cache (for "solve from scratch" benchmarks); counters are kept. */
export function clearSimilarityCaches(): void {
  for (const c of clearers) c();
}

/** A snapshot of the counters. */
export function similaritySolveCounts(): SimilaritySolveCounts {
  return { ...solveCounts };
}

/** Sets every counter back to zero. */
export function resetSimilaritySolveCounts(): void {
  for (const k of Object.keys(solveCounts) as (keyof SimilaritySolveCounts)[]) solveCounts[k] = 0;
}
