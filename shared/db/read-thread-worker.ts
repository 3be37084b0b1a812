// The worker side of read-thread.ts: read-only statements on a private SQLite
// connection per database file, so a long read never holds the server's event loop.
// Read-only: this connection can never write, and in WAL mode it neither blocks the
// writer (the CLI, the server's own connection) nor waits for it.
import BetterSqlite3 from 'better-sqlite3';
import { BUSY_TIMEOUT_MS } from './busy.js';

export interface ReadTask {
  path: string;
  sql: string;
  params: unknown[];
}

const connections = new Map<string, BetterSqlite3.Database>();

function connection(path: string): BetterSqlite3.Database {
  let db = connections.get(path);
  if (!db) {
    db = new BetterSqlite3(path, { readonly: true, fileMustExist: true, timeout: BUSY_TIMEOUT_MS });
    connections.set(path, db);
  }
  return db;
}

export default function read({ path, sql, params }: ReadTask): unknown[] {
  return connection(path).prepare(sql).all(...params);
}
