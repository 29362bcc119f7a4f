// PCI condition categories. The seven-step rating scale is the one published
// in ASTM D6433 (Good 86–100 … Failed 0–10). Councils read five bands better,
// so Wearcourse groups the seven into five of its own, each with its colour and
// with words of its own that cannot be read as the standard's ratings (the
// standard's "Good" is not our second band, our lowest band is not "Failed").
// Every legend says how the five map onto the seven (BAND_MAPPING_NOTE).
//
// The band ids (very-good … failed) are stable keys from the first release:
// they are used in the segment filter (?band=), in saved plan results and in
// exports, and are not names. Screens and documents show the labels.

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
  { id: 'very-good', label: 'Sound', min: 86, max: 100, color: '#0f766e', standard: ['Good'] },
  { id: 'good', label: 'Light wear', min: 71, max: 85, color: '#4d9a7a', standard: ['Satisfactory'] },
  { id: 'fair', label: 'Moderate wear', min: 56, max: 70, color: '#d6b25e', standard: ['Fair'] },
  { id: 'poor', label: 'Heavy wear', min: 26, max: 55, color: '#b45309', standard: ['Poor', 'Very Poor'] },
  { id: 'failed', label: 'Broken up', min: 0, max: 25, color: '#7f1d1d', standard: ['Serious', 'Failed'] },
] as const;

/** One line for every legend: how Wearcourse's five bands map onto the seven ASTM D6433 ratings. */
export const BAND_MAPPING_NOTE = `Bands are Wearcourse's own groups of the ASTM D6433 ratings: ${CONDITION_BANDS.map(
  (b) => `${b.label} = ${b.standard.join(' + ')}`,
).join('; ')}.`;

export type ConditionBandId = (typeof CONDITION_BANDS)[number]['id'];
export const NO_DATA_COLOR = '#4b5058';
export const CONDITION_BAND_IDS = CONDITION_BANDS.map((b) => b.id) as [ConditionBandId, ...ConditionBandId[]];

export function conditionBand(pci: number | null | undefined) {
  if (pci === null || pci === undefined || Number.isNaN(pci)) return null;
  const r = Math.round(pci);
  return CONDITION_BANDS.find((b) => r >= b.min) ?? CONDITION_BANDS[CONDITION_BANDS.length - 1];
}
