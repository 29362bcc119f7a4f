// Heavy work in the worker pool, proved by ordering (never by timing): the
// request thread answers while a heavy task runs, the caps answer 429 with
// Retry-After, cancel stops a run, runs are agency-scoped, and a restart turns
// a cut-off run into "failed: interrupted" instead of a 404.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticOptimizeBody } from '../../bench/synthetic-network';
import { APP_URL, createTestApp, type TestApp } from '../helpers/test-app';
import { until } from '../helpers/until';

type Client = Awaited<ReturnType<TestApp['as']>>;
const INTERRUPTED = 'interrupted by a server restart — run it again';

async function pollToEnd(c: Client, agencyId: string, runId: string) {
  let body: { status: string } = { status: 'running' };
  await until(async () => {
    body = (await c.get(`/api/agencies/${agencyId}/runs/${runId}`)).body;
    return body.status !== 'running';
  }, `run ${runId} ends`);
  return body as { status: string; result: unknown; error: { message: string } | null };
}

// An exact optimisation that runs to its 1-second time limit (HiGHS cannot close this model that fast).
const hardOptimize = () => syntheticOptimizeBody(1000, 4, 5, 1);
const planSettings = { startYear: 2027, horizonYears: 20, budgetMode: 'flat', annualBudget: 3_000_000, method: 'fast' };

