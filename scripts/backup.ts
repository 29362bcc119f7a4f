// npm run backup [-- <file>]: a consistent copy of the whole database while the
// server runs, through SQLite's online backup API (better-sqlite3's db.backup).
import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { loadConfig } from '../server/config';

const config = loadConfig();
if (!fs.existsSync(config.databasePath)) {
  console.error(`No database at ${config.databasePath}`);
  process.exit(1);
}
const stamp = new Date().toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
const dest = path.resolve(
  process.argv[2] ?? path.join(path.dirname(config.databasePath), 'backups', `wearcourse-${stamp}.db`),
);
fs.mkdirSync(path.dirname(dest), { recursive: true });
const db = new Database(config.databasePath, { readonly: true, fileMustExist: true });
db.pragma('busy_timeout = 5000');
await db.backup(dest);
db.close();
const check = new Database(dest, { readonly: true });
const ok = check.pragma('integrity_check', { simple: true });
check.close();
console.log(
  `Backed up ${config.databasePath} to ${dest} (${(fs.statSync(dest).size / 1024 / 1024).toFixed(1)} MB, integrity ${ok}).`,
);
if (ok !== 'ok') process.exit(1);
