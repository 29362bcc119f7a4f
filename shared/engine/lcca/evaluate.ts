// Life-cycle cost of one alternative (docs/COMPUTATION.md, Schedule), following the FHWA
// LCCA method (Interim Technical Bulletin FHWA-SA-98-079, 1998; LCCA Primer, 2002):
// present value of each activity's cost, less the present value of the
// remaining service life of the last activity at the end of the analysis
// period, and the equivalent uniform annual cost of the net.
import { ap, pf } from './interest';

export type Activity = {
  year: number;
  cost: number;
  serviceLifeYears: number;
  label?: string;
  /** Agency-defined user cost (work-zone delay) in the same dollars, discounted with the cost. */
  userCost?: number;
  /** False for routine maintenance that carries no remaining-life credit. Default true. */
  salvage?: boolean;
  /**
   * When the activity's life ends, exactly, if it does not simply run from its
   * booking year (a fractional life chained from an earlier one, booked at the
   * end of the year in which it falls). Default: year + serviceLifeYears.
   */
  lifeEndsAt?: number;
};

export type CashFlow = { year: number; cost: number; userCost: number; presentValue: number; label?: string };

export type AlternativeResult = {
  /** Net present value: PV of all costs (and user costs) less PV of the remaining service life value. */
  presentValue: number;
  presentValueOfCosts: number;
  presentValueOfUserCosts: number;
  euac: number;
  remainingServiceLifeValue: number;
  presentValueOfRemainingLife: number;
  /** The activity whose remaining life is credited, or null when none runs past the period. */
  rslActivityIndex: number | null;
  cashFlows: CashFlow[];
};

const endOfLife = (a: Activity) => a.lifeEndsAt ?? a.year + a.serviceLifeYears;

/**
 * Remaining service life value at year N of the last activity whose life runs
 * past N: its cost × (life left at N) / (its service life), FHWA-SA-98-079.
 * The fraction is exact for fractional lives (no rounding to whole years).
 */
export function remainingLife(activities: Activity[], analysisPeriodYears: number) {
  let index: number | null = null;
  for (let i = 0; i < activities.length; i++) {
    const a = activities[i];
    if (a.salvage === false || a.serviceLifeYears <= 0) continue;
    if (endOfLife(a) > analysisPeriodYears && (index === null || a.year >= activities[index].year)) index = i;
  }
  if (index === null) return { value: 0, index, fraction: 0 };
  const a = activities[index];
  const fraction = Math.min(1, (endOfLife(a) - analysisPeriodYears) / a.serviceLifeYears);
  return { value: a.cost * fraction, index, fraction };
}

export function evaluateAlternative(
  activities: Activity[],
  discountRate: number,
  analysisPeriodYears: number,
): AlternativeResult {
  const cashFlows = activities.map((a) => {
    const f = pf(discountRate, a.year);
    return {
      year: a.year,
      cost: a.cost,
      userCost: a.userCost ?? 0,
      presentValue: (a.cost + (a.userCost ?? 0)) * f,
      label: a.label,
    };
  });
  const presentValueOfCosts = cashFlows.reduce((s, c) => s + c.cost * pf(discountRate, c.year), 0);
  const presentValueOfUserCosts = cashFlows.reduce((s, c) => s + c.userCost * pf(discountRate, c.year), 0);
  const rsl = remainingLife(activities, analysisPeriodYears);
  const presentValueOfRemainingLife = rsl.value * pf(discountRate, analysisPeriodYears);
  const presentValue = presentValueOfCosts + presentValueOfUserCosts - presentValueOfRemainingLife;
  return {
    presentValue,
    presentValueOfCosts,
    presentValueOfUserCosts,
    euac: presentValue * ap(discountRate, analysisPeriodYears),
    remainingServiceLifeValue: rsl.value,
    presentValueOfRemainingLife,
    rslActivityIndex: rsl.index,
    cashFlows,
  };
}
