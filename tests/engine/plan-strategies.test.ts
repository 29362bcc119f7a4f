// The plan's condition model, strategy generator, benefit and life-cycle cost, on small hand-worked
// cases. Curves here are chosen so the arithmetic can be done by hand (linear: PCI = 100 − a·t).
import { describe, expect, it } from 'vitest';
import type { Curve } from '../../shared/engine/forecast/curve';
import { ageAt, pciAt } from '../../shared/engine/forecast/curve';
import { lifeAtThickness } from '../../shared/engine/lcca/costing';
import { ap, pf } from '../../shared/engine/lcca/interest';
import { strategyLifeCycleCost } from '../../shared/engine/plan/benefit';
import {
  ageingYears,
  CurveTable,
  END_OF_LIFE_PCI,
  type PlanSegment,
  type PlanSettings,
  type PlanTreatment,
} from '../../shared/engine/plan/condition';
import { runPlan } from '../../shared/engine/plan/run-plan';
import { generateStrategies, SegmentWalker, surfaceSetsOf } from '../../shared/engine/plan/strategies';
import { DEMO_MIXES } from '../../server/seed/demo-catalog';

const seg = (over: Partial<PlanSegment> = {}): PlanSegment => ({
  ref: 1,
  segmentId: 'S-1',
  roadName: 'Test Road',
  lengthMi: 0.5,
  lanes: 2,
  areaSy: 1000,
  laneMiles: 1,
  functionalClass: 'local',
  surface: 'asphalt',
  adt: 100,
  truckPct: 0,
  pci: 60,
  pciDate: null,
  lastTreatmentYear: null,
  familyKey: 'asphalt|local|unknown',
  ...over,
});

const treatment = (over: Partial<PlanTreatment> & { id: string }): PlanTreatment => ({
  name: over.id,
  category: 'rehabilitation',
  costPerSy: 10,
  costPerLaneMile: 0,
  tonsPerSy: 0,
  mixName: null,
  thicknessIn: null,
  lifeYears: 9,
  effect: { type: 'reset', value: 100, resetsAge: true },
  applicability: {
    pciMin: 0,
    pciMax: 100,
    surfaces: ['asphalt', 'chip_seal'],
    classes: ['local'],
    minYearsSinceLast: 50,
  },
  ...over,
});

const settings = (over: Partial<PlanSettings> = {}): PlanSettings => ({
  startYear: 2027,
  budgets: [1e9, 1e9],
  weighting: 'lane-miles',
  needsWorkBelow: 70,
  benefitTailYears: 3,
  maxStrategiesPerSegment: 200,
  discountRate: 0.04,
  ...over,
});

const linear = (a: number): Curve => ({ p0: 100, a, b: 1 });
const walker = (s: PlanSegment, ts: PlanTreatment[], curves: (k: string) => Curve, st: PlanSettings, W: number) =>
  new SegmentWalker(new CurveTable(curves), s, ts, surfaceSetsOf(ts), st, W);

/** The path of works [(treatment index, year)] on a segment, years 0 … W. */
function pathOf(w: SegmentWalker, works: { treatment: number; year: number }[]) {
  const path = new Float64Array(w.W + 1);
  w.trace(null, works, path, 0, new Int32Array(32), new Uint8Array(16));
  return Array.from(path);
}

