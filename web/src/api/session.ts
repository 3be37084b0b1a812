// The signed-in user and the CSRF token: GET/POST/DELETE /api/session, password reset, invites.
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api, ApiError, setCsrfToken } from './client.js';
import type { User } from './types.js';

export interface SessionResponse {
  user: User;
  csrfToken: string;
}

export const sessionKey = ['session'] as const;

// Whether this browser holds a session, remembered beside the (HttpOnly, unreadable)
// cookie: a browser that never signed in, or signed out, does not ask the server, so the
// sign-in page loads without a 401 in the console. A session that expired while the hint
// says "signed in" costs one 401, after which the hint is gone. A cookie without the hint
// (a browser that signed in before the hint existed) leads to the sign-in page once.
const HINT = 'filmsweep.signed-in';

/** Whether this browser says it holds a session (pages may ask for their data before the session answers). */
export function signedInHint(): boolean {
  return hinted();
}

function hinted(): boolean {
  try {
    return localStorage.getItem(HINT) === '1';
  } catch {
    return true; // storage blocked: ask the server
  }
}

function remember(signedIn: boolean) {
  try {
    if (signedIn) localStorage.setItem(HINT, '1');
    else localStorage.removeItem(HINT);
  } catch {
    // storage blocked: the probe runs every time instead
  }
}

/** The session ended (signed out here, or a 401 elsewhere): forget it. */
export function sessionEnded(client: QueryClient) {
  remember(false);
  setCsrfToken(null);
  client.setQueryData(sessionKey, null);
}

/** The session, or null when signed out (401 is an answer here, not an error). App.tsx starts it before the first page's code has loaded. */
export const sessionQuery = {
  queryKey: sessionKey,
  queryFn: async (): Promise<SessionResponse | null> => {
    if (!hinted()) return null;
    try {
      const s = await api<SessionResponse>('/api/session');
      setCsrfToken(s.csrfToken);
      return s;
    } catch (e) {
      if (e instanceof ApiError && e.status === 401) {
        remember(false);
        setCsrfToken(null);
        return null;
      }
      throw e;
    }
  },
  staleTime: 60_000,
  retry: false,
};

export function useSession() {
  return useQuery(sessionQuery);
}

function useSignedIn() {
  const client = useQueryClient();
  return (s: SessionResponse) => {
    remember(true);
    setCsrfToken(s.csrfToken);
    client.setQueryData(sessionKey, s);
  };
}

export function useSignIn() {
  const signedIn = useSignedIn();
  return useMutation({
    mutationFn: (body: { email: string; password: string }) => api<SessionResponse>('/api/session', { method: 'POST', body }),
    onSuccess: signedIn,
  });
}

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/api/session', { method: 'DELETE' }),
    onSettled: () => {
      client.clear();
      sessionEnded(client);
    },
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (body: { email: string }) => api<void>('/api/password-reset', { method: 'POST', body }),
  });
}

export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (body: { token: string; password: string }) => api<void>('/api/password-reset/confirm', { method: 'POST', body }),
  });
}

export function useAcceptInvite() {
  const signedIn = useSignedIn();
  return useMutation({
    mutationFn: (body: { token: string; password: string; name?: string }) =>
      api<SessionResponse>('/api/invites/accept', { method: 'POST', body }),
    onSuccess: signedIn,
  });
}
