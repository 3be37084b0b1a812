// `npm run bench`: throughput figures, reported as ratios measured in one run (the
// machine is shared and noisy, so absolute numbers mean little on their own).
// Not a test: it asserts nothing and CI does not run it. Sections can be picked:
//   npm run bench -- similarity correlations e2e sweep workers api queue design
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { benchSimilarity, benchSimilaritySweep } from './similarity.js';
import { benchCorrelations } from './correlations.js';
import { benchEndToEnd, benchWorkers } from './runner.js';
import { benchApi } from './api.js';
import { benchQueue } from './queue.js';
import { benchDesign } from './design.js';
import type { BenchContext } from './timing.js';

const sections: Record<string, (ctx: BenchContext) => Promise<void> | void> = {
  similarity: benchSimilarity,
  correlations: benchCorrelations,
  sweep: benchSimilaritySweep,
  e2e: benchEndToEnd,
  workers: benchWorkers,
  api: benchApi,
  queue: benchQueue,
  design: benchDesign,
};

async function main() {
  const wanted = process.argv.slice(2).filter((a) => !a.startsWith('-'));
  const names = wanted.length ? wanted : Object.keys(sections);
  for (const n of names) if (!sections[n]) throw new Error(`unknown bench section '${n}'; expected: ${Object.keys(sections).join(', ')}`);
  const dir = mkdtempSync(join(tmpdir(), 'filmsweep-bench-'));
  const ctx: BenchContext = {
    dir,
    study(name, yaml) {
      const path = join(dir, `${name}.yaml`);
      writeFileSync(path, yaml);
      return path;
    },
  };
  console.log(`filmsweep bench — node ${process.version}, ${new Date().toISOString()}`);
  console.log('reproduce one section with: npm run bench -- <section>\n');
  try {
    for (const n of names) {
      console.log(`## ${n}  (npm run bench -- ${n})`);
      await sections[n](ctx);
      console.log('');
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
