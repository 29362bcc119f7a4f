// One plan run from a self-contained input snapshot: strategies, the chosen method beside the
// worst-first baseline, and the year-by-year results (docs/COMPUTATION.md, The budget plan).
import type { Curve } from '../forecast/curve';
import { findBudget } from './budget-search';
import type { PlanSegment, PlanSettings, PlanTreatment } from './condition';
import type { PackedInstance } from './instance';
import type { Highs, Method } from './optimize';
import { simulate } from './simulate';
import { solvePlan } from './solve';
import { generateStrategies } from './strategies';

export type PlanInput = {
  planName: string;
  agencyName: string;
  method: Method;
  minNetworkPci: number | null;
  settings: PlanSettings;
  segments: PlanSegment[];
  treatments: PlanTreatment[];
  curves: Record<string, Curve>;
  timeLimitSeconds?: number;
  /** The mix and lift a mix policy put on the named treatment kinds (null: the catalog's own). */
  mixPolicy?: { mixName: string; thicknessIn: number } | null;
};

// Measured here: HiGHS in WebAssembly aborted on a 59k-binary plan model (bench/plan.bench.ts); 20k solves.
export const MAX_EXACT_OPTIONS = 20_000;

export function curveFn(input: Pick<PlanInput, 'curves'>) {
  return (key: string) =>
    input.curves[key] ??
    input.curves[`default|${key.split('|')[0]}`] ??
    input.curves['default|other'] ?? { p0: 100, a: 1, b: 1.4 };
}

/** The strategies of a run, packed for the methods. */
export function candidates(input: PlanInput) {
  return generateStrategies(input.segments, input.treatments, curveFn(input), input.settings);
}

const sumOf = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

function addTons(into: Record<string, number>, from: Record<string, number>) {
  for (const [k, v] of Object.entries(from)) into[k] = (into[k] ?? 0) + v;
}

export function runPlan(input: PlanInput, highs: Highs | null, onProgress?: (f: number) => void) {
  const g = generateStrategies(input.segments, input.treatments, curveFn(input), input.settings);
  const inst: PackedInstance = g.inst;
  onProgress?.(0.1);
  const options = inst.segStart[inst.nSegments];
  const solution = solvePlan(inst, input.method, highs, {
    timeLimitSeconds: input.timeLimitSeconds ?? 60,
    onProgress: (f) => onProgress?.(0.1 + 0.7 * f),
  });
  onProgress?.(0.85);
  const baseline = input.method === 'ranking' ? solution : solvePlan(inst, 'ranking', null);
  const sim = simulate(input.segments, input.treatments, g.curveTable, input.settings, inst, g.meta, solution.pick);
  const baseSim =
    input.method === 'ranking'
      ? sim
      : simulate(input.segments, input.treatments, g.curveTable, input.settings, inst, g.meta, baseline.pick);
  const last = sim.years[sim.years.length - 1];
  const minPci = input.settings.targets?.minNetworkPci ?? input.minNetworkPci ?? null;
  const floorMissed =
    minPci === null ? [] : sim.years.filter((y) => y.networkPci < minPci - 1e-9).map((y) => y.calendarYear);
  const benefitOf = (pick: Int32Array) => {
    let b = 0;
    for (const o of pick) if (o >= 0) b += inst.benefit[o];
    return b;
  };
  const tonsByMix: Record<string, number> = {};
  for (const y of sim.years) addTons(tonsByMix, y.tonsByMix);
  let segmentsTreated = 0;
  for (const o of solution.pick) if (o >= 0) segmentsTreated++;
  return {
    planName: input.planName,
    method: input.method,
    candidates: { segments: countWithOptions(inst), options },
    solution: {
      totalBenefit: benefitOf(solution.pick),
      bound: solution.bound,
      gap: solution.gap,
      status: solution.status,
      objective: inst.objective,
      objectiveValue: solution.objective,
      targetsMissed: [...g.meta.floorsUnreachable, ...solution.targetsMissed],
      mixPolicy: input.mixPolicy ?? null,
    },
    baseline: {
      totalBenefit: benefitOf(baseline.pick),
      finalPci: baseSim.years[baseSim.years.length - 1].networkPci,
      years: baseSim.years.map((y) => ({ calendarYear: y.calendarYear, networkPci: y.networkPci, spent: y.spent })),
    },
    years: sim.years,
    work: sim.work,
    summary: {
      startPci: sim.years[0].networkPciDoNothing,
      finalPci: last.networkPci,
      finalPciDoNothing: last.networkPciDoNothing,
      totalSpent: sumOf(sim.years.map((y) => y.spent)),
      totalBudget: sumOf(sim.years.map((y) => y.budget)),
      backlogStart: sim.years[0].backlog,
      backlogEnd: last.backlog,
      laneMiles: sim.laneMiles,
      segmentsTreated,
      workItems: sim.work.length,
      lifeCycleCost: sim.lifeCycleCost,
      failedLaneMilesStart: sim.years[0].failedLaneMiles,
      failedLaneMilesEnd: last.failedLaneMiles,
      tonsByMix,
    },
    minNetworkPci: minPci,
    floorMissedIn: floorMissed,
  };
}

function countWithOptions(inst: PackedInstance) {
  let n = 0;
  for (let i = 0; i < inst.nSegments; i++) if (inst.segStart[i + 1] > inst.segStart[i]) n++;
  return n;
}

export type PlanResult = ReturnType<typeof runPlan>;

/**
 * "What flat annual budget holds the network at PCI X?": findBudget (budget-search.ts) over the fast
 * method on one set of strategies (they do not depend on the budget). The rule "hold-every-year"
 * tests every year's network PCI; "final-year" the last year's only.
 */
export function budgetSearch(
  input: PlanInput,
  targetPci: number,
  onProgress?: (f: number) => void,
  rule: 'hold-every-year' | 'final-year' = 'hold-every-year',
) {
  const g = generateStrategies(input.segments, input.treatments, curveFn(input), input.settings);
  const H = input.settings.budgets.length;
  const Y = g.inst.years;
  // Upper end: enough to do every segment's dearest strategy's costliest year, every year.
  let maxNeed = 0;
  for (let i = 0; i < g.inst.nSegments; i++) {
    let m = 0;
    for (let o = g.inst.segStart[i]; o < g.inst.segStart[i + 1]; o++)
      for (let y = 0; y < Y; y++) m = Math.max(m, g.inst.cost[o * Y + y]);
    maxNeed += m;
  }
  const found = findBudget(
    (b) => {
      const settings = { ...input.settings, budgets: new Array(H).fill(b) };
      const inst = { ...g.inst, budgets: Float64Array.from(settings.budgets) };
      const s = solvePlan(inst, 'fast', null, { iterations: 80 });
      const sim = simulate(input.segments, input.treatments, g.curveTable, settings, inst, g.meta, s.pick);
      return { pciByYear: sim.years.map((y) => y.networkPci) };
    },
    { targetPci, rule, maxBudget: Math.max(1000, maxNeed), onProgress },
  );
  return { targetPci, rule, ...found };
}
