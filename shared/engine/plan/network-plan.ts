// The budget plan's engine, in parts (docs/COMPUTATION.md, The budget plan):
//   condition.ts   the condition model (ageing, curves after work, inclusive limits)
//   strategies.ts  the strategy generator, writing a PackedInstance
//   benefit.ts     benefit (area between curves over one window) and life-cycle cost
//   simulate.ts    from chosen strategies to year-by-year results
// This file keeps the old names for callers not yet moved.
import type { Curve } from '../forecast/curve';
import type { PlanSegment, PlanSettings, PlanTreatment } from './condition';
import { generateStrategies } from './strategies';

export * from './benefit';
export * from './condition';
export { simulate, type WorkItem, type YearResult } from './simulate';
export { generateStrategies, type StrategyMeta } from './strategies';

/** The generator's strategies, packed, with what each option is (kept under its old name for callers). */
export function buildCandidates(
  segments: PlanSegment[],
  treatments: PlanTreatment[],
  curves: (key: string) => Curve,
  settings: PlanSettings,
) {
  const g = generateStrategies(segments, treatments, curves, settings);
  return { packed: g.inst, meta: g.meta };
}
