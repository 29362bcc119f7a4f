// The strategy generator (docs/COMPUTATION.md, The budget plan: strategies). For every segment it
// writes a bounded set of treatment strategies — sequences of work over the horizon — straight
// into a PackedInstance: cost per year, benefit over do-nothing, life-cycle cost, and the target rows.
import { CONDITION_BANDS } from '../../condition';
import type { Curve } from '../forecast/curve';
import { checkOverlay, conditionFactor, type StructuralCheck } from '../structural';
import { areaBetween, segmentWeight, stepDiscounts, strategyLifeCycleCost } from './benefit';
import {
  applyTreatment,
  fadeFactor,
  surfaceAfter,
  type CondState,
  CurveTable,
  initialState,
  inPciRange,
  PCI_TOLERANCE,
  type PlanSegment,
  type PlanSettings,
  type PlanTreatment,
  triggerPci,
  yearZeroPci,
} from './condition';
import type { PackedInstance, TargetRow } from './instance';

export const DEFAULT_MAX_STRATEGIES = 24;
export const DEFAULT_BENEFIT_TAIL_YEARS = 10;
/** Fallback real discount rate for snapshots that carry none (the demo agency's 2 %). */
export const FALLBACK_DISCOUNT_RATE = 0.02;
/** "Good or better": PCI at or above the lower edge of the Light wear band (ASTM D6433 Satisfactory, 71). */
export const GOOD_OR_BETTER_PCI = CONDITION_BANDS.find((b) => b.id === 'good')!.min;

/** What the packed arrays do not hold: the works of each option, to rebuild paths and work lists. */
export type StrategyMeta = {
  /** Benefit window in years: the horizon plus the tail. */
  W: number;
  /** Works of option o are actStart[o] … actStart[o+1]−1. */
  actStart: Int32Array;
  actTreatment: Int32Array;
  actYear: Int32Array;
  /** 1 where the AASHTO 1993 check flags the lift (allowed only with allowThinOnWeakBase, or a thick lift). */
  actFlag: Uint8Array;
  /** Labels of class floors no strategy of a segment can keep. */
  floorsUnreachable: string[];
};

/** A lift the structural rule keeps out where the check flags it: a thin or mill-and-overlay lift (under 3 in). */
export const isThinLift = (t: PlanTreatment) =>
  t.thicknessIn !== null &&
  (t.kind === 'thin_overlay' || t.kind === 'mill_and_overlay' || (t.kind === undefined && t.thicknessIn < 3));

class Grow {
  n = 0;
  constructor(
    public a: Float64Array | Int32Array | Uint8Array,
    private make: (n: number) => Float64Array | Int32Array | Uint8Array,
  ) {}
  push(v: number) {
    if (this.n === this.a.length) {
      const b = this.make(this.a.length * 2);
      b.set(this.a);
      this.a = b;
    }
    this.a[this.n++] = v;
  }
  done() {
    return this.a.slice(0, this.n);
  }
}
const f64 = (n: number) => new Float64Array(n);
const i32 = (n: number) => new Int32Array(n);
const u8 = (n: number) => new Uint8Array(n);

const SURFACE_INDEX: Record<string, number> = { asphalt: 0, chip_seal: 1, concrete: 2, gravel: 3, other: 4 };

/**
 * One segment's context for walking strategies (shared by the generator and the simulation). A path
 * is read off a base array — do-nothing's raw curve values, or the raw values of the curve an
 * age-resetting treatment started (cached per treatment and surface) — plus the points that works
 * not resetting age have added since, each fading over its treatment's life:
 * PCI(y) = min(100, base[y − origin] + Σ gain_k·fadeFactor(y − y_k, life_k)). This is the condition
 * model of condition.ts (stateValue) tabulated once per segment.
 */
