// The frozen input of a plan run: inventory (with survey dates, for ageing), curves of every family
// a road can move into, planning costs with the plan's mix policy applied, and the settings.
import { and, eq, isNotNull } from 'drizzle-orm';
import { classGroup, familyKey } from '../../shared/engine/forecast/families';
import { resolveTreatment } from '../../shared/engine/lcca/costing';
import type { PlanSegment, PlanTreatment } from '../../shared/engine/plan/condition';
import { MAX_EXACT_OPTIONS, type PlanInput } from '../../shared/engine/plan/run-plan';
import { generateStrategies } from '../../shared/engine/plan/strategies';
import { areaSy, laneMiles } from '../../shared/engine/quantities';
import { budgetsOf, type PlanSettingsParsed, PlanSettingsSchema } from '../../shared/schemas/plans';
import { SURFACES } from '../../shared/schemas/segments';
import { agencyById } from '../agencies/agencies.service';
import * as catalogRepo from '../catalog/catalog.repo';
import type { Deps } from '../deps';
import { plans, segments } from '../db/schema';
import { curveLookup, families } from '../forecast/forecast.service';
import { HttpError, notFound } from '../http/errors';

export const MAX_PLAN_SEGMENTS = 60_000;

const bad = (path: string, message: string) =>
  new HttpError(400, 'invalid_request', `Invalid request: ${path} — ${message}`, [{ path, message }]);

/** Stored settings with today's defaults filled in (rows saved before a setting existed stay valid). */
export function storedSettings(text: string): PlanSettingsParsed {
  const parsed = PlanSettingsSchema.safeParse(JSON.parse(text));
  if (!parsed.success) {
    const i = parsed.error.issues[0];
    throw bad(`settings.${i.path.join('.')}`, i.message);
  }
  const s = parsed.data;
  // The old top-level minimum network PCI maps onto the targets.
  if (s.targets.minNetworkPci === null && s.minNetworkPci !== null)
    return { ...s, targets: { ...s.targets, minNetworkPci: s.minNetworkPci } };
  return s;
}

