// The signed-in user and the CSRF token: GET/POST/DELETE /api/session, password reset, invites.
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api, ApiError, setCsrfToken } from './client.js';
import { SESSION_URL } from './run-urls.js';
import type { User } from './types.js';

export interface SessionResponse {
  user: User;
  csrfToken: string;
}

export const sessionKey = ['session'] as const;

import { remember, signedInHint as hinted } from './session-hint.js';
export { signedInHint } from './session-hint.js';

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
      const s = await api<SessionResponse>(SESSION_URL);
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
