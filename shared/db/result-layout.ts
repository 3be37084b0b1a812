// A run's results as plain typed columns instead of JSON (see migrations/0005_run_tables.ts
// for why): every input and output name of a run is a column, numbers are stored as
// numbers, and each result row names its *shape*, the ordered list of columns that make
// its inputs and outputs objects. So a row reads back as exactly the objects the engine
// returned (same keys, same order, same doubles), and the dashboard filters and sorts on
// real columns.
//
// This module is the codec, without a database: the worker threads encode their batches
// with ResultBatchEncoder (columnar arrays, cheap to pass between threads), the writer maps
// a batch's columns and shapes onto the run's RunLayout (adding what is new), and the
// readers decode rows with RunLayout.decode.
import type { Inputs, Outputs } from '../physics/types.js';

/** How a column stores its values: numbers as doubles, booleans as 0/1, anything else as JSON text. */
export type ColumnKind = 'number' | 'string' | 'boolean' | 'json';
export type ColumnRole = 'input' | 'output';

export interface ResultColumn {
  role: ColumnRole;
  name: string;
  kind: ColumnKind;
}

/** The columns of a row's inputs and outputs objects, in key order (column indices). */
export interface ResultShape {
  inputs: number[];
  outputs: number[];
}

/**
 * One computed batch, columnar: n points with M results each, point-major (result r is
 * point `points[floor(r / methods)]`, method `r % methods`). Columns and shapes are the
 * batch's own; the writer maps them onto the run's.
 */
export interface ResultBatch {
  points: number[];
  methods: number;
  columns: ResultColumn[];
  /**
   * Per column, one value per result: a Float64Array for numbers (NaN where the row has no
   * such value), else an array of strings (strings, JSON text) or 0/1 (booleans) or null.
   */
  values: (Float64Array | (string | number | null)[])[];
  shapes: ResultShape[];
  /** Per result, its shape (index into `shapes`). */
  shape: Uint32Array;
  /** Per result, the JSON array of its flags, or null when it has none. */
  flags: (string | null)[];
}

export function kindOf(value: unknown): ColumnKind {
  switch (typeof value) {
    case 'number':
      return 'number';
    case 'string':
      return 'string';
    case 'boolean':
      return 'boolean';
    default:
      return 'json';
  }
}

const columnKey = (c: ResultColumn) => `${c.role}\u0000${c.kind}\u0000${c.name}`;
const shapeKey = (s: ResultShape) => `${s.inputs.join(',')}|${s.outputs.join(',')}`;

/** A value as the batch stores it (see ResultBatch.values). */
function stored(kind: ColumnKind, value: unknown): string | number | null {
  if (kind === 'number') return (value as number) + 0; // -0 reads back as 0, as it did through JSON
  if (kind === 'boolean') return value ? 1 : 0;
  if (kind === 'json') return JSON.stringify(value) ?? null;
  return value as string;
}

/** A stored value back as the engine gave it. */
export function decodeValue(kind: ColumnKind, value: unknown): unknown {
  if (value === null || value === undefined) return null; // a non-finite number, as JSON would have had it
  switch (kind) {
    case 'number':
      return Number(value);
    case 'string':
      return String(value);
    case 'boolean':
      return value === 1 || value === true || value === '1';
    default:
      return JSON.parse(String(value));
  }
}

/** An ordered list of object keys (name and value kind), with the column each maps to. */
class KeyList {
  readonly names: string[] = [];
  readonly kinds: ColumnKind[] = [];
  readonly columns: number[] = [];

  get length(): number {
    return this.names.length;
  }

  is(i: number, name: string, kind: ColumnKind): boolean {
    return this.names[i] === name && this.kinds[i] === kind;
  }

  push(name: string, kind: ColumnKind, column = -1): void {
    this.names.push(name);
    this.kinds.push(kind);
    this.columns.push(column);
  }

  clear(): void {
    this.names.length = this.kinds.length = this.columns.length = 0;
  }
}

/**
 * Builds a ResultBatch point by point: `addPoint`, then `addResult` once per method, in
 * method order. An output that is not a finite number is left out and the result gets
 * the flag `non-finite:<output>` (it used to be written as JSON, which has no NaN).
 */
