// What the dashboard lists: studies with their versions and latest run, and runs with the
// dashboard's own facts (reference flag, who started it).
import { listRuns, getRun, type ListRunsOptions, type RunInfo } from './queries.js';
import type { RunStatus } from './schema.js';
import type { Store } from './store.js';

/** RunInfo plus what only the dashboard records. */
export interface DashboardRun extends RunInfo {
  reference: boolean;
  /** E-mail of who started the run from the dashboard or pushed it; null for CLI runs. */
  started_by: string | null;
}

export interface StudyListEntry {
  id: number;
  name: string;
  /** Title and configuration of the newest version. */
  title: string | null;
  configuration: string;
  versions: number;
  last_run: DashboardRun | null;
}

export interface StudyVersionInfo {
  id: number;
  version: number;
  hash: string;
  yaml: string;
  created_at: string;
}

export async function withRunMeta(store: Store, runs: RunInfo[]): Promise<DashboardRun[]> {
  if (runs.length === 0) return [];
  const meta = await store.db
    .selectFrom('runs')
    .leftJoin('users', 'users.id', 'runs.started_by')
    .select(['runs.id', 'runs.reference', 'users.email'])
    .where(
      'runs.id',
      'in',
      runs.map((r) => r.id),
    )
    .execute();
  const byId = new Map(meta.map((m) => [m.id, m]));
  return runs.map((r) => ({ ...r, reference: (byId.get(r.id)?.reference ?? 0) !== 0, started_by: byId.get(r.id)?.email ?? null }));
}

export async function getDashboardRun(store: Store, id: number): Promise<DashboardRun | undefined> {
  const run = await getRun(store, id);
  return run && (await withRunMeta(store, [run]))[0];
}

export async function listDashboardRuns(store: Store, options: ListRunsOptions = {}): Promise<DashboardRun[]> {
  return withRunMeta(store, await listRuns(store, options));
}

export async function setRunReference(store: Store, id: number, reference: boolean): Promise<void> {
  await store.db.updateTable('runs').set({ reference: reference ? 1 : 0 }).where('id', '=', id).execute();
}

/**
 * Called from the runner's onStart, between batch writes. On SQLite the statement runs
 * before this returns (the dialect's statements are synchronous underneath).
 */
export async function setRunStartedBy(store: Store, id: number, userId: number, gitCommit: string | null): Promise<void> {
  await store.dialect.run('update runs set started_by = ?, git_commit = ? where id = ?', [userId, gitCommit, id]);
}

export async function findStudyByName(store: Store, name: string): Promise<{ id: number; name: string } | undefined> {
  return store.db.selectFrom('studies').select(['id', 'name']).where('name', '=', name).executeTakeFirst();
}

export async function getStudyName(store: Store, id: number): Promise<string | undefined> {
  return (await store.db.selectFrom('studies').select('name').where('id', '=', id).executeTakeFirst())?.name;
}

/** Studies by name; `q` matches name or title (case-insensitive substring). */
export async function listStudies(store: Store, q?: string): Promise<StudyListEntry[]> {
  const rows = await store.db
    .selectFrom('studies as s')
    .innerJoin('study_versions as v', 'v.study_id', 's.id')
    .select(['s.id', 's.name', 'v.title', 'v.configuration', 'v.version'])
    .orderBy('s.name')
    .orderBy('v.version')
    .execute();
  const byStudy = new Map<number, StudyListEntry>();
  for (const r of rows) {
    const entry = byStudy.get(r.id) ?? { id: r.id, name: r.name, title: null, configuration: r.configuration, versions: 0, last_run: null };
    entry.title = r.title;
    entry.configuration = r.configuration;
    entry.versions += 1;
    byStudy.set(r.id, entry);
  }
  const needle = q?.trim().toLowerCase();
  const studies = [...byStudy.values()].filter(
    (s) => !needle || s.name.toLowerCase().includes(needle) || (s.title ?? '').toLowerCase().includes(needle),
  );
  for (const s of studies) {
    const [last] = await listDashboardRuns(store, { study: s.name, limit: 1 });
    s.last_run = last ?? null;
  }
  return studies;
}

export async function getStudy(
  store: Store,
  id: number,
): Promise<{ study: Omit<StudyListEntry, 'last_run' | 'versions'> & { created_at: string }; versions: StudyVersionInfo[]; runs: DashboardRun[] } | undefined> {
  const study = await store.db.selectFrom('studies').select(['id', 'name', 'created_at']).where('id', '=', id).executeTakeFirst();
  if (!study) return undefined;
  const versions = await store.db
    .selectFrom('study_versions')
    .select(['id', 'version', 'hash', 'yaml', 'created_at', 'title', 'configuration'])
    .where('study_id', '=', id)
    .orderBy('version')
    .execute();
  const newest = versions[versions.length - 1];
  return {
    study: { id: study.id, name: study.name, title: newest?.title ?? null, configuration: newest?.configuration ?? '', created_at: study.created_at },
    versions: versions.map(({ id, version, hash, yaml, created_at }) => ({ id, version, hash, yaml, created_at })),
    runs: await listDashboardRuns(store, { study: study.name }),
  };
}

export type { RunStatus };
