// Import of a generated 50,000-row CSV end to end (HTTP upload → the worker pool: parse → validate → one
// transaction on the worker's connection), beside a bare better-sqlite3 insert loop of the same rows. Also:
// the longest the write lock was held at a stretch (what a request-thread write would have waited), and
// the request thread's longest event-loop stall during the import (it should only move bytes).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import Papa from 'papaparse';
import request from 'supertest';
import { createApp } from '../server/app';
import { loadConfig } from '../server/config';
import { createDeps } from '../server/create-deps';
import { seedDemo } from '../server/seed/seed';
import { syntheticCsv } from './synthetic-network';
import { probeWriteLock } from './write-lock-probe';

const N = Number(process.env.BENCH_ROWS ?? 50_000);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-bench-'));
const csv = syntheticCsv(N);
console.log(`generated ${N.toLocaleString('en-US')} rows, ${(csv.length / 1024 / 1024).toFixed(1)} MB`);

const config = loadConfig({
  NODE_ENV: 'test',
  DATABASE_PATH: path.join(dir, 'bench.db'),
  APP_URL: 'http://localhost:1',
});
const built = await createDeps(config, { mailCatcher: false });
const { db } = built.deps;
const ids = await seedDemo(db);
const { app } = createApp(built.deps);
const agent = request.agent(app);
await agent
  .post('/api/auth/sign-in/email')
  .set('Origin', 'http://localhost:1')
  .send({ email: 'engineer@marlow.example', password: 'wearcourse-demo' });

/** The longest the request thread (this process's event loop) went without a 5 ms timer firing. */
function loopStalls() {
  let last = performance.now();
  let longest = 0;
  const timer = setInterval(() => {
    const now = performance.now();
    longest = Math.max(longest, now - last - 5);
    last = now;
  }, 5);
  return () => {
    clearInterval(timer);
    return longest;
  };
}

global.gc?.();
const heap0 = process.memoryUsage().rss;
let stopLock = probeWriteLock(config.databasePath);
let stopLoop = loopStalls();
let t = performance.now();
const res = await agent
  .post(`/api/agencies/${ids.marlow}/imports`)
  .set('Origin', 'http://localhost:1')
  .attach('file', Buffer.from(csv), 'synthetic.csv');
const importMs = performance.now() - t;
const lockMs = stopLock();
const loopMs = stopLoop();
if (res.status !== 200) throw new Error(`import failed: ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`);
console.log(
  `Wearcourse import, end to end: ${importMs.toFixed(0)} ms (${(N / (importMs / 1000)).toFixed(0)} rows/s), added ${res.body.added}; RSS grew ${((process.memoryUsage().rss - heap0) / 1024 / 1024).toFixed(0)} MB`,
);
console.log(
  `  write lock held at most ${lockMs.toFixed(0)} ms at a stretch; request thread's longest stall ${loopMs.toFixed(0)} ms (it builds the multipart body here too)`,
);

stopLock = probeWriteLock(config.databasePath);
stopLoop = loopStalls();
t = performance.now();
const again = await agent
  .post(`/api/agencies/${ids.marlow}/imports`)
  .set('Origin', 'http://localhost:1')
  .field('dryRun', 'true')
  .attach('file', Buffer.from(csv), 'synthetic.csv');
console.log(
  `re-import dry run (all unchanged: ${again.body.unchanged}): ${(performance.now() - t).toFixed(0)} ms; write lock held at most ${stopLock().toFixed(0)} ms; request thread's longest stall ${stopLoop().toFixed(0)} ms`,
);

// Baseline: parse with papaparse and insert the same rows with one prepared statement, no checks.
const bare = new Database(path.join(dir, 'bare.db'));
bare.pragma('journal_mode = WAL');
bare.exec(
  'CREATE TABLE s (segment_id TEXT UNIQUE, road_name TEXT, from_desc TEXT, to_desc TEXT, length_mi REAL, width_ft REAL, lanes INT, functional_class TEXT, surface TEXT, adt INT, truck_pct REAL, pci REAL, pci_date TEXT, last_treatment TEXT, last_treatment_year INT, district TEXT, geometry TEXT)',
);
t = performance.now();
const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.slice(1);
const ins = bare.prepare('INSERT INTO s VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?,?)');
bare.transaction(() => {
  for (const r of parsed) ins.run(...r);
})();
const bareMs = performance.now() - t;
console.log(
  `bare parse + better-sqlite3 insert loop: ${bareMs.toFixed(0)} ms (${(N / (bareMs / 1000)).toFixed(0)} rows/s)`,
);
console.log(
  `ratio: Wearcourse import takes ${(importMs / bareMs).toFixed(1)}× the bare loop (it validates, reprojects, measures, diffs, writes history and surveys)`,
);
bare.close();
await built.close();
fs.rmSync(dir, { recursive: true, force: true });
process.exit(0);
