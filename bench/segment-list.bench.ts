// Paged segment list on the demo county: time per request, in process.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../server/app';
import { loadConfig } from '../server/config';
import { createDeps } from '../server/create-deps';
import { seedDemo } from '../server/seed/seed';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-bench-'));
const config = loadConfig({
  NODE_ENV: 'test',
  DATABASE_PATH: path.join(dir, 'bench.db'),
  APP_URL: 'http://localhost:1',
});
const built = await createDeps(config, { mailCatcher: false });
const { db } = built.deps;
// The query path itself, not the list cache (npm run bench load measures the cached answers).
built.deps.listCache = undefined;
let t = performance.now();
const ids = await seedDemo(db);
console.log(`seed demo agencies: ${(performance.now() - t).toFixed(0)} ms`);
const { app } = createApp(built.deps);
const agent = request.agent(app);
await agent
  .post('/api/auth/sign-in/email')
  .set('Origin', 'http://localhost:1')
  .send({ email: 'viewer@brannock.example', password: 'wearcourse-demo' });
const N = 300;
const times: number[] = [];
for (let i = 0; i < N; i++) {
  t = performance.now();
  const res = await agent.get(`/api/agencies/${ids.brannock}/segments?limit=100&offset=${(i * 100) % 1200}&sort=pci`);
  if (res.status !== 200) throw new Error(`status ${res.status}`);
  times.push(performance.now() - t);
}
times.sort((a, b) => a - b);
const q = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))].toFixed(2);
console.log(`GET segments?limit=100 (${N} requests, in process): p50 ${q(0.5)} ms, p99 ${q(0.99)} ms`);
await built.close();
fs.rmSync(dir, { recursive: true, force: true });
process.exit(0);
