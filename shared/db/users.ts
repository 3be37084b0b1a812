// Dashboard accounts: e-mail (lower-case, unique), name, role, bcrypt password hash.
// Accounts are disabled, never deleted, so the runs and audit entries that name them stay whole.
import { bcryptCompare, bcryptHash } from './password-hashing.js';
import type { Role } from './schema.js';
import type { Store } from './store.js';

export interface User {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  created_at: string;
}

/** Default bcrypt cost (2^11 rounds, about 0.1 s here); tests pass 4. */
export const DEFAULT_BCRYPT_COST = 11;
export const MIN_PASSWORD_LENGTH = 10;

/** An account with this e-mail already exists. */
export class DuplicateUserError extends Error {
  constructor(email: string) {
    super(`a user with e-mail ${email} already exists`);
    this.name = 'DuplicateUserError';
  }
}

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

type UserRow = { id: number; email: string; name: string; role: Role; disabled: number; created_at: string };
const toUser = (r: UserRow): User => ({ id: r.id, email: r.email, name: r.name, role: r.role, disabled: r.disabled !== 0, created_at: r.created_at });
const columns = ['id', 'email', 'name', 'role', 'disabled', 'created_at'] as const;

export function hashPassword(password: string, cost = DEFAULT_BCRYPT_COST): Promise<string> {
  return bcryptHash(password, cost);
}

export interface NewUser {
  email: string;
  name?: string;
  role: Role;
  password: string;
  /** bcrypt cost; default DEFAULT_BCRYPT_COST. */
  cost?: number;
}

export async function createUser(store: Store, spec: NewUser): Promise<User> {
  const email = normalizeEmail(spec.email);
  // Hash before touching the database: no transaction stays open across bcrypt's await.
  const hash = await hashPassword(spec.password, spec.cost);
  if (await findUserByEmail(store, email)) throw new DuplicateUserError(email);
  try {
    const row = await store.db
      .insertInto('users')
      .values({ email, name: spec.name?.trim() || email.split('@')[0], role: spec.role, password_hash: hash, created_at: new Date().toISOString() })
      .returning(columns)
      .executeTakeFirstOrThrow();
    return toUser(row);
  } catch (e) {
    if ((e as { code?: string }).code === 'SQLITE_CONSTRAINT_UNIQUE') throw new DuplicateUserError(email);
    throw e;
  }
}

export async function findUserByEmail(store: Store, email: string): Promise<User | undefined> {
  const row = await store.db.selectFrom('users').select(columns).where('email', '=', normalizeEmail(email)).executeTakeFirst();
  return row && toUser(row);
}

export async function getUser(store: Store, id: number): Promise<User | undefined> {
  const row = await store.db.selectFrom('users').select(columns).where('id', '=', id).executeTakeFirst();
  return row && toUser(row);
}

export async function listUsers(store: Store): Promise<User[]> {
  return (await store.db.selectFrom('users').select(columns).orderBy('id').execute()).map(toUser);
}

/** The user when the e-mail and password match an enabled account, else undefined. */
export async function verifyCredentials(store: Store, email: string, password: string): Promise<User | undefined> {
  const row = await store.db
    .selectFrom('users')
    .select([...columns, 'password_hash'])
    .where('email', '=', normalizeEmail(email))
    .executeTakeFirst();
  // Compare against a fixed hash when there is no such user, so both refusals take as long.
  const ok = await bcryptCompare(password, row?.password_hash ?? UNKNOWN_USER_HASH);
  if (!row || !ok || row.disabled) return undefined;
  return toUser(row);
}
// bcrypt of a random string, cost 11: never matches a real password.
const UNKNOWN_USER_HASH = '$2b$11$g08OQPGzN8FOO6h30lZhweN6F0x23GDl564.Ly0dNm2m21lWy7gl6';

export async function updateUser(store: Store, id: number, change: { role?: Role; disabled?: boolean; name?: string }): Promise<User | undefined> {
  const set: { role?: Role; disabled?: number; name?: string } = {};
  if (change.role !== undefined) set.role = change.role;
  if (change.disabled !== undefined) set.disabled = change.disabled ? 1 : 0;
  if (change.name !== undefined) set.name = change.name;
  if (Object.keys(set).length) await store.db.updateTable('users').set(set).where('id', '=', id).execute();
  return getUser(store, id);
}

export async function setPassword(store: Store, id: number, password: string, cost = DEFAULT_BCRYPT_COST): Promise<void> {
  const hash = await hashPassword(password, cost);
  await store.db.updateTable('users').set({ password_hash: hash }).where('id', '=', id).execute();
}