export class ResultBatchEncoder {
  private readonly columns: ResultColumn[] = [];
  private readonly values: (Float64Array | (string | number | null)[])[] = [];
  private readonly columnIds = new Map<string, number>();
  /** Per role, the column a name last mapped to (a hit needs no key string). */
  private readonly lastColumn = { input: new Map<string, number>(), output: new Map<string, number>() };
  private readonly shapes: ResultShape[] = [];
  private readonly shapeIds = new Map<string, number>();
  /** Per method, the shape of its last result (the next one nearly always has the same). */
  private readonly lastShape: (number | undefined)[];
  private readonly points: number[] = [];
  private readonly shape: Uint32Array;
  private readonly flags: (string | null)[];
  private readonly rows: number;
  private row = 0;
  /** The current point's input columns (the same array while points keep their keys) and stored values. */
  private inputColumns: number[] = [];
  private readonly inputValues: (string | number | null)[] = [];
  private readonly outputColumns: number[] = [];
  /**
   * The keys (name and kind) behind inputColumns, and per method behind its last outputs:
   * a point or result with the same keys as the last one (nearly all of a sweep) takes
   * their columns and shape without a lookup.
   */
  private readonly inputKeys = new KeyList(); // its columns unused: inputColumns keeps them, as one array per key list
  private readonly outputKeys: KeyList[];

  constructor(
    private readonly methods: number,
    /** Points the batch will hold. */
    capacity: number,
  ) {
    this.rows = capacity * methods;
    this.shape = new Uint32Array(this.rows);
    this.flags = new Array(this.rows).fill(null);
    this.lastShape = new Array(methods).fill(undefined);
    this.outputKeys = Array.from({ length: methods }, () => new KeyList());
  }

  private column(role: ColumnRole, name: string, kind: ColumnKind): number {
    const last = this.lastColumn[role].get(name);
    if (last !== undefined && this.columns[last].kind === kind) return last;
    const key = `${role}\u0000${kind}\u0000${name}`;
    let id = this.columnIds.get(key);
    if (id === undefined) {
      id = this.columns.length;
      this.columns.push({ role, name, kind });
      this.values.push(kind === 'number' ? new Float64Array(this.rows).fill(NaN) : new Array(this.rows).fill(null));
      this.columnIds.set(key, id);
    }
    this.lastColumn[role].set(name, id);
    return id;
  }

  addPoint(index: number, inputs: Inputs): void {
    if (this.row !== this.points.length * this.methods) throw new Error('internal: a point needs a result per method before the next point');
    if (this.points.length * this.methods >= this.rows) throw new Error('internal: batch is full');
    this.points.push(index);
    const keys = this.inputKeys;
    let same = true;
    let n = 0;
    for (const name in inputs) {
      const value = inputs[name];
      const kind = kindOf(value);
      if (same && !keys.is(n, name, kind)) same = false;
      this.inputValues[n++] = stored(kind, value);
    }
    // inputValues may keep stale entries past n: addResult reads inputColumns.length of them.
    if (same && n === keys.length) return;
    const columns: number[] = [];
    keys.clear();
    n = 0;
    for (const name in inputs) {
      const kind = kindOf(inputs[name]);
      keys.push(name, kind);
      columns[n++] = this.column('input', name, kind);
    }
    this.inputColumns = columns;
  }

  addResult(outputs: Outputs, flags: readonly string[]): void {
    const r = this.row++;
    if (r >= this.points.length * this.methods) throw new Error('internal: more results than methods for this point');
    const { inputColumns, inputValues, values, outputColumns } = this;
    for (let i = 0; i < inputColumns.length; i++) values[inputColumns[i]][r] = inputValues[i] as never;
    const method = r % this.methods;
    const keys = this.outputKeys[method];
    let same = true;
    let rowFlags: string[] | undefined;
    let n = 0;
    for (const name in outputs) {
      const value: unknown = outputs[name];
      if (typeof value === 'number' && !Number.isFinite(value)) {
        (rowFlags ??= [...flags]).push(`non-finite:${name}`);
        continue;
      }
      const kind = kindOf(value);
      let c: number;
      if (same && keys.is(n, name, kind)) c = keys.columns[n];
      else {
        same = false;
        c = this.column('output', name, kind);
      }
      outputColumns[n++] = c;
      values[c][r] = stored(kind, value) as never;
    }
    const last = this.lastShape[method];
    if (same && n === keys.length && last !== undefined && this.shapes[last].inputs === inputColumns) this.shape[r] = last;
    else {
      outputColumns.length = n;
      keys.clear();
      n = 0;
      for (const name in outputs) {
        const value: unknown = outputs[name];
        if (typeof value === 'number' && !Number.isFinite(value)) continue;
        keys.push(name, kindOf(value), outputColumns[n++]);
      }
      this.shape[r] = this.shapeOf(method);
    }
    const all = rowFlags ?? flags;
    this.flags[r] = all.length ? JSON.stringify(all) : null;
  }

