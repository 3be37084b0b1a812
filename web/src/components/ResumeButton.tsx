// "Resume run" in the run page's header, for interrupted runs and the roles that start
// runs (researchers and leads): POST /api/runs/:id/resume finishes the run in the
// background without repeating or losing points; the page then follows it like any
// running run. The server's refusal (a pushed run, a study or method changed since) shows
// as it is.
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client.js';
import { useSession } from '../api/session.js';
import type { RunInfo } from '../api/types.js';
import { can } from '../lib/roles.js';
import { ErrorNote } from './States.js';

export function ResumeButton({ run }: { run: Pick<RunInfo, 'id' | 'status'> }) {
  const session = useSession();
  const client = useQueryClient();
  const resume = useMutation({
    mutationFn: () => api<{ run: RunInfo }>(`/api/runs/${run.id}/resume`, { method: 'POST', body: {} }),
    onSuccess: () => {
      for (const key of [['run', run.id], ['runs'], ['results', run.id], ['chart', run.id]]) void client.invalidateQueries({ queryKey: key });
    },
  });
  // Starting runs is a researcher's right ('upload'); resuming one is the same right.
  if (run.status !== 'interrupted' || !can(session.data?.user.role, 'upload')) return null;
  return (
    <>
      <button type="button" className="btn btn-primary btn-small" disabled={resume.isPending || resume.isSuccess} onClick={() => resume.mutate()}>
        {resume.isPending ? 'Resuming…' : 'Resume run'}
      </button>
      {resume.isError && <ErrorNote error={resume.error} title="The run was not resumed" />}
    </>
  );
}
