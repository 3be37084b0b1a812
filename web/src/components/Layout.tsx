// The frame around every signed-in page: header with navigation and the user, the
// page, and the caution in the footer (DESIGN.md section 12).
import { NavLink, Navigate, Outlet, useLocation } from 'react-router-dom';
import { CAUTION } from '../../../shared/export/caution.js';
import { useSession, useSignOut } from '../api/session.js';
import { can } from '../lib/roles.js';
import { ErrorNote, Loading } from './States.js';

function Tab({ to, children }: { to: string; children: string }) {
  return (
    <NavLink
      to={to}
      className={({ isActive }) =>
        `rounded-md px-2.5 py-1 text-sm ${isActive ? 'bg-ink-700 text-white' : 'text-ink-100 hover:bg-ink-800 hover:text-white'}`
      }
    >
      {children}
    </NavLink>
  );
}

export function Layout() {
  const session = useSession();
  const signOut = useSignOut();
  const location = useLocation();
  if (session.isPending) return <div className="p-8"><Loading what="Checking your session" /></div>;
  if (session.isError) return <div className="p-8"><ErrorNote error={session.error} title="The server did not answer" /></div>;
  if (!session.data) return <Navigate to="/sign-in" replace state={{ from: location.pathname + location.search }} />;
  const { user } = session.data;
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-ink-900 text-white">
        <div className="mx-auto flex max-w-[1800px] items-center gap-6 px-5 py-2.5">
          <NavLink to="/studies" className="flex items-baseline gap-2">
            <span className="text-lg font-semibold tracking-tight">Filmsweep</span>
            <span className="hidden text-xs text-ink-200 xl:inline">convection sweeps</span>
          </NavLink>
          <nav aria-label="Main" className="flex flex-wrap items-center gap-1">
            <Tab to="/studies">Studies</Tab>
            <Tab to="/compare">Compare</Tab>
            <Tab to="/catalogue">Catalogue</Tab>
            {can(user.role, 'team') && <Tab to="/team">Team</Tab>}
            {can(user.role, 'tokens') && <Tab to="/tokens">API tokens</Tab>}
            {can(user.role, 'outbox') && <Tab to="/outbox">Outbox</Tab>}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span title={user.email} data-testid="current-user">
              {user.name || user.email} <span className="rounded bg-ink-700 px-1.5 py-0.5 text-xs uppercase tracking-wide">{user.role}</span>
            </span>
            <button type="button" className="btn btn-small" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-[1800px] flex-1 px-5 py-5">
        <Outlet />
      </main>
      <footer className="border-t border-ink-100 bg-white">
        <p className="mx-auto max-w-[1800px] px-5 py-3 text-xs text-ink-600" data-testid="caution">
          {CAUTION}
        </p>
      </footer>
    </div>
  );
}
