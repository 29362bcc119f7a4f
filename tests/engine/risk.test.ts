import { describe, expect, it } from 'vitest';
import { evaluateAlternative } from '../../shared/engine/lcca/evaluate';
import { breakEvenRate, type ModelInput, monteCarlo, sensitivity } from '../../shared/engine/lcca/risk';
import { type Distribution, distributionMean, rng, sample } from '../../shared/engine/random';

function moments(d: Distribution, n = 200_000, seed = 11) {
  const u = rng(seed);
  let s = 0;
  let s2 = 0;
  for (let i = 0; i < n; i++) {
    const x = sample(d, u);
    s += x;
    s2 += x * x;
  }
  const mean = s / n;
  return { mean, variance: s2 / n - mean * mean };
}

describe('distribution sampler against closed-form moments', () => {
  it('triangular: mean (a+b+c)/3, variance (a²+b²+c²−ab−ac−bc)/18 (closed forms of the triangular distribution)', () => {
    const [a, c, b] = [60, 74, 95];
    const m = moments({ type: 'triangular', min: a, mode: c, max: b });
    expect(m.mean).toBeCloseTo((a + b + c) / 3, 1);
    expect(m.variance / ((a * a + b * b + c * c - a * b - a * c - b * c) / 18)).toBeCloseTo(1, 1);
    expect(distributionMean({ type: 'triangular', min: a, mode: c, max: b })).toBe((a + b + c) / 3);
  });

  it('uniform: mean (a+b)/2, variance (b−a)²/12', () => {
    const m = moments({ type: 'uniform', min: 10, max: 16 });
    expect(m.mean).toBeCloseTo(13, 1);
    expect(m.variance / (36 / 12)).toBeCloseTo(1, 1);
  });

  it('normal: mean μ and variance σ²', () => {
    const m = moments({ type: 'normal', mean: 0.03, sd: 0.01 });
    expect(m.mean).toBeCloseTo(0.03, 3);
    expect(m.variance / 1e-4).toBeCloseTo(1, 1);
  });

  it('lognormal given by its own mean and SD reproduces them', () => {
    const m = moments({ type: 'lognormal', mean: 12, sd: 3 });
    expect(m.mean / 12).toBeCloseTo(1, 2);
    expect(Math.sqrt(m.variance) / 3).toBeCloseTo(1, 1);
  });

  it('the generator is reproducible from its seed', () => {
    const a = rng(42);
    const b = rng(42);
    expect(Array.from({ length: 5 }, a)).toEqual(Array.from({ length: 5 }, b));
  });
});

// A two-alternative model: A costs more now, B more later.
const inputs: ModelInput[] = [
  {
    key: 'rate',
    label: 'Discount rate',
    base: 0.03,
    low: 0.01,
    high: 0.07,
    distribution: { type: 'triangular', min: 0.01, mode: 0.03, max: 0.07 },
  },
  {
    key: 'priceA',
    label: 'Price of A',
    base: 100,
    low: 80,
    high: 130,
    distribution: { type: 'uniform', min: 80, max: 130 },
  },
  { key: 'lifeB', label: 'Life of B', base: 8, low: 6, high: 10 },
];
const model = (v: Record<string, number>) => [
  evaluateAlternative(
    [
      { year: 0, cost: v.priceA, serviceLifeYears: 20 },
      { year: 20, cost: v.priceA, serviceLifeYears: 20 },
    ],
    v.rate,
    40,
  ).presentValue,
  evaluateAlternative(
    Array.from({ length: Math.ceil(40 / v.lifeB) }, (_, i) => ({
      year: Math.round(i * v.lifeB),
      cost: 45,
      serviceLifeYears: v.lifeB,
    })).filter((a) => a.year < 40),
    v.rate,
    40,
  ).presentValue,
];

describe('sensitivity and break-even', () => {
  it('moves one input at a time and sorts by the largest swing', () => {
    const s = sensitivity(inputs, model);
    expect(s.base).toEqual(model({ rate: 0.03, priceA: 100, lifeB: 8 }));
    const rate = s.rows.find((r) => r.key === 'rate')!;
    expect(rate.npvAtLow).toEqual(model({ rate: 0.01, priceA: 100, lifeB: 8 }));
    expect(rate.npvAtHigh).toEqual(model({ rate: 0.07, priceA: 100, lifeB: 8 }));
    for (let i = 1; i < s.rows.length; i++) expect(s.rows[i - 1].swing).toBeGreaterThanOrEqual(s.rows[i].swing);
  });

  it('finds the rate at which the two cost the same', () => {
    const at = (r: number) => model({ rate: r, priceA: 100, lifeB: 8 });
    const r = breakEvenRate(at, 0, 1, 0, 0.2);
    expect(r).not.toBeNull();
    const v = at(r!);
    expect(Math.abs(v[0] - v[1])).toBeLessThan(1e-6 * v[0]);
  });

  it('says null when one alternative is cheaper at every rate in the range', () => {
    expect(breakEvenRate((r) => [1 + r, 2 + r], 0, 1)).toBeNull();
  });
});

describe('Monte Carlo', () => {
  it('is reproducible, its probabilities of being cheapest add to one, and quantiles are ordered', () => {
    const a = monteCarlo(inputs, model, { iterations: 3000, seed: 7 });
    const b = monteCarlo(inputs, model, { iterations: 3000, seed: 7 });
    expect(a).toEqual(b);
    expect(a.probabilityCheapest.reduce((s, p) => s + p, 0)).toBeCloseTo(1, 12);
    for (const s of a.stats) {
      expect(s.p5).toBeLessThanOrEqual(s.p50);
      expect(s.p50).toBeLessThanOrEqual(s.p95);
      expect(s.sd).toBeGreaterThan(0);
    }
    expect(a.histogram.counts[0].reduce((s, c) => s + c, 0)).toBe(3000);
    const c = monteCarlo(inputs, model, { iterations: 3000, seed: 8 });
    expect(c.stats[0].mean).not.toBe(a.stats[0].mean);
  });

  it('with fixed inputs every draw is the deterministic answer', () => {
    const fixed = inputs.map((i) => ({ ...i, distribution: undefined }));
    const r = monteCarlo(fixed, model, { iterations: 100, seed: 1 });
    const base = model({ rate: 0.03, priceA: 100, lifeB: 8 });
    expect(r.stats[0].sd).toBeLessThan(1e-9 * base[0]);
    expect(r.stats[0].mean).toBeCloseTo(base[0], 9);
  });
});