export class SegmentWalker {
  readonly none: Float64Array;
  readonly s0: CondState;
  readonly cost: Float64Array;
  private noneRaw: Float64Array;
  private classOk: Uint8Array;
  private bases = new Map<number, Float64Array>();
  /** Σ disc[y]·(after − before) / 2 of the last traced path's works after year 0 (benefit.ts areaBetween). */
  jumps = 0;
  /** The benefit's step discounts at the plan's real discount rate (benefit.ts stepDiscounts). */
  readonly disc: Float64Array;
  /**
   * The last traced path as the benefit counts it: never below the PCI at which its last
   * age-resetting work was done (the renewal credit, docs/COMPUTATION.md "Benefit").
   */
  readonly bpath: Float64Array;
  private fadeAmt: Float64Array;
  private fadeAt: Int32Array;
  private fadeLife: Float64Array;
  private structural: (StructuralCheck | undefined)[] = [];
  private structuralPci: number[] = [];
  private structuralFirst: (StructuralCheck | undefined)[] = [];
  constructor(
    readonly ct: CurveTable,
    readonly seg: PlanSegment,
    readonly treatments: PlanTreatment[],
    readonly surfaceSets: Set<string>[],
    readonly settings: PlanSettings,
    readonly W: number,
  ) {
    this.s0 = initialState(ct, seg, settings.startYear);
    this.disc = stepDiscounts(settings.discountRate ?? FALLBACK_DISCOUNT_RATE, W);
    this.bpath = new Float64Array(W + 1);
    this.fadeAmt = new Float64Array(W + 2);
    this.fadeAt = new Int32Array(W + 2);
    this.fadeLife = new Float64Array(W + 2);
    this.noneRaw = new Float64Array(W + 1);
    this.none = new Float64Array(W + 1);
    for (let t = 0; t <= W; t++) {
      this.noneRaw[t] = ct.pci(this.s0.curve, this.s0.age + t) + this.s0.shift;
      this.none[t] = this.noneRaw[t] > 100 ? 100 : this.noneRaw[t];
    }
    // Year 0 is the measured PCI itself when no ageing is needed (no round trip through the curve).
    const z = yearZeroPci(ct, seg, this.s0, settings.startYear);
    this.none[0] = z;
    this.noneRaw[0] = z;
    this.cost = new Float64Array(treatments.length);
    this.classOk = new Uint8Array(treatments.length);
    treatments.forEach((t, i) => {
      this.cost[i] = t.costPerSy * seg.areaSy + t.costPerLaneMile * seg.laneMiles;
      this.classOk[i] = t.applicability.classes.includes(seg.functionalClass) ? 1 : 0;
    });
  }

  private check(ti: number, pci: number) {
    const level = pci >= 70 ? 0 : pci >= 55 ? 1 : pci >= 40 ? 2 : 3;
    const k = ti * 4 + level;
    let c = this.structural[k];
    if (!c) {
      // One checkOverlay per lift (its design traffic and required SN do not depend on PCI); the
      // condition factor's steps rescale its effective existing SN (structural.ts conditionFactor).
      let first = this.structuralFirst[ti];
      if (!first) {
        const t = this.treatments[ti];
        first = checkOverlay(
          { adt: this.seg.adt, truckPct: this.seg.truckPct ?? null, functionalClass: this.seg.functionalClass, pci },
          { thicknessIn: t.thicknessIn!, serviceLifeYears: t.lifeYears },
        );
        this.structuralPci[ti] = pci;
        this.structuralFirst[ti] = first;
        this.structural[k] = first;
        return first;
      }
      const f0 = conditionFactor(this.structuralPci[ti]);
      const existing = (first.effectiveExistingSn / f0) * conditionFactor(pci);
      const sn = existing + (first.snWithOverlay - first.effectiveExistingSn);
      const shortBy = Math.max(0, first.requiredSn - sn);
      c = { ...first, effectiveExistingSn: existing, snWithOverlay: sn, shortBy, caution: shortBy > 0 };
      this.structural[k] = c;
    }
    return c;
  }

  /** The AASHTO 1993 check (structural.ts checkOverlay) of treatment ti's lift on this road at this PCI. */
  structuralCheck(ti: number, pci: number) {
    return this.check(ti, pci);
  }

  /** −1: not applicable; 0: applicable; 1: applicable and flagged by the structural check. */
  applicable(ti: number, surface: string, lastYear: number, y: number, pci: number) {
    const t = this.treatments[ti];
    if (!this.classOk[ti] || !this.surfaceSets[ti].has(surface) || !inPciRange(t, pci)) return -1;
    if (y - lastYear < t.applicability.minYearsSinceLast) return -1;
    if (t.thicknessIn === null) return 0;
    if (!this.check(ti, pci).caution) return 0;
    return isThinLift(t) && !this.settings.allowThinOnWeakBase ? -1 : 1;
  }

  /** Raw values (before the 100 cap) of the curve an age-resetting treatment starts, years 0 … W after it. */
  private base(ti: number, surface: string, before: number) {
    const t = this.treatments[ti];
    const cacheable = t.effect.type === 'reset';
    const key = ti * 8 + (SURFACE_INDEX[surface] ?? 5);
    if (cacheable) {
      const b = this.bases.get(key);
      if (b) return b;
    }
    const st: CondState = { ...this.s0, surface };
    applyTreatment(this.ct, st, t, this.seg.functionalClass, 0, before);
    const b = new Float64Array(this.W + 1);
    for (let k = 0; k <= this.W; k++) b[k] = this.ct.pci(st.curve, st.age + st.speed * k) + st.shift;
    if (cacheable) this.bases.set(key, b);
    return b;
  }

