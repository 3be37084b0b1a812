// The facts about a run that memo exports print above their table, as label/value pairs.
import type { RunInfo } from './types.js';

export function runFacts(run: RunInfo): [string, string][] {
  const facts: [string, string][] = [
    ['Study', `${run.study}${run.title ? ` (${run.title})` : ''}, version ${run.study_version}`],
    ['Study file sha256', run.yaml_hash],
    ['Configuration', run.configuration],
    ['Methods', run.methods.map((m) => `${m.id} v${m.version}`).join(', ')],
    [
      'Status',
      `${run.status}, ${run.points_done} of ${run.points_total} points, ${run.results_count} results, ` +
        `${run.flagged_count} flagged`,
    ],
  ];
  if (run.started_at) facts.push(['Started', run.started_at]);
  if (run.finished_at) facts.push(['Finished', run.finished_at]);
  facts.push(['Git commit', run.git_commit ?? 'none (study file not in a git repository)']);
  facts.push(['Host', `${run.host}, ${run.workers} worker${run.workers === 1 ? '' : 's'}`]);
  return facts;
}
