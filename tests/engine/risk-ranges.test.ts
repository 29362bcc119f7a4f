// Ranges given for the uncertain inputs must be distributions around the value
// the comparison uses: a triangular distribution needs min ≤ mode ≤ max (its
// closed-form mean (a+b+c)/3 assumes it), and a tornado row whose range leaves
// the base case out misreads. The engine refuses such a range, naming the field.
import { describe, expect, it } from 'vitest';
import { runComparison, ComparisonInputError } from '../../shared/engine/lcca/comparison';
import { RangeOverrideSchema } from '../../shared/schemas/comparisons';
import { alt, comparisonInput } from './lcca-fixture';

const alts = [
  alt('2 in dense-graded', { treatmentId: 'mill_and_overlay' }),
  alt('Chip seal cycle', { treatmentId: 'chip_seal' }),
];
const withRanges = (ranges: Record<string, { low: number; high: number }>) =>
  comparisonInput(alts, {
    risk: {
      iterations: 200,
      seed: 7,
      ranges: Object.fromEntries(
        Object.entries(ranges).map(([k, v]) => [k, { ...v, distribution: 'triangular' as const }]),
      ),
    },
  });

function refusal(ranges: Record<string, { low: number; high: number }>) {
  try {
    runComparison(withRanges(ranges), { monteCarlo: false });
  } catch (e) {
    if (e instanceof ComparisonInputError) return { path: e.path, message: e.message };
    throw e;
  }
  return null;
}

describe('risk ranges (the base must lie inside low–high)', () => {
  it('refuses a mix-price range of $80–120 around a price of $74, naming the field', () => {
    expect(refusal({ 'mix:dense': { low: 80, high: 120 } })).toEqual({
      path: 'risk.ranges.mix:dense.low',
      message: expect.stringMatching(/low 80 is above the value the comparison uses, 74, .*Dense-graded/),
    });
  });

  it('refuses a high below the base, and a low above the high (schema and engine)', () => {
    expect(refusal({ 'mix:dense': { low: 60, high: 70 } })?.path).toBe('risk.ranges.mix:dense.high');
    expect(refusal({ 'mix:dense': { low: 90, high: 60 } })?.path).toBe('risk.ranges.mix:dense.low');
    const parsed = RangeOverrideSchema.safeParse({ low: 90, high: 60 });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].path).toEqual(['low']);
  });

  it('refuses a key that is no input of the comparison, a zero life and a rate of −100 %', () => {
    expect(refusal({ 'mix:nope': { low: 1, high: 2 } })?.path).toBe('risk.ranges.mix:nope');
    expect(refusal({ 'alt:1:life:0': { low: 0, high: 8 } })?.message).toMatch(/more than 0 years/);
    expect(refusal({ rate: { low: -1, high: 0.06 } })?.message).toMatch(/more than −100 %/);
  });

  it('accepts a valid range and uses it as given (the base is never moved)', () => {
    const r = runComparison(withRanges({ 'mix:dense': { low: 70, high: 90 } }), { monteCarlo: false });
    const row = r.sensitivity.rows.find((x) => x.key === 'mix:dense')!;
    expect([row.low, row.high]).toEqual([70, 90]);
    const base = r.sensitivity.base[0];
    expect(row.npvAtLow[0]).toBeLessThan(base);
    expect(row.npvAtHigh[0]).toBeGreaterThan(base);
  });
});
