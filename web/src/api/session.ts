// The signed-in user and the CSRF token: GET/POST/DELETE /api/session, password reset, invites.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError, setCsrfToken } from './client.js';
import type { User } from './types.js';

export interface SessionResponse {
  user: User;
  csrfToken: string;
}

export const sessionKey = ['session'] as const;

/** The session, or null when signed out (401 is an answer here, not an error). */
export function useSession() {
  return useQuery({
    queryKey: sessionKey,
    queryFn: async (): Promise<SessionResponse | null> => {
      try {
        const s = await api<SessionResponse>('/api/session');
        setCsrfToken(s.csrfToken);
        return s;
      } catch (e) {
        if (e instanceof ApiError && e.status === 401) {
          setCsrfToken(null);
          return null;
        }
        throw e;
      }
    },
    staleTime: 60_000,
    retry: false,
  });
}

function useSignedIn() {
  const client = useQueryClient();
  return (s: SessionResponse) => {
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
      setCsrfToken(null);
      client.clear();
      client.setQueryData(sessionKey, null);
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
