import { CONDITION_BANDS } from '@shared/condition';
import { CLASS_LABELS, SURFACE_LABELS } from '@/lib/format';

// The Roads screen's filters, as they stand in its address.
export const FILTER_KEYS = ['q', 'class', 'surface', 'band', 'district'] as const;
export type Filters = Record<(typeof FILTER_KEYS)[number], string | undefined>;

/** The active filters in words, for the empty table: `road or id “PV-”, surface gravel`. */
export function describeFilters(f: Filters) {
  const band = CONDITION_BANDS.find((b) => b.id === f.band);
  const parts = [
    f.q && `road or id “${f.q}”`,
    f.class && `class ${CLASS_LABELS[f.class]?.toLowerCase() ?? f.class}`,
    f.surface && `surface ${SURFACE_LABELS[f.surface]?.toLowerCase() ?? f.surface}`,
    f.band && (band ? `condition ${band.label.toLowerCase()} (PCI ${band.min}–${band.max})` : 'no PCI'),
    f.district && `district ${f.district}`,
  ].filter(Boolean);
  return `Filtered by ${parts.join(', ')}. Loosen one of them or clear them all.`;
}
