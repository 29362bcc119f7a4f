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

  it('take their limits at a zero rate', () => {
    expect(pa(0, 20)).toBe(20);
    expect(ap(0, 20)).toBe(1 / 20);
    expect(pf(0, 20)).toBe(1);
  });
});
