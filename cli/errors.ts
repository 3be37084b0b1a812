// Exit codes are a public contract (DESIGN.md section 6): 0 success, 1 bad input or
// usage, 2 the run failed (or was interrupted), 3 a check failed.
export const EXIT = { ok: 0, badInput: 1, runFailed: 2, checkFailed: 3 } as const;

/** An error that ends the command with a given exit code and a one-line message. */
export class ExitError extends Error {
  constructor(
    public readonly code: number,
    message: string,
  ) {
    super(message);
    this.name = 'ExitError';
  }
}