export function planInput(deps: Pick<Deps, 'db'>, agencyId: string, planId: string): PlanInput {
  const row = deps.db
    .select()
    .from(plans)
    .where(and(eq(plans.agencyId, agencyId), eq(plans.id, planId)))
    .get();
  if (!row) throw notFound('No such plan');
  const settings = storedSettings(row.settings);
  const agency = agencyById(deps, agencyId)!;
  const segRows = deps.db
    .select()
    .from(segments)
    .where(and(eq(segments.agencyId, agencyId), isNotNull(segments.pci)))
    .all();
  const total = deps.db.select({ id: segments.id }).from(segments).where(eq(segments.agencyId, agencyId)).all().length;
  if (total === 0)
    throw new HttpError(409, 'empty_inventory', 'The inventory is empty: import segments before running a plan');
  if (segRows.length === 0)
    throw new HttpError(
      409,
      'no_condition',
      'No segment has a PCI yet: import condition surveys before running a plan',
    );
  if (segRows.length > MAX_PLAN_SEGMENTS)
    throw new HttpError(
      413,
      'plan_too_large',
      `A plan takes at most ${MAX_PLAN_SEGMENTS.toLocaleString('en-US')} segments`,
    );
  const planSegments: PlanSegment[] = segRows.map((r) => ({
    ref: r.id,
    segmentId: r.segmentId,
    roadName: r.roadName,
    fromDesc: r.fromDesc,
    toDesc: r.toDesc,
    lengthMi: r.lengthMi,
    lanes: r.lanes,
    areaSy: areaSy(r.lengthMi, r.widthFt),
    laneMiles: laneMiles(r.lengthMi, r.lanes),
    functionalClass: r.functionalClass,
    surface: r.surface,
    adt: r.adt,
    truckPct: r.truckPct,
    pci: r.pci!,
    pciDate: r.pciDate,
    lastTreatmentYear: r.lastTreatmentYear,
    familyKey: familyKey(r.surface, r.functionalClass, r.lastTreatment),
  }));
  const econ = catalogRepo.economicsOf(deps.db, agencyId);
  const mixes = new Map(catalogRepo.listMixes(deps.db, agencyId).map((m) => [m.id, m]));
  const all = catalogRepo.listTreatments(deps.db, agencyId);
  if (settings.treatmentIds.some((id) => !all.some((t) => t.id === id)))
    throw bad('settings.treatmentIds', 'names treatments not in the catalog');
  const policy = settings.mixPolicy;
  const policyMix = policy ? mixes.get(policy.mixId) : undefined;
  if (policy && !policyMix) throw bad('settings.mixPolicy.mixId', 'names a mix not in the catalog');
  if (policy && policyMix && (policy.thicknessIn < policyMix.minLiftIn || policy.thicknessIn > policyMix.maxLiftIn))
    throw bad(
      'settings.mixPolicy.thicknessIn',
      `must be within ${policyMix.name}'s lift range, ${policyMix.minLiftIn} to ${policyMix.maxLiftIn} in`,
    );
  const chosen = settings.treatmentIds.length ? all.filter((t) => settings.treatmentIds.includes(t.id)) : all;
  // Planning cost per segment: unit rates, traffic control and add-ons; mobilisation belongs to contracts,
  // not segments. A mix policy swaps the mix and lift of the treatments of its kinds (resolveTreatment
  // then gives their price, tons and, where the catalog sets no life, the life of that mix at that lift).
  const treatments: PlanTreatment[] = chosen.map((t) => {
    const swap = policy && policyMix && (policy.kinds as string[]).includes(t.kind);
    const r = resolveTreatment(
      t,
      swap ? policyMix : t.mixId ? (mixes.get(t.mixId) ?? null) : null,
      swap ? { thicknessIn: policy.thicknessIn } : {},
      { ...econ, mobilizationPerJob: 0 },
    );
    return {
      id: t.id,
      name: swap ? r.label : t.name,
      category: t.category,
      kind: t.kind,
      costPerSy: r.rates.perSy * (1 + r.rates.addOnFraction),
      costPerLaneMile: r.rates.perLaneMile * (1 + r.rates.addOnFraction),
      tonsPerSy: r.tonsPerSy,
      mixName: r.mix?.name ?? null,
      thicknessIn: r.thicknessIn,
      lifeYears: r.serviceLifeYears,
      effect: t.effect,
      applicability: t.applicability,
    };
  });
  // Every family a road can be in or move into: its surface or any other, its class group, any treatment group.
  const lookup = curveLookup(families(deps as Deps, agencyId, false));
  const keys = new Set(planSegments.map((s) => s.familyKey));
  for (const cg of new Set(planSegments.map((s) => classGroup(s.functionalClass))))
    for (const surface of SURFACES)
      for (const g of ['reconstruction', 'overlay', 'preservation', 'unknown']) keys.add(`${surface}|${cg}|${g}`);
  const curves = Object.fromEntries([...keys].map((k) => [k, lookup(k)]));
  const targets = settings.targets;
  const input: PlanInput = {
    planName: row.name,
    agencyName: agency.name,
    method: settings.method,
    minNetworkPci: targets.minNetworkPci,
    settings: {
      startYear: settings.startYear,
      budgets: budgetsOf(settings),
      weighting: settings.weighting,
      needsWorkBelow: settings.needsWorkBelow,
      minNetworkPci: targets.minNetworkPci,
      objective: settings.objective,
      targets,
      maxStrategiesPerSegment: settings.maxStrategiesPerSegment,
      allowThinOnWeakBase: settings.allowThinOnWeakBase,
      benefitTailYears: settings.benefitTailYears,
      discountRate: econ.discountRate,
    },
    segments: planSegments,
    treatments,
    curves,
    mixPolicy: policy && policyMix ? { mixName: policyMix.name, thicknessIn: policy.thicknessIn } : null,
  };
  const g = generateStrategies(input.segments, input.treatments, (k) => curves[k], input.settings);
  const options = g.inst.segStart[g.inst.nSegments];
  if (options === 0) throw bad('settings.treatmentIds', 'no treatment applies to any segment in the horizon');
  if (settings.method === 'exact' && options > MAX_EXACT_OPTIONS)
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: settings.method — ${options.toLocaleString('en-US')} candidates is more than the exact method takes here (${MAX_EXACT_OPTIONS.toLocaleString('en-US')}); use the fast method, which reports its gap to a bound`,
      [{ path: 'settings.method', message: 'too many candidates for the exact method; use fast' }],
    );
  return input;
}
