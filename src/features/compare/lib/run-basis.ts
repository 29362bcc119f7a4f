// What a result was run on, in a comparable form, so that a result shown
// beside changed inputs carries an "out of date" mark saying what changed.
import type { Economics, Mix, Treatment } from '@shared/schemas/catalog';
import type { AlternativeSpec, Step, ComparisonInput } from '@shared/schemas/comparisons';
import { type Roads, roadsOfGroup } from './roads';

export type RunBasis = { roads: string; alternatives: string; baseline: number; iterations: number; prices: string };

type Prices = { mixes: Mix[]; treatments: Treatment[]; economics: Economics };

const step = (s: Step) => ({
  treatmentId: s.treatmentId,
  mixId: s.mixId ?? null,
  thicknessIn: s.thicknessIn ?? null,
  serviceLifeYears: s.serviceLifeYears ?? null,
});

const altsKey = (alts: AlternativeSpec[]) =>
  JSON.stringify(
    alts.map((a) => ({
      name: a.name,
      initial: step(a.initial),
      rehabilitation: (a.rehabilitation ?? []).map(step),
      maintenance: (a.maintenance ?? []).map((m) => [m.treatmentId, m.everyYears]),
      repeat: a.repeatAtEndOfLife ?? true,
    })),
  );

const roadsKey = (r: Roads) =>
  r.kind === 'segments'
    ? `segments:${[...r.ids].sort((x, y) => x - y).join(',')}`
    : `typed:${JSON.stringify(Object.entries(r.section).map(([k, v]) => [k, typeof v === 'number' ? Number(v.toFixed(4)) : v]))}`;

/** The prices and economics the alternatives use (not the whole catalog: an unrelated edit changes nothing). */
function pricesKey(alts: AlternativeSpec[], p: Prices) {
  const steps = alts.flatMap((a) => [a.initial, ...(a.rehabilitation ?? [])]);
  const tIds = new Set([
    ...steps.map((s) => s.treatmentId),
    ...alts.flatMap((a) => (a.maintenance ?? []).map((m) => m.treatmentId)),
  ]);
  const treatments = p.treatments
    .filter((t) => tIds.has(t.id))
    .map((t) => [
      t.id,
      t.lifeYears,
      t.millDepthIn,
      t.defaultThicknessIn,
      t.productionSyPerDay,
      t.costItems.map((c) => [c.basis, c.amount]),
      t.applicability.pciMin,
      t.applicability.pciMax,
    ]);
  const mIds = new Set(steps.map((s) => s.mixId ?? p.treatments.find((t) => t.id === s.treatmentId)?.mixId));
  const mixes = p.mixes
    .filter((m) => mIds.has(m.id))
    .map((m) => [m.id, m.pricePerTon, m.spreadRateLbPerSyIn, m.refLiftIn, m.refLifeYears]);
  const e = p.economics;
  const econ = [
    e.discountRate,
    e.analysisPeriodYears,
    e.mobilizationPerJob,
    e.trafficControlPerDay,
    e.engineeringFraction,
    e.contingencyFraction,
  ];
  return JSON.stringify({ treatments, mixes, econ });
}

export function basisOf(
  roads: Roads,
  alts: AlternativeSpec[],
  baseline: number,
  iterations: number,
  prices: Prices,
): RunBasis {
  return { roads: roadsKey(roads), alternatives: altsKey(alts), baseline, iterations, prices: pricesKey(alts, prices) };
}

export function basisOfSaved(input: ComparisonInput): RunBasis {
  return basisOf(roadsOfGroup(input.group), input.alternatives, input.baselineIndex, input.risk.iterations, {
    mixes: input.catalog.mixes,
    treatments: input.catalog.treatments,
    economics: input.economics,
  });
}

/** What differs, in words, for the "out of date" mark; empty when the result matches the inputs. */
export function changesSince(ran: RunBasis, now: RunBasis): string[] {
  const out: string[] = [];
  if (ran.roads !== now.roads) out.push('the roads');
  if (ran.alternatives !== now.alternatives) out.push('the alternatives');
  if (ran.baseline !== now.baseline) out.push('the baseline');
  if (ran.iterations !== now.iterations) out.push('the number of Monte Carlo draws');
  if (ran.prices !== now.prices) out.push('catalog prices or economics');
  return out;
}
