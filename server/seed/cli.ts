// npm run seed [-- --reset]: seeds the demo agencies into DATABASE_PATH.
import { loadConfig } from '../config';
import { openDb } from '../db/client';
import { DEMO_ACCOUNTS, hasAnyAgency, seedDemo, wipe } from './seed';
import { DEMO_PASSWORD } from '../auth/passwords';

const config = loadConfig();
const { db, sqlite } = openDb(config.databasePath);
const reset = process.argv.includes('--reset');
if (reset) wipe(sqlite);
if (hasAnyAgency(db)) {
  console.log(`${config.databasePath} already has agencies; use --reset to rebuild the demo.`);
} else {
  await seedDemo(db);
  console.log(`Seeded the demo agencies into ${config.databasePath}. Demo accounts (password ${DEMO_PASSWORD}):`);
  for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(28)} ${a.note}`);
}
sqlite.close();
