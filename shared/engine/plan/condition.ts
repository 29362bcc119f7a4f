// The plan's condition model (docs/COMPUTATION.md, The budget plan: condition).
// A segment's PCI in plan year y is read off its family's deterioration curve:
//   PCI(y) = min(100, curve(A + s·(y − Y0)) + g + Σ g_k·fadeFactor(y − y_k, L_k))
// where Y0 is the year the state began (plan start, or the year of the last
// age-resetting treatment), A the age on the curve then, s a time scale (1 on the
// family's own curve; after a treatment, the speed that brings the curve to the
// end-of-life PCI exactly at the treatment's service life), g the excess of a PCI
// above the curve's top, and g_k the points a gain that does not reset age added in
// year y_k, fading straight to none at the end of that treatment's life L_k.
import { classGroup } from '../forecast/families';
import type { Curve } from '../forecast/curve';

export type PlanSegment = {
  ref: number;
  segmentId: string;
  roadName: string;
  fromDesc?: string | null;
  toDesc?: string | null;
  lengthMi: number;
  lanes: number;
  areaSy: number;
  laneMiles: number;
  functionalClass: string;
  surface: string;
  adt: number | null;
  truckPct?: number | null;
  /** The measured PCI, on pciDate. */
  pci: number;
  /** Date of the survey that gave pci (YYYY-MM-DD); null: taken as measured at the plan's start. */
  pciDate?: string | null;
  lastTreatmentYear: number | null;
  familyKey: string;
};

