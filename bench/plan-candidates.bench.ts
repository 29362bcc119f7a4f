// Strategy generation for 20,000 segments × 10 years (goal: under 1 s on this machine's cores),
// on the demo catalog's treatments and default curves, with a class floor and a network-PCI target
// (so the target rows are built too). Prints strategies, works and the time of each run.
import os from 'node:os';
import { DEFAULT_CURVES } from '../shared/engine/forecast/families';
import { resolveTreatment } from '../shared/engine/lcca/costing';
import type { PlanSegment, PlanTreatment } from '../shared/engine/plan/condition';
import { generateStrategies } from '../shared/engine/plan/strategies';
import { rng } from '../shared/engine/random';
import type { Mix, Treatment } from '../shared/schemas/catalog';
import { DEMO_ECONOMICS, DEMO_MIXES, DEMO_TREATMENTS } from '../server/seed/demo-catalog';

const N = Number(process.env.BENCH_SEGMENTS ?? 20_000);
const H = 10;
const u = rng(99);
const mixes: Mix[] = DEMO_MIXES.map(({ key, ...m }) => ({
  ...m,
  id: key,
  isDemo: true,
  coldWeatherNote: m.coldWeatherNote ?? null,
  spreadRateLbPerSyIn: m.spreadRateLbPerSyIn ?? 110,
}));
const econ = {
  discountRate: 0.02,
  discountRateSource: null,
  analysisPeriodYears: 40,
  baseYear: 2027,
  ...DEMO_ECONOMICS,
  mobilizationPerJob: 0,
};
const treatments: PlanTreatment[] = DEMO_TREATMENTS.map(({ mixKey, ...t }, i) => {
  const tr: Treatment = { ...t, id: `t${i}`, mixId: mixKey, isDemo: true };
  const r = resolveTreatment(tr, mixKey ? mixes.find((m) => m.id === mixKey)! : null, {}, econ);
  return {
    id: tr.id,
    name: tr.name,
    category: tr.category,
    kind: tr.kind,
    costPerSy: r.rates.perSy * (1 + r.rates.addOnFraction),
    costPerLaneMile: 0,
    tonsPerSy: r.tonsPerSy,
    mixName: r.mix?.name ?? null,
    thicknessIn: r.thicknessIn,
    lifeYears: r.serviceLifeYears,
    effect: tr.effect,
    applicability: tr.applicability,
  };
});
const classes = ['local', 'local', 'local', 'minor_collector', 'major_collector', 'minor_arterial'];
const segments: PlanSegment[] = Array.from({ length: N }, (_, i) => {
  const len = 0.1 + u() * 0.9;
  const surface = u() < 0.75 ? 'asphalt' : 'chip_seal';
  return {
    ref: i,
    segmentId: `B-${i}`,
    roadName: `Road ${i % 500}`,
    lengthMi: len,
    lanes: 2,
    areaSy: (len * 5280 * 24) / 9,
    laneMiles: len * 2,
    functionalClass: classes[i % classes.length],
    surface,
    adt: Math.round(50 + u() * 3000),
    truckPct: Math.round(u() * 12),
    pci: Math.round(15 + u() * 83),
    pciDate: `2025-0${1 + Math.floor(u() * 9)}-15`,
    lastTreatmentYear: 2005 + Math.floor(u() * 20),
    familyKey: `${surface}|local|unknown`,
  };
});
const curves = (k: string) => DEFAULT_CURVES[k.split('|')[0]] ?? DEFAULT_CURVES.other;
const settings = {
  startYear: 2027,
  budgets: new Array(H).fill(N * 1000),
  weighting: 'lane-miles' as const,
  needsWorkBelow: 71,
  targets: {
    minNetworkPci: 60,
    classFloors: [{ functionalClass: 'minor_arterial', minPci: 40 }],
    goodOrBetterPct: null,
  },
};

for (let run = 1; run <= 3; run++) {
  const t = performance.now();
  const cpu0 = process.cpuUsage();
  const { inst, meta } = generateStrategies(segments, treatments, curves, settings);
  const ms = performance.now() - t;
  const c = process.cpuUsage(cpu0);
  const cpuMs = (c.user + c.system) / 1000;
  const options = inst.segStart[inst.nSegments];
  console.log(
    `run ${run}: ${N.toLocaleString('en-US')} segments × ${H} years: ${options.toLocaleString('en-US')} strategies, ` +
      `${meta.actTreatment.length.toLocaleString('en-US')} works, ${inst.targets.length} target rows in ${ms.toFixed(0)} ms (CPU time ${cpuMs.toFixed(0)} ms; the machine's load: ${os.loadavg()[0].toFixed(1)})` +
      `${N === 20_000 ? (ms < 1000 ? ' (goal under 1 s: met)' : ' (goal under 1 s: NOT met)') : ''}`,
  );
}
