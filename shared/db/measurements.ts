// Measured data attached to a study (a CSV the dashboard overlays on its charts). Values
// are kept by the input or output name each CSV column was mapped to, in SI.
import type { Store } from './store.js';

export interface Measurement {
  id: number;
  study_id: number;
  name: string;
  created_at: string;
  rows: number;
  /** CSV column → input or output name. */
  columns: Record<string, string>;
}

export interface MeasurementRow {
  values: Record<string, number>;
}

type Row = { id: number; study_id: number; name: string; created_at: string; row_count: number; columns: string };
const toMeasurement = (r: Row): Measurement => ({
  id: r.id,
  study_id: r.study_id,
  name: r.name,
  created_at: r.created_at,
  rows: r.row_count,
  columns: JSON.parse(r.columns) as Record<string, string>,
});
const columns = ['id', 'study_id', 'name', 'created_at', 'row_count', 'columns'] as const;

export async function createMeasurement(
  store: Store,
  spec: { studyId: number; name: string; columns: Record<string, string>; rows: MeasurementRow[]; createdBy: number | null },
): Promise<Measurement> {
  const row = await store.db
    .insertInto('measurements')
    .values({
      study_id: spec.studyId,
      name: spec.name,
      columns: JSON.stringify(spec.columns),
      rows: JSON.stringify(spec.rows.map((r) => r.values)),
      row_count: spec.rows.length,
      created_by: spec.createdBy,
      created_at: new Date().toISOString(),
    })
    .returning(columns)
    .executeTakeFirstOrThrow();
  return toMeasurement(row);
}

export async function listMeasurements(store: Store, studyId: number): Promise<Measurement[]> {
  return (await store.db.selectFrom('measurements').select(columns).where('study_id', '=', studyId).orderBy('id').execute()).map(toMeasurement);
}

export async function getMeasurement(store: Store, id: number): Promise<{ measurement: Measurement; rows: MeasurementRow[] } | undefined> {
  const r = await store.db.selectFrom('measurements').select([...columns, 'rows']).where('id', '=', id).executeTakeFirst();
  if (!r) return undefined;
  const values = JSON.parse(r.rows) as Record<string, number>[];
  return { measurement: toMeasurement(r), rows: values.map((v) => ({ values: v })) };
}

/** The configurations a study's versions use (a measurement's names are read against their methods). */
export async function studyConfigurations(store: Store, studyId: number): Promise<string[]> {
  const rows = await store.db.selectFrom('study_versions').select('configuration').distinct().where('study_id', '=', studyId).execute();
  return rows.map((r) => r.configuration);
}
