// The strategy generator (docs/COMPUTATION.md, The budget plan: strategies). For every segment it
// writes a bounded set of treatment strategies — sequences of work over the horizon — straight
// into a PackedInstance: cost per year, benefit over do-nothing, life-cycle cost, and the target rows.
import { CONDITION_BANDS } from '../../condition';
import type { Curve } from '../forecast/curve';
import { checkOverlay, type StructuralCheck } from '../structural';
import { areaBetween, segmentWeight, strategyLifeCycleCost } from './benefit';
import {
  applyTreatment,
  type CondState,
  CurveTable,
  initialState,
  inPciRange,
  PCI_TOLERANCE,
  type PlanSegment,
  type PlanSettings,
  type PlanTreatment,
  stateValue,
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

const structuralMemo = new Map<string, StructuralCheck>();
/** checkOverlay (shared/engine/structural.ts), memoised on what it reads. */
export function structuralCheck(seg: PlanSegment, t: PlanTreatment, pci: number) {
  const trucks = (seg.adt ?? 0) * ((seg.truckPct ?? 0) / 100);
  const f = pci >= 70 ? 0 : pci >= 55 ? 1 : pci >= 40 ? 2 : 3;
  const key = `${trucks}|${seg.functionalClass}|${f}|${t.thicknessIn}|${t.lifeYears}`;
  let c = structuralMemo.get(key);
  if (!c) {
    c = checkOverlay(
      { adt: seg.adt, truckPct: seg.truckPct ?? null, functionalClass: seg.functionalClass, pci },
      { thicknessIn: t.thicknessIn!, serviceLifeYears: t.lifeYears },
    );
    if (structuralMemo.size > 100_000) structuralMemo.clear();
    structuralMemo.set(key, c);
  }
  return c;
}

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

/** One segment's context for walking strategies (shared by the generator and the simulation). */
export class SegmentWalker {
  readonly none: Float64Array;
  readonly s0: CondState;
  readonly cost: Float64Array;
  private classOk: Uint8Array;
  constructor(
    readonly ct: CurveTable,
    readonly seg: PlanSegment,
    readonly treatments: PlanTreatment[],
    readonly surfaceSets: Set<string>[],
    readonly settings: PlanSettings,
    readonly W: number,
  ) {
    this.s0 = initialState(ct, seg, settings.startYear);
    this.none = new Float64Array(W + 1);
    this.none[0] = yearZeroPci(ct, seg, this.s0, settings.startYear);
    for (let t = 1; t <= W; t++) this.none[t] = stateValue(ct, this.s0, t);
    this.cost = new Float64Array(treatments.length);
    this.classOk = new Uint8Array(treatments.length);
    treatments.forEach((t, i) => {
      this.cost[i] = t.costPerSy * seg.areaSy + t.costPerLaneMile * seg.laneMiles;
      this.classOk[i] = t.applicability.classes.includes(seg.functionalClass) ? 1 : 0;
    });
  }

  /** −1: not applicable; 0: applicable; 1: applicable and flagged by the structural check. */
  applicable(ti: number, s: CondState, y: number, pci: number) {
    const t = this.treatments[ti];
    if (!this.classOk[ti] || !this.surfaceSets[ti].has(s.surface) || !inPciRange(t, pci)) return -1;
    if (y - s.lastYear < t.applicability.minYearsSinceLast) return -1;
    if (t.thicknessIn === null) return 0;
    if (!structuralCheck(this.seg, t, pci).caution) return 0;
    return isThinLift(t) && !this.settings.allowThinOnWeakBase ? -1 : 1;
  }

  /**
   * Walks one strategy: the seed work (ti in year y0) and, with followUp, further work within the
   * horizon whenever the road has fallen to a treatment's trigger PCI and that treatment fits
   * (the cheapest such one). Writes the path (years 0 … W) and returns the number of works.
   */
  walk(
    ti: number,
    y0: number,
    flag0: number,
    followUp: boolean,
    H: number,
    path: Float64Array,
    off: number,
    acts: Int32Array,
    flags: Uint8Array,
  ) {
    const { ct, none, W } = this;
    const st: CondState = { ...this.s0 };
    for (let y = 0; y < y0; y++) path[off + y] = none[y];
    path[off + y0] = applyTreatment(ct, st, this.treatments[ti], this.seg.functionalClass, y0, none[y0]);
    acts[0] = ti;
    acts[1] = y0;
    flags[0] = flag0;
    let n = 1;
    for (let y = y0 + 1; y <= W; y++) {
      let v = stateValue(ct, st, y);
      if (followUp && y < H) {
        let best = -1;
        let bestFlag = 0;
        for (let tj = 0; tj < this.treatments.length; tj++) {
          if (v > triggerPci(this.treatments[tj]) + PCI_TOLERANCE) continue;
          if (best >= 0 && this.cost[tj] >= this.cost[best]) continue;
          const f = this.applicable(tj, st, y, v);
          if (f < 0) continue;
          best = tj;
          bestFlag = f;
        }
        if (best >= 0 && n * 2 + 1 < acts.length) {
          v = applyTreatment(ct, st, this.treatments[best], this.seg.functionalClass, y, v);
          acts[n * 2] = best;
          acts[n * 2 + 1] = y;
          flags[n] = bestFlag;
          n++;
        }
      }
      path[off + y] = v;
    }
    return n;
  }

  /** Replays a list of works (treatment index, plan year), writing the path and each work's before/after PCI. */
  replay(works: { treatment: number; year: number }[], path: Float64Array) {
    const { ct, none, W } = this;
    const st: CondState = { ...this.s0 };
    const out: { before: number; after: number }[] = [];
    let k = 0;
    let treated = false;
    for (let y = 0; y <= W; y++) {
      let v = treated ? stateValue(ct, st, y) : none[y];
      while (k < works.length && works[k].year === y) {
        const before = v;
        v = applyTreatment(ct, st, this.treatments[works[k].treatment], this.seg.functionalClass, y, v);
        out.push({ before, after: v });
        treated = true;
        k++;
      }
      path[y] = v;
    }
    return out;
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
  const cLcc = new Float64Array(maxCand);
  const cRatio = new Float64Array(maxCand);
  const order: number[] = [];

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
        const f0 = wk.applicable(ti, wk.s0, y0, none[y0]);
        if (f0 < 0) continue;
        for (let v = 0; v < 2; v++) {
          const off = n * (W + 1);
          const works = wk.walk(
            ti,
            y0,
            f0,
            v === 1,
            H,
            cPath,
            off,
            cActs.subarray(n * MAXW * 2, (n + 1) * MAXW * 2),
            cFlags.subarray(n * MAXW, (n + 1) * MAXW),
          );
          if (v === 1 && works === 1) continue; // no follow-up: the same as the seed alone
          if (floor !== undefined) {
            let low = false;
            for (let y = 0; y < H; y++) if (cPath[off + y] < floor - PCI_TOLERANCE) low = true;
            if (low) continue;
          }
          const b = areaBetween(cPath.subarray(off, off + W + 1), none, W) * weight;
          if (!(b > 1e-9)) continue;
          const acts = [];
          let total = 0;
          for (let k = 0; k < works; k++) {
            const tk = cActs[n * MAXW * 2 + k * 2];
            const yk = cActs[n * MAXW * 2 + k * 2 + 1];
            total += wk.cost[tk];
            acts.push({ year: yk, cost: wk.cost[tk], serviceLifeYears: treatments[tk].lifeYears });
          }
          cN[n] = works;
          cBenefit[n] = b;
          cLcc[n] = strategyLifeCycleCost(acts, rate, W).presentValue;
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
      lcc.push(cLcc[c]);
      actStart.push(actTreatment.n);
      const yearCost = new Float64Array(H);
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
