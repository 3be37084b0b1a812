// Rows in slices for the streamed exports (stream.ts): where they come from (memory here,
// the database in shared/db/run-rows.ts), what a text format does with a slice, and the
// pump that hands slices to a format with backpressure and a turn of the event loop between.
import type { Writable } from 'node:stream';
import { setImmediate as nextTurn } from 'node:timers/promises';
import type { ExportRow } from './types.js';
import { ColumnCollector } from './table.js';

/** Rows an export can read more than once, a slice at a time. */
export interface RowSource {
  chunks(): AsyncIterable<readonly ExportRow[]>;
}

/** A text format, a slice at a time: head, then rows of each slice in order, then tail. */
export interface RowEncoder {
  head(): string;
  rows(chunk: readonly ExportRow[]): string;
  tail(): string;
}

export const MEMORY_CHUNK = 2000;

/** Rows already in memory, as a source. */
export function rowsOf(rows: readonly ExportRow[], chunk = MEMORY_CHUNK): RowSource {
  return {
    async *chunks() {
      for (let i = 0; i < rows.length; i += chunk) yield rows.slice(i, i + chunk);
    },
  };
}

/** The output went away (the client closed the connection): stop reading. */
export class OutputClosedError extends Error {
  constructor(message = 'the export was abandoned: its output closed') {
    super(message);
    this.name = 'OutputClosedError';
  }
}

/**
 * How long the output may refuse more data before the export gives up: a reader that
 * stops reading must not hold an export (and its slot on the server) for ever.
 */
export const STALL_TIMEOUT_MS = 60_000;

/** Waits until the output wants more (or fails when it closed meanwhile, or took nothing for STALL_TIMEOUT_MS). */
export function drained(out: Writable, stallMs = STALL_TIMEOUT_MS): Promise<void> {
  if (out.destroyed || out.writableEnded) return Promise.reject(new OutputClosedError());
  if (!out.writableNeedDrain) return Promise.resolve();
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => done(new OutputClosedError(`the export was abandoned: its reader took nothing for ${stallMs / 1000} s`)), stallMs);
    const done = (e?: Error) => {
      clearTimeout(timer);
      out.off('drain', onDrain);
      out.off('close', onClose);
      out.off('error', done);
      if (e) reject(e);
      else resolve();
    };
    const onDrain = () => done();
    const onClose = () => done(new OutputClosedError());
    out.on('drain', onDrain);
    out.on('close', onClose);
    out.on('error', done);
  });
}

/** For each slice: handle it, wait for the output to take it, give the event loop a turn. */
export async function pumpRows(source: RowSource, out: Writable, handle: (chunk: readonly ExportRow[]) => void): Promise<void> {
  for await (const chunk of source.chunks()) {
    handle(chunk);
    await drained(out);
    await nextTurn();
  }
}

/** Every column of the rows (one pass over the source). */
export async function collectColumns(source: RowSource): Promise<ColumnCollector> {
  const seen = new ColumnCollector();
  for await (const chunk of source.chunks()) {
    seen.add(chunk);
    await nextTurn();
  }
  return seen;
}

