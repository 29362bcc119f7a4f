// A real app for API tests: a temporary SQLite file, the demo seed, and the
// real mail catcher on a free loopback port. Nothing is mocked.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { desc, eq } from 'drizzle-orm';
import request from 'supertest';
import { createApp } from '../../server/app';
import { DEMO_PASSWORD } from '../../server/auth/passwords';
import { loadConfig, type AppConfig } from '../../server/config';
import { createDeps } from '../../server/create-deps';
import { agencies, caughtMail } from '../../server/db/schema';
import { hasAnyAgency, seedDemo } from '../../server/seed/seed';

export const APP_URL = 'http://localhost:3999';

export type TestApp = Awaited<ReturnType<typeof createTestApp>>;

/**
 * opts.databasePath: use this file and leave it in place (the caller removes it); opening it a second time
 * is a restart — the demo is seeded only into an empty file.
 */
export async function createTestApp(
  overrides: Partial<AppConfig> = {},
  opts: { seed?: boolean; databasePath?: string } = {},
) {
  const dir = opts.databasePath ? null : fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-test-'));
  const config: AppConfig = {
    ...loadConfig({
      NODE_ENV: 'test',
      APP_URL,
      DATABASE_PATH: opts.databasePath ?? path.join(dir!, 'test.db'),
      MAIL_CATCHER_PORT: '0',
    }),
    ...overrides,
  };
  const built = await createDeps(config, { logMail: false });
  const { deps } = built;
  const { db, sqlite } = deps;
  const byName = (name: string) => db.select().from(agencies).where(eq(agencies.name, name)).get()?.id ?? '';
  const ids =
    opts.seed === false
      ? { brannock: '', marlow: '' }
      : hasAnyAgency(db)
        ? { brannock: byName('Brannock County'), marlow: byName('City of Marlow') }
        : await seedDemo(db);
  const { app, routes } = createApp(deps);

  /** A signed-in client that sends the Origin header like a browser would. */
  async function as(email: string, password = DEMO_PASSWORD) {
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/sign-in/email').set('Origin', APP_URL).send({ email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return client(agent);
  }

  function client(agent: ReturnType<typeof request.agent> | ReturnType<typeof request>) {
    const withOrigin = <T extends { set: (k: string, v: string) => T }>(r: T) => r.set('Origin', APP_URL);
    return {
      agent,
      get: (url: string) => agent.get(url),
      post: (url: string) => withOrigin(agent.post(url)),
      patch: (url: string) => withOrigin(agent.patch(url)),
      put: (url: string) => withOrigin(agent.put(url)),
      delete: (url: string) => withOrigin(agent.delete(url)),
    };
  }

  const anonymous = () => client(request.agent(app));

  function lastMailTo(email: string) {
    return db.select().from(caughtMail).where(eq(caughtMail.toAddress, email)).orderBy(desc(caughtMail.id)).get();
  }

  async function close() {
    await built.close();
    if (dir) fs.rmSync(dir, { recursive: true, force: true });
  }

  const agencyIdByName = (name: string) => db.select().from(agencies).where(eq(agencies.name, name)).get()!.id;

  return {
    app,
    routes,
    deps,
    db,
    sqlite,
    config,
    ids,
    as,
    anonymous,
    lastMailTo,
    close,
    agencyIdByName,
    interruptedRuns: built.interruptedRuns,
  };
}

export function tokenFrom(text: string, kind: 'invite' | 'reset-password') {
  const m = text.match(new RegExp(`/${kind}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${kind} link in mail: ${text}`);
  return m[1];
}
