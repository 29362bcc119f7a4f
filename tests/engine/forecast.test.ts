import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ageAt, fitCurve, pciAt } from '../../shared/engine/forecast/curve';
import { rng } from '../../shared/engine/random';

describe('deterioration curve', () => {
  it('recovers the parameters of a known curve from noisy data generated from it', () => {
    const truth = { p0: 100, a: 0.8, b: 1.6 };
    const u = rng(5);
    const pts = Array.from({ length: 400 }, () => {
      const age = 1 + u() * 18;
      const noise = Math.sqrt(-2 * Math.log(1 - u())) * Math.cos(2 * Math.PI * u()) * 3;
      return { age, pci: pciAt(truth, age) + noise };
    });
    const fit = fitCurve(pts)!;
    expect(fit.curve.b).toBeCloseTo(1.6, 1);
    expect(fit.curve.a / 0.8).toBeCloseTo(1, 1);
    expect(fit.rmse).toBeGreaterThan(2.5);
    expect(fit.rmse).toBeLessThan(3.5);
    expect(fit.n).toBe(400);
  });

  it('recovers them exactly from noiseless data', () => {
    const truth = { p0: 100, a: 1.3, b: 1.25 };
    const pts = [1, 2, 3, 5, 8, 10, 12].map((age) => ({ age, pci: pciAt(truth, age) }));
    const fit = fitCurve(pts)!;
    expect(fit.curve.b).toBeCloseTo(1.25, 3);
    expect(fit.curve.a).toBeCloseTo(1.3, 3);
    expect(fit.rmse).toBeLessThan(1e-3);
  });

  it('is monotone non-increasing and within 0–100 at every age, for any parameters', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0.001, max: 20, noNaN: true }),
        fc.double({ min: 1, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        (p0, a, b, t, dt) => {
          const c = { p0, a, b };
          const v1 = pciAt(c, t);
          const v2 = pciAt(c, t + dt);
          return v1 >= 0 && v1 <= 100 && v2 <= v1 + 1e-12;
        },
      ),
    );
  });

  it('inverts: the age at a PCI gives back that PCI', () => {
    const c = { p0: 100, a: 0.7, b: 1.45 };
    for (const p of [95, 80, 55, 30, 5]) expect(pciAt(c, ageAt(c, p))).toBeCloseTo(p, 9);
  });

  it('declines to fit fewer than three points', () => {
    expect(
      fitCurve([
        { age: 1, pci: 90 },
        { age: 2, pci: 85 },
      ]),
    ).toBeNull();
  });
});
