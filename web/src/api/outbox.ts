// The local mail outbox (lead, development mode only): GET /api/outbox.
import { useQuery } from '@tanstack/react-query';
import { api } from './client.js';

export interface OutboxMessage {
  id: number;
  to: string;
  subject: string;
  text: string;
  created_at: string;
}

export function useOutbox() {
  return useQuery({
    queryKey: ['outbox'],
    queryFn: () => api<{ messages: OutboxMessage[] }>('/api/outbox'),
    retry: false,
  });
}
