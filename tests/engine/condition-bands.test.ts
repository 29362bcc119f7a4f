// Wearcourse's five condition bands against the seven ratings of ASTM D6433
// (Good 86–100, Satisfactory 71–85, Fair 56–70, Poor 41–55, Very Poor 26–40,
// Serious 11–25, Failed 0–10): each band is a union of whole ratings, and its
// name is our own, never one of the standard's words.
import { describe, expect, it } from 'vitest';
import { ASTM_D6433_RATINGS, BAND_MAPPING_NOTE, CONDITION_BANDS, conditionBand } from '../../shared/condition';

describe('condition bands and ASTM D6433', () => {
  it('each band covers exactly the ASTM ratings it says it maps to', () => {
    for (const b of CONDITION_BANDS) {
      const inside = ASTM_D6433_RATINGS.filter((r) => r.min >= b.min && r.max <= b.max).map((r) => r.rating);
      expect(inside).toEqual([...b.standard]);
      expect(Math.min(...ASTM_D6433_RATINGS.filter((r) => inside.includes(r.rating)).map((r) => r.min))).toBe(b.min);
      expect(Math.max(...ASTM_D6433_RATINGS.filter((r) => inside.includes(r.rating)).map((r) => r.max))).toBe(b.max);
    }
    expect(CONDITION_BANDS.flatMap((b) => b.standard)).toEqual(ASTM_D6433_RATINGS.map((r) => r.rating));
  });

  it('no band name can be read as a rating of the standard', () => {
    const words = ['good', 'satisfactory', 'fair', 'poor', 'serious', 'failed', 'fail'];
    for (const b of CONDITION_BANDS) for (const w of words) expect(b.label.toLowerCase()).not.toContain(w);
  });

  it('the legend line names every band with its ratings', () => {
    expect(BAND_MAPPING_NOTE).toContain('Heavy wear = Poor + Very Poor');
    expect(BAND_MAPPING_NOTE).toContain('Broken up = Serious + Failed');
    for (const b of CONDITION_BANDS) expect(BAND_MAPPING_NOTE).toContain(b.label);
  });

  it('PCI 25 is Broken up (ASTM Serious), 26 Heavy wear (ASTM Very Poor), 86 Sound (ASTM Good)', () => {
    expect(conditionBand(25)!.label).toBe('Broken up');
    expect(conditionBand(26)!.label).toBe('Heavy wear');
    expect(conditionBand(86)!.label).toBe('Sound');
  });
});
