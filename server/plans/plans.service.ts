import { and, desc, eq, isNotNull } from 'drizzle-orm';
import { resolveTreatment } from '../../shared/engine/lcca/costing';
import { familyKey } from '../../shared/engine/forecast/families';
import type { PlanSegment, PlanTreatment } from '../../shared/engine/plan/network-plan';
import { candidates, MAX_EXACT_OPTIONS, type PlanInput, type PlanResult } from '../../shared/engine/plan/run-plan';
import { areaSy, laneMiles } from '../../shared/engine/quantities';
import { budgetsOf, type PlanSettingsInput } from '../../shared/schemas/plans';
import { agencyById } from '../agencies/agencies.repo';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import * as catalogRepo from '../catalog/catalog.repo';
import type { Deps } from '../deps';
import { memberships, plans, segments, users } from '../db/schema';
import { curveLookup, families } from '../forecast/forecast.service';
import { HttpError, notFound } from '../http/errors';
import * as runs from '../runs/runs.service';
import { budgetSearchTask, planRunTask, planSnapshotTask } from './plans.tasks';

export const MAX_PLAN_SEGMENTS = 60_000;

type PlanRow = typeof plans.$inferSelect;

function view(deps: Pick<Deps, 'db'>, row: PlanRow) {
  const last = runs.latest(deps, row.agencyId, 'plan', row.id);
  return {
    id: row.id,
    name: row.name,
    status: row.status,
    settings: JSON.parse(row.settings) as PlanSettingsInput,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    publishedAt: row.publishedAt,
    lastRun: last
      ? { id: last.id, status: last.status, startedAt: last.startedAt ?? last.createdAt, endedAt: last.endedAt }
      : null,
  };
}

/** Viewers see published plans only; anything else answers as if it did not exist. */
function planRow(deps: Pick<Deps, 'db'>, agencyId: string, planId: string, role: string) {
  const row = deps.db
    .select()
    .from(plans)
    .where(and(eq(plans.agencyId, agencyId), eq(plans.id, planId)))
    .get();
  if (!row || (role === 'viewer' && row.status !== 'published')) throw notFound('No such plan');
  return row;
}

export function listPlans(deps: Deps, agencyId: string, role: string) {
  const rows = deps.db.select().from(plans).where(eq(plans.agencyId, agencyId)).orderBy(desc(plans.updatedAt)).all();
  return { items: rows.filter((r) => role !== 'viewer' || r.status === 'published').map((r) => view(deps, r)) };
}

export function getPlan(deps: Pick<Deps, 'db'>, agencyId: string, planId: string, role: string) {
  return view(deps, planRow(deps, agencyId, planId, role));
}

export function createPlan(deps: Deps, agencyId: string, userId: string, name: string, settings: PlanSettingsInput) {
  const id = newId();
  deps.db.transaction((tx) => {
    tx.insert(plans)
      .values({ id, agencyId, name, settings: JSON.stringify(settings), createdBy: userId })
      .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'plan.create',
      entity: 'plan',
      entityId: id,
      detail: { name, settings },
    });
  });
  return getPlan(deps, agencyId, id, 'engineer');
}

export function updatePlan(
  deps: Deps,
  agencyId: string,
  userId: string,
  planId: string,
  name: string,
  settings: PlanSettingsInput,
) {
  deps.db.transaction((tx) => {
    const before = planRow(deps, agencyId, planId, 'engineer');
    tx.update(plans)
      .set({ name, settings: JSON.stringify(settings), updatedAt: new Date().toISOString() })
      .where(eq(plans.id, planId))
      .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'plan.update',
      entity: 'plan',
      entityId: planId,
      detail: { before: { name: before.name, settings: JSON.parse(before.settings) }, after: { name, settings } },
    });
  });
  return getPlan(deps, agencyId, planId, 'engineer');
}

export function deletePlan(deps: Deps, agencyId: string, userId: string, planId: string) {
  deps.db.transaction((tx) => {
    planRow(deps, agencyId, planId, 'engineer');
    runs.deleteForSubject(tx, agencyId, planId);
    tx.delete(plans).where(eq(plans.id, planId)).run();
    recordAudit(tx, { agencyId, userId, action: 'plan.delete', entity: 'plan', entityId: planId });
  });
}

