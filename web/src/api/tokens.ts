// API tokens (researcher and lead): GET/POST /api/tokens, DELETE /api/tokens/:id.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from './client.js';

export interface ApiToken {
  id: number;
  name: string;
  created_at: string;
  last_used_at: string | null;
}

export function useTokens() {
  return useQuery({ queryKey: ['tokens'], queryFn: () => api<{ tokens: ApiToken[] }>('/api/tokens') });
}

export function useCreateToken() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => api<{ token: string; id: number; name: string }>('/api/tokens', { method: 'POST', body }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['tokens'] }),
  });
}

export function useRevokeToken() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<void>(`/api/tokens/${id}`, { method: 'DELETE' }),
    onSuccess: () => client.invalidateQueries({ queryKey: ['tokens'] }),
  });
}
