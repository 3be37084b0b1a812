// Invitations (lead only): GET/POST /api/invites.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from './client.js';
import type { Role } from './types.js';

export interface Invite {
  id: number;
  email: string;
  role: Role;
  expires_at: string;
  accepted_at?: string | null;
}

export function useInvites() {
  return useQuery({ queryKey: ['invites'], queryFn: () => api<{ invites: Invite[] }>('/api/invites') });
}

export function useCreateInvite() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; role: Role }) => api<{ invite: Invite }>('/api/invites', { method: 'POST', body }),
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: ['invites'] });
      void client.invalidateQueries({ queryKey: ['outbox'] });
    },
  });
}