/** The whole input of a run, frozen: inventory, curves, planning costs and settings. */
export function planInput(deps: Deps, agencyId: string, planId: string): PlanInput {
  const row = planRow(deps, agencyId, planId, 'engineer');
  const settings = JSON.parse(row.settings) as PlanSettingsInput;
  const agency = agencyById(deps.db, agencyId)!;
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
    lengthMi: r.lengthMi,
    lanes: r.lanes,
    areaSy: areaSy(r.lengthMi, r.widthFt),
    laneMiles: laneMiles(r.lengthMi, r.lanes),
    functionalClass: r.functionalClass,
    surface: r.surface,
    adt: r.adt,
    pci: r.pci!,
    lastTreatmentYear: r.lastTreatmentYear,
    familyKey: familyKey(r.surface, r.functionalClass, r.lastTreatment),
  }));
  const econ = catalogRepo.economicsOf(deps.db, agencyId);
  const mixes = new Map(catalogRepo.listMixes(deps.db, agencyId).map((m) => [m.id, m]));
  const all = catalogRepo.listTreatments(deps.db, agencyId);
  const unknown = settings.treatmentIds.filter((id) => !all.some((t) => t.id === id));
  if (unknown.length)
    throw new HttpError(
      400,
      'invalid_request',
      'Invalid request: settings.treatmentIds — names treatments not in the catalog',
      [{ path: 'settings.treatmentIds', message: 'names treatments not in the catalog' }],
    );
  const chosen = settings.treatmentIds.length ? all.filter((t) => settings.treatmentIds.includes(t.id)) : all;
  // Planning cost per segment: unit rates, traffic control and add-ons; mobilisation belongs to contracts, not segments.
  const treatments: PlanTreatment[] = chosen.map((t) => {
    const r = resolveTreatment(
      t,
      t.mixId ? (mixes.get(t.mixId) ?? null) : null,
      {},
      { ...econ, mobilizationPerJob: 0 },
    );
    return {
      id: t.id,
      name: t.name,
      category: t.category,
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
  const fams = families(deps, agencyId, false);
  const lookup = curveLookup(fams);
  const curves = Object.fromEntries([...new Set(planSegments.map((s) => s.familyKey))].map((k) => [k, lookup(k)]));
  const input: PlanInput = {
    planName: row.name,
    agencyName: agency.name,
    method: settings.method,
    minNetworkPci: settings.minNetworkPci,
    settings: {
      startYear: settings.startYear,
      budgets: budgetsOf(settings),
      weighting: settings.weighting,
      needsWorkBelow: settings.needsWorkBelow,
      minNetworkPci: settings.minNetworkPci,
    },
    segments: planSegments,
    treatments,
    curves,
  };
  const cand = candidates(input);
  const options = cand.instance.segments.reduce((s, x) => s + x.options.length, 0);
  if (options === 0)
    throw new HttpError(
      400,
      'invalid_request',
      'Invalid request: settings.treatmentIds — no treatment applies to any segment in the horizon',
      [{ path: 'settings.treatmentIds', message: 'no treatment applies to any segment in the horizon' }],
    );
  if (settings.method === 'exact' && options > MAX_EXACT_OPTIONS) {
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: settings.method — ${options.toLocaleString('en-US')} candidates is more than the exact method takes here (${MAX_EXACT_OPTIONS.toLocaleString('en-US')}); use the fast method, which reports its gap to a bound`,
      [{ path: 'settings.method', message: 'too many candidates for the exact method; use fast' }],
    );
  }
  return input;
}

/** Snapshot and run in a worker (a 4xx of the snapshot answers the request): 202 with the run. */
export function startRun(deps: Deps, agencyId: string, userId: string, planId: string) {
  planRow(deps, agencyId, planId, 'engineer');
  return runs.startRun(
    deps,
    { agencyId, userId },
    {
      kind: 'plan',
      subjectId: planId,
      snapshot: planSnapshotTask,
      payload: { agencyId, planId, userId },
      work: planRunTask,
    },
  );
}

/** The latest finished run of the plan, without its result (null when it never finished). */
export function latestRun(deps: Pick<Deps, 'db'>, agencyId: string, planId: string, role: string) {
  planRow(deps, agencyId, planId, role);
  const r = runs.latestDone(deps, agencyId, 'plan', planId);
  return r ? { runId: r.id, endedAt: r.endedAt } : null;
}

/** `{ latest: { runId, endedAt, result } | null }` as JSON bytes, the stored result copied in unparsed. */
export function latestResultJson(deps: Deps, agencyId: string, planId: string, role: string) {
  const latest = latestRun(deps, agencyId, planId, role);
  if (!latest) return Buffer.from('{"latest":null}');
  const inner = runs.withResult(latest, runs.resultOf(deps, agencyId, latest.runId));
  return Buffer.concat([Buffer.from('{"latest":'), inner, Buffer.from('}')]);
}

/** The result of one finished plan run, parsed: for the brief and the work list, which are built in workers. */
export function runResult(deps: Pick<Deps, 'db'>, agencyId: string, runId: string): PlanResult {
  return JSON.parse(runs.finishedRun(deps, agencyId, runId, 'plan').result.toString('utf8')) as PlanResult;
}

export async function publish(
  deps: Deps,
  agencyId: string,
  userId: string,
  planId: string,
  publishIt: boolean,
  notify: boolean,
) {
  const row = planRow(deps, agencyId, planId, 'engineer');
  if (publishIt && !latestRun(deps, agencyId, planId, 'engineer'))
    throw new HttpError(409, 'not_run', 'Run the plan before publishing it');
  deps.db.transaction((tx) => {
    tx.update(plans)
      .set({ status: publishIt ? 'published' : 'draft', publishedAt: publishIt ? new Date().toISOString() : null })
      .where(eq(plans.id, planId))
      .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: publishIt ? 'plan.publish' : 'plan.unpublish',
      entity: 'plan',
      entityId: planId,
      detail: { name: row.name },
    });
  });
  let notified = 0;
  if (publishIt && notify) {
    const agency = agencyById(deps.db, agencyId)!;
    const viewers = deps.db
      .select({ email: users.email, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.agencyId, agencyId), eq(memberships.role, 'viewer')))
      .all();
    const link = `${deps.config.appUrl}/a/${agencyId}/plans/${planId}`;
    for (const v of viewers) {
      await deps.mailer.send({
        to: v.email,
        agencyId,
        subject: `${agency.name}: paving plan "${row.name}" is published`,
        text: `${v.name},\n\nThe paving plan "${row.name}" for ${agency.name} is published in Wearcourse. Read it, with its council brief, here:\n${link}\n\nThe plan is a planning estimate; agency specifications and licensed engineering judgement govern the work itself.`,
      });
      notified++;
    }
  }
  return { ...getPlan(deps, agencyId, planId, 'engineer'), notified };
}

/** The flat budget that holds a target PCI: a run of its own, on the plan's snapshot. */
export function startBudgetSearch(deps: Deps, agencyId: string, userId: string, planId: string, targetPci: number) {
  planRow(deps, agencyId, planId, 'engineer');
  return runs.startRun(
    deps,
    { agencyId, userId },
    {
      kind: 'budget-search',
      subjectId: planId,
      snapshot: planSnapshotTask,
      payload: { agencyId, planId, userId, targetPci },
      work: budgetSearchTask,
    },
  );
}

export function segmentGeometries(deps: Pick<Deps, 'db'>, agencyId: string) {
  const rows = deps.db
    .select({ ref: segments.id, geometry: segments.geometry })
    .from(segments)
    .where(and(eq(segments.agencyId, agencyId), isNotNull(segments.geometry)))
    .all();
  return new Map(
    rows.map((r) => [r.ref, JSON.parse(r.geometry!) as { type: string; coordinates: number[][] | number[][][] }]),
  );
}

export const agencyName = (deps: Pick<Deps, 'db'>, agencyId: string) => agencyById(deps.db, agencyId)!.name;