describe('plan condition model', () => {
  it('ages the measured PCI from the survey date to the start year, and leaves it untouched when no ageing is needed', () => {
    // Linear curve, 1 point a year: PCI 80 is age 20; surveyed 1 Jan 2025, the plan starts 1 Jan 2027: 2 years.
    expect(ageingYears('2025-01-01', 2027)).toBe(2);
    const aged = walker(seg({ pci: 80, pciDate: '2025-01-01' }), [], () => linear(1), settings(), 4);
    expect(aged.none[0]).toBeCloseTo(78, 12);
    expect(aged.none[3]).toBeCloseTo(75, 12);
    // Surveyed after the start (or in the start year's later months): year 0 is the measured PCI, exactly.
    const curve = { p0: 100, a: 0.75, b: 1.45 };
    const fresh = walker(seg({ pci: 63.7, pciDate: '2027-05-01' }), [], () => curve, settings(), 4);
    expect(fresh.none[0]).toBe(63.7);
    expect(fresh.none[1]).toBeCloseTo(pciAt(curve, ageAt(curve, 63.7) + 1), 12);
  });

  it('treats the catalog PCI limits as inclusive, also at the exact boundary on a curved family', () => {
    const curve = { p0: 100, a: 0.75, b: 1.45 }; // the demo's asphalt default: 45 → age → PCI is not exact
    const thin = treatment({
      id: 'thin',
      applicability: { ...treatment({ id: 'x' }).applicability, pciMin: 45, pciMax: 75 },
    });
    const at = generateStrategies([seg({ pci: 45 })], [thin], () => curve, settings());
    expect(Array.from(at.meta.actYear)).toContain(0);
    const below = generateStrategies([seg({ pci: 44.99 })], [thin], () => curve, settings());
    expect(Array.from(below.meta.actYear)).not.toContain(0);
  });

  it('a gain that does not reset age shifts the curve up by the gain, fading to none at the end of its life', () => {
    const curve = { p0: 100, a: 0.75, b: 1.45 };
    const crack = treatment({ id: 'crack', effect: { type: 'gain', value: 5, resetsAge: false }, lifeYears: 3 });
    const w = walker(seg({ pci: 80 }), [crack], () => curve, settings(), 5);
    const p = pathOf(w, [{ treatment: 0, year: 0 }]);
    expect(p[0]).toBe(85);
    // Life 3: 5, 3⅓, 1⅔ and 0 points above do-nothing in years 0 … 3, none after (fadeFactor).
    for (let k = 1; k <= 5; k++) expect(p[k]).toBeCloseTo(w.none[k] + 5 * Math.max(0, 1 - k / 3), 9);
    expect(p[4]).toBeCloseTo(w.none[4], 12);
    // Not the reading "counts as new at 85": that would be the curve restarted at PCI 85.
    expect(Math.abs(p[3] - pciAt(curve, ageAt(curve, 85) + 3))).toBeGreaterThan(0.5);
  });

  it('a reconstructed chip-seal road follows the asphalt reconstruction family, not its old chip-seal curve', () => {
    const curves: Record<string, Curve> = {
      'chip_seal|local|unknown': linear(3),
      'chip_seal|local|reconstruction': linear(9),
      'asphalt|local|reconstruction': linear(1),
    };
    const recon = treatment({ id: 'recon', category: 'reconstruction', kind: 'reconstruction', lifeYears: 45 });
    const w = walker(
      seg({ surface: 'chip_seal', familyKey: 'chip_seal|local|unknown', pci: 40 }),
      [recon],
      (k) => curves[k],
      settings(),
      5,
    );
    const p = pathOf(w, [{ treatment: 0, year: 0 }]);
    // Asphalt curve 1 point a year; 100 → END_OF_LIFE_PCI (55) takes 45 years = the life, so speed 1.
    expect(END_OF_LIFE_PCI).toBe(55);
    expect(p.slice(0, 4)).toEqual([100, 99, 98, 97].map((v) => expect.closeTo(v, 9)));
  });

  it('a thinner lift has a shorter life and so a different path, reaching PCI 55 at its own life', () => {
    const thinMix = DEMO_MIXES.find((m) => m.key === 'thin')!;
    const mix = { ...thinMix, id: 'thin', isDemo: true, coldWeatherNote: null, spreadRateLbPerSyIn: 110 };
    const life1 = lifeAtThickness(mix, 1);
    const life075 = lifeAtThickness(mix, 0.75);
    expect(life1).toBe(8); // the demo mix's reference: 1 in, 8 years
    expect(life075).toBe(6); // proportional to thickness (costing.ts lifeAtThickness)
    const curve = { p0: 100, a: 0.75, b: 1.45 };
    const mk = (lifeYears: number) =>
      walker(
        seg({ pci: 50 }),
        [treatment({ id: 't', lifeYears, effect: { type: 'reset', value: 95, resetsAge: true } })],
        () => curve,
        settings(),
        10,
      );
    const p1 = pathOf(mk(life1), [{ treatment: 0, year: 0 }]);
    const p075 = pathOf(mk(life075), [{ treatment: 0, year: 0 }]);
    expect(p1[8]).toBeCloseTo(55, 9);
    expect(p075[6]).toBeCloseTo(55, 9);
    expect(p075[4]).toBeLessThan(p1[4] - 1);
  });
});

