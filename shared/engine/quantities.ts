// Quantities (docs/COMPUTATION.md, Cost of one application). US customary units inside the engine.

export const FT_PER_MILE = 5280;
export const SQ_FT_PER_SY = 9;
export const LB_PER_TON = 2000;

/** Pavement area in square yards: length (ft) × width (ft) / 9. */
export function areaSy(lengthMi: number, widthFt: number): number {
  return (lengthMi * FT_PER_MILE * widthFt) / SQ_FT_PER_SY;
}

/** Lane-miles: one mile of one lane. */
export function laneMiles(lengthMi: number, lanes: number): number {
  return lengthMi * lanes;
}

/** Mix tonnage: area (SY) × thickness (in) × spread rate (lb/SY-in) / 2000. */
export function mixTons(areaSqYd: number, thicknessIn: number, spreadRateLbPerSyIn: number): number {
  return (areaSqYd * thicknessIn * spreadRateLbPerSyIn) / LB_PER_TON;
}
