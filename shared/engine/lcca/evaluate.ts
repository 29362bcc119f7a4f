// Life-cycle cost of one alternative (COMPUTATION.md §2), following the FHWA
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

/** Remaining service life value at year N of the last activity whose life runs past N. */
export function remainingLife(activities: Activity[], analysisPeriodYears: number) {
  let index: number | null = null;
  for (let i = 0; i < activities.length; i++) {
    const a = activities[i];
    if (a.salvage === false || a.serviceLifeYears <= 0) continue;
    if (a.year + a.serviceLifeYears > analysisPeriodYears && (index === null || a.year >= activities[index].year))
      index = i;
  }
  if (index === null) return { value: 0, index };
  const a = activities[index];
  const fraction = (a.year + a.serviceLifeYears - analysisPeriodYears) / a.serviceLifeYears;
  return { value: a.cost * fraction, index };
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
