// The audit log (lead): GET /api/audit.
import { useQuery } from '@tanstack/react-query';
import { api } from './client.js';

export interface AuditEntry {
  id: number;
  at: string;
  user: string | null;
  action: string;
  detail: unknown;
}

export function useAudit(enabled: boolean) {
  return useQuery({ queryKey: ['audit'], queryFn: () => api<{ entries: AuditEntry[] }>('/api/audit'), enabled });
}
