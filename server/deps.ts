import type { AppConfig } from './config';
import type { Db, Sqlite } from './db/client';
import type { Mailer } from './mail/mailer';
import type { WorkerPool } from './pool/pool';
import type { ListCache } from './segments/list-cache';

// What services and routes are handed: no globals, so tests build their own
// (server/create-deps.ts builds them for the server, the tests and the benchmarks).
export type Deps = {
  db: Db;
  sqlite: Sqlite;
  config: AppConfig;
  mailer: Mailer;
  /** The worker pool every heavy task runs in, with its caps. */
  pool: WorkerPool;
  /** Optional: cached paged lists (bumped on every segment or survey write). */
  listCache?: ListCache;
};