describe('the worker pool and its caps', () => {
  let t: TestApp;
  let A: string;
  let B: string;
  beforeAll(async () => {
    t = await createTestApp({ signInRateLimit: 1000, workers: { threads: 2, perAgency: 1, perUser: 1 } });
    A = t.ids.brannock;
    B = t.ids.marlow;
  });
  afterAll(() => t.close());

  it('/api/health answers while an exact optimise runs; the viewer cannot start a second heavy task', {
    timeout: 60_000,
  }, async () => {
    const viewer = await t.as('viewer@brannock.example');
    let answered = false;
    const pending = viewer
      .post('/api/plan/optimize')
      .send(hardOptimize())
      .then((r) => {
        answered = true;
        return r;
      });
    await until(() => t.deps.pool.busy === 1, 'the optimisation takes its slot');
    const health = await t.anonymous().get('/api/health');
    expect(health.status).toBe(200);
    expect(health.body).toEqual({ ok: true });
    expect(answered).toBe(false);

    const second = await viewer.get(`/api/agencies/${A}/segments/export?format=csv`);
    expect(second.status).toBe(429);
    expect(second.headers['retry-after']).toBe('10');
    expect(second.body.error.message).toMatch(/^You already have 1 heavy task going .* try again\.$/);
    expect(answered).toBe(false);

    const res = await pending;
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ method: 'exact', status: expect.stringMatching(/time limit/) });
    expect(t.deps.pool.busy).toBe(0);
    expect((await viewer.get(`/api/agencies/${A}/segments/export?format=csv`)).status).toBe(200);
  });

  it('global cap: with every worker busy, a third person is told the server is busy', { timeout: 60_000 }, async () => {
    const engA = await t.as('engineer@brannock.example');
    const engB = await t.as('engineer@marlow.example');
    const first = engA
      .post('/api/plan/optimize')
      .send(hardOptimize())
      .then((r) => r);
    const second = engB
      .post('/api/plan/optimize')
      .send(hardOptimize())
      .then((r) => r);
    await until(() => t.deps.pool.busy === 2, 'both optimisations take a slot');
    const third = await (await t.as('consultant@example.com'))
      .post('/api/plan/optimize')
      .send({ budgets: [10], method: 'fast', segments: [] });
    expect(third.status).toBe(429);
    expect(third.headers['retry-after']).toBe('10');
    expect(third.body.error).toMatchObject({
      code: 'too_busy',
      message: expect.stringMatching(/server is busy: all 2/),
    });
    expect((await first).status).toBe(200);
    expect((await second).status).toBe(200);
  });

  // A budget search runs the whole plan a few dozen times (a scan, then bisection to $1,000): it holds its
  // slot for many seconds on the demo county, long past the requests below.
  it('per-agency cap: a budget search holds its agency’s slot until cancelled; other agencies cannot see it', {
    timeout: 60_000,
  }, async () => {
    const eng = await t.as('engineer@brannock.example');
    const admin = await t.as('admin@brannock.example');
    const plan = await eng.post(`/api/agencies/${A}/plans`).send({ name: 'held', settings: planSettings });
    const started = await eng.post(`/api/agencies/${A}/plans/${plan.body.id}/budget-search`).send({ targetPci: 45 });
    expect(started.status).toBe(202);
    expect(started.body).toMatchObject({
      kind: 'budget-search',
      subjectId: plan.body.id,
      status: 'running',
      error: null,
    });
    const runUrl = `/api/agencies/${A}/runs/${started.body.id}`;

    const refused = await admin.get(`/api/agencies/${A}/export`);
    expect(refused.status).toBe(429);
    expect(refused.headers['retry-after']).toBe('10');
    expect(refused.body.error.message).toMatch(
      /^This agency already has 1 heavy task going, the most one agency can run at once\./,
    );
    // Another agency's work goes on (the global cap has room).
    expect((await (await t.as('admin@marlow.example')).get(`/api/agencies/${B}/export`)).status).toBe(200);

    // Another agency cannot poll or cancel the run; a viewer of its own agency may not either.
    const marlow = await t.as('engineer@marlow.example');
    expect((await marlow.get(`/api/agencies/${B}/runs/${started.body.id}`)).status).toBe(404);
    expect((await marlow.post(`/api/agencies/${B}/runs/${started.body.id}/cancel`)).status).toBe(404);
    expect((await marlow.get(runUrl)).status).toBe(404);
    expect((await (await t.as('viewer@brannock.example')).get(runUrl)).status).toBe(403);
    expect((await eng.get(runUrl)).body.status).toBe('running');

    const cancelled = await eng.post(`${runUrl}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.body).toMatchObject({ status: 'cancelled', endedAt: expect.any(String) });
    await until(() => t.deps.pool.busy === 0, 'the cancelled run frees its slot');
    expect((await eng.get(runUrl)).body).toMatchObject({ status: 'cancelled', result: null });
    expect((await admin.get(`/api/agencies/${A}/export`)).status).toBe(200);
  });

  it('a request that goes away frees its slot', async () => {
    const eng = await t.as('engineer@brannock.example');
    const req = eng.post('/api/plan/optimize').send(hardOptimize());
    const settled = req.then(
      () => 'answered',
      () => 'aborted',
    );
    await until(() => t.deps.pool.busy === 1, 'the optimisation takes its slot');
    req.abort();
    await until(() => t.deps.pool.busy === 0, 'the slot is freed');
    expect(await Promise.race([settled, Promise.resolve('still pending')])).not.toBe('answered');
  });

  it('sign-in checks the password outside the heavy pool: with every heavy slot taken it still answers', async () => {
    const held = [
      t.deps.pool.reserve({ userId: 'held-1', agencyId: null }),
      t.deps.pool.reserve({ userId: 'held-2', agencyId: null }),
    ];
    try {
      expect(t.deps.pool.busy).toBe(2);
      const signIn = (password: string) =>
        t
          .anonymous()
          .post('/api/auth/sign-in/email')
          .set('Origin', APP_URL)
          .send({ email: 'engineer@marlow.example', password });
      const right = await signIn('wearcourse-demo');
      expect(right.status).toBe(200);
      expect(right.headers['set-cookie']?.[0]).toMatch(/^wearcourse\.sid=/);
      const wrong = await signIn('not-the-password');
      expect(wrong.status).toBe(401);
      expect(wrong.body.error.message).toBe('Wrong e-mail or password');
      // The heavy pool was never asked: its slots are the two held here.
      expect(t.deps.pool.busy).toBe(2);
    } finally {
      for (const s of held) s.release();
    }
  });

  it('the old poll URLs are gone, and the runs endpoint is documented with its schema and 429', async () => {
    const eng = await t.as('engineer@brannock.example');
    expect((await eng.get(`/api/agencies/${A}/jobs/x`)).body.error.message).toBe('No such API route');
    expect((await eng.get(`/api/agencies/${A}/analyses/runs/x`)).status).toBe(404);
    const doc = (await t.anonymous().get('/api/openapi.json')).body;
    const poll = doc.paths['/api/agencies/{agencyId}/runs/{runId}'].get;
    expect(Object.keys(poll.responses['200'].content['application/json'].schema.properties)).toEqual(
      expect.arrayContaining(['id', 'kind', 'status', 'progress', 'error', 'result']),
    );
    expect(doc.paths['/api/agencies/{agencyId}/runs/{runId}/cancel'].post).toBeDefined();
    expect(doc.paths['/api/plan/optimize'].post.responses['429'].headers['Retry-After']).toBeDefined();
    expect(doc.paths['/api/agencies/{agencyId}/plans/{planId}/brief.pdf'].get.responses['429']).toBeDefined();
  });
});

describe('runs across a restart', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-restart-'));
  const databasePath = path.join(dir, 'restart.db');
  const workers = { threads: 4, perAgency: 4, perUser: 4 };
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('runs cut off by a restart poll as failed with a message; finished ones keep their result', {
    timeout: 180_000,
  }, async () => {
    const t1 = await createTestApp({ workers }, { databasePath });
    const A = t1.ids.brannock;
    const eng = await t1.as('engineer@brannock.example');
    const catalog = (await eng.get(`/api/agencies/${A}/catalog`)).body as {
      treatments: { id: string; name: string }[];
    };
    const tr = (n: string) => catalog.treatments.find((x) => x.name === n)!.id;
    const segmentIds = (await eng.get(`/api/agencies/${A}/segments?limit=1000`)).body.items.map(
      (s: { id: number }) => s.id,
    );
    const comparison = (iterations: number) => ({
      group: { label: 'All', segmentIds, areaSy: 1, laneMiles: 1, centrelineMiles: 1, segments: [] },
      alternatives: (iterations > 1000
        ? [
            'Crack seal',
            'Chip seal',
            'Micro-surfacing',
            'Thin overlay',
            'Mill and overlay (2 in)',
            'Structural overlay (3 in)',
          ]
        : ['Crack seal', 'Chip seal']
      ).map((name) => ({ name, initial: { treatmentId: tr(name) } })),
      risk: { iterations, seed: 5 },
    });
    const finished = await eng.post(`/api/agencies/${A}/analyses/runs`).send(comparison(200));
    const done = await pollToEnd(eng, A, finished.body.id);
    expect(done.status).toBe('done');

    const plan = await eng.post(`/api/agencies/${A}/plans`).send({ name: 'cut off', settings: planSettings });
    // Each kind in turn: start it, and from the moment it is answered hold SQLite's write lock on a
    // connection of this test's own, so the run cannot write its result (reads go on: the database is in
    // WAL mode); stop the server with the run going, then start it again on the same file.
    const starts: [string, (c: Client) => Promise<{ body: { id: string; kind: string } }>][] = [
      [
        'budget-search',
        (c) => c.post(`/api/agencies/${A}/plans/${plan.body.id}/budget-search`).send({ targetPci: 45 }),
      ],
      ['comparison', (c) => c.post(`/api/agencies/${A}/analyses/runs`).send(comparison(20_000))],
      ['plan', (c) => c.post(`/api/agencies/${A}/plans/${plan.body.id}/run`)],
    ];
    let app = t1;
    let client = eng;
    const cutOff: { id: string; kind: string }[] = [];
    for (const [kind, start] of starts) {
      await client.get('/api/me');
      const started = await start(client);
      const lock = new Database(databasePath);
      lock.exec('BEGIN IMMEDIATE');
      try {
        expect(started.body.kind).toBe(kind);
        expect((await client.get(`/api/agencies/${A}/runs/${started.body.id}`)).body.status, kind).toBe('running');
        await app.close();
      } finally {
        lock.exec('ROLLBACK');
        lock.close();
      }
      cutOff.push(started.body);
      app = await createTestApp({ workers }, { databasePath });
      expect(app.interruptedRuns, kind).toBe(1);
      client = await app.as('engineer@brannock.example');
    }
    const t2 = app;
    try {
      const again = client;
      for (const r of cutOff) {
        const polled = await again.get(`/api/agencies/${A}/runs/${r.id}`);
        expect(polled.status, r.kind).toBe(200);
        expect(polled.body, r.kind).toMatchObject({ status: 'failed', error: { message: INTERRUPTED }, result: null });
      }
      expect((await again.get(`/api/agencies/${A}/plans/${plan.body.id}`)).body.lastRun.status).toBe('failed');
      const kept = await again.get(`/api/agencies/${A}/runs/${finished.body.id}`);
      expect(kept.body.status).toBe('done');
      expect(kept.body.result).toEqual(done.result);
      // The finished run can still be saved with its snapshot after the restart.
      const saved = await again.post(`/api/agencies/${A}/analyses`).send({ name: 'Kept', runId: finished.body.id });
      expect(saved.status).toBe(201);
      expect((await again.get(`/api/agencies/${A}/analyses/${saved.body.id}`)).body.result).toEqual(done.result);
    } finally {
      await t2.close();
    }
  });
});
