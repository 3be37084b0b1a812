// Session ids, API tokens and e-mailed links: 32 random bytes, shown once, stored only as
// their sha256 so a copy of the database does not let anyone in.
import { createHash, randomBytes } from 'node:crypto';

export function newSecret(): string {
  return randomBytes(32).toString('base64url');
}

export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}
