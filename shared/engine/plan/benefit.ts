// Benefit and life-cycle cost of one strategy (docs/COMPUTATION.md, The budget plan: benefit).
import { type Activity, evaluateAlternative } from '../lcca/evaluate';
import type { PlanSegment, PlanSettings } from './condition';

/** Traffic factor of the optional traffic weighting: log10(ADT + 10), so 0 ADT still counts. */
export const trafficWeight = (adt: number | null) => Math.log10((adt ?? 0) + 10);

/**
 * Weight of a segment in the benefit: lane-miles, or lane-miles × the traffic factor when the plan
 * asks for it. Network PCI, PCI targets and backlog always weight by lane-miles (one weighting for
 * condition); traffic only ever scales the benefit, and only when chosen.
 */
export function segmentWeight(s: PlanSegment, weighting: PlanSettings['weighting']) {
  return s.laneMiles * (weighting === 'lane-miles-traffic' ? trafficWeight(s.adt) : 1);
}

/**
 * Discount factors of the benefit's one-year steps: disc[t] for the step over [t − 1, t], t = 1 … W,
 * is P/F at the step's middle, (1 + r)^−(t − ½), at the agency's real discount rate r — the rate of
 * the life-cycle cost (benefits and costs discounted alike: OMB Circular A-94, FHWA-SA-98-079).
 * disc[0] is unused (0).
 */
export function stepDiscounts(rate: number, W: number) {
  const d = new Float64Array(W + 1);
  for (let t = 1; t <= W; t++) d[t] = (1 + rate) ** -(t - 0.5);
  return d;
}

/**
 * Discounted area between a path and do-nothing's over the common window, years 0 … W, by
 * trapezoids (one-year steps): Σ_{t=1…W} disc[t]·((p_{t−1} − d_{t−1}) + (p_t − d_t)) / 2, in
 * present PCI-years. Work is done at the start of its year, so the step over [y−1, y] ends at the PCI
 * before year y's work: `jumps` is Σ disc[y]·(after − before) / 2 over the works of years 1 … W, taken
 * off the plain trapezoid sum. Without `disc` the steps are not discounted.
 */
export function areaBetween(
  path: ArrayLike<number>,
  none: ArrayLike<number>,
  W: number,
  jumps = 0,
  disc?: ArrayLike<number>,
) {
  let area = 0;
  let prev = path[0] - none[0];
  for (let t = 1; t <= W; t++) {
    const cur = path[t] - none[t];
    area += ((prev + cur) / 2) * (disc ? disc[t] : 1);
    prev = cur;
  }
  return area - jumps;
}

/**
 * Agency life-cycle cost of a strategy: its works as FHWA activities (cost in its plan year, its
 * service life), through the one LCCA engine (evaluate.ts, FHWA-SA-98-079), over the benefit window
 * of W years with the remaining service life of the last work credited at the window's end.
 * Do-nothing has no agency cost in the plan, so this is also the strategy's cost over do-nothing.
 */
export function strategyLifeCycleCost(activities: Activity[], discountRate: number, W: number) {
  if (activities.length === 0) return { presentValue: 0, euac: 0, presentValueOfRemainingLife: 0 };
  return evaluateAlternative(activities, discountRate, W);
}
