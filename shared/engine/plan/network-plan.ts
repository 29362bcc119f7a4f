// From an inventory, its curves and the catalog's treatments to candidate
// work (with benefit and cost), and from chosen work back to what the network
// looks like year by year (docs/COMPUTATION.md, Deterioration curves and the budget plan).
import { CONDITION_BANDS, conditionBand } from '../../condition';
import { ageAt, type Curve, pciAt } from '../forecast/curve';
import type { Instance, OptSegment } from './optimize';

export type PlanSegment = {
  ref: number;
  segmentId: string;
  roadName: string;
  lengthMi: number;
  lanes: number;
  areaSy: number;
  laneMiles: number;
  functionalClass: string;
  surface: string;
  adt: number | null;
  pci: number;
  lastTreatmentYear: number | null;
  familyKey: string;
};

export type PlanTreatment = {
  id: string;
  name: string;
  category: string;
  /** Planning cost per SY, add-ons included (constant base-year dollars). */
  costPerSy: number;
  costPerLaneMile: number;
  tonsPerSy: number;
  mixName: string | null;
  thicknessIn: number | null;
  lifeYears: number;
  effect: { type: 'reset' | 'gain'; value: number; resetsAge: boolean };
  applicability: { pciMin: number; pciMax: number; surfaces: string[]; classes: string[]; minYearsSinceLast: number };
};

export type PlanSettings = {
  startYear: number;
  budgets: number[];
  weighting: 'lane-miles' | 'lane-miles-traffic';
  /** PCI below which an untreated road counts in the backlog. */
  needsWorkBelow: number;
  /** Optional minimum length-weighted network PCI in every year (enforced by the exact method). */
  minNetworkPci?: number | null;
};

/** Condition by plan year without any work: the curve continued from today's PCI. */
export function doNothing(curve: Curve, pci: number, years: number) {
  const a0 = ageAt(curve, pci);
  return Array.from({ length: years }, (_, y) => pciAt(curve, a0 + y));
}

/** Condition by plan year when the treatment is applied in year t. */
export function withTreatment(curve: Curve, none: number[], t: PlanTreatment, year: number, years: number) {
  const after = t.effect.type === 'reset' ? t.effect.value : Math.min(100, none[year] + t.effect.value);
  const a = ageAt(curve, after);
  return Array.from({ length: years }, (_, y) => (y < year ? none[y] : pciAt(curve, a + (y - year))));
}

export const trafficWeight = (adt: number | null) => Math.log10((adt ?? 0) + 10);

export function segmentWeight(s: PlanSegment, weighting: PlanSettings['weighting']) {
  return s.laneMiles * (weighting === 'lane-miles-traffic' ? trafficWeight(s.adt) : 1);
}

export function treatmentCost(t: PlanTreatment, s: PlanSegment) {
  return t.costPerSy * s.areaSy + t.costPerLaneMile * s.laneMiles;
}

function applicable(t: PlanTreatment, s: PlanSegment, pci: number, calendarYear: number) {
  const a = t.applicability;
  if (!a.surfaces.includes(s.surface) || !a.classes.includes(s.functionalClass)) return false;
  if (pci < a.pciMin || pci > a.pciMax) return false;
  if (s.lastTreatmentYear !== null && calendarYear - s.lastTreatmentYear < a.minYearsSinceLast) return false;
  return true;
}

/**
 * Candidates: each applicable treatment in each year of the horizon. Benefit
 * is the area between the with- and without-treatment curves, weighted by
 * lane-miles (and traffic, if chosen), counted over the horizon and on past
 * it until the treatment's life ends, so late work is not undervalued.
 */
