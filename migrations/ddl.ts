// DDL pieces by dialect, for the migrations (and for shared/db, which imports migrations/
// anyway to apply them). This module imports only Kysely, so migrations/ never imports
// shared/db/ and the two do not import each other in a circle.
import { PostgresAdapter, sql, type ColumnDefinitionBuilder, type CreateTableBuilder, type Kysely } from '#kysely';

export function isPostgres(db: Kysely<any>): boolean {
  return db.getExecutor().adapter instanceof PostgresAdapter;
}

export const ddl = {
  jsonType(db: Kysely<any>): 'blob' | 'json' {
    return isPostgres(db) ? 'json' : 'blob';
  },
  /** An integer key the database numbers itself (SQLite AUTOINCREMENT, PostgreSQL identity). */
  autoId(db: Kysely<any>): (c: ColumnDefinitionBuilder) => ColumnDefinitionBuilder {
    return isPostgres(db) ? (c) => c.primaryKey().generatedByDefaultAsIdentity() : (c) => c.primaryKey().autoIncrement();
  },
  /** Type of a row-numbering key: SQLite's rowid is `integer` (64-bit); PostgreSQL needs `bigint`. */
  rowIdType(db: Kysely<any>): 'integer' | 'bigint' {
    return isPostgres(db) ? 'bigint' : 'integer';
  },
  /** An integer key that is SQLite's rowid (no AUTOINCREMENT table), an identity on PostgreSQL. */
  rowId(db: Kysely<any>): (c: ColumnDefinitionBuilder) => ColumnDefinitionBuilder {
    return isPostgres(db) ? (c) => c.primaryKey().generatedByDefaultAsIdentity() : (c) => c.primaryKey();
  },
  /** SQLite's WITHOUT ROWID (a table clustered on its primary key); PostgreSQL has no such thing. */
  clustered<T extends string, C extends string>(db: Kysely<any>, table: CreateTableBuilder<T, C>): CreateTableBuilder<T, C> {
    return isPostgres(db) ? table : table.modifyEnd(sql`without rowid`);
  },
};