  /** The shape of the current inputs and outputColumns: the method's last one when it matches. */
  private shapeOf(method: number): number {
    const last = this.lastShape[method];
    if (last !== undefined) {
      const s = this.shapes[last];
      const o = this.outputColumns;
      if (s.inputs === this.inputColumns && s.outputs.length === o.length && s.outputs.every((c, i) => c === o[i])) return last;
    }
    const key = `${this.inputColumns.join(',')}|${this.outputColumns.join(',')}`;
    let id = this.shapeIds.get(key);
    if (id === undefined) {
      id = this.shapes.length;
      this.shapes.push({ inputs: this.inputColumns, outputs: [...this.outputColumns] });
      this.shapeIds.set(key, id);
    }
    // Compared by identity next time: the shape keeps this point's input array.
    if (this.shapes[id].inputs !== this.inputColumns) this.shapes[id] = { ...this.shapes[id], inputs: this.inputColumns };
    this.lastShape[method] = id;
    return id;
  }

  finish(): ResultBatch {
    const n = this.points.length;
    if (this.row !== n * this.methods) throw new Error(`internal: ${this.row} results for ${n} points of ${this.methods} methods`);
    const rows = this.row;
    return {
      points: this.points,
      methods: this.methods,
      columns: this.columns,
      values: this.values.map((v) => (rows === this.rows ? v : v.slice(0, rows))),
      shapes: this.shapes,
      shape: rows === this.rows ? this.shape : this.shape.slice(0, rows),
      flags: rows === this.rows ? this.flags : this.flags.slice(0, rows),
    };
  }
}

/** Rows as JSON text (the older batch form, still accepted from callers) → a ResultBatch. */
export function encodeJsonRows(batch: { points: number[]; inputs: string[]; outputs: string[]; flags: string[] }, methods: number): ResultBatch {
  const encoder = new ResultBatchEncoder(methods, batch.points.length);
  for (let i = 0; i < batch.points.length; i++) {
    encoder.addPoint(batch.points[i], JSON.parse(batch.inputs[i]) as Inputs);
    for (let m = 0, k = i * methods; m < methods; m++, k++) encoder.addResult(JSON.parse(batch.outputs[k]) as Outputs, JSON.parse(batch.flags[k]) as string[]);
  }
  return encoder.finish();
}

/** What a batch adds to a run's layout, and where its columns and shapes land. */
export interface LayoutMapping {
  /** Batch column → run column. */
  columns: number[];
  /** Batch shape → run shape. */
  shapes: number[];
  added: { columns: { idx: number; column: ResultColumn }[]; shapes: { idx: number; shape: ResultShape }[] };
}

/** The columns and shapes of one run, in the order they were first stored. */
export class RunLayout {
  readonly columns: ResultColumn[] = [];
  readonly shapes: ResultShape[] = [];
  private readonly columnIds = new Map<string, number>();
  private readonly shapeIds = new Map<string, number>();

  static from(columns: { idx: number; column: ResultColumn }[], shapes: { idx: number; shape: ResultShape }[]): RunLayout {
    const layout = new RunLayout();
    for (const c of [...columns].sort((a, b) => a.idx - b.idx)) {
      if (c.idx !== layout.columns.length) throw new Error(`internal: result columns are not numbered 0 … n (found ${c.idx})`);
      layout.addColumn(c.column);
    }
    for (const s of [...shapes].sort((a, b) => a.idx - b.idx)) {
      if (s.idx !== layout.shapes.length) throw new Error(`internal: result shapes are not numbered 0 … n (found ${s.idx})`);
      layout.addShape(s.shape);
    }
    return layout;
  }

