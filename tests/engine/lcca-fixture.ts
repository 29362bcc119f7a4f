// A self-contained comparison input built from the demo catalog (the fictional
// Brannock County's invented prices): the numbers checked against it come from
// the published formulas, never from the demo values themselves.
import { DEMO_ECONOMICS, DEMO_MIXES, DEMO_TREATMENTS } from '../../server/seed/demo-catalog';
import type { Mix, Treatment } from '../../shared/schemas/catalog';
import type { AlternativeSpec, Group, ComparisonInput } from '../../shared/schemas/comparisons';

export const mixes: Mix[] = DEMO_MIXES.map(({ key, ...m }) => ({ ...m, id: key, isDemo: true }));
export const treatments: Treatment[] = DEMO_TREATMENTS.map(({ mixKey, ...t }) => ({
  ...t,
  id: t.kind,
  mixId: mixKey,
  isDemo: true,
}));

/** One 1-mile, 24-ft, two-lane collector at PCI 55 (demo scenario). */
export const oneMile: Group = {
  label: 'Test section',
  segmentIds: [],
  areaSy: (5280 * 24) / 9,
  laneMiles: 2,
  centrelineMiles: 1,
  segments: [{ segmentId: 'T-1', adt: 1500, truckPct: 8, functionalClass: 'major_collector', pci: 55, lengthMi: 1 }],
};

export const alt = (name: string, initial: AlternativeSpec['initial'], more: Partial<AlternativeSpec> = {}) =>
  ({ name, initial, rehabilitation: [], maintenance: [], repeatAtEndOfLife: true, ...more }) as AlternativeSpec;

export function comparisonInput(alternatives: AlternativeSpec[], over: Partial<ComparisonInput> = {}): ComparisonInput {
  return {
    economics: {
      discountRate: 0.04,
      discountRateSource: null,
      analysisPeriodYears: 40,
      baseYear: 2026,
      ...DEMO_ECONOMICS,
    },
    group: oneMile,
    alternatives,
    baselineIndex: 0,
    risk: { iterations: 200, seed: 7, ranges: {} },
    catalog: { mixes, treatments },
    ...over,
  };
}
