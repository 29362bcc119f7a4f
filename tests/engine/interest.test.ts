import { npv as fnpv, pmt as fpmt, pv as fpv } from 'financial';
import { describe, expect, it } from 'vitest';
import { af, ap, fp, pa, pf } from '../../shared/engine/lcca/interest';

describe('compound-interest factors', () => {
  it('match the 3% engineering-economy table (Blank & Tarquin, Engineering Economy, 3% interest table)', () => {
    // Table values as printed: P/F(3%, 10) = 0.7441, A/P(3%, 20) = 0.06722.
    expect(pf(0.03, 10)).toBeCloseTo(0.7441, 4);
    expect(ap(0.03, 20)).toBeCloseTo(0.06722, 5);
  });

  it('P/A agrees with the `financial` package’s pv (a numpy-financial port) over many rates and periods', () => {
    for (const r of [0.005, 0.01, 0.02, 0.03, 0.04, 0.07, 0.1]) {
      for (const n of [1, 5, 10, 20, 35, 40, 50]) {
        // financial.pv(rate, nper, pmt) is the present value of paying pmt each period, with the cash-flow sign flipped.
        expect(pa(r, n)).toBeCloseTo(-fpv(r, n, 1), 9);
        // financial.pmt(rate, nper, pv) is the payment that repays pv: A/P with the sign flipped.
        expect(ap(r, n)).toBeCloseTo(-fpmt(r, n, 1), 12);
      }
    }
  });

  it('present worth of a cash-flow vector agrees with financial.npv (whose first value is year 0, undiscounted)', () => {
    // Convention: financial.npv(rate, [c0, c1, …]) = Σ c_t / (1 + r)^t, t from 0 — unlike a spreadsheet's NPV.
    const flows = [1000, 0, 0, 250, 0, 0, 0, 400, 0, 0, 120];
    const ours = flows.reduce((s, c, t) => s + c * pf(0.04, t), 0);
    expect(ours).toBeCloseTo(fnpv(0.04, flows), 9);
  });

  it('are consistent with each other (identities of the factors)', () => {
    for (const [r, n] of [
      [0.03, 20],
      [0.07, 8],
      [0.0001, 30],
    ]) {
      expect(pa(r, n) * ap(r, n)).toBeCloseTo(1, 12);
      expect(pf(r, n) * fp(r, n)).toBeCloseTo(1, 12);
      expect(ap(r, n) - af(r, n)).toBeCloseTo(r, 12);
    }
  });

  it('match more printed table values (standard discrete-compounding tables, e.g. Blank & Tarquin; from memory, and checked against the closed forms)', () => {
    expect(ap(0.1, 10)).toBeCloseTo(0.16275, 5); // A/P(10 %, 10)
    expect(pa(0.05, 20)).toBeCloseTo(12.4622, 4); // P/A(5 %, 20)
    expect(pf(0.06, 15)).toBeCloseTo(0.4173, 4); // P/F(6 %, 15)
    expect(af(0.08, 5)).toBeCloseTo(0.17046, 5); // A/F(8 %, 5)
  });

  it('keep full precision at tiny rates: A/P(1e−12, N) against its limit 1/N + r(N+1)/(2N) + O(r²)', () => {
    // Series of r / (1 − (1 + r)^−N) about r = 0: 1/N + r(N + 1)/(2N) + r²(N² − 1)/(12N) − …;
    // at r = 1e−12 the r² term is below 1e−24, so the first two terms are exact to double precision.
    for (const n of [1, 10, 40, 100]) {
      for (const r of [1e-12, 1e-9, -1e-12]) {
        const limit = 1 / n + (r * (n + 1)) / (2 * n);
        expect(Math.abs(ap(r, n) - limit) / limit).toBeLessThan(1e-14);
        // P/A = N − r·N(N+1)/2 + O(r²); A/F = A/P − r.
        expect(Math.abs(pa(r, n) - (n - (r * n * (n + 1)) / 2)) / n).toBeLessThan(1e-14);
        expect(Math.abs(af(r, n) - (limit - r)) / limit).toBeLessThan(1e-13);
      }
    }
    // The direct form r(1+r)^N / ((1+r)^N − 1) is 8.9e−5 off here (measured), and so is financial.pmt,
    // which uses it; that is why the cross-check against `financial` below stops at 1e−4.
    const direct = (1e-12 * (1 + 1e-12) ** 40) / ((1 + 1e-12) ** 40 - 1);
    expect(Math.abs(direct - ap(1e-12, 40)) / ap(1e-12, 40)).toBeGreaterThan(1e-5);
  });

  it('agree with financial.pmt and financial.pv at small ordinary rates (1e−4 to 1e−2)', () => {
    for (const r of [1e-4, 5e-4, 1e-3, 1e-2]) {
      for (const n of [5, 20, 40]) {
        expect(ap(r, n) / -fpmt(r, n, 1)).toBeCloseTo(1, 9);
        expect(pa(r, n) / -fpv(r, n, 1)).toBeCloseTo(1, 9);
      }
    }
  });

  it('take their limits at a zero rate', () => {
    expect(pa(0, 20)).toBe(20);
    expect(ap(0, 20)).toBe(1 / 20);
    expect(pf(0, 20)).toBe(1);
  });
});
