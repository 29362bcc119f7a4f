import type { AppConfig } from './config';
import type { Db, Sqlite } from './db/client';
import type { Mailer } from './mail/mailer';
import type { WorkerPool } from './pool/pool';

// What services and routes are handed: no globals, so tests build their own
// (server/create-deps.ts builds them for the server, the tests and the benchmarks).
export type Deps = {
  db: Db;
  sqlite: Sqlite;
  config: AppConfig;
  mailer: Mailer;
  /** The worker pool every heavy task runs in, with its caps. */
  pool: WorkerPool;
  /** Optional: cached paged lists (bumped on every segment or survey write); server/segments/list-cache.ts. */
  listCache?: AgencyJsonCache;
};

/** JSON answers kept per agency and query; `bump` forgets all of an agency's after any change to it. */
export type AgencyJsonCache = {
  key(agencyId: string, query: unknown): string;
  get(key: string): string | undefined;
  set(key: string, json: string): void;
  bump(agencyId: string): void;
};
