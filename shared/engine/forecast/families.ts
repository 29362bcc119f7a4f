// Pavement families: surface × functional-class group × treatment group.
import type { ClassGroup, TreatmentGroup } from '../../schemas/forecast';
import type { Curve } from './curve';

export const classGroup = (cls: string): ClassGroup =>
  /arterial|interstate|freeway/.test(cls) ? 'arterial' : /collector/.test(cls) ? 'collector' : 'local';

export function treatmentGroup(lastTreatment: string | null): TreatmentGroup {
  const t = (lastTreatment ?? '').toLowerCase();
  if (/reconstruct|new construction/.test(t)) return 'reconstruction';
  if (/overlay|mill|inlay|resurfac/.test(t)) return 'overlay';
  if (/seal|micro|slurry|scrub/.test(t)) return 'preservation';
  return 'unknown';
}

export const familyKey = (surface: string, cls: string, lastTreatment: string | null) =>
  `${surface}|${classGroup(cls)}|${treatmentGroup(lastTreatment)}`;

/**
 * Fallback curves where a family has too few surveys to fit. These are
 * planning defaults invented for Wearcourse's demo and first use, not
 * published values; the Forecast screen labels them and lets the agency edit them.
 */
export const DEFAULT_CURVES: Record<string, Curve> = {
  asphalt: { p0: 100, a: 0.75, b: 1.45 },
  chip_seal: { p0: 100, a: 1.3, b: 1.35 },
  concrete: { p0: 100, a: 0.35, b: 1.5 },
  other: { p0: 100, a: 1, b: 1.4 },
  gravel: { p0: 100, a: 2, b: 1.2 },
};

export const MIN_POINTS_TO_FIT = 20;
