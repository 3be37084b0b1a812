// Runs the compiled CLI (`npm test` builds first) as a real child process.
import { spawnSync, type SpawnSyncOptions } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const cliPath = fileURLToPath(new URL('../../bin/filmsweep.js', import.meta.url));

export interface CliResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: string[], options: SpawnSyncOptions = {}): CliResult {
  const r = spawnSync(process.execPath, [cliPath, ...args], {
    encoding: 'utf8',
    cwd: repoRoot,
    timeout: 120_000,
    ...options,
    env: { ...process.env, NO_COLOR: '1', ...(options.env ?? {}) },
  });
  return { status: r.status, stdout: String(r.stdout), stderr: String(r.stderr) };
}
