// A run's status as a coloured word, plus a progress bar for running runs.
import type { RunInfo, RunStatus } from '../api/types.js';

const tone: Record<RunStatus, string> = {
  queued: 'bg-ink-50 text-ink-600 border-ink-200',
  running: 'bg-copper-100 text-copper-700 border-copper-500/40',
  done: 'bg-moss-100 text-moss-700 border-moss-700/30',
  failed: 'bg-brick-100 text-brick-700 border-brick-700/30',
  interrupted: 'bg-brick-100 text-brick-700 border-brick-700/30',
};

export function StatusBadge({ status }: { status: RunStatus }) {
  return <span className={`inline-block rounded-[3px] border px-1.5 py-0.5 text-xs font-medium ${tone[status]}`} data-testid="run-status">{status}</span>;
}

export function RunProgress({ run }: { run: Pick<RunInfo, 'points_done' | 'points_total' | 'status'> }) {
  const fraction = run.points_total > 0 ? Math.min(1, run.points_done / run.points_total) : 0;
  return (
    <div className="flex items-center gap-2" aria-label="run progress">
      <div
        className="h-2 w-32 overflow-hidden rounded-[2px] bg-ink-100 sm:w-48"
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={run.points_total}
        aria-valuenow={run.points_done}
      >
        <div className={`h-full ${run.status === 'running' ? 'film' : 'bg-ink-600'}`} style={{ width: `${(fraction * 100).toFixed(1)}%` }} />
      </div>
      <span className="text-xs tabular-nums text-ink-600">
        {run.points_done.toLocaleString('en')} / {run.points_total.toLocaleString('en')} points
      </span>
    </div>
  );
}
