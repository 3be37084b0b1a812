// `filmsweep show RUN`: one run's facts and its per-method summary. Also the summary
// table `run` and `resume` print when a run ends.
import type { Command } from 'commander';
import {
  closeStore,
  getRecommendationCounts,
  getRunDetails,
  getRunSummary,
  openStore,
  resolveDbPath,
  resolveRunRef,
  type MethodSummary,
  type RecommendationCounts,
  type RunInfo,
} from '../../shared/db/index.js';
import { formatNumber, printJson, table } from '../format.js';

function useColor(stream: NodeJS.WriteStream): boolean {
  return Boolean(stream.isTTY) && !process.env.NO_COLOR;
}

const STATUS_COLOR: Record<string, number> = { done: 32, running: 36, queued: 36, interrupted: 33, failed: 31 };

export function statusText(status: string, stream: NodeJS.WriteStream = process.stdout): string {
  return useColor(stream) ? `\x1b[${STATUS_COLOR[status] ?? 0}m${status}\x1b[0m` : status;
}

/**
 * The per-method table: points, flagged points, min/max Nu, and (with per-point
 * summaries) at how many points the method was the recommended one.
 */
export function summaryTable(summary: MethodSummary[], recommended?: RecommendationCounts): string {
  const counted = recommended !== undefined && recommended.points > 0;
  const body = table(
    ['method', 'version', 'points', 'flagged', 'Nu min', 'Nu max', ...(counted ? ['recommended'] : [])],
    summary.map((m) => [
      m.method,
      m.version,
      m.points,
      m.flagged_points,
      m.nu_min === null ? '' : `${formatNumber(m.nu_min, 5)}${m.nu_name === 'Nu_x' ? ' (Nu_x)' : ''}`,
      m.nu_max === null ? '' : `${formatNumber(m.nu_max, 5)}${m.nu_name === 'Nu_x' ? ' (Nu_x)' : ''}`,
      ...(counted ? [recommended.byMethod[m.method] ?? 0] : []),
    ]),
  );
  if (!counted || recommended.none === 0) return body;
  return `${body}\nno-applicable-method: ${recommended.none} of ${recommended.points} points (no method's validity ranges hold there)`;
}


/** What `run` and `resume` print after a run: a status line and the summary table. */
export function runReport(run: RunInfo, summary: MethodSummary[], seconds?: number, recommended?: RecommendationCounts): string {
  const time = seconds === undefined ? '' : ` in ${formatNumber(seconds, 3)} s`;
  return [
    `run ${run.id}  ${run.study} (version ${run.study_version})  ${statusText(run.status)}  ` +
      `${run.points_done}/${run.points_total} points, ${run.results_count} results, ${run.flagged_count} flagged${time}`,
    summaryTable(summary, recommended),
    '',
  ].join('\n');
}

export function register(program: Command) {
  program
    .command('show')
    .description("one run: study, status, timing, git commit, host, and per method the points, flagged points and Nu range")
    .argument('<run>', "run id, or 'latest'")
    .option('--db <file>', 'database file or postgres:// URL (default: $FILMSWEEP_DB or ./filmsweep.db)')
    .option('--json', 'print JSON: {"run": {...}, "error": ..., "summary": [...], "recommended": {"points", "byMethod": {method: points}, "none"}}')
    .action(async (ref: string, opts: { db?: string; json?: boolean }) => {
      const store = await openStore(resolveDbPath(opts.db), { create: false });
      try {
        const run = await resolveRunRef(store, ref);
        const details = (await getRunDetails(store, run.id))!;
        const summary = await getRunSummary(store, run.id);
        const recommended = await getRecommendationCounts(store, run.id);
        if (opts.json) {
          printJson({ run, error: details.error, summary, recommended });
          return;
        }
        const lines = [
          `run ${run.id}: ${run.study}${run.title ? ` — ${run.title}` : ''}`,
          `  status         ${statusText(run.status)}${details.error ? ` (${details.error})` : ''}`,
          `  study version  ${run.study_version} (sha256 ${run.yaml_hash.slice(0, 12)})`,
          `  configuration  ${run.configuration}`,
          `  methods        ${run.methods.map((m) => `${m.id} v${m.version}`).join(', ')}`,
          `  points         ${run.points_done}/${run.points_total} (${run.results_count} results, ${run.flagged_count} flagged)`,
          `  started        ${run.started_at ?? '—'}`,
          `  finished       ${run.finished_at ?? '—'}`,
          `  git commit     ${run.git_commit ?? '—'}`,
          `  host           ${run.host}${details.pid ? ` (pid ${details.pid})` : ''}, ${run.workers} worker${run.workers === 1 ? '' : 's'}`,
          '',
          summaryTable(summary, recommended),
        ];
        process.stdout.write(`${lines.join('\n')}\n`);
      } finally {
        await closeStore(store);
      }
    });
}
