// Hides a page from roles the API would refuse anyway.
import type { ReactNode } from 'react';
import { useSession } from '../api/session.js';
import { can, type Permission } from '../lib/roles.js';
import { Empty } from './States.js';

export function RequireRole({ permission, children }: { permission: Permission; children: ReactNode }) {
  const session = useSession();
  if (!can(session.data?.user.role, permission)) {
    return <Empty>Your role ({session.data?.user.role ?? 'signed out'}) does not give access to this page.</Empty>;
  }
  return <>{children}</>;
}