describe('plan benefit and life-cycle cost', () => {
  // Hand-worked: linear curve 5 points a year, PCI 60, a reset to 100 with a 9-year life (100 → 55 in
  // 9 years at 5 a year: speed 1). Horizon 2 years, tail 3, rate 4 %: window years 0 … 5.
  const t = treatment({ id: 'overlay' });
  const st = settings();
  const g = generateStrategies([seg()], [t], () => linear(5), st);
  const byYear = (y: number) => {
    for (let o = 0; o < g.inst.segStart[1]; o++) if (g.meta.actYear[g.meta.actStart[o]] === y) return o;
    return -1;
  };

  it('does not reward deferral at the default settings: the same thin overlay a year later, same cost, scores less', () => {
    // Default window tail (10 years) and the demo agency's real discount rate (2 %): the settings
    // leave both unset. Linear curve, 5 points a year; PCI 60; a thin overlay sets PCI 95, life 8
    // (95 → 55 in 8 years at 5 a year: speed 1). Horizon 2: window years 0 … 12.
    // Do-nothing: 60 55 50 … 0.
    // Year 0: path 95 90 … 60 55 50 …, counted at no less than 60 (the renewal credit): gains over
    //   do-nothing 35 (years 0–7), 40 45 50 55 60 (years 8–12).
    // Year 1: 60 | 95 90 … 55 50 …, counted at no less than 55: gains 0 at the end of step [0, 1]
    //   (the PCI before the work), then 40 (years 1–9), 45 50 55 (years 10–12).
    // Trapezoids, undiscounted: 245 + 37.5 + 42.5 + 47.5 + 52.5 + 57.5 = 482.5 against 320 + 42.5 +
    // 47.5 + 52.5 = 462.5. Discounted, step t at P/F(2 %, t − ½) (engineering-economy interest
    // tables: 0.990148, 0.970733, …, 0.796339): 424.80 against 405.73 present PCI-years.
    const thin = treatment({
      id: 'thin',
      kind: 'thin_overlay',
      lifeYears: 8,
      effect: { type: 'reset', value: 95, resetsAge: true },
      applicability: { pciMin: 45, pciMax: 75, surfaces: ['asphalt'], classes: ['local'], minYearsSinceLast: 50 },
    });
    const dflt: PlanSettings = { startYear: 2027, budgets: [1e9, 1e9], weighting: 'lane-miles', needsWorkBelow: 70 };
    const d = generateStrategies([seg()], [thin], () => linear(5), dflt);
    expect(d.meta.W).toBe(12);
    const at = (y: number) => {
      for (let o = 0; o < d.inst.segStart[1]; o++) if (d.meta.actYear[d.meta.actStart[o]] === y) return o;
      return -1;
    };
    const o0 = at(0);
    const o1 = at(1);
    expect(d.inst.cost[o0 * 2]).toBe(10_000);
    expect(d.inst.cost[o1 * 2 + 1]).toBe(10_000);
    expect(d.inst.benefit[o0]).toBeCloseTo(424.8017, 3);
    expect(d.inst.benefit[o1]).toBeCloseTo(405.7345, 3);
    // Without discounting (rate 0) the same window gives the undiscounted figures.
    const u = generateStrategies([seg()], [thin], () => linear(5), { ...dflt, discountRate: 0 });
    expect(u.inst.benefit[o0]).toBeCloseTo(482.5, 9);
    expect(u.inst.benefit[o1]).toBeCloseTo(462.5, 9);
  });

  it('later never scores more for one reset treatment, at any year, tail and rate (the derived condition)', () => {
    const curve = { p0: 100, a: 0.75, b: 1.45 }; // the demo's asphalt default curve
    const thin = treatment({ id: 'thin', lifeYears: 6, effect: { type: 'reset', value: 95, resetsAge: true } });
    for (const tail of [0, 3, 10, 20])
      for (const discountRate of [0, 0.02, 0.07])
        for (const pci of [45, 60, 75, 90]) {
          const d = generateStrategies(
            [seg({ pci })],
            [thin],
            () => curve,
            settings({ budgets: new Array(10).fill(1e9), benefitTailYears: tail, discountRate }),
          );
          const b = new Array(10).fill(Number.NaN);
          for (let o = 0; o < d.inst.segStart[1]; o++)
            if (d.meta.actStart[o + 1] - d.meta.actStart[o] === 1)
              b[d.meta.actYear[d.meta.actStart[o]]] = d.inst.benefit[o];
          for (let y = 0; y < 9; y++)
            expect(b[y + 1], `tail ${tail} rate ${discountRate} PCI ${pci} year ${y}`).toBeLessThanOrEqual(b[y] + 1e-9);
        }
  });

  it("gives each strategy its PV, EUAC and remaining-life credit by FHWA-SA-98-079's method", () => {
    // One work of $10,000 in year 0, life 9, analysis period = the window, 5 years, at 4 %.
    // RSL value = cost × (life left at 5) / life = 10,000 × 4/9 = 4,444.44 (FHWA-SA-98-079).
    // P/F(4 %, 5) = 1/1.04^5 = 0.821927; A/P(4 %, 5) = 0.224627 (engineering-economy interest tables).
    // PV = 10,000 − 4,444.44 × 0.821927 = 6,346.99; EUAC = 6,346.99 × 0.224627 = 1,425.71.
    const o0 = byYear(0);
    expect(pf(0.04, 5)).toBeCloseTo(0.821927, 6);
    expect(ap(0.04, 5)).toBeCloseTo(0.224627, 6);
    expect(g.inst.lcc[o0]).toBeCloseTo(6346.99, 1);
    const r = strategyLifeCycleCost([{ year: 0, cost: 10_000, serviceLifeYears: 9 }], 0.04, 5);
    expect(r.euac).toBeCloseTo(1425.71, 1);
    // Work in year 1: PV of cost 10,000 × P/F(4 %, 1) = 9,615.38; life left at 5 = 5 of 9:
    // RSL 5,555.56 × 0.821927 = 4,566.26; PV = 5,049.12.
    expect(g.inst.lcc[byYear(1)]).toBeCloseTo(5049.12, 1);
  });

  it('plans two treatments on one segment in one plan (a strategy, not a single job)', () => {
    const curve = { p0: 100, a: 0.75, b: 1.45 };
    const thin = treatment({
      id: 'thin',
      name: 'Thin overlay',
      effect: { type: 'reset', value: 95, resetsAge: true },
      lifeYears: 8,
      applicability: { pciMin: 45, pciMax: 75, surfaces: ['asphalt'], classes: ['local'], minYearsSinceLast: 5 },
    });
    const crack = treatment({
      id: 'crack',
      name: 'Crack seal',
      category: 'preservation',
      costPerSy: 0.5,
      effect: { type: 'gain', value: 5, resetsAge: false },
      lifeYears: 3,
      applicability: { pciMin: 60, pciMax: 95, surfaces: ['asphalt'], classes: ['local'], minYearsSinceLast: 2 },
    });
    const input = {
      planName: 'two works',
      agencyName: 'Brannock County',
      method: 'fast' as const,
      minNetworkPci: null,
      settings: settings({ budgets: new Array(10).fill(1e9), benefitTailYears: 10 }),
      segments: [seg({ pci: 50 })],
      treatments: [thin, crack],
      curves: { 'asphalt|local|unknown': curve, 'asphalt|local|overlay': curve },
    };
    const r = runPlan(input, null);
    // Thin overlay at PCI about 50 → 95; the road falls to the crack seal's trigger (77.5) after some
    // years and is crack-sealed, and again two or more years later.
    expect(r.work.length).toBeGreaterThanOrEqual(2);
    expect(new Set(r.work.map((w) => w.ref)).size).toBe(1);
    expect(r.work.map((w) => w.treatment)).toEqual(expect.arrayContaining(['Thin overlay', 'Crack seal']));
    expect(r.work[0].strategy).toMatch(/^thin overlay 20\d\d, crack seal 20\d\d/);
    const crackWork = r.work.find((w) => w.treatment === 'Crack seal')!;
    expect(crackWork.pciBefore).toBeLessThanOrEqual(77.5 + 1e-6);
    expect(crackWork.pciAfter).toBeCloseTo(crackWork.pciBefore + 5, 9);
  });

  it('drops strategies that leave a class below its floor, and makes a segment whose do-nothing breaks it choose', () => {
    const st2 = settings({
      targets: { minNetworkPci: null, classFloors: [{ functionalClass: 'local', minPci: 52 }], goodOrBetterPct: null },
    });
    const f = generateStrategies([seg()], [t], () => linear(5), st2);
    // Do-nothing reaches 55 in year 1 — fine — but the horizon is 2 years (0, 1): no break; raise the floor.
    expect(f.inst.mustChoose[0]).toBe(0);
    const st3 = settings({
      targets: { minNetworkPci: null, classFloors: [{ functionalClass: 'local', minPci: 58 }], goodOrBetterPct: null },
    });
    const h = generateStrategies([seg()], [t], () => linear(5), st3);
    expect(h.inst.mustChoose[0]).toBe(1);
    // The year-1 work leaves year 1 at… 100 (work at the start of the year), but year 0 is 60: kept;
    // every strategy left keeps years 0 and 1 at 58 or more.
    for (let o = 0; o < h.inst.segStart[1]; o++) expect(h.inst.benefit[o]).toBeGreaterThan(0);
    const strict = settings({
      targets: { minNetworkPci: null, classFloors: [{ functionalClass: 'local', minPci: 61 }], goodOrBetterPct: null },
    });
    const s = generateStrategies([seg()], [t], () => linear(5), strict);
    // Year 0 is 60 before work, 100 after year-0 work: only the year-0 strategy keeps PCI ≥ 61.
    expect(s.inst.segStart[1]).toBe(1);
    expect(s.meta.actYear[0]).toBe(0);
  });
});
