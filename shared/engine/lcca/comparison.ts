// A life-cycle cost comparison of 2–6 alternatives on one group of segments,
// built from catalog items: the answer first, then results, cost lines,
// sensitivity, break-even rates, Monte Carlo and cautions. Pure: the same input
// gives the same output.
import type { ComparisonInput } from '../../schemas/comparisons';
import { answerFor } from './answer';
import { costLines } from './costing';
import { evaluateScheduleForGroup } from './network';
import { breakEvenRate, monteCarlo, sensitivity } from './risk';
import { serviceChecks, comparisonCautions } from './comparison-cautions';
import { comparisonInputs, comparisonModel } from './comparison-inputs';
import { buildSchedule, lookup, ComparisonInputError } from './schedule-input';

export { ComparisonInputError } from './schedule-input';
export { comparisonInputs, comparisonModel } from './comparison-inputs';
export type { ComparisonCaution } from './comparison-cautions';

/** Feet in a mile; with 9 sq ft to the square yard, lane width = SY × 9 / (lane-miles × 5,280). */
const FT_PER_MILE = 5280;

export type ComparisonResult = ReturnType<typeof runComparison>;

export function runComparison(
  input: ComparisonInput,
  opts: { onProgress?: (fraction: number) => void; monteCarlo?: boolean } = {},
) {
  if (input.baselineIndex >= input.alternatives.length)
    throw new ComparisonInputError('baselineIndex', 'names no alternative');
  const look = lookup(input);
  const { discountRate: rate, analysisPeriodYears: N } = input.economics;
  const q = { areaSy: input.group.areaSy, laneMiles: input.group.laneMiles };
  const service = serviceChecks(input, look);
  const alternatives = input.alternatives.map((a, i) => {
    const { plan, initial, rehab } = buildSchedule(a, i, input, look, {});
    const { result, rated } = evaluateScheduleForGroup(plan, q, rate, N);
    const first = costLines(initial, q);
    return {
      name: a.name,
      presentValue: result.presentValue,
      presentValueOfCosts: result.presentValueOfCosts,
      euac: result.euac,
      remainingServiceLifeValue: result.remainingServiceLifeValue,
      presentValueOfRemainingLife: result.presentValueOfRemainingLife,
      perLaneMile: result.presentValue / q.laneMiles,
      euacPerLaneMile: result.euac / q.laneMiles,
      perSy: result.presentValue / q.areaSy,
      firstCost: first.total,
      firstCostPerLaneMile: first.total / q.laneMiles,
      initialTons: first.tons,
      /** First cost of the job per ton of mix laid (in place), null without a mix. */
      firstCostPerTon: first.tons > 0 ? first.total / first.tons : null,
      initial: {
        label: initial.label,
        serviceLifeYears: initial.serviceLifeYears,
        lifeSource: initial.lifeSource,
        thicknessIn: initial.thicknessIn,
        millDepthIn: initial.millDepthIn,
        costLines: first,
      },
      rehabilitation: rehab.map((r) => ({
        label: r.label,
        serviceLifeYears: r.serviceLifeYears,
        lifeSource: r.lifeSource,
        costLines: costLines(r, q),
      })),
      service: service[i],
      cashFlows: result.cashFlows.map((c, k) => ({ ...c, kind: rated[k].kind })),
    };
  });
  const base = alternatives[input.baselineIndex];
  const ranked = alternatives
    .map((a, i) => ({ index: i, presentValue: a.presentValue }))
    .sort((x, y) => x.presentValue - y.presentValue);
  const vsBaseline = alternatives.map((a) => ({
    savings: base.presentValue - a.presentValue,
    savingsPerLaneMile: (base.presentValue - a.presentValue) / q.laneMiles,
    firstCostSavings: base.firstCost - a.firstCost,
    firstCostSavingsPerLaneMile: (base.firstCost - a.firstCost) / q.laneMiles,
    tonsSaved: base.initialTons - a.initialTons,
    tonsSavedPerLaneMile: (base.initialTons - a.initialTons) / q.laneMiles,
  }));

  const inputs = comparisonInputs(input);
  const model = comparisonModel(input);
  const tornado = sensitivity(inputs, model);
  const baseValues = Object.fromEntries(inputs.map((i) => [i.key, i.base]));
  const breakEven = alternatives.map((_, i) =>
    i === input.baselineIndex
      ? null
      : breakEvenRate((r) => model({ ...baseValues, rate: r }), i, input.baselineIndex, 0, 0.12),
  );
  const mc =
    opts.monteCarlo === false
      ? null
      : monteCarlo(inputs, model, {
          iterations: input.risk.iterations,
          seed: input.risk.seed,
          onProgress: (d) => opts.onProgress?.(d / input.risk.iterations),
          among: service.every((s) => s.equal) ? undefined : service.flatMap((s, i) => (s.equal ? [i] : [])),
        });
  const ranking = ranked.map((r) => r.index);
  return {
    analysisPeriodYears: N,
    discountRate: rate,
    group: {
      label: input.group.label,
      areaSy: q.areaSy,
      laneMiles: q.laneMiles,
      centrelineMiles: input.group.centrelineMiles,
      segments: input.group.segments.length,
      /** The average lane width behind every "per lane-mile" figure: area ÷ lane length. */
      laneWidthFt: (q.areaSy * 9) / (q.laneMiles * FT_PER_MILE),
      pci: service[0]?.groupPci ?? null,
    },
    baselineIndex: input.baselineIndex,
    alternatives,
    ranking,
    answer: answerFor({ analysisPeriodYears: N, discountRate: rate, alternatives, ranking, monteCarlo: mc }),
    vsBaseline,
    sensitivity: { base: tornado.base, rows: tornado.rows.map((r) => ({ ...r })) },
    breakEven,
    monteCarlo: mc,
    cautions: comparisonCautions(input, look, alternatives, service),
  };
}
