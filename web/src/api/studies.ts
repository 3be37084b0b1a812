// Studies and their versions: GET /api/studies, GET /api/studies/:id, POST /api/studies.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, qs } from './client.js';
import type { RunInfo } from './types.js';

export interface StudyListItem {
  id: number;
  name: string;
  title: string | null;
  configuration: string;
  versions: number;
  last_run: RunInfo | null;
}

export interface StudyVersion {
  id: number;
  version: number;
  hash: string;
  yaml: string;
  created_at: string;
}

export interface StudyDetail {
  study: { id: number; name: string; title?: string | null; configuration?: string; created_at?: string };
  versions: StudyVersion[];
  runs: RunInfo[];
}

export interface UploadStudyResponse {
  study: { id: number; name: string };
  version: StudyVersion;
  run: RunInfo;
}

export function useStudies(q: string) {
  return useQuery({
    queryKey: ['studies', q],
    queryFn: () => api<{ studies: StudyListItem[] }>(`/api/studies${qs({ q })}`),
    placeholderData: (prev) => prev,
  });
}

export function useStudy(id: number) {
  return useQuery({
    queryKey: ['study', id],
    queryFn: () => api<StudyDetail>(`/api/studies/${id}`),
    // A freshly uploaded version runs in the background: keep the run list moving.
    refetchInterval: (query) =>
      query.state.data?.runs.some((r) => r.status === 'running' || r.status === 'queued') ? 2000 : false,
  });
}

export function useUploadStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return api<UploadStudyResponse>('/api/studies', { method: 'POST', body: form });
    },
    onSuccess: (data) => {
      void client.invalidateQueries({ queryKey: ['studies'] });
      void client.invalidateQueries({ queryKey: ['study', data.study.id] });
      void client.invalidateQueries({ queryKey: ['runs'] });
    },
  });
}
