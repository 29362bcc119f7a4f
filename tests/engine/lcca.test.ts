import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluateAlternative, remainingLife, type Activity } from '../../shared/engine/lcca/evaluate';
import { ap, pa } from '../../shared/engine/lcca/interest';
import { evaluateNetwork, evaluateScheduleForGroup } from '../../shared/engine/lcca/network';
import { activityCost, expandSchedule, type Schedule } from '../../shared/engine/lcca/schedule';

describe('FHWA LCCA formulas (FHWA-SA-98-079, 1998): hand-worked cases', () => {
  it('no remaining life when every activity ends inside the period', () => {
    // 4%, 35 years; $1,000,000 at year 0 (15-yr life), $400,000 at year 15 (12-yr life, ends year 27).
    // PV = 1,000,000 + 400,000 / 1.04^15 = 1,000,000 + 222,105.80 = 1,222,105.80 (calculator).
    const r = evaluateAlternative(
      [
        { year: 0, cost: 1_000_000, serviceLifeYears: 15 },
        { year: 15, cost: 400_000, serviceLifeYears: 12 },
      ],
      0.04,
      35,
    );
    expect(r.remainingServiceLifeValue).toBe(0);
    expect(r.presentValue).toBeCloseTo(1_222_105.8, 1);
  });

  it('credits the remaining life of the last activity, prorated on its life, discounted from year N', () => {
    // 4%, 35 years; $1,000,000 at 0 (20 yr), $500,000 at 20 (20 yr → ends year 40).
    // RSL = 500,000 × (20 + 20 − 35) / 20 = 125,000; PV(RSL) = 125,000 / 1.04^35 = 125,000 × 0.253415 = 31,676.93.
    // PV(costs) = 1,000,000 + 500,000 / 1.04^20 = 1,228,193.47; NPV = 1,196,516.54.
    // EUAC = NPV × A/P(4%, 35) = 1,196,516.54 × 0.0535773 = 64,106.15 (calculator).
    const r = evaluateAlternative(
      [
        { year: 0, cost: 1_000_000, serviceLifeYears: 20 },
        { year: 20, cost: 500_000, serviceLifeYears: 20 },
      ],
      0.04,
      35,
    );
    expect(r.remainingServiceLifeValue).toBeCloseTo(125_000, 6);
    expect(r.presentValueOfRemainingLife).toBeCloseTo(31_676.93, 1);
    expect(r.presentValueOfCosts).toBeCloseTo(1_228_193.47, 1);
    expect(r.presentValue).toBeCloseTo(1_196_516.54, 1);
    expect(r.euac).toBeCloseTo(64_106.15, 1);
  });

  it('takes the remaining life from the last activity, not from earlier long-lived ones', () => {
    const acts: Activity[] = [
      { year: 0, cost: 100, serviceLifeYears: 50 },
      { year: 30, cost: 10, serviceLifeYears: 10 },
    ];
    const rsl = remainingLife(acts, 35);
    expect(rsl.index).toBe(1);
    expect(rsl.value).toBeCloseTo(10 * (5 / 10), 12);
  });

  it('gives no credit to maintenance marked without salvage', () => {
    const rsl = remainingLife(
      [
        { year: 0, cost: 100, serviceLifeYears: 40 },
        { year: 33, cost: 5, serviceLifeYears: 3, salvage: false },
      ],
      35,
    );
    expect(rsl.index).toBe(0);
    expect(rsl.value).toBeCloseTo(100 * (5 / 40), 12);
  });

  it('EUAC at a zero rate is NPV / N', () => {
    const r = evaluateAlternative(
      [
        { year: 0, cost: 700, serviceLifeYears: 10 },
        { year: 10, cost: 300, serviceLifeYears: 10 },
      ],
      0,
      20,
    );
    expect(r.presentValue).toBe(1000);
    expect(r.euac).toBe(50);
  });
});

const activityArb = (n: number) =>
  fc.record({
    year: fc.integer({ min: 0, max: n }),
    cost: fc.double({ min: 1, max: 1e7, noNaN: true }),
    serviceLifeYears: fc.integer({ min: 1, max: 30 }),
  });

