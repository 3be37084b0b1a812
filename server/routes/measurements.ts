// Measured data for a study: a CSV whose columns are mapped to input and output names
// (at least Nu or h), kept in SI as given, for overlay on the run charts.
import { Router } from 'express';
import { z } from 'zod';
import { recordAudit } from '../../shared/db/audit.js';
import { createMeasurement, getMeasurement, listMeasurements, type MeasurementRow } from '../../shared/db/measurements.js';
import { NAME_PATTERN } from '../../shared/db/results-query.js';
import { getStudyName } from '../../shared/db/studies.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { CSV_UPLOAD, singleTextFile, uploadedText } from '../middleware/upload.js';
import { parse } from '../middleware/validate.js';
import { parseCsv } from '../csv.js';
import { idParams } from './users.js';

export const MAX_MEASUREMENT_ROWS = 100_000;

const mappingSchema = z
  .record(z.string().min(1).max(200), z.string().regex(NAME_PATTERN, 'a mapped name must be an input or output name'))
  .refine((m) => Object.values(m).some((n) => n === 'Nu' || n === 'h'), 'map at least one column to the output Nu or h')
  .refine((m) => new Set(Object.values(m)).size === Object.values(m).length, 'each name may be mapped once');

const fields = z
  .object({
    mapping: z.string().max(64 * 1024).transform((text, c) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        c.addIssue({ code: 'custom', message: 'mapping is not valid JSON' });
        return z.NEVER;
      }
    }),
    name: z.string().trim().min(1).max(200).optional(),
  })
  .strict();

export function measurementsRouter(ctx: AppContext): { byStudy: Router; byId: Router } {
  const byStudy = Router({ mergeParams: true });
  byStudy.get('/', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    if (!(await getStudyName(ctx.store, id))) throw notFound(`study ${id}`);
    res.json({ measurements: (await listMeasurements(ctx.store, id)).map(({ study_id: _, ...m }) => m) });
  });
  byStudy.post('/', singleTextFile(CSV_UPLOAD), async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    if (!(await getStudyName(ctx.store, id))) throw notFound(`study ${id}`);
    const f = parse(fields, req.body, 'field');
    const mapping = parse(mappingSchema, f.mapping, 'field');
    const { name, text } = uploadedText(req);
    const rows = readMeasurementCsv(text, mapping);
    const user = req.auth!.user;
    const m = await createMeasurement(ctx.store, { studyId: id, name: f.name ?? name, columns: mapping, rows, createdBy: user.id });
    await recordAudit(ctx.store, { user, action: 'measurement-upload', detail: { study: id, measurement: m.id, rows: rows.length }, ip: req.ip });
    const { study_id: _, ...measurement } = m;
    res.status(201).json({ measurement });
  });

  const byId = Router();
  byId.get('/:id', async (req, res) => {
    const { id } = parse(idParams, req.params, 'params');
    parse(z.object({}).strict(), req.query, 'query');
    const found = await getMeasurement(ctx.store, id);
    if (!found) throw notFound(`measurement ${id}`);
    res.json(found);
  });
  return { byStudy, byId };
}

/** Rows of mapped numbers; every mapped cell must be a finite number (line named otherwise). */
export function readMeasurementCsv(text: string, mapping: Record<string, string>): MeasurementRow[] {
  const table = parseCsv(text);
  if (table.length < 2) throw new HttpError(400, 'the CSV needs a header line and at least one data line');
  const header = table[0].map((h) => h.trim());
  const positions = Object.entries(mapping).map(([column, name]) => {
    const at = header.indexOf(column);
    if (at < 0) throw new HttpError(400, `the CSV has no column '${column}'; its columns are: ${header.join(', ')}`);
    return { at, column, name };
  });
  if (table.length - 1 > MAX_MEASUREMENT_ROWS) throw new HttpError(413, `at most ${MAX_MEASUREMENT_ROWS} data lines`);
  const rows: MeasurementRow[] = [];
  for (let i = 1; i < table.length; i++) {
    const cells = table[i];
    if (cells.length === 1 && cells[0].trim() === '') continue; // blank line
    const values: Record<string, number> = {};
    for (const p of positions) {
      const cell = (cells[p.at] ?? '').trim();
      const v = cell === '' ? NaN : Number(cell);
      if (!Number.isFinite(v)) throw new HttpError(400, `CSV line ${i + 1}, column '${p.column}': '${cell}' is not a number`);
      values[p.name] = v;
    }
    rows.push({ values });
  }
  if (rows.length === 0) throw new HttpError(400, 'the CSV has no data lines');
  return rows;
}
