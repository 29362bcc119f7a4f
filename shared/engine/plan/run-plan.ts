// One plan run from a self-contained input snapshot: candidates, the chosen
// method beside the worst-first baseline, and the year-by-year results.
import type { Curve } from '../forecast/curve';
import { buildCandidates, type PlanSegment, type PlanSettings, type PlanTreatment, simulate } from './network-plan';
import { type Highs, type Instance, type Method, type Solution, solveExact, solveFast, solveRanking } from './optimize';

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
};

// Measured here: HiGHS in WebAssembly aborted on a 59k-binary plan model (bench/plan.bench.ts); 20k solves.
export const MAX_EXACT_OPTIONS = 20_000;

function chosenMap(inst: Instance, meta: ReturnType<typeof buildCandidates>['meta'], s: Solution) {
  const byOption = new Map<string, { treatmentId: string; year: number }>();
  meta.forEach((m, i) =>
    m.options.forEach((o, j) => {
      byOption.set(inst.segments[i].options[j].id, { treatmentId: o.treatment.id, year: o.year });
    }),
  );
  const out = new Map<number, { treatmentId: string; year: number }>();
  for (const c of s.chosen) out.set(Number(c.segmentId), byOption.get(c.optionId)!);
  return out;
}

export function curveFn(input: PlanInput) {
  return (key: string) =>
    input.curves[key] ?? input.curves[`default|${key.split('|')[0]}`] ?? input.curves['default|other'];
}

export function candidates(input: PlanInput) {
  return buildCandidates(input.segments, input.treatments, curveFn(input), input.settings);
}

export function runPlan(input: PlanInput, highs: Highs | null, onProgress?: (f: number) => void) {
  const curves = curveFn(input);
  const { instance, meta } = buildCandidates(input.segments, input.treatments, curves, input.settings);
  onProgress?.(0.1);
  const options = instance.segments.reduce((s, x) => s + x.options.length, 0);
  let solution: Solution;
  if (input.method === 'exact') {
    if (!highs) throw new Error('the exact method needs the HiGHS solver');
    solution = solveExact(instance, highs, { timeLimitSeconds: input.timeLimitSeconds ?? 60, gap: 1e-4 });
  } else if (input.method === 'fast')
    solution = solveFast(instance, { onProgress: (f) => onProgress?.(0.1 + 0.7 * f) });
  else solution = solveRanking(instance);
  onProgress?.(0.85);
  const baseline = input.method === 'ranking' ? solution : solveRanking(instance);
  const sim = simulate(input.segments, input.treatments, curves, input.settings, chosenMap(instance, meta, solution));
  const baseSim =
    input.method === 'ranking'
      ? sim
      : simulate(input.segments, input.treatments, curves, input.settings, chosenMap(instance, meta, baseline));
  const last = sim.years[sim.years.length - 1];
  const floorMissed =
    input.minNetworkPci === null
      ? []
      : sim.years.filter((y) => y.networkPci < input.minNetworkPci! - 1e-9).map((y) => y.calendarYear);
  return {
    planName: input.planName,
    method: input.method,
    candidates: { segments: instance.segments.filter((s) => s.options.length > 0).length, options },
    solution: {
      totalBenefit: solution.totalBenefit,
      bound: solution.bound,
      gap: solution.gap,
      status: solution.status,
    },
    baseline: {
      totalBenefit: baseline.totalBenefit,
      finalPci: baseSim.years[baseSim.years.length - 1].networkPci,
      years: baseSim.years.map((y) => ({ calendarYear: y.calendarYear, networkPci: y.networkPci, spent: y.spent })),
    },
    years: sim.years,
    work: sim.work,
    summary: {
      startPci: sim.years[0].networkPciDoNothing,
      finalPci: last.networkPci,
      finalPciDoNothing: last.networkPciDoNothing,
      totalSpent: sim.years.reduce((s, y) => s + y.spent, 0),
      totalBudget: sim.years.reduce((s, y) => s + y.budget, 0),
      backlogStart: sim.years[0].backlog,
      backlogEnd: last.backlog,
      laneMiles: input.segments.reduce((s, x) => s + x.laneMiles, 0),
      segmentsTreated: sim.work.length,
    },
    minNetworkPci: input.minNetworkPci,
    floorMissedIn: floorMissed,
  };
}

export type PlanResult = ReturnType<typeof runPlan>;

/** "What annual budget holds the network at PCI X?" — bisection over flat budgets with the fast method. */
export function budgetSearch(input: PlanInput, targetPci: number, onProgress?: (f: number) => void) {
  const curves = curveFn(input);
  const H = input.settings.budgets.length;
  const evalAt = (b: number) => {
    const settings = { ...input.settings, budgets: new Array(H).fill(b) };
    const { instance, meta } = buildCandidates(input.segments, input.treatments, curves, settings);
    const s = solveFast(instance, { iterations: 80 });
    const sim = simulate(input.segments, input.treatments, curves, settings, chosenMap(instance, meta, s));
    return {
      budget: b,
      finalPci: sim.years[H - 1].networkPci,
      minPci: Math.min(...sim.years.map((y) => y.networkPci)),
    };
  };
  // Upper end: enough to do every segment's dearest option in one year.
  const { instance } = buildCandidates(input.segments, input.treatments, curves, {
    ...input.settings,
    budgets: new Array(H).fill(Number.MAX_SAFE_INTEGER),
  });
  const maxNeed = instance.segments.reduce(
    (s, x) => s + Math.max(0, ...x.options.map((o) => o.costs.reduce((t, c) => t + c.cost, 0))),
    0,
  );
  const points: { budget: number; finalPci: number; minPci: number }[] = [];
  const levels = 8;
  for (let i = 0; i <= levels; i++) {
    points.push(evalAt((maxNeed / H) * 2 * (i / levels) ** 2));
    onProgress?.((i + 1) / (levels + 12));
  }
  let lo = 0;
  let hi = maxNeed;
  const ok = (p: { finalPci: number }) => p.finalPci >= targetPci;
  if (!ok(evalAt(hi))) return { targetPci, budget: null as number | null, points, reachable: false };
  for (let k = 0; k < 11; k++) {
    const mid = (lo + hi) / 2;
    const p = evalAt(mid);
    points.push(p);
    if (ok(p)) hi = mid;
    else lo = mid;
    onProgress?.((levels + 2 + k) / (levels + 12));
  }
  points.sort((a, b) => a.budget - b.budget);
  return { targetPci, budget: hi, points, reachable: true };
}
