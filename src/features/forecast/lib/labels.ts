import { CLASS_GROUP_LABELS, CURVE_SOURCE_LABELS, type Family, TREATMENT_GROUP_LABELS } from '@shared/schemas/forecast';
import { fmtInt, SURFACE_LABELS } from '@/lib/format';

/** "Asphalt, local roads, last treatment: overlay or mill and overlay". */
export const familyTitle = (f: Family) =>
  `${SURFACE_LABELS[f.surface] ?? f.surface}, ${CLASS_GROUP_LABELS[f.classGroup]}, last treatment: ${TREATMENT_GROUP_LABELS[f.treatmentGroup]}`;

/** "214 segments · 1,302 surveys · fitted to surveys · RMSE 4.1 PCI points". */
export function familyFacts(f: Family) {
  const rmse = f.rmse !== null ? ` · RMSE ${f.rmse.toFixed(1)} PCI points` : '';
  return `${fmtInt(f.segments)} segments · ${fmtInt(f.n)} surveys · ${CURVE_SOURCE_LABELS[f.source]}${rmse}`;
}
