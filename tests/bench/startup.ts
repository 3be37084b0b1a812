// Start-up of the command line against a bare `node -e 0`, measured in the same run:
// each command's wall time from spawn to exit, interleaved with the bare start so both
// see the same machine load; medians of ROUNDS.
import { spawnSync } from 'node:child_process';
import { join, resolve } from 'node:path';
import { fmt, type BenchContext } from './timing.js';

const BIN = resolve('bin/filmsweep.js');
const ROUNDS = 15;
/** Goal (issue 14): each command within 5× a bare node start. */
const GOAL = 5;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

export function benchStartup(ctx: BenchContext) {
  const commands: [label: string, args: string[]][] = [
    ['node -e 0 (bare start)', ['-e', '0']],
    ['filmsweep --version', [BIN, '--version']],
    ['filmsweep --help', [BIN, '--help']],
    ['filmsweep methods', [BIN, 'methods']],
    ['filmsweep solve pipe (one point)', [BIN, 'solve', 'pipe', '--set', 'Re=1e5', '--set', 'Pr=0.7']],
  ];
  const env = { ...process.env, FILMSWEEP_DB: join(ctx.dir, 'startup.db') };
  const times = commands.map(() => [] as number[]);
  for (let r = 0; r < ROUNDS; r++) {
    commands.forEach(([label, args], i) => {
      const t0 = performance.now();
      const out = spawnSync(process.execPath, args, { stdio: 'ignore', env });
      times[i].push(performance.now() - t0);
      if (out.status !== 0) throw new Error(`${label} exited with ${out.status}`);
    });
  }
  const bare = median(times[0]);
  console.log(`start-up, median of ${ROUNDS} (interleaved):`);
  commands.forEach(([label], i) => {
    const ms = median(times[i]);
    const ratio = i === 0 ? '' : `  ${fmt(ms / bare)}× the bare start (goal ≤ ${GOAL}×)`;
    console.log(`  ${label.padEnd(34)} ${fmt(ms).padStart(5)} ms${ratio}`);
  });
}
