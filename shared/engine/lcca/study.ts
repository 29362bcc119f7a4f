// A life-cycle cost comparison of 2–6 alternatives on one group of segments,
// built from catalog items: results, cost lines, sensitivity, break-even
// rates, Monte Carlo and cautions. Pure: the same input gives the same output.
import type { Mix, Treatment } from '../../schemas/catalog';
import { OVERLAY_KINDS } from '../../schemas/catalog';
import type { AlternativeSpec, Step, StudyInput } from '../../schemas/lcca';
import { checkOverlay } from '../structural';
import { type PriceOverrides, type ResolvedTreatment, costLines, resolveTreatment } from './costing';
import { evaluatePlanForGroup } from './network';
import { breakEvenRate, type ModelInput, monteCarlo, sensitivity } from './risk';
import type { ActivityTemplate, SchedulePlan } from './schedule';

export class StudyInputError extends Error {
  constructor(
    public path: string,
    message: string,
  ) {
    super(message);
  }
}

type Lookup = { mix: (id: string) => Mix | undefined; treatment: (id: string) => Treatment | undefined };

function lookup(input: StudyInput): Lookup {
  const m = new Map(input.catalog.mixes.map((x) => [x.id, x]));
  const t = new Map(input.catalog.treatments.map((x) => [x.id, x]));
  return { mix: (id) => m.get(id), treatment: (id) => t.get(id) };
}

function resolveStep(
  step: Step,
  path: string,
  input: StudyInput,
  look: Lookup,
  over: PriceOverrides,
  lifeOverride?: number,
): ResolvedTreatment {
  const t = look.treatment(step.treatmentId);
  if (!t) throw new StudyInputError(`${path}.treatmentId`, 'is not a treatment in the catalog');
  const mixId = step.mixId ?? t.mixId;
  const mix = mixId ? look.mix(mixId) : undefined;
  if (mixId && !mix) throw new StudyInputError(`${path}.mixId`, 'is not a mix in the catalog');
  const thickness = mix ? (step.thicknessIn ?? t.defaultThicknessIn) : null;
  if (mix && thickness !== null && (thickness < mix.minLiftIn - 1e-9 || thickness > mix.maxLiftIn + 1e-9)) {
    throw new StudyInputError(
      `${path}.thicknessIn`,
      `${thickness} in is outside the ${mix.name} lift range of ${mix.minLiftIn}–${mix.maxLiftIn} in`,
    );
  }
  if (step.serviceLifeYears !== undefined && step.serviceLifeYears !== null && step.serviceLifeYears <= 0)
    throw new StudyInputError(`${path}.serviceLifeYears`, 'must be more than 0');
  return resolveTreatment(
    t,
    mix ?? null,
    { thicknessIn: thickness, serviceLifeYears: lifeOverride ?? step.serviceLifeYears },
    input.economics,
    over,
  );
}

const template = (r: ResolvedTreatment, salvage = true): ActivityTemplate => ({
  label: r.label,
  serviceLifeYears: Math.max(1, Math.round(r.serviceLifeYears)),
  rates: r.rates,
  salvage,
});

/** Keys of the lives a model varies: alt:<i>:life:<j>, j = 0 for the initial step, 1… for rehabilitation steps. */
function buildPlan(
  spec: AlternativeSpec,
  i: number,
  input: StudyInput,
  look: Lookup,
  over: PriceOverrides,
  values?: Record<string, number>,
) {
  const life = (j: number) => values?.[`alt:${i}:life:${j}`];
  const initial = resolveStep(spec.initial, `alternatives.${i}.initial`, input, look, over, life(0));
  const rehab = spec.rehabilitation.map((s, j) =>
    resolveStep(s, `alternatives.${i}.rehabilitation.${j}`, input, look, over, life(j + 1)),
  );
  const maint = spec.maintenance.map((m, j) => {
    const r = resolveStep({ treatmentId: m.treatmentId }, `alternatives.${i}.maintenance.${j}`, input, look, over);
    return { template: template(r, false), everyYears: m.everyYears };
  });
  const plan: SchedulePlan = {
    initial: template(initial),
    rehabilitation: rehab.map((r) => template(r)),
    maintenance: maint,
    repeatAtEndOfLife: spec.repeatAtEndOfLife,
  };
  return { plan, initial, rehab };
}

