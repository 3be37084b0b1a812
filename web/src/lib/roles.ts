// What each role may do in the dashboard (the API enforces the same rules; the UI
// only hides what would be refused).
import type { Role } from '../api/types.js';

const rank: Record<Role, number> = { viewer: 0, researcher: 1, lead: 2 };

export type Permission = 'upload' | 'tokens' | 'team' | 'reference' | 'outbox' | 'audit';

const needs: Record<Permission, Role> = {
  upload: 'researcher',
  tokens: 'researcher',
  team: 'lead',
  reference: 'lead',
  outbox: 'lead',
  audit: 'lead',
};

export function can(role: Role | undefined, permission: Permission): boolean {
  return role !== undefined && rank[role] >= rank[needs[permission]];
}
