// Deterioration curves (docs/COMPUTATION.md, Deterioration curves): PCI as a function of age since the
// last treatment, PCI(t) = P0 − a·t^b clamped to 0–100, with P0 ≤ 100, a > 0
// and b ≥ 1 so that the curve never rises and stays in the PCI range. The
// parameters are fitted by least squares to the agency's own surveys.

export type Curve = { p0: number; a: number; b: number };

export const B_MIN = 1;
export const B_MAX = 3;

export function pciAt(c: Curve, age: number): number {
  const v = c.p0 - c.a * Math.max(0, age) ** c.b;
  return Math.min(100, Math.max(0, v));
}

/** The age at which the curve reaches a PCI (its inverse); ages run on past 0 PCI to the curve's end. */
export function ageAt(c: Curve, pci: number): number {
  if (pci >= c.p0) return 0;
  return ((c.p0 - Math.max(0, pci)) / c.a) ** (1 / c.b);
}

export type FitPoint = { age: number; pci: number };
export type Fit = { curve: Curve; n: number; rmse: number };

function sse(c: Curve, pts: FitPoint[]) {
  let s = 0;
  for (const p of pts) s += (pciAt(c, p.age) - p.pci) ** 2;
  return s;
}

/**
 * Least squares for (a, b) with P0 fixed: for a given b the best a has a
 * closed form, a = Σ (P0 − y)·t^b / Σ t^(2b); b is searched on a fine grid and
 * refined by golden-section search, then the clamped fit's error decides.
 */
export function fitCurve(points: FitPoint[], p0 = 100): Fit | null {
  const pts = points.filter((p) => Number.isFinite(p.age) && p.age >= 0 && Number.isFinite(p.pci));
  if (pts.length < 3 || !pts.some((p) => p.age > 0)) return null;
  const aFor = (b: number) => {
    let num = 0;
    let den = 0;
    for (const p of pts) {
      const tb = p.age ** b;
      num += (p0 - p.pci) * tb;
      den += tb * tb;
    }
    return den > 0 ? Math.max(1e-6, num / den) : 1e-6;
  };
  const err = (b: number) => sse({ p0, a: aFor(b), b }, pts);
  let bestB = B_MIN;
  let bestE = Infinity;
  for (let b = B_MIN; b <= B_MAX + 1e-9; b += 0.05) {
    const e = err(b);
    if (e < bestE) {
      bestE = e;
      bestB = b;
    }
  }
  // Golden-section refinement around the best grid point.
  let lo = Math.max(B_MIN, bestB - 0.05);
  let hi = Math.min(B_MAX, bestB + 0.05);
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 40; i++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (err(x1) < err(x2)) hi = x2;
    else lo = x1;
  }
  const b = (lo + hi) / 2;
  const curve = { p0, a: aFor(b), b };
  return { curve, n: pts.length, rmse: Math.sqrt(sse(curve, pts) / pts.length) };
}
