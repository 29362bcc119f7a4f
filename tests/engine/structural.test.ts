import { describe, expect, it } from 'vitest';
import { checkOverlay, log10W18, requiredStructuralNumber, ZR_BY_RELIABILITY } from '../../shared/engine/structural';

describe('AASHTO 1993 flexible design equation', () => {
  it('reproduces the guide’s design-chart example: W18 = 5×10⁶, R = 95 %, S0 = 0.35, MR = 5,000 psi, ΔPSI = 1.9 → SN ≈ 5.0', () => {
    // AASHTO Guide for Design of Pavement Structures (1993), Part II, Figure 3.1 worked
    // example; the chart reads SN = 5.0 (values from memory; a chart reading, hence ±0.1).
    const p = { zr: ZR_BY_RELIABILITY[95], s0: 0.35, deltaPsi: 1.9, mrPsi: 5000 };
    const sn = requiredStructuralNumber(5e6, p);
    expect(sn).toBeGreaterThan(4.9);
    expect(sn).toBeLessThan(5.1);
    // And the equation evaluated at the solution gives back the traffic.
    expect(log10W18(sn, p)).toBeCloseTo(Math.log10(5e6), 6);
  });

  it('asks more structure for more traffic', () => {
    const p = { zr: -1.037, s0: 0.45, deltaPsi: 1.7, mrPsi: 6000 };
    expect(requiredStructuralNumber(1e6, p)).toBeGreaterThan(requiredStructuralNumber(1e5, p));
  });
});

describe('thin-overlay caution', () => {
  it('flags a 1-inch lift on a weak, busy arterial and passes a quiet local road', () => {
    const busy = checkOverlay(
      { adt: 8000, truckPct: 15, functionalClass: 'principal_arterial', pci: 35 },
      { thicknessIn: 1, serviceLifeYears: 10 },
    );
    expect(busy.caution).toBe(true);
    expect(busy.shortBy).toBeGreaterThan(0);
    const quiet = checkOverlay(
      { adt: 150, truckPct: 4, functionalClass: 'local', pci: 75 },
      { thicknessIn: 1.5, serviceLifeYears: 10 },
    );
    expect(quiet.caution).toBe(false);
  });
});
