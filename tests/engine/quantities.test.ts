import { describe, expect, it } from 'vitest';
import { ASTM_D6433_RATINGS, astmRating, conditionBand } from '../../shared/condition';
import { areaSy, laneMiles, mixTons } from '../../shared/engine/quantities';

describe('quantities', () => {
  it('one 12-ft lane-mile is 7,040 SY (5,280 ft × 12 ft / 9 — unit arithmetic)', () => {
    expect(areaSy(1, 12)).toBe(7040);
  });

  it('one inch of mix on a 12-ft lane-mile is about 387 tons at 110 lb/SY-in (common practice spread rate)', () => {
    // 7,040 SY × 1 in × 110 lb/SY-in / 2,000 lb/ton = 387.2 tons
    expect(mixTons(areaSy(1, 12), 1, 110)).toBeCloseTo(387.2, 6);
  });

  it('lane-miles are length × lanes', () => {
    expect(laneMiles(2.5, 4)).toBe(10);
  });
});

describe('PCI rating scale', () => {
  it('follows the ASTM D6433 categories at their boundaries', () => {
    // ASTM D6433 rating scale: Good 86–100, Satisfactory 71–85, Fair 56–70,
    // Poor 41–55, Very Poor 26–40, Serious 11–25, Failed 0–10.
    expect(astmRating(100)).toBe('Good');
    expect(astmRating(86)).toBe('Good');
    expect(astmRating(85)).toBe('Satisfactory');
    expect(astmRating(71)).toBe('Satisfactory');
    expect(astmRating(70)).toBe('Fair');
    expect(astmRating(56)).toBe('Fair');
    expect(astmRating(55)).toBe('Poor');
    expect(astmRating(41)).toBe('Poor');
    expect(astmRating(40)).toBe('Very Poor');
    expect(astmRating(26)).toBe('Very Poor');
    expect(astmRating(25)).toBe('Serious');
    expect(astmRating(11)).toBe('Serious');
    expect(astmRating(10)).toBe('Failed');
    expect(astmRating(0)).toBe('Failed');
    expect(ASTM_D6433_RATINGS).toHaveLength(7);
  });

  it('our five council bands cover 0–100 without gaps and never split an ASTM category', () => {
    for (let p = 0; p <= 100; p++) expect(conditionBand(p)).not.toBeNull();
    expect(conditionBand(null)).toBeNull();
    for (const cat of ASTM_D6433_RATINGS) {
      expect(conditionBand(cat.min)!.id).toBe(conditionBand(cat.max)!.id);
    }
  });
});
