// 20,000 segments × 10 years: the fast method's time and value beside HiGHS on
// the same instance (its answer or its bound within a time limit) and beside worst-first.
import { resolveTreatment } from '../shared/engine/lcca/costing';
import { buildCandidates, type PlanSegment, type PlanTreatment } from '../shared/engine/plan/network-plan';
import { solveFast, solveRanking } from '../shared/engine/plan/optimize';
import { DEFAULT_CURVES } from '../shared/engine/forecast/families';
import { rng } from '../shared/engine/random';
import type { Mix, Treatment } from '../shared/schemas/catalog';
import { WorkerPool } from '../server/pool/pool';
import { taskRef } from '../server/pool/task';
import { DEMO_ECONOMICS, DEMO_MIXES, DEMO_TREATMENTS } from '../server/seed/demo-catalog';

const N = Number(process.env.BENCH_SEGMENTS ?? 20_000);
const H = 10;
const LIMIT = Number(process.env.BENCH_HIGHS_SECONDS ?? 120);
const u = rng(99);
const mixes: Mix[] = DEMO_MIXES.map(({ key, ...m }) => ({
  ...m,
  id: key,
  isDemo: true,
  coldWeatherNote: m.coldWeatherNote ?? null,
  spreadRateLbPerSyIn: m.spreadRateLbPerSyIn ?? 110,
}));
const econ = {
  discountRate: 0.02,
  discountRateSource: null,
  analysisPeriodYears: 40,
  baseYear: 2027,
  ...DEMO_ECONOMICS,
  mobilizationPerJob: 0,
};
const treatments: PlanTreatment[] = DEMO_TREATMENTS.map(({ mixKey, ...t }, i) => {
  const tr: Treatment = {
    ...t,
    id: `t${i}`,
    mixId: mixKey,
    defaultThicknessIn: t.defaultThicknessIn ?? null,
    millDepthIn: t.millDepthIn ?? 0,
    isDemo: true,
  };
  const r = resolveTreatment(tr, mixKey ? mixes.find((m) => m.id === mixKey)! : null, {}, econ);
  return {
    id: tr.id,
    name: tr.name,
    category: tr.category,
    costPerSy: r.rates.perSy * (1 + r.rates.addOnFraction),
    costPerLaneMile: 0,
    tonsPerSy: r.tonsPerSy,
    mixName: r.mix?.name ?? null,
    thicknessIn: r.thicknessIn,
    lifeYears: r.serviceLifeYears,
    effect: tr.effect,
    applicability: tr.applicability,
  };
});
const classes = ['local', 'local', 'local', 'minor_collector', 'major_collector', 'minor_arterial'];
const segments: PlanSegment[] = Array.from({ length: N }, (_, i) => {
  const len = 0.1 + u() * 0.9;
  const surface = u() < 0.75 ? 'asphalt' : 'chip_seal';
  return {
    ref: i,
    segmentId: `B-${i}`,
    roadName: `Road ${i % 500}`,
    lengthMi: len,
    lanes: 2,
    areaSy: (len * 5280 * 24) / 9,
    laneMiles: len * 2,
    functionalClass: classes[i % classes.length],
    surface,
    adt: Math.round(50 + u() * 3000),
    pci: Math.round(15 + u() * 83),
    lastTreatmentYear: 2005 + Math.floor(u() * 20),
    familyKey: surface,
  };
});
const curves = (k: string) => DEFAULT_CURVES[k] ?? DEFAULT_CURVES.other;
const settings = {
  startYear: 2027,
  budgets: new Array(H).fill(N * 1000),
  weighting: 'lane-miles' as const,
  needsWorkBelow: 71,
};

let t = performance.now();
const { instance } = buildCandidates(segments, treatments, curves, settings);
const options = instance.segments.reduce((s, x) => s + x.options.length, 0);
console.log(
  `${N.toLocaleString('en-US')} segments × ${H} years: ${options.toLocaleString('en-US')} candidate options built in ${(performance.now() - t).toFixed(0)} ms; budget $${(settings.budgets[0] / 1e6).toFixed(0)}M a year`,
);

t = performance.now();
const fast = solveFast(instance);
console.log(
  `fast (Lagrangian): ${(performance.now() - t).toFixed(0)} ms, benefit ${fast.totalBenefit.toFixed(0)}, bound ${fast.bound.toFixed(0)}, gap ${(fast.gap * 100).toFixed(3)} %`,
);
t = performance.now();
const rank = solveRanking(instance);
console.log(
  `worst-first: ${(performance.now() - t).toFixed(0)} ms, benefit ${rank.totalBenefit.toFixed(0)} (${((1 - rank.totalBenefit / fast.totalBenefit) * 100).toFixed(1)} % below fast)`,
);
// HiGHS runs in the worker pool with a hard stop (the slot is cancelled, which terminates the worker):
// on very large models it can spend longer than its own time limit reading and presolving the model.
t = performance.now();
const pool = new WorkerPool({ threads: 1, perAgency: 1, perUser: 1 }, ':memory:');
const slot = pool.reserve({ userId: 'bench', agencyId: null });
const stop = setTimeout(() => slot.cancel(), (LIMIT + 60) * 1000);
const answer = await slot
  .run(taskRef<typeof import('./highs-task').default>(new URL('./highs-task.ts', import.meta.url)), {
    instance,
    limit: LIMIT,
  })
  .then(
    (r) => ({ ok: true as const, ...r }),
    (e: Error) => (slot.cancelled ? null : { ok: false as const, message: e.message }),
  );
clearTimeout(stop);
slot.release();
await pool.close();
const secs = ((performance.now() - t) / 1000).toFixed(1);
if (answer?.ok)
  console.log(
    `HiGHS (limit ${LIMIT} s): ${secs} s, ${answer.status}, benefit ${answer.benefit.toFixed(0)}; fast is ${((1 - fast.totalBenefit / answer.benefit) * 100).toFixed(3)} % below it`,
  );
else
  console.log(
    `HiGHS: ${answer && !answer.ok ? answer.message : `no answer within ${LIMIT + 60} s (stopped)`}; fast's own Lagrangian bound stands: it is within ${(fast.gap * 100).toFixed(3)} % of the optimum`,
  );
const mem = process.memoryUsage();
console.log(`memory: RSS ${(mem.rss / 1024 / 1024).toFixed(0)} MB, heap ${(mem.heapUsed / 1024 / 1024).toFixed(0)} MB`);
process.exit(0);