/** The uncertain inputs: rate, each mix price, each treatment's other prices, each life. */
export function studyInputs(input: StudyInput): ModelInput[] {
  const look = lookup(input);
  const out: ModelInput[] = [];
  const r = input.economics.discountRate;
  out.push({ key: 'rate', label: 'Discount rate', base: r, low: Math.max(0, r - 0.02), high: r + 0.02 });
  const mixes = new Set<string>();
  const treatments = new Set<string>();
  input.alternatives.forEach((a, i) => {
    const steps = [a.initial, ...a.rehabilitation];
    for (const s of [...steps, ...a.maintenance.map((m) => ({ treatmentId: m.treatmentId }))]) {
      const t = look.treatment(s.treatmentId);
      if (!t) continue;
      treatments.add(t.id);
      const mixId = (s as Step).mixId ?? t.mixId;
      if (mixId && look.mix(mixId)) mixes.add(mixId);
    }
    steps.forEach((s, j) => {
      const res = resolveStep(
        s,
        `alternatives.${i}.${j === 0 ? 'initial' : `rehabilitation.${j - 1}`}`,
        input,
        look,
        {},
      );
      out.push({
        key: `alt:${i}:life:${j}`,
        label: `${a.name}: life of ${res.label}`,
        base: res.serviceLifeYears,
        low: res.serviceLifeYears * 0.75,
        high: res.serviceLifeYears * 1.25,
      });
    });
  });
  for (const id of mixes) {
    const m = look.mix(id)!;
    out.push({
      key: `mix:${id}`,
      label: `${m.name} price ($/ton)`,
      base: m.pricePerTon,
      low: m.pricePerTon * 0.85,
      high: m.pricePerTon * 1.25,
    });
  }
  for (const id of treatments) {
    const t = look.treatment(id)!;
    if (t.costItems.some((c) => c.basis !== 'percent' && c.amount > 0))
      out.push({ key: `treatment:${id}`, label: `${t.name} unit prices (factor)`, base: 1, low: 0.85, high: 1.25 });
  }
  for (const inp of out) {
    const o = input.risk.ranges[inp.key];
    if (o) {
      inp.low = o.low;
      inp.high = o.high;
    }
    const kind = o?.distribution ?? 'triangular';
    inp.distribution =
      kind === 'fixed'
        ? { type: 'fixed', value: inp.base }
        : kind === 'uniform'
          ? { type: 'uniform', min: inp.low, max: inp.high }
          : { type: 'triangular', min: inp.low, mode: inp.base, max: inp.high };
  }
  return out;
}

function overridesFrom(values: Record<string, number>): PriceOverrides {
  const over: PriceOverrides = { mixPricePerTon: {}, treatmentFactor: {} };
  for (const [k, v] of Object.entries(values)) {
    if (k.startsWith('mix:')) over.mixPricePerTon![k.slice(4)] = v;
    else if (k.startsWith('treatment:')) over.treatmentFactor![k.slice(10)] = v;
  }
  return over;
}

export function studyModel(input: StudyInput) {
  const look = lookup(input);
  const q = { areaSy: input.group.areaSy, laneMiles: input.group.laneMiles };
  return (values: Record<string, number>) => {
    const over = overridesFrom(values);
    return input.alternatives.map(
      (a, i) =>
        evaluatePlanForGroup(
          buildPlan(a, i, input, look, over, values).plan,
          q,
          values.rate,
          input.economics.analysisPeriodYears,
        ).result.presentValue,
    );
  };
}

export type StudyResult = ReturnType<typeof runStudy>;

