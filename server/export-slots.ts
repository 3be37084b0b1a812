// How many exports run at once. An export streams from the database in slices and yields
// to other requests between them, so it costs little memory and blocks nobody; but each
// one still takes a share of the CPU for as long as it runs (seconds for a large XLSX), so
// one user may run one at a time and the server a few, and more are answered 429.
import { HttpError } from './http-error.js';

export const MAX_EXPORTS = 3;
export const MAX_EXPORTS_PER_USER = 1;

export class ExportSlots {
  private readonly perUser = new Map<number, number>();
  private total = 0;

  constructor(
    private readonly max = MAX_EXPORTS,
    private readonly maxPerUser = MAX_EXPORTS_PER_USER,
  ) {}

  get active(): number {
    return this.total;
  }

  /** Takes a slot for the user or throws 429; call the returned function once the export has ended. */
  take(userId: number): () => void {
    const mine = this.perUser.get(userId) ?? 0;
    if (mine >= this.maxPerUser) throw new HttpError(429, `you have ${mine} export${mine === 1 ? '' : 's'} in progress; start the next one when it has finished`);
    if (this.total >= this.max) throw new HttpError(429, `${this.total} exports are in progress on the server; try again in a moment`);
    this.perUser.set(userId, mine + 1);
    this.total += 1;
    let released = false;
    return () => {
      if (released) return;
      released = true;
      this.total -= 1;
      const left = (this.perUser.get(userId) ?? 1) - 1;
      if (left > 0) this.perUser.set(userId, left);
      else this.perUser.delete(userId);
    };
  }
}
