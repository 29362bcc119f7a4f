// PCI condition categories. The seven-step rating scale is the one published
// in ASTM D6433 (Good 86–100 … Failed 0–10). Councils read five bands better,
// so Wearcourse groups the seven into five of its own, each with its colour.

export const ASTM_D6433_RATINGS = [
  { rating: 'Good', min: 86, max: 100 },
  { rating: 'Satisfactory', min: 71, max: 85 },
  { rating: 'Fair', min: 56, max: 70 },
  { rating: 'Poor', min: 41, max: 55 },
  { rating: 'Very Poor', min: 26, max: 40 },
  { rating: 'Serious', min: 11, max: 25 },
  { rating: 'Failed', min: 0, max: 10 },
] as const;

export function astmRating(pci: number): (typeof ASTM_D6433_RATINGS)[number]['rating'] {
  const r = Math.round(pci);
  for (const band of ASTM_D6433_RATINGS) if (r >= band.min) return band.rating;
  return 'Failed';
}

export const CONDITION_BANDS = [
  { id: 'very-good', label: 'Very good', min: 86, max: 100, color: '#0f766e' },
  { id: 'good', label: 'Good', min: 71, max: 85, color: '#4d9a7a' },
  { id: 'fair', label: 'Fair', min: 56, max: 70, color: '#d6b25e' },
  { id: 'poor', label: 'Poor', min: 26, max: 55, color: '#b45309' },
  { id: 'failed', label: 'Failed', min: 0, max: 25, color: '#7f1d1d' },
] as const;

export type ConditionBandId = (typeof CONDITION_BANDS)[number]['id'];
export const NO_DATA_COLOR = '#4b5058';
export const CONDITION_BAND_IDS = CONDITION_BANDS.map((b) => b.id) as [ConditionBandId, ...ConditionBandId[]];

export function conditionBand(pci: number | null | undefined) {
  if (pci === null || pci === undefined || Number.isNaN(pci)) return null;
  const r = Math.round(pci);
  return CONDITION_BANDS.find((b) => r >= b.min) ?? CONDITION_BANDS[CONDITION_BANDS.length - 1];
}
