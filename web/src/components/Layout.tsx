// The frame around every signed-in page: a light header with the mark, the sections and
// the user, the film stripe under it, the page, and the caution in the footer (DESIGN.md
// section 12). Below the md breakpoint the sections and the user fold into a menu.
import { useEffect, useState } from 'react';
import { NavLink, Navigate, Outlet, useLocation } from 'react-router-dom';
import { CAUTION } from '../../../shared/export/caution.js';
import { useSession, useSignOut } from '../api/session.js';
import { can } from '../lib/roles.js';
import { ErrorNote, Loading } from './States.js';
import { Wordmark } from './Wordmark.js';

function Section({ to, children }: { to: string; children: string }) {
  return (
    <NavLink
      to={to}
      className={({ isActive }) =>
        // The active section sits on the film, marked by an ember bar (a row in the folded menu).
        `block border-l-[3px] px-3 py-2 text-sm md:-mb-[3px] md:border-l-0 md:border-b-[3px] md:px-1 md:py-3 ${
          isActive ? 'border-ember-500 font-semibold text-ink-900' : 'border-transparent text-ink-700 hover:text-ink-900'
        }`
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
  const [menuOpen, setMenuOpen] = useState(false);
  useEffect(() => setMenuOpen(false), [location.pathname]);
  if (session.isPending) return <div className="p-8"><Loading what="Checking your session" /></div>;
  if (session.isError) return <div className="p-8"><ErrorNote error={session.error} title="The server did not answer" /></div>;
  if (!session.data) return <Navigate to="/sign-in" replace state={{ from: location.pathname + location.search }} />;
  const { user } = session.data;
  return (
    <div className="flex min-h-screen flex-col">
      <header className="bg-sheet">
        <div className="mx-auto flex max-w-[1800px] flex-wrap items-center gap-x-8 px-4 md:flex-nowrap md:px-6">
          <NavLink to="/studies" className="py-2.5" aria-label="Filmsweep, studies">
            <Wordmark tagline />
          </NavLink>
          <button
            type="button"
            className="btn btn-small ml-auto md:hidden"
            aria-expanded={menuOpen}
            aria-controls="main-menu"
            onClick={() => setMenuOpen((o) => !o)}
          >
            {menuOpen ? 'Close menu' : 'Menu'}
          </button>
          <div id="main-menu" className={`${menuOpen ? 'flex' : 'hidden'} w-full flex-col pb-2 md:flex md:w-auto md:flex-1 md:flex-row md:items-center md:pb-0`}>
            <nav aria-label="Main" className="flex flex-col md:flex-row md:gap-6">
              <Section to="/studies">Studies</Section>
              <Section to="/compare">Compare</Section>
              <Section to="/catalogue">Catalogue</Section>
              {can(user.role, 'team') && <Section to="/team">Team</Section>}
              {can(user.role, 'tokens') && <Section to="/tokens">API tokens</Section>}
              {can(user.role, 'outbox') && <Section to="/outbox">Outbox</Section>}
            </nav>
            <div className="mt-2 flex items-center gap-3 border-t border-line px-3 pt-2 text-sm md:ml-auto md:mt-0 md:border-0 md:p-0">
              <span title={user.email} data-testid="current-user" className="min-w-0 truncate">
                {user.name || user.email} <span className="text-ink-600">· {user.role}</span>
              </span>
              <button type="button" className="btn btn-small ml-auto md:ml-0" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
                Sign out
              </button>
            </div>
          </div>
        </div>
        <div className="film h-[3px]" aria-hidden />
      </header>
      <main className="mx-auto w-full min-w-0 max-w-[1800px] flex-1 px-4 py-5 md:px-6">
        <Outlet />
      </main>
      <footer className="border-t border-line">
        <p className="mx-auto max-w-[1800px] px-4 py-3 text-xs text-ink-600 md:px-6" data-testid="caution">
          {CAUTION}
        </p>
      </footer>
    </div>
  );
}
