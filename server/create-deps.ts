// The one place Deps are built: the server (main.ts), the tests
// (tests/helpers/test-app.ts) and the benchmarks all call createDeps.
import type { AppConfig } from './config';
import { openDb } from './db/client';
import type { Deps } from './deps';
import { type MailCatcher, startMailCatcher } from './mail/catcher';
import { createMailer } from './mail/mailer';
import { WorkerPool } from './pool/pool';
import { recoverRuns } from './runs/runs.service';
import { ListCache } from './segments/list-cache';

export type DepsOptions = {
  /** Start the local mail catcher when no SMTP_URL is set (default true; benchmarks that send no mail skip it). */
  mailCatcher?: boolean;
  /** Log each caught message (default: outside tests). */
  logMail?: boolean;
};

export type Built = {
  deps: Deps;
  catcher: MailCatcher | null;
  /** Runs found running at start (cut off by a stop) and now marked failed. */
  interruptedRuns: number;
  close: () => Promise<void>;
};

export async function createDeps(config: AppConfig, opts: DepsOptions = {}): Promise<Built> {
  const { db, sqlite } = openDb(config.databasePath);
  const catcher =
    config.smtpUrl || opts.mailCatcher === false
      ? null
      : await startMailCatcher(db, config.mailCatcherPort, opts.logMail ?? config.env !== 'test');
  const mailer = createMailer({ smtpUrl: config.smtpUrl, catcherPort: catcher?.port, from: config.mailFrom });
  const pool = new WorkerPool(config.workers, config.databasePath);
  const deps: Deps = { db, sqlite, config, mailer, pool, listCache: new ListCache() };
  // No worker survives a stop: what was running then is marked failed before anyone can poll it.
  const { interrupted } = recoverRuns(deps);
  const close = async () => {
    await pool.close();
    await catcher?.close();
    mailer.close();
    sqlite.close();
  };
  return { deps, catcher, interruptedRuns: interrupted, close };
}
