// Figures of a result that saved results of every age can give: fields added
// later (lane width, first cost per ton) are derived when absent.
import type { ComparisonResult } from '@shared/engine/lcca/comparison';

const FT_PER_MILE = 5280;

export const laneWidthFt = (r: ComparisonResult) =>
  r.group.laneWidthFt ?? (r.group.areaSy * 9) / (r.group.laneMiles * FT_PER_MILE);

/** Square yards in one lane-mile at that width. */
export const syPerLaneMile = (r: ComparisonResult) => r.group.areaSy / r.group.laneMiles;

export const perTon = (a: ComparisonResult['alternatives'][number]) =>
  a.initialTons > 0 ? a.firstCost / a.initialTons : null;

export const saving = (v: number, fmt: (x: number) => string) =>
  v > 0 ? `saves ${fmt(v)}` : v < 0 ? `${fmt(-v)} more` : 'the same';
