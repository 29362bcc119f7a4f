import type { Server } from 'node:http';
import { createApp } from './app';
import { DEMO_PASSWORD } from './auth/passwords';
import type { AppConfig } from './config';
import { createDeps } from './create-deps';
import type { Deps } from './deps';
import type { MailCatcher } from './mail/catcher';
import { DEMO_ACCOUNTS, hasAnyAgency, seedDemo } from './seed/seed';

export type Running = {
  server: Server;
  deps: Deps;
  url: string;
  catcher: MailCatcher | null;
  stop: () => Promise<void>;
};

/** Opens the database, seeds the demo on a fresh file, starts the catcher and listens. */
export async function startWearcourse(config: AppConfig, log = console.log): Promise<Running> {
  const built = await createDeps(config);
  const { deps, catcher } = built;
  let seeded = false;
  if (config.seedDemo && !hasAnyAgency(deps.db)) {
    await seedDemo(deps.db);
    seeded = true;
  }
  if (built.interruptedRuns)
    log(
      `${built.interruptedRuns} run(s) left running by an earlier stop are marked failed (interrupted by a restart).`,
    );
  const { app } = createApp(deps);
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const url = `http://localhost:${port}`;
  // With PORT=0 the real port is known only now; links in mail must use it.
  if (config.appUrlFromPort) config.appUrl = url;
  log(`Wearcourse is running at ${url}  (database ${config.databasePath}${seeded ? ', demo seeded' : ''})`);
  log(
    catcher
      ? `Mail goes to the local catcher on 127.0.0.1:${catcher.port}; admins read it under "Sent mail".`
      : 'Mail goes to SMTP_URL.',
  );
  if (config.env !== 'production' && config.seedDemo) {
    log(`Demo accounts (password ${DEMO_PASSWORD}):`);
    for (const a of DEMO_ACCOUNTS) log(`  ${a.email.padEnd(28)} ${a.note}`);
  }
  const stop = async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await built.close();
  };
  return { server, deps, url, catcher, stop };
}