describe('properties (fast-check)', () => {
  it('PV falls as the rate rises, for positive cash flows with no remaining-life credit', () => {
    fc.assert(
      fc.property(
        fc.array(activityArb(30), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        fc.double({ min: 0.001, max: 0.05, noNaN: true }),
        (acts, r, dr) => {
          const noRsl = acts.map((a) => ({ ...a, salvage: false }));
          const a = evaluateAlternative(noRsl, r, 30).presentValue;
          const b = evaluateAlternative(noRsl, r + dr, 30).presentValue;
          return b <= a * (1 + 1e-12);
        },
      ),
    );
  });

  it('EUAC × P/A(r, N) = NPV', () => {
    fc.assert(
      fc.property(
        fc.array(activityArb(40), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 0.0001, max: 0.12, noNaN: true }),
        (acts, r) => {
          const res = evaluateAlternative(acts, r, 40);
          return Math.abs(res.euac * pa(r, 40) - res.presentValue) <= 1e-6 * Math.max(1, Math.abs(res.presentValue));
        },
      ),
    );
  });

  it('a zero rate gives the plain sum less the undiscounted remaining-life value', () => {
    fc.assert(
      fc.property(fc.array(activityArb(35), { minLength: 1, maxLength: 8 }), (acts) => {
        const res = evaluateAlternative(acts, 0, 35);
        const sum = acts.reduce((s, a) => s + a.cost, 0);
        return Math.abs(res.presentValue - (sum - res.remainingServiceLifeValue)) <= 1e-6 * sum;
      }),
    );
  });

  it('doubling all prices doubles NPV', () => {
    fc.assert(
      fc.property(
        fc.array(activityArb(35), { minLength: 1, maxLength: 8 }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        (acts, r) => {
          const one = evaluateAlternative(acts, r, 35).presentValue;
          const two = evaluateAlternative(
            acts.map((a) => ({ ...a, cost: a.cost * 2 })),
            r,
            35,
          ).presentValue;
          return Math.abs(two - 2 * one) <= 1e-9 * Math.abs(one);
        },
      ),
    );
  });
});

const rates = (perSy: number, perJob = 0, addOnFraction = 0) => ({ perSy, perLaneMile: 0, perJob, addOnFraction });

describe('schedule expansion', () => {
  const plan: Schedule = {
    initial: { label: 'mill and overlay 2 in', serviceLifeYears: 12, rates: rates(20) },
    rehabilitation: [{ label: 'overlay 1.5 in', serviceLifeYears: 10, rates: rates(14) }],
    maintenance: [{ template: { label: 'crack seal', serviceLifeYears: 3, rates: rates(0.4) }, everyYears: 4 }],
    repeatAtEndOfLife: true,
  };

  it('repeats rehabilitation at each end of life and cycles maintenance inside each life', () => {
    const acts = expandSchedule(plan, 35);
    const major = acts.filter((a) => a.kind !== 'maintenance').map((a) => a.year);
    expect(major).toEqual([0, 12, 22, 32]);
    const seals = acts.filter((a) => a.kind === 'maintenance').map((a) => a.year);
    // every 4 years after each treatment, before the next one: 4, 8 | 16, 20 | 26, 30 | 36 is past N
    expect(seals).toEqual([4, 8, 16, 20, 26, 30]);
    expect(acts.every((a) => a.year < 35)).toBe(true);
  });

  it('without repetition the initial treatment stands alone', () => {
    expect(expandSchedule({ ...plan, repeatAtEndOfLife: false, maintenance: [] }, 35).map((a) => a.year)).toEqual([0]);
  });

  it('costs are rates × quantities plus add-ons', () => {
    expect(
      activityCost(
        { perSy: 2, perLaneMile: 100, perJob: 3500, addOnFraction: 0.18 },
        { areaSy: 7040, laneMiles: 1, jobs: 1 },
      ),
    ).toBeCloseTo((2 * 7040 + 100 + 3500) * 1.18, 9);
  });
});

describe('vectorised network evaluation', () => {
  it('equals a segment-by-segment evaluation, and the group total equals one evaluation of the group', () => {
    const plan: Schedule = {
      initial: {
        label: 'thin overlay',
        serviceLifeYears: 9,
        rates: { perSy: 9.5, perLaneMile: 250, perJob: 4700, addOnFraction: 0.18 },
      },
      rehabilitation: [],
      maintenance: [{ template: { label: 'crack seal', serviceLifeYears: 3, rates: rates(0.4) }, everyYears: 3 }],
      repeatAtEndOfLife: true,
    };
    const areaSy = Float64Array.from([7040, 12000, 3500, 800]);
    const laneMiles = Float64Array.from([1, 1.6, 0.5, 0.1]);
    const [res] = evaluateNetwork([plan], { areaSy, laneMiles }, 0.03, 40);
    const total = areaSy.reduce((s, v) => s + v, 0);
    for (let i = 0; i < areaSy.length; i++) {
      const jobsShare = areaSy[i] / total;
      const acts = expandSchedule(plan, 40).map((a) => ({
        year: a.year,
        cost: activityCost(a.template.rates, { areaSy: areaSy[i], laneMiles: laneMiles[i], jobs: jobsShare }),
        serviceLifeYears: a.template.serviceLifeYears,
        salvage: a.template.salvage ?? true,
      }));
      const one = evaluateAlternative(acts, 0.03, 40);
      expect(res.npv[i]).toBeCloseTo(one.presentValue, 6);
      expect(res.euac[i]).toBeCloseTo(one.presentValue * ap(0.03, 40), 6);
    }
    const group = evaluateScheduleForGroup(
      plan,
      { areaSy: total, laneMiles: laneMiles.reduce((s, v) => s + v, 0) },
      0.03,
      40,
    );
    expect(res.totalNpv).toBeCloseTo(group.result.presentValue, 4);
  });
});
