// Parsers of option values shared by several commands. Loaded at every start (commander
// calls them while parsing), so this module imports nothing but commander.
import { InvalidArgumentError } from 'commander';

export function parseWholeNumber(raw: string): number {
  const n = Number(raw);
  if (!/^\s*\d+\s*$/.test(raw) || !Number.isSafeInteger(n) || n < 1) throw new InvalidArgumentError('expected a whole number ≥ 1');
  return n;
}
