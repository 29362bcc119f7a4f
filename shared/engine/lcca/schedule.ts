// Expands an alternative's plan (an initial treatment, what follows each time
// a treatment reaches the end of its life, and maintenance cycles within each
// life) into dated activities over the analysis period.

export type CostRates = {
  /** Dollars per square yard (mix, milling, tack, seal…). */
  perSy: number;
  /** Dollars per lane-mile. */
  perLaneMile: number;
  /** Dollars per job (mobilisation, traffic control days). */
  perJob: number;
  /** Add-ons as a fraction of the subtotal (engineering 0.08 + contingency 0.10 = 0.18). */
  addOnFraction: number;
};

export type ActivityTemplate = {
  label: string;
  serviceLifeYears: number;
  rates: CostRates;
  /** Work-zone user cost per job, if the agency counts it. */
  userCostPerJob?: number;
  salvage?: boolean;
};

export type MaintenanceCycle = { template: ActivityTemplate; everyYears: number };

export type Schedule = {
  initial: ActivityTemplate;
  /** Treatments applied in turn as each life ends; the last one repeats. Empty: the initial repeats. */
  rehabilitation: ActivityTemplate[];
  /** Maintenance within each treatment's life, every n years after it (not in its last year). */
  maintenance: MaintenanceCycle[];
  /** When false, nothing follows the initial treatment (it simply ages out). */
  repeatAtEndOfLife: boolean;
};

export type RatedActivity = {
  /**
   * The year the cost is booked: the year in which the need falls, end-of-year
   * convention (a life that ends at 11.67 years books the next treatment in
   * year 12). Whole years, as in the FHWA bulletin's year-by-year cash flows.
   */
  year: number;
  template: ActivityTemplate;
  kind: 'initial' | 'rehabilitation' | 'maintenance';
  /**
   * When this treatment's life begins and ends, in years from the start, exactly:
   * fractional lives are chained as they are (11.67, 23.33, 35.00 …), never
   * rounded, so no rounding drift builds up and the remaining-life credit at the
   * end of the period is the exact fraction left (FHWA-SA-98-079).
   */
  lifeStartsAt: number;
  lifeEndsAt: number;
};

/** The whole year in which a moment falls (end-of-year convention); a hair of float error is forgiven. */
export const bookingYear = (t: number) => Math.max(0, Math.ceil(t - 1e-9));

/**
 * Lives shorter than one year are taken as one year: costs are booked by whole
 * years, and a schedule of several treatments in one year means nothing here.
 */
const MIN_LIFE_YEARS = 1;

export function expandSchedule(plan: Schedule, analysisPeriodYears: number): RatedActivity[] {
  const out: RatedActivity[] = [];
  let startsAt = 0;
  let current = plan.initial;
  let k = 0;
  for (;;) {
    const year = bookingYear(startsAt);
    const life = Math.max(MIN_LIFE_YEARS, current.serviceLifeYears);
    const endsAt = startsAt + life;
    const nextYear = bookingYear(endsAt);
    out.push({
      year,
      template: current,
      kind: year === 0 ? 'initial' : 'rehabilitation',
      lifeStartsAt: startsAt,
      lifeEndsAt: endsAt,
    });
    for (const m of plan.maintenance) {
      // Every n years after the treatment, up to (not in) the year the next one is booked.
      for (let t = year + m.everyYears; t < nextYear && t < analysisPeriodYears; t += m.everyYears) {
        const mLife = Math.max(MIN_LIFE_YEARS, m.template.serviceLifeYears);
        out.push({
          year: t,
          template: { ...m.template, salvage: m.template.salvage ?? false },
          kind: 'maintenance',
          lifeStartsAt: t,
          lifeEndsAt: t + mLife,
        });
      }
    }
    startsAt = endsAt;
    if (!plan.repeatAtEndOfLife || nextYear >= analysisPeriodYears) break;
    current = plan.rehabilitation.length
      ? plan.rehabilitation[Math.min(k, plan.rehabilitation.length - 1)]
      : plan.initial;
    k++;
  }
  return out.sort((a, b) => a.year - b.year);
}

/** Cost of one activity on given quantities: (rates × quantities) × (1 + add-ons). */
export function activityCost(r: CostRates, q: { areaSy: number; laneMiles: number; jobs: number }) {
  return (r.perSy * q.areaSy + r.perLaneMile * q.laneMiles + r.perJob * q.jobs) * (1 + r.addOnFraction);
}
