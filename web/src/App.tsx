// Routes and providers. Hash routing, so the built app works from any static server
// and mailed links (/#/invite/<token>) need no server-side fallback.
import { MutationCache, QueryCache, QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createHashRouter, Navigate, RouterProvider } from 'react-router-dom';
import { ApiError } from './api/client.js';
import { sessionKey } from './api/session.js';
import { Layout } from './components/Layout.js';
import { RequireRole } from './components/RequireRole.js';
import { SignInPage } from './routes/SignInPage.js';
import { StudiesPage } from './routes/StudiesPage.js';
import { StudyPage } from './routes/StudyPage.js';
import { RunPage } from './routes/RunPage.js';
import { ComparePage } from './routes/ComparePage.js';
import { CataloguePage } from './routes/CataloguePage.js';
import { MeasurementPage } from './routes/MeasurementPage.js';
import { TeamPage } from './routes/TeamPage.js';
import { TokensPage } from './routes/TokensPage.js';
import { OutboxPage } from './routes/OutboxPage.js';
import { InvitePage } from './routes/InvitePage.js';
import { ResetPasswordPage } from './routes/ResetPasswordPage.js';
import { NotFoundPage } from './routes/NotFoundPage.js';

// A 401 anywhere means the session ended (expired, signed out elsewhere, user disabled).
function onAuthError(error: unknown) {
  if (error instanceof ApiError && error.status === 401) queryClient.setQueryData(sessionKey, null);
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

const router = createHashRouter([
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/invite/:token', element: <InvitePage /> },
  { path: '/reset/:token', element: <ResetPasswordPage /> },
  {
    element: <Layout />,
    children: [
      { index: true, element: <Navigate to="/studies" replace /> },
      { path: '/studies', element: <StudiesPage /> },
      { path: '/studies/:id', element: <StudyPage /> },
      { path: '/runs/:id', element: <RunPage /> },
      { path: '/compare', element: <ComparePage /> },
      { path: '/catalogue', element: <CataloguePage /> },
      { path: '/measurements/:id', element: <MeasurementPage /> },
      { path: '/team', element: <RequireRole permission="team"><TeamPage /></RequireRole> },
      { path: '/tokens', element: <RequireRole permission="tokens"><TokensPage /></RequireRole> },
      { path: '/outbox', element: <RequireRole permission="outbox"><OutboxPage /></RequireRole> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
