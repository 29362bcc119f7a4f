// A synthetic packed plan instance of treatment strategies, for benchmarks and solver tests only
// (the numbers are invented, like the demo scenario; the real generator is run-plan's).
// Each segment decays linearly from its PCI; a strategy is one to three treatments in
// different years (crack seal: +8 without reset; thin overlay: reset to 95; mill and overlay:
// reset to 100; reconstruction: reset to 100 with half the decay). Benefit: lane-miles × the
// PCI points above do-nothing summed over the plan years (one window for every option).
// Life-cycle cost: present value at 3 % of the strategy's costs less a credit for the PCI
// left above do-nothing in the last year (a stand-in for remaining service life).
import type { PackedInstance, TargetRow } from '../shared/engine/plan/instance';
import { rng } from '../shared/engine/random';

type Tr = { reset: number | null; gain: number; perLaneMile: number; decayFactor: number };
const TREATMENTS: Tr[] = [
  { reset: null, gain: 8, perLaneMile: 4_000, decayFactor: 1 },
  { reset: 95, gain: 0, perLaneMile: 60_000, decayFactor: 1 },
  { reset: 100, gain: 0, perLaneMile: 110_000, decayFactor: 0.9 },
  { reset: 100, gain: 0, perLaneMile: 300_000, decayFactor: 0.5 },
];

export type SyntheticOptions = {
  segments: number;
  years: number;
  /** Strategies per segment, at most. */
  perSegment: number;
  /** Flat budget per year as a fraction of the money that would treat every segment's dearest strategy once, spread over the years. */
  budgetShare: number;
  seed: number;
  objective?: 'benefit' | 'cost';
  /** Network-condition targets: fraction of the most that work could lift each listed year (rows Σ gain·x ≥ rhs). */
  targetYears?: number[];
  targetShare?: number;
  /** Fraction of segments that must take work (mustChoose). */
  mustShare?: number;
};

export function syntheticStrategies(o: SyntheticOptions): PackedInstance & { gainByYear: Float64Array } {
  const u = rng(o.seed);
  const Y = o.years;
  const n = o.segments;
  const segStart = new Int32Array(n + 1);
  // Worst case sizes first; trimmed at the end.
  const cap = n * o.perSegment;
  const benefit = new Float64Array(cap);
  const lcc = new Float64Array(cap);
  const cost = new Float64Array(cap * Y);
  const gainByYear = new Float64Array(cap * Y);
  const priority = new Float64Array(n);
  const mustChoose = new Uint8Array(n);
  const none = new Float64Array(Y);
  const path = new Float64Array(Y);
  let k = 0;
  let dearest = 0;
  for (let i = 0; i < n; i++) {
    const pci = 15 + u() * 83;
    const decay = 2 + u() * 3;
    const laneMiles = 0.2 + u() * 1.8;
    priority[i] = pci;
    mustChoose[i] = u() < (o.mustShare ?? 0) ? 1 : 0;
    for (let y = 0; y < Y; y++) none[y] = Math.max(0, pci - decay * y);
    let most = 0;
    const start = k;
    for (let s = 0; s < o.perSegment; s++) {
      // One to three treatments in increasing years, at least two years apart.
      const count = 1 + Math.floor(u() * u() * 3);
      let year = Math.floor(u() * Math.min(Y, 4));
      const plan: { t: number; year: number }[] = [];
      for (let q = 0; q < count && year < Y; q++) {
        plan.push({ t: q === 0 && u() < 0.4 ? 0 : Math.floor(u() * TREATMENTS.length), year });
        year += 2 + Math.floor(u() * 4);
      }
      let p = pci;
      let rate = decay;
      let at = 0;
      let pv = 0;
      for (let y = 0; y < Y; y++) {
        if (y > 0) p = Math.max(0, p - rate);
        while (at < plan.length && plan[at].year === y) {
          const tr = TREATMENTS[plan[at].t];
          p = tr.reset ?? Math.min(100, p + tr.gain);
          if (tr.reset !== null) rate = decay * tr.decayFactor;
          const c = tr.perLaneMile * laneMiles;
          cost[k * Y + y] += c;
          pv += c / 1.03 ** y;
          at++;
        }
        path[y] = p;
      }
      let b = 0;
      for (let y = 0; y < Y; y++) {
        const g = (path[y] - none[y]) * laneMiles;
        gainByYear[k * Y + y] = g;
        b += g;
      }
      let total = 0;
      for (let y = 0; y < Y; y++) total += cost[k * Y + y];
      most = Math.max(most, total);
      benefit[k] = Math.max(0, b);
      // Credit: the PCI left above do-nothing at the end, at $1,500 per lane-mile-point (invented).
      lcc[k] = pv - ((path[Y - 1] - none[Y - 1]) * laneMiles * 1_500) / 1.03 ** Y;
      k++;
    }
    dearest += most;
    segStart[i + 1] = k;
    if (k === start) mustChoose[i] = 0;
  }
  const budgets = new Float64Array(Y).fill((dearest / Y) * o.budgetShare);
  const targets: TargetRow[] = [];
  for (const ty of o.targetYears ?? []) {
    // The most work could add in that year: each segment's largest gain.
    let reach = 0;
    for (let i = 0; i < n; i++) {
      let m = 0;
      for (let q = segStart[i]; q < segStart[i + 1]; q++) m = Math.max(m, gainByYear[q * Y + ty]);
      reach += m;
    }
    const idx: number[] = [];
    const gain: number[] = [];
    for (let q = 0; q < k; q++)
      if (gainByYear[q * Y + ty] !== 0) {
        idx.push(q);
        gain.push(gainByYear[q * Y + ty]);
      }
    targets.push({
      label: `condition gain in plan year ${ty + 1} ≥ ${Math.round((o.targetShare ?? 0.3) * 100)} % of the most work could add`,
      year: ty,
      rhs: reach * (o.targetShare ?? 0.3),
      idx: Int32Array.from(idx),
      gain: Float64Array.from(gain),
    });
  }
  return {
    years: Y,
    budgets,
    nSegments: n,
    segStart,
    benefit: benefit.slice(0, k),
    lcc: lcc.slice(0, k),
    cost: cost.slice(0, k * Y),
    priority,
    mustChoose,
    targets,
    objective: o.objective ?? 'benefit',
    gainByYear: gainByYear.slice(0, k * Y),
  };
}
