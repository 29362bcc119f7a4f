// Every plan setting added with treatment strategies reaches the result: each plan is created through
// the API (so the settings pass its validation), then its frozen input is built from the real demo
// database (server/plans/plan-input.ts) and run by the engine, as the worker does.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mixes } from '../../server/db/schema';
import { planInput } from '../../server/plans/plan-input';
import { CurveTable } from '../../shared/engine/plan/condition';
import { curveFn, type PlanInput, runPlan } from '../../shared/engine/plan/run-plan';
import { SegmentWalker, surfaceSetsOf } from '../../shared/engine/plan/strategies';
import { PlanResultSchema } from '../../shared/schemas/plan-result';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/plans`;
});
afterAll(() => t.close());

const settings = (over: Record<string, unknown> = {}) => ({
  startYear: 2027,
  horizonYears: 5,
  budgetMode: 'flat',
  annualBudget: 3_000_000,
  method: 'fast',
  ...over,
});

async function run(over: Record<string, unknown> = {}) {
  const res = await eng.post(base).send({ name: 'settings test', settings: settings(over) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const input = planInput(t.deps, t.ids.brannock, res.body.id);
  const r = runPlan(input, null);
  PlanResultSchema.parse(r);
  return { input, r };
}

describe('plan settings reach the result', () => {
  let plain: Awaited<ReturnType<typeof run>>;
  beforeAll(async () => {
    plain = await run();
  });

  it('objective: least life-cycle cost is reported as such', async () => {
    const { r } = await run({ objective: 'cost', targets: { minNetworkPci: 55 } });
    expect(plain.r.solution.objective).toBe('benefit');
    expect(r.solution.objective).toBe('cost');
    expect(r.solution.objectiveValue).toBeCloseTo(r.summary.lifeCycleCost, 6);
  });

  it('targets.minNetworkPci becomes one row per year, and the old top-level minNetworkPci maps onto it', async () => {
    const a = await run({ targets: { minNetworkPci: 99 } });
    expect(a.r.minNetworkPci).toBe(99);
    expect(a.r.solution.targetsMissed.filter((l) => l.startsWith('network PCI ≥ 99'))).toHaveLength(5);
    const b = await run({ minNetworkPci: 99 });
    expect(b.input.settings.targets?.minNetworkPci).toBe(99);
  });

  it('targets.classFloors drops strategies that leave the class below the floor', async () => {
    const { r } = await run({ targets: { classFloors: [{ functionalClass: 'local', minPci: 60 }] } });
    expect(r.candidates.options).toBeLessThan(plain.r.candidates.options);
  });

  it('targets.goodOrBetterPct becomes one row per year', async () => {
    const { r } = await run({ targets: { goodOrBetterPct: 99 } });
    expect(r.solution.targetsMissed.filter((l) => l.includes('good or better condition ≥ 99 %'))).toHaveLength(5);
  });

  it('maxStrategiesPerSegment caps the strategies of each segment', async () => {
    const { r } = await run({ maxStrategiesPerSegment: 2 });
    expect(r.candidates.options).toBeLessThanOrEqual(2 * r.candidates.segments);
    expect(r.candidates.options).toBeLessThan(plain.r.candidates.options);
  });

  it('mixPolicy puts the chosen mix and lift on thin overlays: names, tons and lives follow', async () => {
    const rubber = t.deps.db
      .select()
      .from(mixes)
      .where(eq(mixes.agencyId, t.ids.brannock))
      .all()
      .find((m) => /rubber/i.test(m.name))!;
    const { r, input } = await run({ mixPolicy: { kinds: ['thin_overlay'], mixId: rubber.id, thicknessIn: 1.5 } });
    expect(r.solution.mixPolicy).toEqual({ mixName: rubber.name, thicknessIn: 1.5 });
    const thin = input.treatments.find((x) => x.kind === 'thin_overlay')!;
    expect(thin.mixName).toBe(rubber.name);
    expect(thin.thicknessIn).toBe(1.5);
    expect(thin.lifeYears).toBe(14); // the demo rubber-modified mix: 14 years at its 1.5 in reference lift
    expect(Object.keys(r.summary.tonsByMix)).toContain(rubber.name);
    expect(Object.keys(plain.r.summary.tonsByMix)).not.toContain(rubber.name);
    const bad = await eng
      .post(base)
      .send({ name: 'x', settings: settings({ mixPolicy: { kinds: [], mixId: rubber.id, thicknessIn: 1.5 } }) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: { path: string }) => i.path)).toContain('body.settings.mixPolicy.kinds');
  });

  it('allowThinOnWeakBase lets flagged thin lifts in, and each such item says so', async () => {
    const { r } = await run({ allowThinOnWeakBase: true });
    expect(r.candidates.options).toBeGreaterThan(plain.r.candidates.options);
    expect(plain.r.work.filter((w) => w.structuralFlag && /thin/i.test(w.treatment))).toHaveLength(0);
    const flagged = r.work.filter((w) => w.structuralFlag);
    expect(flagged.length).toBeGreaterThan(0);
    expect(flagged[0].structuralFlag).toMatch(/AASHTO 1993/);
  });

  it('benefitTailYears changes the window and so the benefit', async () => {
    const { r } = await run({ benefitTailYears: 0 });
    expect(r.solution.totalBenefit).not.toBeCloseTo(plain.r.solution.totalBenefit, 0);
  });

  /** Arterials at PCI 25 or less (the Broken up band) in the plan's last year: each segment's works replayed. */
  function arterialsFailedAtEnd(input: PlanInput, r: ReturnType<typeof runPlan>) {
    const H = input.settings.budgets.length;
    const ct = new CurveTable(curveFn(input));
    const sets = surfaceSetsOf(input.treatments);
    const path = new Float64Array(H + 1);
    const out: string[] = [];
    for (const s of input.segments) {
      if (!s.functionalClass.includes('arterial')) continue;
      const works = r.work
        .filter((w) => w.ref === s.ref)
        .map((w) => ({ treatment: input.treatments.findIndex((x) => x.name === w.treatment), year: w.year }))
        .sort((a, b) => a.year - b.year);
      const wk = new SegmentWalker(ct, s, input.treatments, sets, input.settings, H);
      wk.trace(null, works, path, 0, new Int32Array(works.length * 2 + 2), new Uint8Array(works.length + 1));
      if (path[H - 1] <= 25) out.push(`${s.segmentId} ${path[H - 1].toFixed(1)}`);
    }
    return out;
  }

  it('the demo plan over ten years mixes crack seals, chip seals, thin overlays and mill-and-overlays', async () => {
    const shown: Record<string, Awaited<ReturnType<typeof run>>> = {};
    for (const annualBudget of [2_400_000, 5_000_000]) {
      const x = await run({ horizonYears: 10, annualBudget });
      shown[annualBudget] = x;
      const counts: Record<string, number> = {};
      for (const w of x.r.work) counts[w.treatment] = (counts[w.treatment] ?? 0) + 1;
      console.log(`demo plan, $${annualBudget / 1e6}M a year for 10 years:`, counts, {
        startPci: x.r.summary.startPci.toFixed(1),
        finalPci: x.r.summary.finalPci.toFixed(1),
        finalPciDoNothing: x.r.summary.finalPciDoNothing.toFixed(1),
        failedLaneMiles: [x.r.summary.failedLaneMilesStart.toFixed(1), x.r.summary.failedLaneMilesEnd.toFixed(1)],
        segmentsTreated: x.r.summary.segmentsTreated,
        workItems: x.r.summary.workItems,
        arterialsFailedAtEnd: arterialsFailedAtEnd(x.input, x.r),
      });
    }
    const { r } = shown[5_000_000];
    const counts: Record<string, number> = {};
    for (const w of r.work) counts[w.treatment] = (counts[w.treatment] ?? 0) + 1;
    for (const k of ['Crack seal', 'Chip seal', 'Thin overlay', 'Mill and overlay (2 in)'])
      expect(counts[k], k).toBeGreaterThan(0);
    expect(r.summary.workItems).toBeGreaterThan(r.summary.segmentsTreated);
    expect(r.summary.finalPci).toBeGreaterThan(r.summary.finalPciDoNothing);
  });
  it('with a floor for arterials, the ten-year demo plan at $5M leaves no arterial failed', async () => {
    // The benefit alone never buys reconstruction (its benefit per dollar is low), so failed arterials stay
    // failed without a rule; a class floor (targets.classFloors) is how an agency says "not on our arterials".
    const floors = ['principal_arterial', 'minor_arterial'].map((functionalClass) => ({ functionalClass, minPci: 26 }));
    const x = await run({ horizonYears: 10, annualBudget: 5_000_000, targets: { classFloors: floors } });
    const failed = arterialsFailedAtEnd(x.input, x.r);
    console.log('demo plan with arterial floors at PCI 26, $5M a year:', {
      finalPci: x.r.summary.finalPci.toFixed(1),
      failedLaneMiles: [x.r.summary.failedLaneMilesStart.toFixed(1), x.r.summary.failedLaneMilesEnd.toFixed(1)],
      targetsMissed: x.r.solution.targetsMissed,
      arterialsFailedAtEnd: failed,
    });
    expect(failed).toEqual([]);
  });
});