export function runStudy(
  input: StudyInput,
  opts: { onProgress?: (fraction: number) => void; monteCarlo?: boolean } = {},
) {
  if (input.baselineIndex >= input.alternatives.length)
    throw new StudyInputError('baselineIndex', 'names no alternative');
  const look = lookup(input);
  const { discountRate: rate, analysisPeriodYears: N } = input.economics;
  const q = { areaSy: input.group.areaSy, laneMiles: input.group.laneMiles };
  const alternatives = input.alternatives.map((a, i) => {
    const { plan, initial, rehab } = buildPlan(a, i, input, look, {});
    const { result, rated } = evaluatePlanForGroup(plan, q, rate, N);
    const first = costLines(initial, q);
    return {
      name: a.name,
      presentValue: result.presentValue,
      presentValueOfCosts: result.presentValueOfCosts,
      euac: result.euac,
      remainingServiceLifeValue: result.remainingServiceLifeValue,
      presentValueOfRemainingLife: result.presentValueOfRemainingLife,
      perLaneMile: result.presentValue / q.laneMiles,
      euacPerLaneMile: result.euac / q.laneMiles,
      perSy: result.presentValue / q.areaSy,
      firstCost: first.total,
      initialTons: first.tons,
      initial: {
        label: initial.label,
        serviceLifeYears: initial.serviceLifeYears,
        lifeSource: initial.lifeSource,
        thicknessIn: initial.thicknessIn,
        costLines: first,
      },
      rehabilitation: rehab.map((r) => ({
        label: r.label,
        serviceLifeYears: r.serviceLifeYears,
        lifeSource: r.lifeSource,
        costLines: costLines(r, q),
      })),
      cashFlows: result.cashFlows.map((c, k) => ({ ...c, kind: rated[k].kind })),
    };
  });
  const base = alternatives[input.baselineIndex];
  const ranked = alternatives
    .map((a, i) => ({ index: i, presentValue: a.presentValue }))
    .sort((x, y) => x.presentValue - y.presentValue);
  const vsBaseline = alternatives.map((a) => ({
    savings: base.presentValue - a.presentValue,
    savingsPerLaneMile: (base.presentValue - a.presentValue) / q.laneMiles,
    firstCostSavingsPerLaneMile: (base.firstCost - a.firstCost) / q.laneMiles,
    tonsSaved: base.initialTons - a.initialTons,
    tonsSavedPerLaneMile: (base.initialTons - a.initialTons) / q.laneMiles,
  }));

  const inputs = studyInputs(input);
  const model = studyModel(input);
  const tornado = sensitivity(inputs, model);
  const baseValues = Object.fromEntries(inputs.map((i) => [i.key, i.base]));
  const breakEven = alternatives.map((_, i) =>
    i === input.baselineIndex
      ? null
      : breakEvenRate((r) => model({ ...baseValues, rate: r }), i, input.baselineIndex, 0, 0.12),
  );
  const mc =
    opts.monteCarlo === false
      ? null
      : monteCarlo(inputs, model, {
          iterations: input.risk.iterations,
          seed: input.risk.seed,
          onProgress: (d) => opts.onProgress?.(d / input.risk.iterations),
        });

  // Cautions: thin lifts on weak, busy roads; cold-weather notes of the mixes used.
  const cautions: {
    kind: 'structural' | 'cold-weather' | 'life-assumption' | 'applicability';
    alternative: string;
    message: string;
  }[] = [];
  input.alternatives.forEach((a, i) => {
    const alt = alternatives[i];
    const t = look.treatment(a.initial.treatmentId)!;
    if ((OVERLAY_KINDS as readonly string[]).includes(t.kind) && alt.initial.thicknessIn) {
      const flagged = input.group.segments
        .map((s) => ({
          s,
          c: checkOverlay(s, { thicknessIn: alt.initial.thicknessIn!, serviceLifeYears: alt.initial.serviceLifeYears }),
        }))
        .filter((x) => x.c.caution);
      if (flagged.length) {
        const worst = flagged.sort((x, y) => y.c.shortBy - x.c.shortBy)[0];
        cautions.push({
          kind: 'structural',
          alternative: a.name,
          message: `${flagged.length} of ${input.group.segments.length} segment(s) may be structurally short for a ${alt.initial.thicknessIn}-in lift (worst ${worst.s.segmentId}: estimated SN ${worst.c.snWithOverlay.toFixed(2)} against ${worst.c.requiredSn.toFixed(2)} asked by the AASHTO 1993 equation for ${Math.round(worst.c.designEsals).toLocaleString('en-US')} ESALs). A planning flag from assumed layer values, not a design: confirm with cores, deflection testing and a pavement design.`,
        });
      }
    }
    const outside = input.group.segments.filter(
      (s) =>
        !t.applicability.classes.includes(s.functionalClass as never) ||
        (s.pci !== null && (s.pci < t.applicability.pciMin || s.pci > t.applicability.pciMax)),
    );
    if (outside.length) {
      cautions.push({
        kind: 'applicability',
        alternative: a.name,
        message: `${t.name} is outside the catalog's rules (PCI ${t.applicability.pciMin}–${t.applicability.pciMax}; ${t.applicability.classes.length} functional classes) for ${outside.length} of ${input.group.segments.length} segment(s), e.g. ${outside[0].segmentId}.`,
      });
    }
    const mixes = [alt.initial, ...alt.rehabilitation]
      .map((_, j) => (j === 0 ? a.initial : a.rehabilitation[j - 1]))
      .map((s) => look.mix(s.mixId ?? look.treatment(s.treatmentId)?.mixId ?? ''));
    for (const m of new Set(mixes.filter((x): x is Mix => !!x))) {
      if (m.coldWeatherNote)
        cautions.push({ kind: 'cold-weather', alternative: a.name, message: `${m.name}: ${m.coldWeatherNote}` });
    }
    if (
      alt.initial.lifeSource === 'mix-and-lift' &&
      alt.initial.thicknessIn !== look.mix(a.initial.mixId ?? t.mixId ?? '')?.refLiftIn
    ) {
      cautions.push({
        kind: 'life-assumption',
        alternative: a.name,
        message: `The ${alt.initial.serviceLifeYears.toFixed(1)}-year life of ${alt.initial.label} is scaled from the mix's reference lift in proportion to thickness (an assumption); enter the agency's own life if it has one.`,
      });
    }
  });

  return {
    analysisPeriodYears: N,
    discountRate: rate,
    group: {
      label: input.group.label,
      areaSy: q.areaSy,
      laneMiles: q.laneMiles,
      centrelineMiles: input.group.centrelineMiles,
      segments: input.group.segments.length,
    },
    baselineIndex: input.baselineIndex,
    alternatives,
    ranking: ranked.map((r) => r.index),
    vsBaseline,
    sensitivity: { base: tornado.base, rows: tornado.rows.map((r) => ({ ...r })) },
    breakEven,
    monteCarlo: mc,
    cautions,
  };
}
