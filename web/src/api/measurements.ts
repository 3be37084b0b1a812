// Measured data of a study: /api/studies/:id/measurements and /api/measurements/:id.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from './client.js';

export interface Measurement {
  id: number;
  name: string;
  created_at: string;
  rows: number;
  columns: Record<string, string>;
}

export function useMeasurements(studyId: number | undefined) {
  return useQuery({
    queryKey: ['measurements', studyId],
    queryFn: () => api<{ measurements: Measurement[] }>(`/api/studies/${studyId}/measurements`),
    enabled: studyId !== undefined,
  });
}

export function useMeasurement(id: number) {
  return useQuery({
    queryKey: ['measurement', id],
    queryFn: () =>
      api<{ measurement: Measurement & { study_id?: number }; rows: { values: Record<string, number> }[] }>(`/api/measurements/${id}`),
  });
}

export function useUploadMeasurement(studyId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: { file: File; mapping: Record<string, string> }) => {
      const form = new FormData();
      form.append('file', input.file);
      form.append('mapping', JSON.stringify(input.mapping));
      return api<{ measurement: Measurement }>(`/api/studies/${studyId}/measurements`, { method: 'POST', body: form });
    },
    onSuccess: () => client.invalidateQueries({ queryKey: ['measurements', studyId] }),
  });
}