  /**
   * Walks one strategy and writes its path (years 0 … W) at path[off …]. Either `works` is given
   * (treatment, year pairs, in year order: a replay) or a seed (ti in year y0) with, when followUp,
   * further work within the horizon whenever the road has fallen to a treatment's trigger PCI and that
   * treatment fits (the cheapest such one). Works go to acts (treatment, year pairs) with their
   * structural flags and before/after PCI; returns their number.
   */
  trace(
    seed: { ti: number; y0: number; followUp: boolean; H: number } | null,
    works: { treatment: number; year: number }[] | null,
    path: Float64Array,
    off: number,
    acts: Int32Array,
    flags: Uint8Array,
    pcis?: Float64Array,
    at = 0,
    maxWorks = acts.length >> 1,
  ) {
    const { W, treatments } = this;
    let B = this.noneRaw;
    let origin = 0;
    let nFade = 0;
    const { fadeAmt, fadeAt, fadeLife, disc } = this;
    let surface = this.seg.surface;
    let lastYear = this.s0.lastYear;
    this.jumps = 0;
    const bpath = this.bpath;
    let floor = Number.NEGATIVE_INFINITY;
    let n = 0;
    let k = 0;
    for (let y = 0; y <= W; y++) {
      let extra = 0;
      for (let f = 0; f < nFade; f++) extra += fadeAmt[f] * fadeFactor(y - fadeAt[f], fadeLife[f]);
      let v = y === 0 && origin === 0 ? this.none[0] + extra : B[y - origin] + extra;
      if (v > 100) v = 100;
      // Works this year: the replay's, or the seed, or a follow-up.
      for (;;) {
        let ti = -1;
        let flag = 0;
        if (works) {
          if (k < works.length && works[k].year === y) ti = works[k++].treatment;
        } else if (seed && n === 0 && y === seed.y0) {
          ti = seed.ti;
          flag = this.applicable(ti, surface, lastYear, y, v) === 1 ? 1 : 0;
        } else if (seed?.followUp && n > 0 && y < seed.H && lastYear < y && n < maxWorks) {
          for (let tj = 0; tj < treatments.length; tj++) {
            if (v > triggerPci(treatments[tj]) + PCI_TOLERANCE) continue;
            if (ti >= 0 && this.cost[tj] >= this.cost[ti]) continue;
            const f = this.applicable(tj, surface, lastYear, y, v);
            if (f < 0) continue;
            ti = tj;
            flag = f;
          }
        }
        if (ti < 0) break;
        const t = treatments[ti];
        const before = v;
        const raw = t.effect.type === 'reset' ? t.effect.value : before + t.effect.value;
        const after = raw > 100 ? 100 : raw;
        const bBefore = before > floor ? before : floor;
        if (t.effect.resetsAge) {
          floor = before;
          B = this.base(ti, surface, before);
          origin = y;
          nFade = 0;
        } else if (after > before) {
          fadeAmt[nFade] = after - before;
          fadeAt[nFade] = y;
          fadeLife[nFade] = t.lifeYears;
          nFade++;
        }
        surface = surfaceAfter(t, surface);
        lastYear = y;
        if (y > 0) this.jumps += (disc[y] * ((after > floor ? after : floor) - bBefore)) / 2;
        v = after;
        if (n < maxWorks) {
          acts[(at + n) * 2] = ti;
          acts[(at + n) * 2 + 1] = y;
          flags[at + n] = flag;
          if (pcis) {
            pcis[n * 2] = before;
            pcis[n * 2 + 1] = after;
          }
        }
        n++;
        if (!works) break;
      }
      path[off + y] = v;
      bpath[y] = v > floor ? v : floor;
    }
    return n;
  }
}

export function surfaceSetsOf(treatments: PlanTreatment[]) {
  return treatments.map((t) => new Set(t.applicability.surfaces));
}

/**
 * Candidates for every segment. The rule (docs/COMPUTATION.md):
 * - a seed is a treatment in a plan year where it fits the road left untreated until then (PCI range
 *   with tolerance, surface, class, years since the last work, the structural rule);
 * - each seed gives the seed alone, and the seed with follow-ups: in each later plan year, the
 *   cheapest treatment that fits and whose trigger PCI (the middle of its range) the road has fallen
 *   to; what may follow what is the catalog's applicability on the treated road (its new surface,
 *   PCI and years since the last work);
 * - at most maxStrategiesPerSegment per segment, those with the most benefit per dollar kept;
 *   do-nothing is implicit; strategies with no benefit are dropped.
 */
