// Publishing freezes a version: its name, settings, pinned run and brief. Editing a published
// plan opens the next version as a draft; viewers keep the published one until it is republished.
// Real SQLite file, real worker pool, real SMTP catcher (tests/helpers/test-app.ts).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type AnyPlanResult, headline } from '../../shared/plan-headline';
import { parseDollars } from '../../shared/schemas/plans';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let viewer: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  viewer = await t.as('viewer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/plans`;
});
afterAll(() => t.close());

const settings = (over: Record<string, unknown> = {}) => ({
  startYear: 2027,
  horizonYears: 4,
  budgetMode: 'flat',
  annualBudget: 1_850_000,
  method: 'fast',
  ...over,
});

async function waitRun(id: string) {
  for (let i = 0; i < 600; i++) {
    const r = await eng.get(`/api/agencies/${t.ids.brannock}/runs/${id}`);
    if (r.body.status !== 'running') return r.body;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error('run did not finish');
}

const pdfOf = (req: ReturnType<typeof eng.get>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

describe('plan versions and publishing', () => {
  let planId: string;
  let publishedRunId: string;

  it('"Run the plan" with the screen’s unsaved settings saves them first and the run reflects them', async () => {
    const created = await eng.post(base).send({ name: 'Versions', settings: settings() });
    planId = created.body.id;
    expect(created.body.version).toBe(1);
    const start = await eng
      .post(`${base}/${planId}/run`)
      .send({ name: 'Versions', settings: settings({ horizonYears: 3, annualBudget: 250_000 }) });
    expect(start.status).toBe(202);
    const run = await waitRun(start.body.id);
    expect(run.status).toBe('done');
    expect(run.result.years).toHaveLength(3);
    expect(run.result.years[0].budget).toBe(250_000);
    const plan = await eng.get(`${base}/${planId}`);
    expect(plan.body.settings.horizonYears).toBe(3);
    expect(plan.body.resultCurrent).toBe(true);
    publishedRunId = start.body.id;
  });

  it('publishing needs a run made after the last change (409 naming why)', async () => {
    await eng
      .put(`${base}/${planId}`)
      .send({ name: 'Versions', settings: settings({ horizonYears: 3, annualBudget: 300_000 }) });
    const stale = await eng.get(`${base}/${planId}`);
    expect(stale.body.resultCurrent).toBe(false);
    const res = await eng.post(`${base}/${planId}/publish`).send({ publish: true });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/changed after its last run/);
    const again = await eng
      .post(`${base}/${planId}/run`)
      .send({ settings: settings({ horizonYears: 3, annualBudget: 250_000 }) });
    publishedRunId = again.body.id;
    expect((await waitRun(again.body.id)).status).toBe('done');
  });

  it('publishes version 1 with the headline numbers in the viewer’s e-mail', async () => {
    const pub = await eng.post(`${base}/${planId}/publish`).send({ publish: true, notifyViewers: true });
    expect(pub.status).toBe(200);
    expect(pub.body.published.version).toBe(1);
    expect(pub.body.frozen).toBe(true);
    expect(pub.body.notified).toBe(1);
    const mail = t.lastMailTo('viewer@brannock.example')!.textBody!;
    expect(mail).toContain(`/plans/${planId}`);
    expect(mail).toMatch(/Budget: \$250,000 a year, 2027 to 2029/);
    expect(mail).toMatch(/Network PCI: \d+ now, \d+ by 2029/);
    expect(mail).toMatch(/Lane-miles treated: [\d,]+/);
    expect(mail).toMatch(/Failed lane-miles \(PCI 25 or less\): [\d,]+ at the start, [\d,]+ by 2029/);
  });

  it('editing the published plan opens draft version 2; viewers still see version 1, its run and its brief', async () => {
    const briefBefore = await pdfOf(viewer.get(`${base}/${planId}/brief.pdf`));
    expect(briefBefore.status).toBe(200);
    const edit = await eng
      .put(`${base}/${planId}`)
      .send({ name: 'Versions, bigger', settings: settings({ horizonYears: 5, annualBudget: 2_400_000 }) });
    expect(edit.body.version).toBe(2);
    expect(edit.body.frozen).toBe(false);
    const run2 = await eng.post(`${base}/${planId}/run`);
    expect(run2.status, JSON.stringify(run2.body)).toBe(202);
    expect((await waitRun(run2.body.id)).status).toBe('done');

    const seen = await viewer.get(`${base}/${planId}`);
    expect(seen.body.name).toBe('Versions');
    expect(seen.body.version).toBe(1);
    expect(seen.body.settings.annualBudget).toBe(250_000);
    const res = await viewer.get(`${base}/${planId}/result`);
    expect(res.body.latest.runId).toBe(publishedRunId);
    expect(res.body.latest.result.years).toHaveLength(3);
    const list = await viewer.get(base);
    expect(list.body.items.find((p: { id: string }) => p.id === planId).name).toBe('Versions');
    // The brief is the one frozen at publishing, byte for byte.
    const briefAfter = await pdfOf(viewer.get(`${base}/${planId}/brief.pdf`));
    expect(Buffer.compare(briefAfter.body as Buffer, briefBefore.body as Buffer)).toBe(0);
    // The engineer sees the draft.
    expect((await eng.get(`${base}/${planId}/result`)).body.latest.result.years).toHaveLength(5);
    const versions = await eng.get(`${base}/${planId}/versions`);
    expect(versions.body.editing).toEqual({ version: 2, draft: true });
    expect(versions.body.items.map((v: { version: number; current: boolean }) => [v.version, v.current])).toEqual([
      [1, true],
    ]);
    expect((await viewer.get(`${base}/${planId}/versions`)).status).toBe(403);
  });

  it('republishing moves the pin to version 2; an earlier version can be put back; unpublish hides it', async () => {
    const pub2 = await eng.post(`${base}/${planId}/publish`).send({ publish: true });
    expect(pub2.body.published.version).toBe(2);
    expect((await viewer.get(`${base}/${planId}/result`)).body.latest.result.years).toHaveLength(5);
    expect((await viewer.get(`${base}/${planId}`)).body.name).toBe('Versions, bigger');
    const back = await eng.post(`${base}/${planId}/publish`).send({ publish: true, version: 1 });
    expect(back.body.published.version).toBe(1);
    expect((await viewer.get(`${base}/${planId}/result`)).body.latest.result.years).toHaveLength(3);
    // Engineers can read a given version's result.
    expect((await eng.get(`${base}/${planId}/result?version=2`)).body.latest.result.years).toHaveLength(5);
    expect((await eng.get(`${base}/${planId}/result?version=9`)).status).toBe(404);
    const off = await eng.post(`${base}/${planId}/publish`).send({ publish: false });
    expect(off.body.status).toBe('draft');
    expect((await viewer.get(`${base}/${planId}`)).status).toBe(404);
    // The audit trail says it in words.
    const audit = t.sqlite
      .prepare("SELECT action, detail FROM audit_log WHERE entity_id = ? AND action LIKE 'plan.%' ORDER BY id")
      .all(planId) as { action: string; detail: string | null }[];
    const notes = audit.map((a) => (a.detail ? (JSON.parse(a.detail).note as string | undefined) : undefined));
    expect(notes).toContain('Version 2 opened as a draft; version 1 stays as published');
    expect(notes).toContain('Version 2 published in place of version 1');
    expect(notes).toContain('Version 1 published in place of version 2');
    expect(notes).toContain('Version 1 withdrawn; viewers no longer see the plan');
  });

  it('an unchanged save opens no new version', async () => {
    const p = (await eng.get(`${base}/${planId}`)).body;
    await eng.put(`${base}/${planId}`).send({ name: p.name, settings: p.settings });
    expect((await eng.get(`${base}/${planId}`)).body.version).toBe(p.version);
  });

  it('a plan published before versions existed is frozen at its first edit', async () => {
    const created = await eng.post(base).send({ name: 'Legacy', settings: settings({ horizonYears: 2 }) });
    const id = created.body.id;
    const run = await eng.post(`${base}/${id}/run`);
    expect((await waitRun(run.body.id)).status).toBe('done');
    // As an older server left it: published, no version pinned.
    t.sqlite
      .prepare("UPDATE plans SET status = 'published', published_at = '2026-01-05T00:00:00.000Z' WHERE id = ?")
      .run(id);
    expect((await viewer.get(`${base}/${id}`)).body.settings.horizonYears).toBe(2);
    const edit = await eng
      .put(`${base}/${id}`)
      .send({ name: 'Legacy, edited', settings: settings({ horizonYears: 3 }) });
    expect(edit.body.version).toBe(2);
    const seen = await viewer.get(`${base}/${id}`);
    expect(seen.body.name).toBe('Legacy');
    expect(seen.body.settings.horizonYears).toBe(2);
    expect((await viewer.get(`${base}/${id}/result`)).body.latest.runId).toBe(run.body.id);
    expect((await pdfOf(viewer.get(`${base}/${id}/brief.pdf`))).status).toBe(200);
  });

  it('another agency reaches no version', async () => {
    const marlow = await t.as('engineer@marlow.example');
    expect((await marlow.get(`${base}/${planId}/versions`)).status).toBe(404);
    expect((await marlow.post(`${base}/${planId}/publish`).send({ publish: true, version: 1 })).status).toBe(404);
  });
});

describe('dollar amounts as people type them', () => {
  it.each([
    ['$250,000', 250_000],
    ['250k', 250_000],
    ['1.85M', 1_850_000],
    ['$1.85M', 1_850_000],
    ['$1,850,000', 1_850_000],
    ['2.4 million', 2_400_000],
    ['1850000', 1_850_000],
    ['  $ 900K ', 900_000],
  ])('%s is %d', (text, value) => expect(parseDollars(text)).toBe(value));
  it.each(['', 'abc', '1.2.3', '-5', '$', '12 apples'])('%j is not an amount', (text) =>
    expect(parseDollars(text)).toBeNull(),
  );
});

describe('headline figures read from an older stored result', () => {
  // A hand-made two-year result in the shape stored before the strategy engine (no tons by mix,
  // no failed lane-miles field): the figures come from its work list and its worst band.
  const old = {
    years: [
      { year: 0, calendarYear: 2027, budget: 100, spent: 90, laneMilesByBand: { failed: 4 }, backlog: 10 },
      { year: 1, calendarYear: 2028, budget: 100, spent: 80, laneMilesByBand: { failed: 6 }, backlog: 20 },
    ],
    work: [
      { year: 0, ref: 1, laneMiles: 2, mix: 'Dense', tons: 100 },
      { year: 1, ref: 1, laneMiles: 2, mix: 'Rubber', tons: 30 },
      { year: 1, ref: 2, laneMiles: 3, mix: 'Dense', tons: 50 },
      { year: 1, ref: 3, laneMiles: 1, mix: null, tons: 0 },
    ],
    summary: { totalBudget: 200, totalSpent: 170, startPci: 60, finalPci: 62, finalPciDoNothing: 55, backlogEnd: 20 },
    solution: {},
  } as unknown as AnyPlanResult;

  it('counts each road once in lane-miles treated, sums tons by mix and year, reads failed lane-miles from the band', () => {
    const h = headline(old);
    expect(h.budgetPerYear).toBe(100);
    expect(h.laneMilesTreated).toBe(6); // roads 1, 2 and 3: 2 + 3 + 1, road 1 once though treated twice
    expect(h.jobs).toBe(4);
    expect(h.tonsByYear).toEqual([{ Dense: 100 }, { Rubber: 30, Dense: 50 }]);
    expect(h.tonsTotal).toEqual({ Dense: 150, Rubber: 30 });
    expect([h.failedStart, h.failedEnd]).toEqual([4, 6]);
    expect(h.lifeCycleCost).toBeNull();
    expect(h.mixPolicy).toBeNull();
  });

  it('prefers the new fields when the result has them', () => {
    const h = headline({
      ...old,
      years: old.years.map((y, i) => ({ ...y, failedLaneMiles: 10 + i, tonsByMix: { Rubber: 7 } })),
      summary: { ...old.summary, failedLaneMilesStart: 9, failedLaneMilesEnd: 11, lifeCycleCost: 1234 },
      solution: { ...old.solution, mixPolicy: { mixName: 'Rubber', thicknessIn: 1.5 } },
    } as AnyPlanResult);
    expect([h.failedStart, h.failedEnd]).toEqual([9, 11]);
    expect(h.failedByYear).toEqual([10, 11]);
    expect(h.tonsByYear).toEqual([{ Rubber: 7 }, { Rubber: 7 }]);
    expect(h.lifeCycleCost).toBe(1234);
    expect(h.mixPolicy).toEqual({ mixName: 'Rubber', thicknessIn: 1.5 });
  });
});
