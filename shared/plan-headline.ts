// The figures people quote from a plan result — for the e-mail, the brief, the plans list
// and the scenario comparison. Results stored before the strategy engine lack some fields
// (tons by mix, failed lane-miles, life-cycle cost, the mix policy); each falls back to what
// the older result can tell (tons and mixes from its work list, failed lane-miles from the
// worst condition band) or to null where it cannot.
import type { PlanResult } from './engine/plan/run-plan';

type WorkLike = PlanResult['work'][number] & {
  strategy?: string;
  fromDesc?: string | null;
  toDesc?: string | null;
  functionalClass?: string;
  structuralFlag?: string | null;
};
type YearLike = PlanResult['years'][number] & {
  tonsByMix?: Record<string, number>;
  failedLaneMiles?: number;
};
/** A stored plan result, old or new. */
export type AnyPlanResult = Omit<PlanResult, 'years' | 'work' | 'summary' | 'solution'> & {
  years: YearLike[];
  work: WorkLike[];
  summary: PlanResult['summary'] & {
    lifeCycleCost?: number;
    failedLaneMilesStart?: number;
    failedLaneMilesEnd?: number;
    tonsByMix?: Record<string, number>;
  };
  solution: PlanResult['solution'] & {
    objective?: 'benefit' | 'cost';
    targetsMissed?: string[];
    mixPolicy?: { mixName: string; thicknessIn: number } | null;
  };
};

/** The band of roads that have failed (the worst band). */
export const FAILED_BAND = 'failed';

const failedOf = (y: YearLike) => y.failedLaneMiles ?? y.laneMilesByBand[FAILED_BAND] ?? 0;

/** Tons of each mix placed in each year (a mixless treatment places none). */
export function tonsByMixByYear(r: AnyPlanResult): Record<string, number>[] {
  if (r.years.every((y) => y.tonsByMix)) return r.years.map((y) => ({ ...y.tonsByMix }));
  const out = r.years.map(() => ({}) as Record<string, number>);
  for (const w of r.work) {
    if (!w.mix || !w.tons) continue;
    const row = out[w.year];
    if (row) row[w.mix] = (row[w.mix] ?? 0) + w.tons;
  }
  return out;
}

export function headline(r: AnyPlanResult) {
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  const treated = new Map<number, number>();
  for (const w of r.work) treated.set(w.ref, w.laneMiles);
  const tons = tonsByMixByYear(r);
  const tonsTotal: Record<string, number> = { ...(r.summary.tonsByMix ?? {}) };
  if (!r.summary.tonsByMix)
    for (const row of tons) for (const [mix, t] of Object.entries(row)) tonsTotal[mix] = (tonsTotal[mix] ?? 0) + t;
  return {
    years: r.years.length,
    firstYear: first?.calendarYear ?? 0,
    lastYear: last?.calendarYear ?? 0,
    budgetPerYear: r.years.length ? r.summary.totalBudget / r.years.length : 0,
    totalBudget: r.summary.totalBudget,
    totalSpent: r.summary.totalSpent,
    startPci: r.summary.startPci,
    finalPci: r.summary.finalPci,
    finalPciDoNothing: r.summary.finalPciDoNothing,
    /** Lane-miles of road treated at least once. */
    laneMilesTreated: [...treated.values()].reduce((s, v) => s + v, 0),
    jobs: r.work.length,
    failedStart: r.summary.failedLaneMilesStart ?? (first ? failedOf(first) : 0),
    failedEnd: r.summary.failedLaneMilesEnd ?? (last ? failedOf(last) : 0),
    failedByYear: r.years.map(failedOf),
    backlogEnd: r.summary.backlogEnd,
    lifeCycleCost: r.summary.lifeCycleCost ?? null,
    tonsByYear: tons,
    tonsTotal,
    mixPolicy: r.solution.mixPolicy ?? null,
  };
}
export type Headline = ReturnType<typeof headline>;

const money = (v: number) =>
  Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : `$${Math.round(v).toLocaleString('en-US')}`;
const int = (v: number) => Math.round(v).toLocaleString('en-US');

/** The headline in plain words, one fact a line (the publish e-mail). */
export function headlineLines(h: Headline) {
  return [
    `Budget: ${money(h.budgetPerYear)} a year, ${h.firstYear} to ${h.lastYear} (${money(h.totalBudget)} in all).`,
    `Network PCI: ${h.startPci.toFixed(0)} now, ${h.finalPci.toFixed(0)} by ${h.lastYear} (with no work: ${h.finalPciDoNothing.toFixed(0)}).`,
    `Lane-miles treated: ${int(h.laneMilesTreated)} (${int(h.jobs)} jobs).`,
    `Failed lane-miles (PCI 25 or less): ${int(h.failedStart)} at the start, ${int(h.failedEnd)} by ${h.lastYear}.`,
  ];
}
