import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from './schema';

export type Db = ReturnType<typeof openDb>['db'];
export type Sqlite = Database.Database;

const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../drizzle');

// Opens (creating if needed) the SQLite file, turns on WAL and foreign keys and
// applies the committed migrations.
export function openDb(file: string) {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const { db, sqlite } = connect(new Database(file));
  migrate(db, { migrationsFolder });
  return { db, sqlite };
}

function connect(sqlite: Database.Database) {
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('synchronous = NORMAL');
  return { db: drizzle(sqlite, { schema, casing: 'snake_case' }), sqlite };
}

/**
 * A second writer on an existing, migrated file: what worker threads write with. SQLite takes one write
 * transaction at a time, so a worker's transaction must stay short — the request thread waits for it.
 */
export function openWriteDb(file: string): Db {
  return connect(new Database(file, { fileMustExist: true })).db;
}

/** A read-only connection to an existing, migrated file: what worker threads read with. */
export function openReadOnlyDb(file: string): Db {
  const sqlite = new Database(file, { readonly: true, fileMustExist: true });
  sqlite.pragma('busy_timeout = 5000');
  return drizzle(sqlite, { schema, casing: 'snake_case' });
}