export function generateStrategies(
  segments: PlanSegment[],
  treatments: PlanTreatment[],
  curves: (key: string) => Curve,
  settings: PlanSettings,
): { inst: PackedInstance; meta: StrategyMeta; curveTable: CurveTable } {
  const H = settings.budgets.length;
  const tail = settings.benefitTailYears ?? DEFAULT_BENEFIT_TAIL_YEARS;
  const W = H + tail;
  const K = settings.maxStrategiesPerSegment ?? DEFAULT_MAX_STRATEGIES;
  const rate = settings.discountRate ?? FALLBACK_DISCOUNT_RATE;
  const targets = settings.targets ?? {
    minNetworkPci: settings.minNetworkPci ?? null,
    classFloors: [],
    goodOrBetterPct: null,
  };
  const floorOf = new Map(targets.classFloors.map((f) => [f.functionalClass, f.minPci]));
  const needPaths = targets.minNetworkPci !== null || targets.goodOrBetterPct !== null;
  const ct = new CurveTable(curves);
  const surfaceSets = surfaceSetsOf(treatments);
  const T = treatments.length;
  const maxCand = T * H * 2;
  const MAXW = H + 1;
  const cPath = new Float64Array(maxCand * (W + 1));
  const cActs = new Int32Array(maxCand * MAXW * 2);
  const cFlags = new Uint8Array(maxCand * MAXW);
  const cN = new Int32Array(maxCand);
  const cBenefit = new Float64Array(maxCand);
  const cRatio = new Float64Array(maxCand);
  const order: number[] = [];
  const yearCost = new Float64Array(H);

  const segStart = new Int32Array(segments.length + 1);
  const benefit = new Grow(f64(1024), f64);
  const lcc = new Grow(f64(1024), f64);
  const cost = new Grow(f64(1024 * H), f64);
  const actStart = new Grow(i32(1024), i32);
  const actTreatment = new Grow(i32(2048), i32);
  const actYear = new Grow(i32(2048), i32);
  const actFlag = new Grow(u8(2048), u8);
  const pathsH = needPaths ? new Grow(f64(1024 * H), f64) : null;
  const noneH = needPaths ? new Float64Array(segments.length * H) : null;
  const priority = new Float64Array(segments.length);
  const mustChoose = new Uint8Array(segments.length);
  const floorsUnreachable: string[] = [];
  let nOpt = 0;

  for (let i = 0; i < segments.length; i++) {
    const seg = segments[i];
    segStart[i] = nOpt;
    const wk = new SegmentWalker(ct, seg, treatments, surfaceSets, settings, W);
    const none = wk.none;
    priority[i] = none[0];
    if (noneH) for (let y = 0; y < H; y++) noneH[i * H + y] = none[y];
    const weight = segmentWeight(seg, settings.weighting);
    const floor = floorOf.get(seg.functionalClass);
    let n = 0;
    for (let ti = 0; ti < T; ti++) {
      for (let y0 = 0; y0 < H; y0++) {
        if (wk.applicable(ti, seg.surface, wk.s0.lastYear, y0, none[y0]) < 0) continue;
        for (let v = 0; v < 2; v++) {
          const off = n * (W + 1);
          const works = wk.trace(
            { ti, y0, followUp: v === 1, H },
            null,
            cPath,
            off,
            cActs,
            cFlags,
            undefined,
            n * MAXW,
            MAXW,
          );
          if (v === 1 && works === 1) continue; // no follow-up: the same as the seed alone
          if (floor !== undefined) {
            let low = false;
            for (let y = 0; y < H; y++) if (cPath[off + y] < floor - PCI_TOLERANCE) low = true;
            if (low) continue;
          }
          const b = areaBetween(wk.bpath, none, W, wk.jumps, wk.disc) * weight;
          if (!(b > 1e-9)) continue;
          let total = 0;
          for (let k = 0; k < works; k++) total += wk.cost[cActs[n * MAXW * 2 + k * 2]];
          cN[n] = works;
          cBenefit[n] = b;
          cRatio[n] = total > 0 ? b / total : Number.POSITIVE_INFINITY;
          n++;
        }
      }
    }
    if (floor !== undefined) {
      let low = false;
      for (let y = 0; y < H; y++) if (none[y] < floor - PCI_TOLERANCE) low = true;
      if (low) {
        if (n > 0) mustChoose[i] = 1;
        else
          floorsUnreachable.push(
            `${seg.segmentId} (${seg.functionalClass.replace(/_/g, ' ')}): no strategy keeps it at PCI ${floor} or more`,
          );
      }
    }
    order.length = 0;
    for (let c = 0; c < n; c++) order.push(c);
    if (n > K) {
      order.sort((a, b) => cRatio[b] - cRatio[a] || cBenefit[b] - cBenefit[a]);
      order.length = K;
      order.sort((a, b) => a - b);
    }
    for (const c of order) {
      benefit.push(cBenefit[c]);
      const activities = [];
      for (let k = 0; k < cN[c]; k++) {
        const tk = cActs[c * MAXW * 2 + k * 2];
        activities.push({
          year: cActs[c * MAXW * 2 + k * 2 + 1],
          cost: wk.cost[tk],
          serviceLifeYears: treatments[tk].lifeYears,
        });
      }
      lcc.push(strategyLifeCycleCost(activities, rate, W).presentValue);
      actStart.push(actTreatment.n);
      yearCost.fill(0);
      for (let k = 0; k < cN[c]; k++) {
        const tk = cActs[c * MAXW * 2 + k * 2];
        const yk = cActs[c * MAXW * 2 + k * 2 + 1];
        actTreatment.push(tk);
        actYear.push(yk);
        actFlag.push(cFlags[c * MAXW + k]);
        yearCost[yk] += wk.cost[tk];
      }
      for (let y = 0; y < H; y++) cost.push(yearCost[y]);
      if (pathsH) for (let y = 0; y < H; y++) pathsH.push(cPath[c * (W + 1) + y]);
      nOpt++;
    }
  }
  segStart[segments.length] = nOpt;
  actStart.push(actTreatment.n);

  const rows: TargetRow[] = [];
  if (pathsH && noneH) {
    const P = pathsH.done();
    const lm = segments.map((s) => s.laneMiles);
    const totalLm = lm.reduce((a, b) => a + b, 0);
    for (let y = 0; y < H; y++) {
      const cal = settings.startYear + y;
      if (targets.minNetworkPci !== null) {
        rows.push(
          row(`network PCI ≥ ${targets.minNetworkPci} in ${cal}`, y, targets.minNetworkPci * totalLm, (i, o) =>
            o < 0 ? noneH[i * H + y] * lm[i] : (P[o * H + y] - noneH[i * H + y]) * lm[i],
          ),
        );
      }
      if (targets.goodOrBetterPct !== null) {
        const good = (v: number) => (v >= GOOD_OR_BETTER_PCI - PCI_TOLERANCE ? 1 : 0);
        rows.push(
          row(
            `lane-miles in good or better condition ≥ ${targets.goodOrBetterPct} % in ${cal}`,
            y,
            (targets.goodOrBetterPct / 100) * totalLm,
            (i, o) => (o < 0 ? good(noneH[i * H + y]) * lm[i] : (good(P[o * H + y]) - good(noneH[i * H + y])) * lm[i]),
          ),
        );
      }
    }
  }
  /** Σ over options of gain·x ≥ target − Σ do-nothing (o = −1 asks for a segment's do-nothing term). */
  function row(label: string, year: number, target: number, term: (i: number, o: number) => number): TargetRow {
    let base = 0;
    const idx: number[] = [];
    const gain: number[] = [];
    for (let i = 0; i < segments.length; i++) {
      base += term(i, -1);
      for (let o = segStart[i]; o < segStart[i + 1]; o++) {
        const g = term(i, o);
        if (g !== 0) {
          idx.push(o);
          gain.push(g);
        }
      }
    }
    return { label, year, rhs: target - base, idx: Int32Array.from(idx), gain: Float64Array.from(gain) };
  }

  const inst: PackedInstance = {
    years: H,
    budgets: Float64Array.from(settings.budgets),
    nSegments: segments.length,
    segStart,
    benefit: benefit.done() as Float64Array,
    lcc: lcc.done() as Float64Array,
    cost: cost.done() as Float64Array,
    priority,
    mustChoose,
    targets: rows,
    objective: settings.objective ?? 'benefit',
  };
  const meta: StrategyMeta = {
    W,
    actStart: actStart.done() as Int32Array,
    actTreatment: actTreatment.done() as Int32Array,
    actYear: actYear.done() as Int32Array,
    actFlag: actFlag.done() as Uint8Array,
    floorsUnreachable,
  };
  return { inst, meta, curveTable: ct };
}
