// Sensitivity (one input at a time), break-even discount rate, and Monte Carlo
// over a model that maps named input values to one net present value per
// alternative (docs/COMPUTATION.md, Risk).
import { type Distribution, rng, sample } from '../random';

export type ModelInput = {
  key: string;
  label: string;
  base: number;
  low: number;
  high: number;
  distribution?: Distribution;
};

export type Model = (values: Record<string, number>) => number[];

const baseValues = (inputs: ModelInput[]) => Object.fromEntries(inputs.map((i) => [i.key, i.base]));

export type TornadoRow = {
  key: string;
  label: string;
  low: number;
  high: number;
  npvAtLow: number[];
  npvAtHigh: number[];
  swing: number;
};

/** One input at a time to its low and high; rows sorted by the largest swing of any alternative. */
export function sensitivity(inputs: ModelInput[], model: Model): { base: number[]; rows: TornadoRow[] } {
  const base = baseValues(inputs);
  const baseNpv = model(base);
  const rows = inputs.map((inp) => {
    const npvAtLow = model({ ...base, [inp.key]: inp.low });
    const npvAtHigh = model({ ...base, [inp.key]: inp.high });
    const swing = Math.max(...npvAtLow.map((v, i) => Math.abs(npvAtHigh[i] - v)));
    return { key: inp.key, label: inp.label, low: inp.low, high: inp.high, npvAtLow, npvAtHigh, swing };
  });
  rows.sort((a, b) => b.swing - a.swing);
  return { base: baseNpv, rows };
}

/**
 * The discount rate at which alternatives a and b cost the same, searched on
 * [lo, hi] by scanning for a sign change and bisecting it. Null when one is
 * cheaper across the whole range.
 */
export function breakEvenRate(
  npvAt: (rate: number) => number[],
  a: number,
  b: number,
  lo = 0,
  hi = 0.15,
): number | null {
  const diff = (r: number) => {
    const v = npvAt(r);
    return v[a] - v[b];
  };
  const steps = 60;
  let x0 = lo;
  let f0 = diff(x0);
  if (f0 === 0) return x0;
  for (let s = 1; s <= steps; s++) {
    const x1 = lo + ((hi - lo) * s) / steps;
    const f1 = diff(x1);
    if (f1 === 0) return x1;
    if (Math.sign(f1) !== Math.sign(f0)) {
      let l = x0;
      let h = x1;
      let fl = f0;
      for (let k = 0; k < 60; k++) {
        const m = (l + h) / 2;
        const fm = diff(m);
        if (Math.sign(fm) === Math.sign(fl)) {
          l = m;
          fl = fm;
        } else h = m;
      }
      return (l + h) / 2;
    }
    x0 = x1;
    f0 = f1;
  }
  return null;
}

export type McStats = { mean: number; sd: number; p5: number; p50: number; p95: number; min: number; max: number };
export type McResult = {
  iterations: number;
  seed: number;
  stats: McStats[];
  probabilityCheapest: number[];
  /** Probability of being the cheapest among `among` alternatives only (0 for the others); absent without it. */
  probabilityCheapestAmong?: number[];
  histogram: { edges: number[]; counts: number[][] };
  /** Sorted draws per alternative, thinned to at most 200 points for a CDF plot. */
  cdf: number[][];
};

function quantile(sorted: Float64Array, p: number) {
  // Linear interpolation between order statistics (the "type 7" rule of R and numpy).
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.ceil(h);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

export function monteCarlo(
  inputs: ModelInput[],
  model: Model,
  opts: {
    iterations: number;
    seed: number;
    bins?: number;
    onProgress?: (done: number) => void;
    /** A subset (e.g. the alternatives that give the same service) to count the cheapest within as well. */
    among?: number[];
  },
): McResult {
  const u = rng(opts.seed);
  const base = baseValues(inputs);
  const random = inputs.filter((i) => i.distribution && i.distribution.type !== 'fixed');
  const nAlt = model(base).length;
  const draws = Array.from({ length: nAlt }, () => new Float64Array(opts.iterations));
  const cheapest = new Array(nAlt).fill(0);
  const among = opts.among?.length ? opts.among : null;
  const cheapestAmong = new Array(nAlt).fill(0);
  for (let it = 0; it < opts.iterations; it++) {
    const values = { ...base };
    for (const inp of random) values[inp.key] = sample(inp.distribution!, u);
    const npv = model(values);
    let best = 0;
    for (let a = 0; a < nAlt; a++) {
      draws[a][it] = npv[a];
      if (npv[a] < npv[best]) best = a;
    }
    cheapest[best]++;
    if (among) {
      let b = among[0];
      for (const a of among) if (npv[a] < npv[b]) b = a;
      cheapestAmong[b]++;
    }
    if (opts.onProgress && it % 500 === 499) opts.onProgress(it + 1);
  }
  const stats = draws.map((d) => {
    const n = d.length;
    let mean = 0;
    for (let i = 0; i < n; i++) mean += d[i];
    mean /= n;
    let ss = 0;
    for (let i = 0; i < n; i++) ss += (d[i] - mean) ** 2;
    const sorted = Float64Array.from(d).sort();
    return {
      mean,
      sd: Math.sqrt(ss / Math.max(1, n - 1)),
      p5: quantile(sorted, 0.05),
      p50: quantile(sorted, 0.5),
      p95: quantile(sorted, 0.95),
      min: sorted[0],
      max: sorted[n - 1],
      sorted,
    };
  });
  const lo = Math.min(...stats.map((s) => s.min));
  const hi = Math.max(...stats.map((s) => s.max));
  const bins = opts.bins ?? 40;
  const width = hi > lo ? (hi - lo) / bins : 1;
  const edges = Array.from({ length: bins + 1 }, (_, i) => lo + i * width);
  const counts = draws.map((d) => {
    const c = new Array(bins).fill(0);
    for (const v of d) c[Math.min(bins - 1, Math.floor((v - lo) / width))]++;
    return c;
  });
  const cdf = stats.map((s) => {
    const step = Math.max(1, Math.floor(s.sorted.length / 200));
    const pts: number[] = [];
    for (let i = 0; i < s.sorted.length; i += step) pts.push(s.sorted[i]);
    return pts;
  });
  return {
    iterations: opts.iterations,
    seed: opts.seed,
    stats: stats.map(({ sorted: _s, ...rest }) => rest),
    probabilityCheapest: cheapest.map((c) => c / opts.iterations),
    ...(among ? { probabilityCheapestAmong: cheapestAmong.map((c) => c / opts.iterations) } : {}),
    histogram: { edges, counts },
    cdf,
  };
}