export type PlanTreatment = {
  id: string;
  name: string;
  category: string;
  /** Catalog kind (thin_overlay, mill_and_overlay …); older snapshots lack it. */
  kind?: string;
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

export type ClassFloor = { functionalClass: string; minPci: number };
export type PlanTargets = { minNetworkPci: number | null; classFloors: ClassFloor[]; goodOrBetterPct: number | null };

export type PlanSettings = {
  startYear: number;
  budgets: number[];
  weighting: 'lane-miles' | 'lane-miles-traffic';
  /** PCI below which a road counts in the backlog. */
  needsWorkBelow: number;
  /** Old name of targets.minNetworkPci (old snapshots). */
  minNetworkPci?: number | null;
  objective?: 'benefit' | 'cost';
  targets?: PlanTargets;
  maxStrategiesPerSegment?: number;
  allowThinOnWeakBase?: boolean;
  benefitTailYears?: number;
  /** Real discount rate of the agency, for each strategy's life-cycle cost. */
  discountRate?: number;
};

/** Inclusive PCI limits are compared with this tolerance, so a PCI of exactly 45.0 meets "45 to 75". */
export const PCI_TOLERANCE = 1e-6;

/**
 * The PCI at which a treatment's service life ends: the post-treatment curve is
 * scaled in time to reach it exactly at the life the catalog (or the mix and lift)
 * gives. 55 is the top of the ASTM D6433 "Poor" rating; a planning rule of Wearcourse
 * (common practice: a treatment is spent when the road is poor again).
 */
export const END_OF_LIFE_PCI = 55;

/** Years from the survey date to 1 January of the start year (0 when the survey is later or has no date). */
export function ageingYears(pciDate: string | null | undefined, startYear: number) {
  if (!pciDate) return 0;
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(pciDate);
  if (!m) return 0;
  const y = Number(m[1]);
  const t = Date.UTC(y, Number(m[2]) - 1, Number(m[3]));
  const frac = (t - Date.UTC(y, 0, 1)) / (Date.UTC(y + 1, 0, 1) - Date.UTC(y, 0, 1));
  return Math.max(0, startYear - (y + frac));
}

export type TreatmentGroupKey = 'reconstruction' | 'overlay' | 'preservation';

/** The family group a treatment puts the road in (the third part of a family key). */
export function groupAfter(t: Pick<PlanTreatment, 'category' | 'kind'>): TreatmentGroupKey {
  if (t.kind === 'reconstruction' || t.category === 'reconstruction') return 'reconstruction';
  if (t.kind === 'thin_overlay' || t.kind === 'mill_and_overlay' || t.kind === 'structural_overlay') return 'overlay';
  if (t.category === 'rehabilitation') return 'overlay';
  return 'preservation';
}

/**
 * The surface after a treatment: an asphalt lift or a reconstruction makes an asphalt road
 * (a concrete road is rebuilt in concrete), a chip seal a chip-seal road; other work keeps it.
 */
export function surfaceAfter(t: Pick<PlanTreatment, 'category' | 'kind'>, surface: string) {
  const g = groupAfter(t);
  if (g === 'reconstruction') return surface === 'concrete' ? 'concrete' : 'asphalt';
  if (g === 'overlay') return 'asphalt';
  if (t.kind === 'chip_seal') return 'chip_seal';
  return surface;
}

export const familyKeyOf = (surface: string, functionalClass: string, group: string) =>
  `${surface}|${classGroup(functionalClass)}|${group}`;

export function inPciRange(t: PlanTreatment, pci: number) {
  const a = t.applicability;
  return pci >= a.pciMin - PCI_TOLERANCE && pci <= a.pciMax + PCI_TOLERANCE;
}

/** The trigger PCI of a follow-up: the middle of the treatment's applicable PCI range (a planning rule). */
export const triggerPci = (t: PlanTreatment) => (t.applicability.pciMin + t.applicability.pciMax) / 2;

/** Curves in flat arrays, one index per family key, for the generator's inner loops. */
export class CurveTable {
  p0: number[] = [];
  a: number[] = [];
  b: number[] = [];
  private index = new Map<string, number>();
  constructor(private lookup: (key: string) => Curve) {}
  idx(key: string) {
    let i = this.index.get(key);
    if (i === undefined) {
      const c = this.lookup(key);
      i = this.p0.length;
      this.p0.push(c.p0);
      this.a.push(c.a);
      this.b.push(c.b);
      this.index.set(key, i);
    }
    return i;
  }
  /** curve(age), clamped to 0–100 (shared/engine/forecast/curve.ts pciAt). */
  pci(ci: number, age: number) {
    const v = this.p0[ci] - this.a[ci] * (age > 0 ? age : 0) ** this.b[ci];
    return v < 0 ? 0 : v > 100 ? 100 : v;
  }
  /** The curve's inverse (curve.ts ageAt). */
  age(ci: number, pci: number) {
    const p0 = this.p0[ci];
    if (pci >= p0) return 0;
    return ((p0 - (pci > 0 ? pci : 0)) / this.a[ci]) ** (1 / this.b[ci]);
  }
}

/**
 * How much of a gain that does not reset age is left k years after the work: all of it at the work,
 * none at the end of the treatment's life, straight in between: max(0, 1 − k / life). A planning rule
 * of Wearcourse (common practice: a seal's benefit is spent within its service life); it replaces the
 * permanent shift of the first strategy model, which let a crack seal lift the curve for good.
 */
export function fadeFactor(k: number, life: number) {
  if (k <= 0) return 1;
  if (!(life > 0)) return 0;
  const f = 1 - k / life;
  return f > 0 ? f : 0;
}

/** A gain that does not reset age: its points, its plan year and its treatment's life. */
export type Fade = { gain: number; year: number; life: number };

/** A segment's condition state: PCI(y) = min(100, curve(age + speed·(y − origin)) + shift + fading gains). */
export type CondState = {
  curve: number;
  age: number;
  speed: number;
  shift: number;
  origin: number;
  surface: string;
  /** Plan-year index of the last treatment (negative: before the plan; −Infinity: never). */
  lastYear: number;
  /** Gains that do not reset age, since the last age-resetting work. */
  fades: Fade[];
};

export function stateValue(ct: CurveTable, s: CondState, y: number) {
  let v = ct.pci(s.curve, s.age + s.speed * (y - s.origin)) + s.shift;
  for (const f of s.fades) v += f.gain * fadeFactor(y - f.year, f.life);
  return v > 100 ? 100 : v;
}

/** The state at the plan's start: the measured PCI placed on its curve and aged from the survey date. */
export function initialState(ct: CurveTable, seg: PlanSegment, startYear: number): CondState {
  const curve = ct.idx(seg.familyKey);
  const a0 = ct.age(curve, seg.pci);
  // A PCI above the curve's P0 keeps its excess as a shift (the curve cannot reach it).
  const shift = seg.pci > ct.p0[curve] ? seg.pci - ct.p0[curve] : 0;
  return {
    curve,
    age: a0 + ageingYears(seg.pciDate, startYear),
    speed: 1,
    shift,
    origin: 0,
    surface: seg.surface,
    lastYear: seg.lastTreatmentYear === null ? -Infinity : seg.lastTreatmentYear - startYear,
    fades: [],
  };
}

/** PCI in plan year 0 with no work: the measured PCI itself when no ageing is needed (no round trip). */
export function yearZeroPci(ct: CurveTable, seg: PlanSegment, s0: CondState, startYear: number) {
  return ageingYears(seg.pciDate, startYear) === 0 ? seg.pci : stateValue(ct, s0, 0);
}

/**
 * Applies treatment t in plan year y to a road at PCI `before`; returns the PCI just after.
 * Age-resetting work moves the road to the family it now belongs to (surface and treatment
 * group), starts at the after-PCI on that curve, and runs the curve at the speed that reaches
 * END_OF_LIFE_PCI at the treatment's life. Work that does not reset age keeps the curve, the
 * age and the speed and adds the points actually gained as a fading gain (fadeFactor).
 */
export function applyTreatment(
  ct: CurveTable,
  s: CondState,
  t: PlanTreatment,
  functionalClass: string,
  y: number,
  before: number,
): number {
  const raw = t.effect.type === 'reset' ? t.effect.value : before + t.effect.value;
  const after = raw > 100 ? 100 : raw;
  s.lastYear = y;
  if (!t.effect.resetsAge) {
    if (after > before) s.fades = [...s.fades, { gain: after - before, year: y, life: t.lifeYears }];
    s.surface = surfaceAfter(t, s.surface);
    return after;
  }
  s.surface = surfaceAfter(t, s.surface);
  const ci = ct.idx(familyKeyOf(s.surface, functionalClass, groupAfter(t)));
  const p0 = ct.p0[ci];
  const shift = after > p0 ? after - p0 : 0;
  const aStart = ct.age(ci, after - shift);
  const aEnd = ct.age(ci, END_OF_LIFE_PCI - shift);
  const speed = after > END_OF_LIFE_PCI + 1e-9 && t.lifeYears > 0 && aEnd > aStart ? (aEnd - aStart) / t.lifeYears : 1;
  s.curve = ci;
  s.age = aStart;
  s.speed = speed;
  s.shift = shift;
  s.fades = [];
  s.origin = y;
  return after;
}
