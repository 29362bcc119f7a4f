// Load on loopback with autocannon: a mix of sign-ins, paged lists, the map
// GeoJSON and LCCA evaluations (with a plan run going) at 50 connections,
// then paged lists alone for their p99. Goal: no errors, p99 ≤ 50 ms for paged lists.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { startServerProcess } from '../tests/helpers/server-process';

const SECONDS = Number(process.env.LOAD_SECONDS ?? 60);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-load-'));
const started = await startServerProcess({ DATABASE_PATH: path.join(dir, 'load.db'), SIGNIN_RATE_LIMIT: '1000000' });
const server = started.child;
const url = started.url.replace('localhost', '127.0.0.1');
const origin = url.replace('127.0.0.1', 'localhost');
const signIn = await fetch(`${url}/api/auth/sign-in/email`, {
  method: 'POST',
  headers: { 'Content-Type': 'application/json', Origin: origin },
  body: JSON.stringify({ email: 'engineer@brannock.example', password: 'wearcourse-demo' }),
});
const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
const me = (await signIn.json()) as { memberships: { agencyId: string; agencyName: string }[] };
const agencyId = me.memberships.find((m) => m.agencyName === 'Brannock County')!.agencyId;
const headers = { cookie, origin, 'content-type': 'application/json' };

// A plan run in the background while the load runs.
const plan = (await (
  await fetch(`${url}/api/agencies/${agencyId}/plans`, {
    method: 'POST',
    headers,
    body: JSON.stringify({
      name: 'load',
      settings: { startYear: 2027, horizonYears: 10, budgetMode: 'flat', annualBudget: 2_400_000, method: 'fast' },
    }),
  })
).json()) as { id: string };
await fetch(`${url}/api/agencies/${agencyId}/plans/${plan.id}/run`, { method: 'POST', headers });

const evaluateBody = JSON.stringify({
  discountRate: 0.03,
  analysisPeriodYears: 40,
  alternatives: [
    {
      name: 'A',
      activities: [
        { year: 0, cost: 1e6, serviceLifeYears: 15 },
        { year: 15, cost: 4e5, serviceLifeYears: 12 },
      ],
    },
  ],
});
const signInBody = JSON.stringify({ email: 'viewer@brannock.example', password: 'wearcourse-demo' });

function run(opts: autocannon.Options) {
  return new Promise<autocannon.Result>((resolve, reject) =>
    autocannon(opts, (err, res) => (err ? reject(err) : resolve(res))),
  );
}
const report = (label: string, r: autocannon.Result) =>
  console.log(
    `${label}: ${r.requests.total.toLocaleString('en-US')} requests in ${r.duration} s (${Math.round(r.requests.average)} req/s), latency p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, errors ${r.errors}, timeouts ${r.timeouts}, non-2xx ${r.non2xx}`,
  );

const mixed = await run({
  url,
  connections: 50,
  duration: SECONDS,
  requests: [
    { method: 'GET', path: `/api/agencies/${agencyId}/segments?limit=100&offset=200&sort=pci`, headers },
    { method: 'GET', path: `/api/agencies/${agencyId}/segments?limit=100&q=Road&class=local`, headers },
    { method: 'POST', path: '/api/lcca/evaluate', headers, body: evaluateBody },
    { method: 'GET', path: `/api/agencies/${agencyId}/segments.geojson?class=minor_arterial`, headers },
    {
      method: 'POST',
      path: '/api/auth/sign-in/email',
      headers: { 'content-type': 'application/json', origin },
      body: signInBody,
    },
  ],
});
report(`mixed load, 50 connections, ${SECONDS} s`, mixed);
const lists = await run({
  url,
  connections: 50,
  duration: Math.max(10, Math.round(SECONDS / 4)),
  requests: [{ method: 'GET', path: `/api/agencies/${agencyId}/segments?limit=100&offset=300`, headers }],
});
report('paged lists alone, 50 connections', lists);
console.log(
  `goal: no errors and p99 ≤ 50 ms for paged lists → ${mixed.errors + mixed.non2xx + lists.errors + lists.non2xx === 0 && lists.latency.p99 <= 50 ? 'met' : 'NOT met'}`,
);
server.kill('SIGTERM');
fs.rmSync(dir, { recursive: true, force: true });
process.exit(0);