export function buildCandidates(
  segments: PlanSegment[],
  treatments: PlanTreatment[],
  curves: (key: string) => Curve,
  settings: PlanSettings,
) {
  const H = settings.budgets.length;
  const optSegments: OptSegment[] = [];
  const meta: { segment: PlanSegment; options: { treatment: PlanTreatment; year: number; cost: number }[] }[] = [];
  for (const s of segments) {
    const curve = curves(s.familyKey);
    const w = segmentWeight(s, settings.weighting);
    const options: OptSegment['options'] = [];
    const m: (typeof meta)[number]['options'] = [];
    for (const t of treatments) {
      const span = H + Math.ceil(t.lifeYears);
      const none = doNothing(curve, s.pci, span);
      for (let y = 0; y < H; y++) {
        if (!applicable(t, s, none[y], settings.startYear + y)) continue;
        const withT = withTreatment(curve, none, t, y, Math.min(span, y + Math.ceil(t.lifeYears) + 1));
        let area = 0;
        for (let k = y; k < withT.length; k++) area += withT[k] - none[k];
        const benefit = area * w;
        if (benefit <= 0) continue;
        const cost = treatmentCost(t, s);
        // Length × PCI gained in each plan year: the option's share of a network-PCI floor.
        const floorGains = Array.from({ length: H }, (_, k) =>
          k < withT.length ? Math.max(0, withT[k] - none[k]) * s.lengthMi : 0,
        );
        options.push({ id: `${s.ref}:${t.id}:${y}`, benefit, costs: [{ year: y, cost }], floorGains });
        m.push({ treatment: t, year: y, cost });
      }
    }
    optSegments.push({ id: String(s.ref), options, priority: s.pci });
    meta.push({ segment: s, options: m });
  }
  const instance: Instance = { budgets: settings.budgets, segments: optSegments };
  if (settings.minNetworkPci !== undefined && settings.minNetworkPci !== null) {
    // Σ length × PCI with no work, per year; the floor asks the work to lift it to target × total length.
    const length = segments.reduce((a, s) => a + s.lengthMi, 0);
    const base = new Array(H).fill(0);
    for (const s of segments) doNothing(curves(s.familyKey), s.pci, H).forEach((v, y) => (base[y] += v * s.lengthMi));
    instance.floors = base
      .map((b, y) => ({ year: y, rhs: settings.minNetworkPci! * length - b }))
      .filter((f) => f.rhs > 0);
  }
  return { instance, meta };
}

export type WorkItem = {
  year: number;
  calendarYear: number;
  ref: number;
  segmentId: string;
  roadName: string;
  treatment: string;
  mix: string | null;
  thicknessIn: number | null;
  tons: number;
  areaSy: number;
  laneMiles: number;
  cost: number;
  pciBefore: number;
  pciAfter: number;
};

export type YearResult = {
  year: number;
  calendarYear: number;
  budget: number;
  spent: number;
  networkPci: number;
  networkPciDoNothing: number;
  laneMilesByBand: Record<string, number>;
  backlog: number;
};

/** Walks the chosen work through the horizon: work lists, spending, network PCI, bands and backlog. */
export function simulate(
  segments: PlanSegment[],
  treatments: PlanTreatment[],
  curves: (key: string) => Curve,
  settings: PlanSettings,
  chosen: Map<number, { treatmentId: string; year: number }>,
) {
  const H = settings.budgets.length;
  const byId = new Map(treatments.map((t) => [t.id, t]));
  const cheapestFor = (s: PlanSegment, pci: number, calendarYear: number) => {
    let best = Infinity;
    for (const t of treatments) if (applicable(t, s, pci, calendarYear)) best = Math.min(best, treatmentCost(t, s));
    return Number.isFinite(best) ? best : 0;
  };
  const years: YearResult[] = Array.from({ length: H }, (_, y) => ({
    year: y,
    calendarYear: settings.startYear + y,
    budget: settings.budgets[y],
    spent: 0,
    networkPci: 0,
    networkPciDoNothing: 0,
    laneMilesByBand: Object.fromEntries(CONDITION_BANDS.map((b) => [b.id, 0])),
    backlog: 0,
  }));
  const work: WorkItem[] = [];
  let lengthSum = 0;
  for (const s of segments) {
    const curve = curves(s.familyKey);
    const none = doNothing(curve, s.pci, H);
    const c = chosen.get(s.ref);
    const t = c ? byId.get(c.treatmentId) : undefined;
    const path = t && c ? withTreatment(curve, none, t, c.year, H) : none;
    if (t && c) {
      const cost = treatmentCost(t, s);
      years[c.year].spent += cost;
      work.push({
        year: c.year,
        calendarYear: settings.startYear + c.year,
        ref: s.ref,
        segmentId: s.segmentId,
        roadName: s.roadName,
        treatment: t.name,
        mix: t.mixName,
        thicknessIn: t.thicknessIn,
        tons: t.tonsPerSy * s.areaSy,
        areaSy: s.areaSy,
        laneMiles: s.laneMiles,
        cost,
        pciBefore: none[c.year],
        pciAfter: path[c.year],
      });
    }
    lengthSum += s.lengthMi;
    for (let y = 0; y < H; y++) {
      years[y].networkPci += path[y] * s.lengthMi;
      years[y].networkPciDoNothing += none[y] * s.lengthMi;
      const band = conditionBand(path[y]);
      if (band) years[y].laneMilesByBand[band.id] += s.laneMiles;
      const treatedBy = c && c.year <= y;
      if (!treatedBy && path[y] < settings.needsWorkBelow)
        years[y].backlog += cheapestFor(s, path[y], settings.startYear + y);
    }
  }
  for (const y of years) {
    y.networkPci = lengthSum > 0 ? y.networkPci / lengthSum : 0;
    y.networkPciDoNothing = lengthSum > 0 ? y.networkPciDoNothing / lengthSum : 0;
  }
  work.sort((a, b) => a.year - b.year || b.cost - a.cost);
  return { years, work };
}
