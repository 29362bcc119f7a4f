import type { Catalog } from '@shared/schemas/catalog';
import type { AlternativeSpec } from '@shared/schemas/comparisons';

/**
 * The name an alternative gets from its first treatment: "1.5 in Rubber-modified,
 * dry process" for an overlay, "Chip seal cycle" otherwise. A name the user has
 * not changed follows the treatment, so a label never tells of a lift it is not.
 */
export function autoName(c: Catalog, s: AlternativeSpec['initial']) {
  const t = c.treatments.find((x) => x.id === s.treatmentId);
  if (!t) return 'Alternative';
  const mix = c.mixes.find((m) => m.id === (s.mixId ?? t.mixId));
  const thickness = s.thicknessIn ?? t.defaultThicknessIn;
  return mix && thickness ? `${thickness} in ${mix.name}` : `${t.name} cycle`;
}

/** A first comparison from the catalog: the catalog overlay, a thinner rubber-modified lift, a chip-seal cycle. */
export function defaultAlternatives(c: Catalog): AlternativeSpec[] {
  const t = (kind: string) => c.treatments.find((x) => x.kind === kind);
  const mill = t('mill_and_overlay');
  const seal = t('crack_seal');
  const chip = t('chip_seal');
  const rubber = c.mixes.find((m) => m.modifier === 'crumb_rubber_dry');
  const maint = seal ? [{ treatmentId: seal.id, everyYears: 4 }] : [];
  const named = (initial: AlternativeSpec['initial'], maintenance = maint): AlternativeSpec => ({
    name: autoName(c, initial),
    initial,
    rehabilitation: [],
    maintenance,
    repeatAtEndOfLife: true,
  });
  const out: AlternativeSpec[] = [];
  if (mill) out.push(named({ treatmentId: mill.id }));
  if (mill && rubber) out.push(named({ treatmentId: mill.id, mixId: rubber.id, thicknessIn: rubber.refLiftIn }));
  if (chip) out.push(named({ treatmentId: chip.id }, []));
  while (out.length < 2 && c.treatments[out.length]) out.push(named({ treatmentId: c.treatments[out.length].id }, []));
  return out;
}
