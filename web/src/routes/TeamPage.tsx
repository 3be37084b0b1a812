// The team (leads): members with their roles, disabling, invitations, and the audit log.
import { useMemo, useState, type FormEvent } from 'react';
import { createColumnHelper } from '@tanstack/react-table';
import { useAudit } from '../api/audit.js';
import { useCreateInvite, useInvites, type Invite } from '../api/invites.js';
import { useSession } from '../api/session.js';
import { ROLES, type Role } from '../api/types.js';
import { useUpdateUser, useUsers, type TeamMember } from '../api/users.js';
import { DataTable } from '../components/DataTable.js';
import { ErrorNote, Loading, Notice } from '../components/States.js';
import { formatTime } from '../lib/format.js';
import type { AuditEntry } from '../api/audit.js';

const uCol = createColumnHelper<TeamMember>();
const iCol = createColumnHelper<Invite>();
const aCol = createColumnHelper<AuditEntry>();

export function TeamPage() {
  const session = useSession();
  const me = session.data?.user.email;
  const users = useUsers();
  const update = useUpdateUser();
  const invites = useInvites();
  const invite = useCreateInvite();
  const audit = useAudit(true);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('viewer');

  const userColumns = useMemo(
    () => [
      uCol.accessor('name', { header: 'Name' }),
      uCol.accessor('email', { header: 'E-mail' }),
      uCol.accessor('role', {
        header: 'Role',
        cell: (c) => {
          const u = c.row.original;
          return (
            <>
              <label className="sr-only" htmlFor={`role-${u.id}`}>role of {u.email}</label>
              <select id={`role-${u.id}`} className="input w-auto py-0.5" value={u.role} disabled={u.email === me || update.isPending} onChange={(e) => update.mutate({ id: u.id, role: e.target.value as Role })}>
                {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
              </select>
            </>
          );
        },
      }),
      uCol.accessor('disabled', {
        header: 'Access',
        cell: (c) => {
          const u = c.row.original;
          return (
            <div className="flex items-center gap-2">
              <span className={u.disabled ? 'text-brick-700' : 'text-moss-700'}>{u.disabled ? 'disabled' : 'active'}</span>
              {u.email !== me && (
                <button type="button" className={`btn btn-small ${u.disabled ? '' : 'btn-danger'}`} disabled={update.isPending} onClick={() => update.mutate({ id: u.id, disabled: !u.disabled })}>
                  {u.disabled ? 'Enable' : 'Disable'}
                </button>
              )}
            </div>
          );
        },
      }),
      uCol.accessor('created_at', { header: 'Since', cell: (c) => formatTime(c.getValue()) }),
    ],
    [me, update.isPending],
  );
  const inviteColumns = useMemo(
    () => [
      iCol.accessor('email', { header: 'E-mail' }),
      iCol.accessor('role', { header: 'Role' }),
      iCol.accessor('expires_at', { header: 'Expires', cell: (c) => formatTime(c.getValue()) }),
      iCol.accessor((i) => (i.accepted_at ? `accepted ${formatTime(i.accepted_at)}` : new Date(i.expires_at) < new Date() ? 'expired' : 'open'), { id: 'state', header: 'State' }),
    ],
    [],
  );
  const auditColumns = useMemo(
    () => [
      aCol.accessor('at', { header: 'When', cell: (c) => formatTime(c.getValue()) }),
      aCol.accessor('user', { header: 'Who', cell: (c) => c.getValue() ?? '—' }),
      aCol.accessor('action', { header: 'Action', cell: (c) => <span className="font-mono text-xs">{c.getValue()}</span> }),
      aCol.accessor((e) => (typeof e.detail === 'string' ? e.detail : JSON.stringify(e.detail ?? '')), { id: 'detail', header: 'Detail', cell: (c) => <span className="block max-w-[48rem] truncate font-mono text-xs" title={c.getValue()}>{c.getValue()}</span> }),
    ],
    [],
  );

  const submit = (e: FormEvent) => {
    e.preventDefault();
    invite.mutate({ email, role }, { onSuccess: () => setEmail('') });
  };

  return (
    <div className="space-y-5">
      <h1 className="text-2xl font-semibold">Team</h1>
      <section className="card" aria-labelledby="members-heading">
        <h2 id="members-heading" className="card-title">Members</h2>
        {update.isError && <div className="mb-2"><ErrorNote error={update.error} title="The change was refused" /></div>}
        {users.isPending ? <Loading what="Loading the members" /> : users.isError ? <ErrorNote error={users.error} title="The members could not be listed" /> : <DataTable label="Team members" columns={userColumns} data={users.data.users} empty="No members yet." />}
      </section>
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[24rem_minmax(0,1fr)]">
        <section className="card" aria-labelledby="invite-heading">
          <h2 id="invite-heading" className="card-title">Invite someone</h2>
          <form onSubmit={submit} className="space-y-3" aria-label="Invite">
            <div>
              <label htmlFor="invite-email" className="field-label">E-mail</label>
              <input id="invite-email" type="email" required className="input" value={email} onChange={(e) => setEmail(e.target.value)} />
            </div>
            <div>
              <label htmlFor="invite-role" className="field-label">Role</label>
              <select id="invite-role" className="input" value={role} onChange={(e) => setRole(e.target.value as Role)}>
                {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
              </select>
            </div>
            {invite.isError && <ErrorNote error={invite.error} title="No invitation sent" />}
            {invite.isSuccess && <Notice>Invitation mailed to {invite.data.invite.email}.</Notice>}
            <button type="submit" className="btn btn-primary" disabled={invite.isPending}>Send invitation</button>
          </form>
        </section>
        <section className="card min-w-0" aria-labelledby="invites-heading">
          <h2 id="invites-heading" className="card-title">Invitations</h2>
          {invites.isPending ? <Loading what="Loading the invitations" /> : invites.isError ? <ErrorNote error={invites.error} title="The invitations could not be listed" /> : <DataTable label="Invitations" columns={inviteColumns} data={invites.data.invites} empty="No invitations sent." pageSize={10} />}
        </section>
      </div>
      <section className="card" aria-labelledby="audit-heading">
        <h2 id="audit-heading" className="card-title">Audit log</h2>
        {audit.isPending ? <Loading what="Loading the audit log" /> : audit.isError ? <ErrorNote error={audit.error} title="The audit log could not be loaded" /> : <DataTable label="Audit log" columns={auditColumns} data={audit.data.entries} pageSize={20} empty="Nothing recorded yet." />}
      </section>
    </div>
  );
}
