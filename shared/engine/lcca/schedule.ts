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

export type SchedulePlan = {
  initial: ActivityTemplate;
  /** Treatments applied in turn as each life ends; the last one repeats. Empty: the initial repeats. */
  rehabilitation: ActivityTemplate[];
  /** Maintenance within each treatment's life, every n years after it (not in its last year). */
  maintenance: MaintenanceCycle[];
  /** When false, nothing follows the initial treatment (it simply ages out). */
  repeatAtEndOfLife: boolean;
};

export type RatedActivity = {
  year: number;
  template: ActivityTemplate;
  kind: 'initial' | 'rehabilitation' | 'maintenance';
};

export function expandSchedule(plan: SchedulePlan, analysisPeriodYears: number): RatedActivity[] {
  const out: RatedActivity[] = [];
  let year = 0;
  let current = plan.initial;
  let k = 0;
  for (;;) {
    out.push({ year, template: current, kind: year === 0 ? 'initial' : 'rehabilitation' });
    const life = Math.max(1, current.serviceLifeYears);
    for (const m of plan.maintenance) {
      for (let t = year + m.everyYears; t < year + life && t < analysisPeriodYears; t += m.everyYears) {
        out.push({ year: t, template: { ...m.template, salvage: m.template.salvage ?? false }, kind: 'maintenance' });
      }
    }
    year += life;
    if (!plan.repeatAtEndOfLife || year >= analysisPeriodYears) break;
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
