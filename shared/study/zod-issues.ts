// zod issues turned into messages attached to document paths. Unions report the
// branch the value came closest to matching, so `{from: 1, to: 9, count: 1.5}` says
// what is wrong with count rather than "no alternative matched".
import type { z } from '#zod';
import type { Path } from './positions.js';

export interface PathMessage {
  path: Path;
  message: string;
  /** Point at the key rather than the value (unknown keys). */
  key?: boolean;
}

type Issue = z.core.$ZodIssue;

export function issueMessages(issues: readonly Issue[], data: unknown, base: Path = []): PathMessage[] {
  const out: PathMessage[] = [];
  for (const issue of issues) {
    const path = [...base, ...(issue.path as (string | number)[])];
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) out.push({ path: [...path, key], key: true, message: `unknown key '${key}'; ${issue.message}` });
      continue;
    }
    if (issue.code === 'invalid_union') {
      const branch = closestBranch(issue.errors);
      if (branch) {
        out.push(...issueMessages(branch, data, path));
        continue;
      }
      // No clear branch: a key that no object form knows is still worth pointing at.
      const unknown = keysUnknownToAll(issue.errors);
      if (unknown.length) {
        for (const key of unknown) out.push({ path: [...path, key], key: true, message: `unknown key '${key}'; ${issue.message}` });
        continue;
      }
    }
    if (path.length > 0 && valueAt(data, path) === undefined) {
      out.push({ path, message: `missing required key '${String(path[path.length - 1])}': ${issue.message}` });
      continue;
    }
    out.push({ path, message: issue.message });
  }
  return out;
}

// The branch whose value had the right shape at its root and fewest problems below;
// none when no branch stands out (the union's own message then says what is allowed).
function closestBranch(branches: readonly (readonly Issue[])[]): readonly Issue[] | undefined {
  const plausible = branches.filter((b) => !b.some((i) => i.path.length === 0 && i.code === 'invalid_type'));
  if (plausible.length === 0) return undefined;
  const fewest = Math.min(...plausible.map((b) => b.length));
  const best = plausible.filter((b) => b.length === fewest);
  const same = best.every((b) => JSON.stringify(b) === JSON.stringify(best[0]));
  return same ? best[0] : undefined;
}

// Keys reported as unrecognized by every branch that had the right shape at its root.
function keysUnknownToAll(branches: readonly (readonly Issue[])[]): string[] {
  const plausible = branches.filter((b) => !b.some((i) => i.path.length === 0 && i.code === 'invalid_type'));
  const unknownIn = (b: readonly Issue[]) =>
    new Set(b.flatMap((i) => (i.code === 'unrecognized_keys' && i.path.length === 0 ? i.keys : [])));
  if (plausible.length === 0) return [];
  const sets = plausible.map(unknownIn);
  return [...sets[0]].filter((k) => sets.every((set) => set.has(k)));
}

export function valueAt(data: unknown, path: Path): unknown {
  let v: unknown = data;
  for (const segment of path) {
    if (v === null || typeof v !== 'object') return undefined;
    v = (v as Record<string | number, unknown>)[segment];
  }
  return v;
}
