// Measured data for a study: a CSV whose columns are mapped to input and output names
// (at least Nu or h), for overlay on the run charts. A column of a dimensional quantity
// carries its unit in the header (`fluid_temperature [degC]`), converted to SI by mathjs
// as study files are (shared/study/units.ts); without one it is refused, never guessed.
import { Router } from 'express';
import { z } from '#zod';
import { recordAudit } from '../../shared/db/audit.js';
import { createMeasurement, getMeasurement, listMeasurements, studyConfigurations, type MeasurementRow } from '../../shared/db/measurements.js';
import { NAME_PATTERN } from '../../shared/db/results-query.js';
import { getStudyName } from '../../shared/db/studies.js';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../http-error.js';
import { CSV_UPLOAD, singleTextFile, uploadedText } from '../middleware/upload.js';
import { parse } from '../middleware/validate.js';
import { makeUnitLookup, type UnitLookup } from '../../shared/export/units.js';
import { isDimensionlessUnit, parseColumnHeader } from '../../shared/measurements/header.js';
import { methodsFor } from '../../shared/physics/catalogue.js';
import { converterToSI, UnitError } from '../../shared/study/units.js';
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
    const unitOf = makeUnitLookup((await studyConfigurations(ctx.store, id)).flatMap((c) => methodsFor(c)));
    const rows = readMeasurementCsv(text, mapping, unitOf);
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

/**
 * Rows of mapped numbers in SI. Every mapped cell must be a finite number (line and
 * column named otherwise); a dimensional column converts from the unit in its header.
 */
export function readMeasurementCsv(text: string, mapping: Record<string, string>, unitOf: UnitLookup): MeasurementRow[] {
  const { header, records } = parseCsv(text);
  if (header.length === 0 || records.length === 0) throw new HttpError(400, 'the CSV needs a header line and at least one data line');
  const positions = Object.entries(mapping).map(([column, name]) => {
    const at = header.indexOf(column.trim());
    if (at < 0) throw new HttpError(400, `the CSV has no column '${column}'; its columns are: ${header.join(', ')}`);
    return { at, column, name, si: unitOf(name), ...columnConversion(column, name, unitOf(name)) };
  });
  if (records.length > MAX_MEASUREMENT_ROWS) throw new HttpError(413, `at most ${MAX_MEASUREMENT_ROWS} data lines`);
  const rows: MeasurementRow[] = [];
  for (const { line, cells } of records) {
    const values: Record<string, number> = {};
    for (const p of positions) {
      const cell = (cells[p.at] ?? '').trim();
      const raw = cell === '' ? NaN : Number(cell);
      if (!Number.isFinite(raw)) throw new HttpError(400, `CSV line ${line}, column '${p.column}': '${cell}' is not a number`);
      const v = p.toSI(raw);
      // An absolute temperature below 0 K is a typo or a wrong unit, not a state.
      if (p.si === 'K' && v < 0) throw new HttpError(400, `CSV line ${line}, column '${p.column}': ${cell}${p.unit ? ` ${p.unit}` : ''} is below absolute zero (${v} K)`);
      values[p.name] = v;
    }
    rows.push({ values });
  }
  return rows;
}

/** How a column's numbers become SI, from the unit in its header; a refusal says what to write. */
function columnConversion(column: string, name: string, si: string | undefined): { toSI: (v: number) => number; unit?: string } {
  const { unit } = parseColumnHeader(column);
  const same = (v: number) => v;
  if (si === undefined) {
    if (isDimensionlessUnit(unit)) return { toSI: same };
    throw new HttpError(400, `column '${column}' is mapped to '${name}', which no method of this study declares, so its unit [${unit}] cannot be converted; map it to a known input or output`);
  }
  if (si === '1') {
    if (isDimensionlessUnit(unit)) return { toSI: same };
    throw new HttpError(400, `column '${column}' is mapped to ${name}, which is dimensionless: write no unit or [-], not [${unit}]`);
  }
  if (isDimensionlessUnit(unit)) {
    throw new HttpError(
      400,
      `column '${column}' is mapped to ${name}, which has a unit (SI: ${si}), but its header gives none: write the unit in square brackets, e.g. '${name} [${si === 'K' ? 'degC' : si}]'`,
    );
  }
  try {
    return { toSI: converterToSI(si, unit!, `a unit of ${name} (SI: ${si})`), unit };
  } catch (e) {
    if (e instanceof UnitError) throw new HttpError(400, `column '${column}': ${e.message}`);
    throw e;
  }
}
