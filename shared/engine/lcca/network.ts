// Vectorised evaluation of alternatives across many segments. Every cost is
// linear in the quantities (SY, lane-miles, jobs), and so are present value
// and the remaining-life credit; one evaluation per unit quantity gives
// coefficients, and each segment's net present value is then three
// multiply-adds. A whole network is one pass over Float64Arrays.
import { evaluateAlternative, type Activity } from './evaluate';
import { ap } from './interest';
import { activityCost, expandSchedule, type RatedActivity, type Schedule } from './schedule';

export type Quantities = { areaSy: Float64Array; laneMiles: Float64Array };

function activitiesFor(rated: RatedActivity[], q: { areaSy: number; laneMiles: number; jobs: number }): Activity[] {
  return rated.map((a) => ({
    year: a.year,
    cost: activityCost(a.template.rates, q),
    userCost: (a.template.userCostPerJob ?? 0) * q.jobs,
    serviceLifeYears: a.template.serviceLifeYears,
    salvage: a.template.salvage ?? true,
    label: a.template.label,
    lifeEndsAt: a.lifeEndsAt,
  }));
}

/** Net present value per unit of each quantity, for one expanded schedule. */
export function unitCoefficients(rated: RatedActivity[], discountRate: number, analysisPeriodYears: number) {
  const npv = (q: { areaSy: number; laneMiles: number; jobs: number }) =>
    evaluateAlternative(activitiesFor(rated, q), discountRate, analysisPeriodYears).presentValue;
  return {
    perSy: npv({ areaSy: 1, laneMiles: 0, jobs: 0 }),
    perLaneMile: npv({ areaSy: 0, laneMiles: 1, jobs: 0 }),
    perJob: npv({ areaSy: 0, laneMiles: 0, jobs: 1 }),
  };
}

export type NetworkAlternativeResult = {
  /** Net present value of each segment; job costs are shared by area. */
  npv: Float64Array;
  euac: Float64Array;
  totalNpv: number;
  totalEuac: number;
};

/**
 * Evaluates each plan over every segment in one call. The group is one job
 * (mobilisation and traffic control once), shared among segments by area.
 */
export function evaluateNetwork(
  plans: Schedule[],
  q: Quantities,
  discountRate: number,
  analysisPeriodYears: number,
): NetworkAlternativeResult[] {
  const n = q.areaSy.length;
  let totalSy = 0;
  for (let i = 0; i < n; i++) totalSy += q.areaSy[i];
  const annuity = ap(discountRate, analysisPeriodYears);
  return plans.map((plan) => {
    const c = unitCoefficients(expandSchedule(plan, analysisPeriodYears), discountRate, analysisPeriodYears);
    const npv = new Float64Array(n);
    const euac = new Float64Array(n);
    let total = 0;
    for (let i = 0; i < n; i++) {
      const share = totalSy > 0 ? q.areaSy[i] / totalSy : 1 / n;
      const v = c.perSy * q.areaSy[i] + c.perLaneMile * q.laneMiles[i] + c.perJob * share;
      npv[i] = v;
      euac[i] = v * annuity;
      total += v;
    }
    return { npv, euac, totalNpv: total, totalEuac: total * annuity };
  });
}

/** The group's full result (cash flows, RSL) for display: the group as one job. */
export function evaluateScheduleForGroup(
  plan: Schedule,
  totals: { areaSy: number; laneMiles: number },
  discountRate: number,
  analysisPeriodYears: number,
) {
  const rated = expandSchedule(plan, analysisPeriodYears);
  const activities = activitiesFor(rated, { ...totals, jobs: 1 });
  return { rated, activities, result: evaluateAlternative(activities, discountRate, analysisPeriodYears) };
}