  private addColumn(c: ResultColumn): number {
    const idx = this.columns.length;
    this.columns.push(c);
    this.columnIds.set(columnKey(c), idx);
    return idx;
  }

  private addShape(s: ResultShape): number {
    const idx = this.shapes.length;
    this.shapes.push(s);
    this.shapeIds.set(shapeKey(s), idx);
    return idx;
  }

  /** The batch's columns and shapes in this layout, or undefined when it has something new. */
  find(batch: Pick<ResultBatch, 'columns' | 'shapes'>): LayoutMapping | undefined {
    const columns: number[] = [];
    for (const c of batch.columns) {
      const id = this.columnIds.get(columnKey(c));
      if (id === undefined) return undefined;
      columns.push(id);
    }
    const shapes: number[] = [];
    for (const s of batch.shapes) {
      const id = this.shapeIds.get(shapeKey({ inputs: s.inputs.map((c) => columns[c]), outputs: s.outputs.map((c) => columns[c]) }));
      if (id === undefined) return undefined;
      shapes.push(id);
    }
    return { columns, shapes, added: { columns: [], shapes: [] } };
  }

  /** Like find, but adds what is new (and says what, for the writer to store). */
  merge(batch: Pick<ResultBatch, 'columns' | 'shapes'>): LayoutMapping {
    const added: LayoutMapping['added'] = { columns: [], shapes: [] };
    const columns = batch.columns.map((c) => {
      const id = this.columnIds.get(columnKey(c));
      if (id !== undefined) return id;
      const idx = this.addColumn({ role: c.role, name: c.name, kind: c.kind });
      added.columns.push({ idx, column: this.columns[idx] });
      return idx;
    });
    const shapes = batch.shapes.map((s) => {
      const mapped = { inputs: s.inputs.map((c) => columns[c]), outputs: s.outputs.map((c) => columns[c]) };
      const id = this.shapeIds.get(shapeKey(mapped));
      if (id !== undefined) return id;
      const idx = this.addShape(mapped);
      added.shapes.push({ idx, shape: mapped });
      return idx;
    });
    return { columns, shapes, added };
  }

  /** A row's inputs and outputs; `value(c)` gives the stored value of run column c. */
  decode(shape: number, value: (column: number) => unknown): { inputs: Inputs; outputs: Outputs } {
    const s = this.shapes[shape];
    if (!s) throw new Error(`internal: a result row names shape ${shape}, which its run does not have`);
    const inputs: Inputs = {};
    for (const c of s.inputs) {
      const col = this.columns[c];
      inputs[col.name] = decodeValue(col.kind, value(c)) as Inputs[string];
    }
    const outputs: Outputs = {};
    for (const c of s.outputs) {
      const col = this.columns[c];
      outputs[col.name] = decodeValue(col.kind, value(c)) as number;
    }
    return { inputs, outputs };
  }

  /** Whether two shapes have the same inputs (so rows of one point can share the object). */
  sameInputs(a: number, b: number): boolean {
    if (a === b) return true;
    const x = this.shapes[a].inputs;
    const y = this.shapes[b].inputs;
    return x.length === y.length && x.every((c, i) => c === y[i]);
  }

  /** The run column of a role, name and kind, if any. */
  column(role: ColumnRole, name: string, kind: ColumnKind = 'number'): number | undefined {
    return this.columnIds.get(columnKey({ role, kind, name }));
  }

  /** The run column holding a name's numbers (an output before an input of the same name), if any. */
  numberColumn(name: string): number | undefined {
    return this.column('output', name) ?? this.column('input', name);
  }

  /** Any column of a name (numbers first, outputs before inputs), for sorting by text too. */
  anyColumn(name: string): number | undefined {
    const n = this.numberColumn(name);
    if (n !== undefined) return n;
    for (const role of ['output', 'input'] as const) {
      for (const kind of ['string', 'boolean', 'json'] as const) {
        const id = this.column(role, name, kind);
        if (id !== undefined) return id;
      }
    }
    return undefined;
  }

  /** Input and output names, each sorted (byte order), as the dashboard lists them. */
  names(): { inputs: string[]; outputs: string[] } {
    const of = (role: ColumnRole) => [...new Set(this.columns.filter((c) => c.role === role).map((c) => c.name))].sort(byteOrder);
    return { inputs: of('input'), outputs: of('output') };
  }
}

function byteOrder(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
