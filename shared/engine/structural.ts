// A structural caution for thin overlays, from the AASHTO Guide for Design of
// Pavement Structures (1993) flexible design equation. It flags; it does not
// design. Layer coefficients and the condition factors below are planning
// assumptions the agency can change, not measured properties of its roads.

/**
 * log10(W18) from the AASHTO 1993 flexible pavement design equation:
 * log10(W18) = ZR·S0 + 9.36·log10(SN+1) − 0.20
 *            + log10(ΔPSI/(4.2−1.5)) / (0.40 + 1094/(SN+1)^5.19)
 *            + 2.32·log10(MR) − 8.07
 */
export function log10W18(sn: number, p: { zr: number; s0: number; deltaPsi: number; mrPsi: number }) {
  return (
    p.zr * p.s0 +
    9.36 * Math.log10(sn + 1) -
    0.2 +
    Math.log10(p.deltaPsi / (4.2 - 1.5)) / (0.4 + 1094 / (sn + 1) ** 5.19) +
    2.32 * Math.log10(p.mrPsi) -
    8.07
  );
}

/** The structural number the equation asks for to carry w18 ESALs (bisection on SN in [0.1, 20]). */
export function requiredStructuralNumber(w18: number, p: { zr: number; s0: number; deltaPsi: number; mrPsi: number }) {
  const target = Math.log10(w18);
  let lo = 0.1;
  let hi = 20;
  for (let i = 0; i < 100; i++) {
    const mid = (lo + hi) / 2;
    if (log10W18(mid, p) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Standard normal deviate ZR for common reliability levels (AASHTO 1993, Part I, Table 4.1). */
export const ZR_BY_RELIABILITY: Record<number, number> = {
  50: 0,
  75: -0.674,
  80: -0.841,
  85: -1.037,
  90: -1.282,
  95: -1.645,
  99: -2.327,
};

export type StructuralAssumptions = {
  reliability: keyof typeof ZR_BY_RELIABILITY;
  s0: number;
  deltaPsi: number;
  subgradeMrPsi: number;
  /** Layer coefficient of new asphalt overlay per inch (a1). */
  overlayLayerCoefficient: number;
  /** ESALs per heavy truck. */
  esalPerTruck: number;
  /** Share of two-way trucks in the design lane. */
  designLaneFactor: number;
  /** Existing structural number of an intact pavement, by functional class group. */
  existingSn: { local: number; collector: number; arterial: number };
};

// Planning defaults: each is an assumption to be replaced by the agency's own
// values (marked "assumption" in the UI); a1 = 0.44 is the often-quoted
// coefficient for dense-graded asphalt concrete (from memory), the rest are
// round planning values.
export const DEFAULT_STRUCTURAL_ASSUMPTIONS: StructuralAssumptions = {
  reliability: 85,
  s0: 0.45,
  deltaPsi: 1.7,
  subgradeMrPsi: 6000,
  overlayLayerCoefficient: 0.44,
  esalPerTruck: 1.0,
  designLaneFactor: 0.5,
  existingSn: { local: 2.2, collector: 2.8, arterial: 3.6 },
};

/** Cracked pavement carries less: an effective-SN factor by condition (planning assumption). */
export function conditionFactor(pci: number | null) {
  if (pci === null) return 0.8;
  if (pci >= 70) return 1;
  if (pci >= 55) return 0.85;
  if (pci >= 40) return 0.7;
  return 0.55;
}

export type StructuralCheck = {
  designEsals: number;
  requiredSn: number;
  effectiveExistingSn: number;
  snWithOverlay: number;
  shortBy: number;
  caution: boolean;
};

export function checkOverlay(
  seg: { adt: number | null; truckPct: number | null; functionalClass: string; pci: number | null },
  overlay: { thicknessIn: number; serviceLifeYears: number },
  a: StructuralAssumptions = DEFAULT_STRUCTURAL_ASSUMPTIONS,
): StructuralCheck {
  const trucksPerDay = (seg.adt ?? 0) * ((seg.truckPct ?? 0) / 100);
  const designEsals = Math.max(
    1000,
    trucksPerDay * a.esalPerTruck * a.designLaneFactor * 365 * overlay.serviceLifeYears,
  );
  const requiredSn = requiredStructuralNumber(designEsals, {
    zr: ZR_BY_RELIABILITY[a.reliability],
    s0: a.s0,
    deltaPsi: a.deltaPsi,
    mrPsi: a.subgradeMrPsi,
  });
  const group = /arterial|interstate|freeway/.test(seg.functionalClass)
    ? 'arterial'
    : /collector/.test(seg.functionalClass)
      ? 'collector'
      : 'local';
  const effectiveExistingSn = a.existingSn[group] * conditionFactor(seg.pci);
  const snWithOverlay = effectiveExistingSn + a.overlayLayerCoefficient * overlay.thicknessIn;
  const shortBy = Math.max(0, requiredSn - snWithOverlay);
  return { designEsals, requiredSn, effectiveExistingSn, snWithOverlay, shortBy, caution: shortBy > 0 };
}
