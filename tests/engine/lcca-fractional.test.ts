// Fractional service lives, scheduled as they are: each treatment is booked in
// the year its predecessor's life ends (end-of-year convention, whole years as
// in the FHWA bulletin's cash flows), lives chain on their exact values, and the
// remaining service life credited at year N is the exact fraction of the last
// life left: RSL = C × (life left at N) / life (Interim Technical Bulletin
// FHWA-SA-98-079, 1998). Expected values are worked by hand from those formulas.
import { describe, expect, it } from 'vitest';
import { evaluateScheduleForGroup } from '../../shared/engine/lcca/network';
import { expandSchedule, type Schedule } from '../../shared/engine/lcca/schedule';
import { runComparison, comparisonInputs, comparisonModel } from '../../shared/engine/lcca/comparison';
import { alt, comparisonInput } from './lcca-fixture';

const perJob = (cost: number) => ({ perSy: 0, perLaneMile: 0, perJob: cost, addOnFraction: 0 });
const plan = (life: number): Schedule => ({
  initial: { label: 'overlay', serviceLifeYears: life, rates: perJob(100_000) },
  rehabilitation: [],
  maintenance: [],
  repeatAtEndOfLife: true,
});

/** Present value by the FHWA formulas of $1 per application booked in the given years, less the RSL credit. */
const fhwa = (booked: number[], rslFraction: number, r: number, n: number) =>
  booked.reduce((s, t) => s + (1 + r) ** -t, 0) - rslFraction * (1 + r) ** -n;

describe('fractional lives (FHWA-SA-98-079 present value, remaining service life, EUAC)', () => {
  it('an 11.5-year life books work in years 0, 12, 23 and 35 and credits 6/11.5 of the last at year 40', () => {
    // Lives end at 11.5, 23, 34.5, 46: booked in the years those fall in (12, 23, 35); the fourth life
    // runs 34.5 → 46, so 6 of its 11.5 years remain at N = 40.
    const acts = expandSchedule(plan(11.5), 40);
    expect(acts.map((a) => a.year)).toEqual([0, 12, 23, 35]);
    expect(acts.map((a) => a.lifeEndsAt)).toEqual([11.5, 23, 34.5, 46]);
    const { result } = evaluateScheduleForGroup(plan(11.5), { areaSy: 0, laneMiles: 0 }, 0.04, 40);
    // Hand-worked at 4 %: PV(costs) = 100,000 × (1 + 1.04^−12 + 1.04^−23 + 1.04^−35) = 228,373.89;
    // RSL = 100,000 × 6 / 11.5 = 52,173.91, PV(RSL) = 52,173.91 × 1.04^−40 = 10,867.25;
    // NPV = 217,506.63; EUAC = NPV × A/P(4 %, 40) = 217,506.63 × 0.0505235 = 10,989.19.
    expect(result.presentValueOfCosts).toBeCloseTo(228_373.89, 1);
    expect(result.remainingServiceLifeValue).toBeCloseTo(52_173.91, 1);
    expect(result.presentValueOfRemainingLife).toBeCloseTo(10_867.25, 1);
    expect(result.presentValue).toBeCloseTo(217_506.63, 1);
    expect(result.euac).toBeCloseTo(10_989.19, 1);
    // Rounding the life to 12 (0, 12, 24, 36 and 8/12 credited) would understate it by 2.6 %.
    expect(100_000 * fhwa([0, 12, 24, 36], 8 / 12, 0.04, 40)).toBeCloseTo(211_952.79, 1);
  });

  it('a life of 35/3 years gathers no float drift: the fourth treatment is in year 35, not 36', () => {
    const acts = expandSchedule(plan(35 / 3), 40);
    expect(acts.map((a) => a.year)).toEqual([0, 12, 24, 35]);
  });

  it('whole-year lives give the schedule they always did (work every life, nothing booked at N)', () => {
    expect(expandSchedule(plan(10), 40).map((a) => a.year)).toEqual([0, 10, 20, 30]);
    const { result } = evaluateScheduleForGroup(plan(10), { areaSy: 0, laneMiles: 0 }, 0.04, 40);
    expect(result.remainingServiceLifeValue).toBe(0);
  });

  it('a comparison shows the life it schedules: 1.25 in of a 14-year-at-1.5-in mix is 11.67 years, priced as such', () => {
    const input = comparisonInput([
      alt('1.25 in rubber-modified', { treatmentId: 'mill_and_overlay', mixId: 'rubber', thicknessIn: 1.25 }),
      alt('Chip seal cycle', { treatmentId: 'chip_seal' }),
    ]);
    const r = runComparison(input, { monteCarlo: false });
    const a = r.alternatives[0];
    expect(a.initial.serviceLifeYears).toBeCloseTo(14 * (1.25 / 1.5), 12);
    expect(a.cashFlows.map((c) => c.year)).toEqual([0, 12, 24, 35]);
    // Lives end at 11.67, 23.33, 35.00, 46.67: 6.67 of 11.67 years (4/7) remain at year 40.
    expect(a.presentValue).toBeCloseTo(a.firstCost * fhwa([0, 12, 24, 35], 4 / 7, 0.04, 40), 4);
  });

  it('tornado and Monte Carlo evaluate the lives they show (no rounding to whole years)', () => {
    const input = comparisonInput([
      alt('1.25 in rubber-modified', { treatmentId: 'mill_and_overlay', mixId: 'rubber', thicknessIn: 1.25 }),
      alt('Chip seal cycle', { treatmentId: 'chip_seal' }),
    ]);
    const r = runComparison(input, { monteCarlo: false });
    const first = r.alternatives[0].firstCost;
    const row = r.sensitivity.rows.find((x) => x.key === 'alt:0:life:0')!;
    expect(row.low).toBeCloseTo(8.75, 12);
    expect(row.high).toBeCloseTo(14.583333, 6);
    // 8.75: lives end 8.75, 17.5, 26.25, 35, 43.75 → booked 0, 9, 18, 27, 35; 3.75/8.75 remains at 40.
    expect(row.npvAtLow[0]).toBeCloseTo(first * fhwa([0, 9, 18, 27, 35], 3.75 / 8.75, 0.04, 40), 4);
    // 14.583: lives end 14.58, 29.17, 43.75 → booked 0, 15, 30; 3.75/14.583 remains at 40.
    expect(row.npvAtHigh[0]).toBeCloseTo(first * fhwa([0, 15, 30], 3.75 / 14.583333333333334, 0.04, 40), 4);
    // Monte Carlo draws go through the same model: a drawn life of 10.3 years is priced at 10.3.
    const model = comparisonModel(input);
    const base = Object.fromEntries(comparisonInputs(input).map((i) => [i.key, i.base]));
    // 10.3: lives end 10.3, 20.6, 30.9, 41.2 → booked 0, 11, 21, 31; 1.2/10.3 remains at 40.
    expect(model({ ...base, 'alt:0:life:0': 10.3 })[0]).toBeCloseTo(
      first * fhwa([0, 11, 21, 31], 1.2 / 10.3, 0.04, 40),
      4,
    );
  });
});
