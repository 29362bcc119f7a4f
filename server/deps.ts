import type { AppConfig } from './config';
import type { Db, Sqlite } from './db/client';
import type { JobRunner } from './jobs/job-runner';
import type { Mailer } from './mail/mailer';
import type { ListCache } from './segments/list-cache';

// What services and routes are handed: no globals, so tests build their own.
export type Deps = {
  db: Db;
  sqlite: Sqlite;
  config: AppConfig;
  mailer: Mailer;
  jobs: JobRunner;
  /** Optional: cached paged lists (bumped on every segment or survey write). */
  listCache?: ListCache;
};
