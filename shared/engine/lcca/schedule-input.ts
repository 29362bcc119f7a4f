// From a comparison's alternatives (catalog steps) to schedule plans: each step
// resolved against the snapshot of the catalog, with its lift checked.
import type { Mix, Treatment } from '../../schemas/catalog';
import type { AlternativeSpec, Step, ComparisonInput } from '../../schemas/comparisons';
import { type PriceOverrides, type ResolvedTreatment, resolveTreatment } from './costing';
import type { ActivityTemplate, Schedule } from './schedule';

export class ComparisonInputError extends Error {
  constructor(
    public path: string,
    message: string,
  ) {
    super(message);
  }
}

export type Lookup = { mix: (id: string) => Mix | undefined; treatment: (id: string) => Treatment | undefined };

export function lookup(input: ComparisonInput): Lookup {
  const m = new Map(input.catalog.mixes.map((x) => [x.id, x]));
  const t = new Map(input.catalog.treatments.map((x) => [x.id, x]));
  return { mix: (id) => m.get(id), treatment: (id) => t.get(id) };
}

export function resolveStep(
  step: Step,
  path: string,
  input: ComparisonInput,
  look: Lookup,
  over: PriceOverrides,
  lifeOverride?: number,
): ResolvedTreatment {
  const t = look.treatment(step.treatmentId);
  if (!t) throw new ComparisonInputError(`${path}.treatmentId`, 'is not a treatment in the catalog');
  const mixId = step.mixId ?? t.mixId;
  const mix = mixId ? look.mix(mixId) : undefined;
  if (mixId && !mix) throw new ComparisonInputError(`${path}.mixId`, 'is not a mix in the catalog');
  const thickness = mix ? (step.thicknessIn ?? t.defaultThicknessIn) : null;
  if (mix && thickness !== null && (thickness < mix.minLiftIn - 1e-9 || thickness > mix.maxLiftIn + 1e-9)) {
    throw new ComparisonInputError(
      `${path}.thicknessIn`,
      `${thickness} in is outside the ${mix.name} lift range of ${mix.minLiftIn}–${mix.maxLiftIn} in`,
    );
  }
  if (step.serviceLifeYears !== undefined && step.serviceLifeYears !== null && step.serviceLifeYears <= 0)
    throw new ComparisonInputError(`${path}.serviceLifeYears`, 'must be more than 0');
  return resolveTreatment(
    t,
    mix ?? null,
    { thicknessIn: thickness, serviceLifeYears: lifeOverride ?? step.serviceLifeYears },
    input.economics,
    over,
  );
}

// Lives are kept as they are (11.67 years stays 11.67): the schedule books each
// treatment in the year its predecessor's life ends and credits the exact
// fraction left at the end (schedule.ts). What is shown is what is computed.
const template = (r: ResolvedTreatment, salvage = true): ActivityTemplate => ({
  label: r.label,
  serviceLifeYears: r.serviceLifeYears,
  rates: r.rates,
  salvage,
});

/** Keys of the lives a model varies: alt:<i>:life:<j>, j = 0 for the initial step, 1… for rehabilitation steps. */
export function buildSchedule(
  spec: AlternativeSpec,
  i: number,
  input: ComparisonInput,
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
  const plan: Schedule = {
    initial: template(initial),
    rehabilitation: rehab.map((r) => template(r)),
    maintenance: maint,
    repeatAtEndOfLife: spec.repeatAtEndOfLife,
  };
  return { plan, initial, rehab };
}
