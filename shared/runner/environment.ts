// Facts about where a run happens: git commit of the study file, host, live processes.
import { execFileSync } from 'node:child_process';
import { availableParallelism, hostname } from 'node:os';

/** Worker threads when none are asked for: one per CPU. */
export function defaultWorkers(): number {
  return availableParallelism();
}

/** `git rev-parse HEAD` in the study file's folder; null outside a repository or without git. */
export function gitCommit(folder: string): string | null {
  try {
    const out = execFileSync('git', ['rev-parse', 'HEAD'], {
      cwd: folder,
      stdio: ['ignore', 'pipe', 'ignore'],
      timeout: 5_000,
      encoding: 'utf8',
    }).trim();
    return /^[0-9a-f]{40,64}$/.test(out) ? out : null;
  } catch {
    return null;
  }
}

export function hostName(): string {
  return hostname();
}

/**
 * Whether process `pid` on `host` is alive. Only this host's processes can be checked;
 * for another host the answer is "maybe", reported as alive so nobody steals a live run.
 */
export function processAlive(host: string, pid: number): boolean {
  if (host !== hostName()) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM'; // exists, owned by someone else
  }
}
