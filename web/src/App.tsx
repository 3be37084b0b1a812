// Routes and providers. Hash routing, so the built app works from any static server
// and mailed links (/#/invite/<token>) need no server-side fallback.
import { MutationCache, QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { createHashRouter, Navigate, RouterProvider } from 'react-router-dom';
import { ApiError } from './api/client.js';
import { sessionEnded, sessionQuery, signedInHint } from './api/session.js';
import { catalogueQuery } from './api/methods.js';
import { chartAxesQuery, chartQuery, resultsQuery, runQuery } from './api/runs.js';
import { defaultChartQuery } from './lib/chart-defaults.js';
import { defaultResultQuery } from './lib/result-query.js';
import { routeId } from './lib/route-id.js';
import { Layout } from './components/Layout.js';
import { RequireRole } from './components/RequireRole.js';
import { Loading } from './components/States.js';
import type { Permission } from './lib/roles.js';
import { SignInPage } from './routes/SignInPage.js';
import { StudiesPage } from './routes/StudiesPage.js';
import { NotFoundPage } from './routes/NotFoundPage.js';

// Every page but the two most opened ones (sign-in, studies) is its own chunk, loaded when
// it is opened: ECharts comes with the run, comparison and measurement pages, KaTeX with
// the catalogue, and the first page loads neither (the bundle test measures it).
const page = <K extends string>(load: () => Promise<Record<K, ComponentType>>, name: K) => async () => ({ Component: (await load())[name] });
// A 401 anywhere means the session ended (expired, signed out elsewhere, user disabled).
function onAuthError(error: unknown) {
  if (error instanceof ApiError && error.status === 401) sessionEnded(queryClient);
}

const queryClient = new QueryClient({
  queryCache: new QueryCache({ onError: onAuthError }),
  mutationCache: new MutationCache({ onError: onAuthError }),
  defaultOptions: {
    queries: {
      // Client errors (4xx) will not improve by asking again.
      retry: (count, error) => !(error instanceof ApiError && error.status < 500) && count < 2,
      refetchOnWindowFocus: false,
    },
  },
});

// The session is asked for at start, not after the first page's code has loaded (no
// request without the signed-in hint: sessionQuery returns null then).
void queryClient.prefetchQuery(sessionQuery);

/**
 * The run page's data, asked for while its code (and ECharts) loads: the run, the catalogue,
 * the chart's axis facts, the first results page and the default chart. Only with the
 * signed-in hint, so a signed-out visit asks for nothing. Returns at once: the page shows
 * its own loading state.
 */
function prefetchRun({ params }: { params: { id?: string } }) {
  const id = routeId(params.id);
  if (id === undefined || !signedInHint()) return null;
  // Asked at once, beside the session (the hint says this browser signed in; a session that
  // expired meanwhile costs these requests a 401 once, and the page then goes to sign-in):
  // the server answers them while the browser loads and runs the page's code.
  void queryClient.prefetchQuery(resultsQuery(id, defaultResultQuery));
  // The default chart, as RunChart asks for it, once the run (its regime) and the chart's axes are in.
  void Promise.all([queryClient.fetchQuery(runQuery(id)), queryClient.fetchQuery(chartAxesQuery(id))])
    .then(([run, axes]) => {
      const query = defaultChartQuery(run, axes);
      if (query) void queryClient.prefetchQuery(chartQuery(id, query));
    })
    .catch(() => undefined); // the page asks again and shows the error
  void queryClient.prefetchQuery(catalogueQuery);
  return null;
}

const router = createHashRouter([
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/invite/:token', lazy: page(() => import('./routes/InvitePage.js'), 'InvitePage') },
  { path: '/reset/:token', lazy: page(() => import('./routes/ResetPasswordPage.js'), 'ResetPasswordPage') },
  {
    element: <Layout />,
    hydrateFallbackElement: <Loading what="Opening the page" />,
    children: [
      { index: true, element: <Navigate to="/studies" replace /> },
      { path: '/studies', element: <StudiesPage /> },
      { path: '/studies/:id', lazy: page(() => import('./routes/StudyPage.js'), 'StudyPage') },
      { path: '/runs/:id', loader: prefetchRun, lazy: page(() => import('./routes/RunPage.js'), 'RunPage') },
      { path: '/runs/:id/points/:point', lazy: page(() => import('./routes/PointPage.js'), 'PointPage') },
      { path: '/compare', lazy: page(() => import('./routes/ComparePage.js'), 'ComparePage') },
      { path: '/catalogue', lazy: page(() => import('./routes/CataloguePage.js'), 'CataloguePage') },
      { path: '/measurements/:id', lazy: page(() => import('./routes/MeasurementPage.js'), 'MeasurementPage') },
      { path: '/team', lazy: async () => ({ Component: guarded('team', (await import('./routes/TeamPage.js')).TeamPage) }) },
      { path: '/tokens', lazy: async () => ({ Component: guarded('tokens', (await import('./routes/TokensPage.js')).TokensPage) }) },
      { path: '/outbox', lazy: async () => ({ Component: guarded('outbox', (await import('./routes/OutboxPage.js')).OutboxPage) }) },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);

function guarded(permission: Permission, Page: ComponentType): ComponentType {
  return function Guarded() {
    return (
      <RequireRole permission={permission}>
        <Page />
      </RequireRole>
    );
  };
}

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
