// Measurement CSVs with units in their headers, through the API of a real server: values
// converted to SI by mathjs exactly as study files are, a dimensional column without a unit
// refused with a message, separators (comma, semicolon, tab), full precision, and line and
// column named in every error; on SQLite and, when FILMSWEEP_TEST_PG_URL is set, PostgreSQL.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { unit } from 'mathjs';
import { quantityToSI } from '../shared/study/units.js';
import { startTestServer, waitForRun, type Client, type TestServer } from './helpers/server.js';
import { STORE_KINDS, createTestDatabase, type TestDatabase } from './helpers/stores.js';

// An invented probe in air (the Fernbrook field station's battery-room duct).
const PROBE = `name: units-probe
configuration: cylinder
methods: [churchill-bernstein, hilpert]
fluid: air
inputs:
  diameter: 12.7 mm
  length: 94 mm
  fluid_temperature: 26.2 degC
  surface_temperature: 128.4 degC
sweep:
  over:
    velocity: [2 m/s, 5 m/s, 10 m/s]
`;

describe.each(STORE_KINDS)('measurement units on %s', (kind) => {
  let database: TestDatabase;
  let s: TestServer;
  let researcher: Client;
  let studyId: number;

  beforeAll(async () => {
    database = await createTestDatabase(kind, 'units');
    s = await startTestServer({}, database.location);
    researcher = await s.signIn(s.emails.researcher);
    const form = new FormData();
    form.append('file', new Blob([PROBE], { type: 'application/yaml' }), 'units-probe.yaml');
    const up = await researcher.json('POST', '/api/studies', { form });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    studyId = up.body.study.id;
    await waitForRun(researcher, up.body.run.id);
  }, 60_000);
  afterAll(async () => {
    await s?.close();
    await database?.drop();
  });

  async function send(csv: string, mapping: Record<string, string>, name = 'rig.csv') {
    const form = new FormData();
    form.append('file', new Blob([csv], { type: 'text/csv' }), name);
    form.append('mapping', JSON.stringify(mapping));
    return researcher.json('POST', `/api/studies/${studyId}/measurements`, { form });
  }
  const rowsOf = async (id: number) => (await researcher.json('GET', `/api/measurements/${id}`)).body.rows.map((r: { values: Record<string, number> }) => r.values);

  it('converts a [degC] column to kelvin with mathjs, as a study file value, and keeps every digit', async () => {
    const csv = '\uFEFFvelocity [m/s];fluid_temperature [degC];h [W/(m^2 K)];Nusselt\r\n2;26.2;31.5;28.25\r\n5.000000000000001;-10;55.25;\r\n';
    const made = await send(csv, { 'velocity [m/s]': 'velocity', 'fluid_temperature [degC]': 'fluid_temperature', 'h [W/(m^2 K)]': 'h' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const rows = await rowsOf(made.body.measurement.id);
    // The same conversion as "26.2 degC" in a study file (shared/study/units.ts) and mathjs itself.
    expect(rows[0].fluid_temperature).toBe(quantityToSI('fluid_temperature', '26.2 degC'));
    expect(rows[0].fluid_temperature).toBe(unit(26.2, 'degC').toNumber('K'));
    expect(rows[1].fluid_temperature).toBe(unit(-10, 'degC').toNumber('K'));
    expect(rows[0].h).toBe(31.5);
    // Full precision: the text's nearest double, not a rounded one.
    expect(rows[1].velocity).toBe(5.000000000000001);
  });

  it('converts other units of the right dimension (degF, mm/s, kW/(m^2 K))', async () => {
    const csv = 'v [mm/s]\tT [degF]\th [kW/(m^2 K)]\n2000\t79.16\t0.0315\n';
    const made = await send(csv, { 'v [mm/s]': 'velocity', 'T [degF]': 'fluid_temperature', 'h [kW/(m^2 K)]': 'h' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const [row] = await rowsOf(made.body.measurement.id);
    expect(row.velocity).toBeCloseTo(2, 14);
    expect(row.fluid_temperature).toBeCloseTo(unit(79.16, 'degF').toNumber('K'), 10);
    expect(row.h).toBeCloseTo(31.5, 12);
  });

  it('refuses a dimensional column without a unit, saying what to write', async () => {
    const made = await send('velocity,fluid_temperature,h\n2,26.2,31.5\n', { velocity: 'velocity', fluid_temperature: 'fluid_temperature', h: 'h' });
    expect(made.status).toBe(400);
    expect(made.body.error.message).toMatch(/column 'velocity' is mapped to velocity, which has a unit \(SI: m\/s\).*velocity \[m\/s\]/);
    const temp = await send('fluid_temperature [-],h [W/(m^2 K)]\n26.2,31.5\n', { 'fluid_temperature [-]': 'fluid_temperature', 'h [W/(m^2 K)]': 'h' });
    expect(temp.status).toBe(400);
    expect(temp.body.error.message).toMatch(/fluid_temperature \[degC\]/);
    const list = (await researcher.json('GET', `/api/studies/${studyId}/measurements`)).body.measurements;
    expect(list.map((m: { name: string }) => m.name)).not.toContain('refused.csv');
  });

  it('refuses a wrong dimension, a unit on a dimensionless column and an unknown unit', async () => {
    const wrong = await send('velocity [m/s],h [W/m^2]\n2,31.5\n', { 'velocity [m/s]': 'velocity', 'h [W/m^2]': 'h' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.message).toMatch(/column 'h \[W\/m\^2\]': 'W\/m\^2' has the wrong dimension/);
    const dimensionless = await send('Re [m],Nu\n2000,20\n', { 'Re [m]': 'Re', Nu: 'Nu' });
    expect(dimensionless.status).toBe(400);
    expect(dimensionless.body.error.message).toMatch(/Re, which is dimensionless/);
    const unknown = await send('velocity [furlongs],Nu [-]\n2,20\n', { 'velocity [furlongs]': 'velocity', 'Nu [-]': 'Nu' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toMatch(/cannot read 'furlongs' as a unit/);
  });

  it('names the line and column of a bad cell, counting lines inside quoted fields', async () => {
    const csv = 'note,Nu\n"two\nlines",20\nok,abc\n';
    const bad = await send(csv, { Nu: 'Nu' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toBe("CSV line 4, column 'Nu': 'abc' is not a number");
    const cold = await send('fluid_temperature [degC],Nu\n-300,20\n', { 'fluid_temperature [degC]': 'fluid_temperature', Nu: 'Nu' });
    expect(cold.status).toBe(400);
    expect(cold.body.error.message).toMatch(/^CSV line 2, column 'fluid_temperature \[degC\]': -300 degC is below absolute zero/);
    const open = await send('note,Nu\n"unclosed,20\n', { Nu: 'Nu' });
    expect(open.status).toBe(400);
    expect(open.body.error.message).toMatch(/^CSV line 2: .*quote/i);
  });
});
