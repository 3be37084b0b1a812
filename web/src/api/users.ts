// The team (lead only): GET /api/users, PATCH /api/users/:id.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from './client.js';
import type { Role } from './types.js';

export interface TeamMember {
  id: number;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  created_at: string;
}

export function useUsers() {
  return useQuery({ queryKey: ['users'], queryFn: () => api<{ users: TeamMember[] }>('/api/users') });
}

export function useUpdateUser() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: { id: number; role?: Role; disabled?: boolean }) =>
      api<{ user: TeamMember }>(`/api/users/${id}`, { method: 'PATCH', body }),
    onSettled: () => client.invalidateQueries({ queryKey: ['users'] }),
  });
}
