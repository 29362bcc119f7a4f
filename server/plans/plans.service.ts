import { and, desc, eq, isNotNull } from 'drizzle-orm';
import type { PlanInput, PlanResult } from '../../shared/engine/plan/run-plan';
import { type AnyPlanResult, headline, headlineLines } from '../../shared/plan-headline';
import type { PlanSettingsInput } from '../../shared/schemas/plans';
import { agencyById } from '../agencies/agencies.service';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import type { Deps } from '../deps';
import { memberships, plans, planVersions, segments, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import * as runsRepo from '../runs/runs.repo';
import * as runs from '../runs/runs.service';
import { budgetSearchTask, planRunTask, planSnapshotTask } from './plans.tasks';

type PlanRow = typeof plans.$inferSelect;
type VersionRow = typeof planVersions.$inferSelect;

function versionRow(deps: Pick<Deps, 'db'>, row: PlanRow, version?: number): VersionRow | undefined {
  const where =
    version === undefined
      ? row.publishedVersionId
        ? eq(planVersions.id, row.publishedVersionId)
        : undefined
      : and(eq(planVersions.planId, row.id), eq(planVersions.version, version));
  if (!where) return undefined;
  return deps.db
    .select()
    .from(planVersions)
    .where(and(eq(planVersions.agencyId, row.agencyId), where))
    .get();
}

/** The editable copy is a published version: the next change opens a new draft version. */
const isFrozen = (deps: Pick<Deps, 'db'>, row: PlanRow) => !!versionRow(deps, row, row.version);

function view(deps: Pick<Deps, 'db'>, row: PlanRow, role = 'engineer') {
  const pub = versionRow(deps, row);
  const asViewer = role === 'viewer' && !!pub;
  const last = asViewer
    ? (runsRepo.runMeta(deps.db, row.agencyId, pub.runId) ?? null)
    : runs.latest(deps, row.agencyId, 'plan', row.id);
  const lastDone = runs.latestDone(deps, row.agencyId, 'plan', row.id);
  return {
    id: row.id,
    name: asViewer ? pub.name : row.name,
    status: row.status,
    settings: JSON.parse(asViewer ? pub.settings : row.settings) as PlanSettingsInput,
    createdAt: row.createdAt,
    updatedAt: asViewer ? pub.publishedAt : row.updatedAt,
    publishedAt: row.publishedAt,
    lastRun: last
      ? { id: last.id, status: last.status, startedAt: last.startedAt ?? last.createdAt, endedAt: last.endedAt }
      : null,
    version: asViewer ? pub.version : row.version,
    frozen: asViewer || isFrozen(deps, row),
    published: pub ? { id: pub.id, version: pub.version, publishedAt: pub.publishedAt } : null,
    resultCurrent: asViewer ? true : lastDone ? lastDone.createdAt >= row.updatedAt : null,
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
  return {
    items: rows.filter((r) => role !== 'viewer' || r.status === 'published').map((r) => view(deps, r, role)),
  };
}

export function getPlan(deps: Pick<Deps, 'db'>, agencyId: string, planId: string, role: string) {
  return view(deps, planRow(deps, agencyId, planId, role), role);
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

/**
 * Saves the name and settings. When the editable copy is a published (frozen) version, the change
 * opens the next version number as a draft; the published version, its run and its brief stay as
 * they were, and viewers keep seeing them. Saving what is already there changes nothing.
 */
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
    const same = before.name === name && before.settings === JSON.stringify(settings);
    if (same) return;
    // A plan published before versions existed is frozen now, as it stands, with its latest run, so
    // this change cannot reach its viewers (its brief is drawn from that run when asked for).
    if (before.status === 'published' && !before.publishedVersionId) {
      const last = runs.latestDone(deps, agencyId, 'plan', planId);
      if (last) {
        const id = newId();
        tx.insert(planVersions)
          .values({
            id,
            planId,
            agencyId,
            version: before.version,
            name: before.name,
            settings: before.settings,
            runId: last.id,
            brief: null,
            publishedBy: before.createdBy,
            publishedAt: before.publishedAt ?? before.updatedAt,
          })
          .run();
        tx.update(plans).set({ publishedVersionId: id }).where(eq(plans.id, planId)).run();
      }
    }
    const frozen = isFrozen(deps, before);
    const version = frozen ? before.version + 1 : before.version;
    tx.update(plans)
      .set({ name, settings: JSON.stringify(settings), version, updatedAt: new Date().toISOString() })
      .where(eq(plans.id, planId))
      .run();
    if (frozen)
      recordAudit(tx, {
        agencyId,
        userId,
        action: 'plan.version',
        entity: 'plan',
        entityId: planId,
        detail: {
          name,
          note: `Version ${version} opened as a draft; version ${before.version} stays as published`,
        },
      });
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
    tx.delete(planVersions)
      .where(and(eq(planVersions.agencyId, agencyId), eq(planVersions.planId, planId)))
      .run();
    runs.deleteForSubject(tx, agencyId, planId);
    tx.delete(plans).where(eq(plans.id, planId)).run();
    recordAudit(tx, { agencyId, userId, action: 'plan.delete', entity: 'plan', entityId: planId });
  });
}

/** The published versions, newest first, and the editable copy's number. */
export function listVersions(deps: Pick<Deps, 'db'>, agencyId: string, planId: string) {
  const row = planRow(deps, agencyId, planId, 'engineer');
  const rows = deps.db
    .select({
      id: planVersions.id,
      version: planVersions.version,
      name: planVersions.name,
      settings: planVersions.settings,
      runId: planVersions.runId,
      publishedAt: planVersions.publishedAt,
      publishedBy: users.name,
    })
    .from(planVersions)
    .leftJoin(users, eq(users.id, planVersions.publishedBy))
    .where(and(eq(planVersions.agencyId, agencyId), eq(planVersions.planId, planId)))
    .orderBy(desc(planVersions.version))
    .all();
  return {
    editing: { version: row.version, draft: !rows.some((r) => r.version === row.version) },
    items: rows.map((r) => ({
      ...r,
      settings: JSON.parse(r.settings) as PlanSettingsInput,
      current: r.id === row.publishedVersionId,
    })),
  };
}

/**
 * Snapshot and run in a worker (a 4xx of the snapshot answers the request): 202 with the run.
 * With a body, the screen's unsaved name and settings are saved first, so the run reflects them.
 */
export function startRun(
  deps: Deps,
  agencyId: string,
  userId: string,
  planId: string,
  edits?: { name?: string; settings?: PlanSettingsInput },
) {
  const row = planRow(deps, agencyId, planId, 'engineer');
  if (edits && (edits.name !== undefined || edits.settings !== undefined))
    updatePlan(
      deps,
      agencyId,
      userId,
      planId,
      edits.name ?? row.name,
      edits.settings ?? (JSON.parse(row.settings) as PlanSettingsInput),
    );
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

/**
 * The run a reader gets: for a viewer (or `version` given) the run a published version pins;
 * otherwise the latest finished run. Without its result; null when there is none.
 */
export function latestRun(deps: Pick<Deps, 'db'>, agencyId: string, planId: string, role: string, version?: number) {
  const row = planRow(deps, agencyId, planId, role);
  const pinned =
    role === 'viewer' || version !== undefined
      ? versionRow(deps, row, role === 'viewer' ? undefined : version)
      : undefined;
  if (version !== undefined && role !== 'viewer' && !pinned) throw notFound(`No published version ${version}`);
  if (pinned) {
    const m = runsRepo.runMeta(deps.db as Db, agencyId, pinned.runId);
    return m ? { runId: m.id, endedAt: m.endedAt, version: pinned } : null;
  }
  const r = runs.latestDone(deps, agencyId, 'plan', planId);
  return r ? { runId: r.id, endedAt: r.endedAt, version: null } : null;
}

/** `{ latest: { runId, endedAt, result } | null }` as JSON bytes, the stored result copied in unparsed. */
export function latestResultJson(deps: Deps, agencyId: string, planId: string, role: string, version?: number) {
  const latest = latestRun(deps, agencyId, planId, role, version);
  if (!latest) return Buffer.from('{"latest":null}');
  const inner = runs.withResult(
    { runId: latest.runId, endedAt: latest.endedAt, version: latest.version?.version ?? null },
    runs.resultOf(deps, agencyId, latest.runId),
  );
  return Buffer.concat([Buffer.from('{"latest":'), inner, Buffer.from('}')]);
}

/** The result of one finished plan run, parsed: for the brief and the work list, which are built in workers. */
export function runResult(deps: Pick<Deps, 'db'>, agencyId: string, runId: string): PlanResult {
  return JSON.parse(runs.finishedRun(deps, agencyId, runId, 'plan').result.toString('utf8')) as PlanResult;
}

/** The stored input snapshot of one finished plan run (the brief re-runs it at other budgets). */
export function runInputOf(deps: Pick<Deps, 'db'>, agencyId: string, runId: string): PlanInput {
  return JSON.parse(runs.finishedRun(deps, agencyId, runId, 'plan').input.toString('utf8')) as PlanInput;
}

/** The latest finished budget search of the plan, if one ran. */
export function latestBudgetSearch(deps: Pick<Deps, 'db'>, agencyId: string, planId: string) {
  const r = runs.latestDone(deps, agencyId, 'budget-search', planId);
  if (!r) return null;
  const bytes = runs.resultOf(deps, agencyId, r.id);
  return bytes
    ? (JSON.parse(bytes.toString('utf8')) as { targetPci: number; budget: number | null; reachable: boolean })
    : null;
}

/** A published version's stored brief (null when none was stored). */
export function versionBrief(deps: Pick<Deps, 'db'>, agencyId: string, versionId: string) {
  return (
    deps.db
      .select({ brief: planVersions.brief })
      .from(planVersions)
      .where(and(eq(planVersions.agencyId, agencyId), eq(planVersions.id, versionId)))
      .get()?.brief ?? null
  );
}

export type BriefMaker = (p: {
  plan: { name: string; status: string; settings: PlanSettingsInput; version: number };
  runId: string;
}) => Promise<Buffer>;

/**
 * Publish the editable copy (freezing its name, settings, latest run and brief as a version), put
 * an earlier published version back (`version`), or withdraw (`publishIt` false). Viewers see the
 * published version only; e-mails carry the headline numbers and the link.
 */
export async function publish(
  deps: Deps,
  agencyId: string,
  userId: string,
  planId: string,
  publishIt: boolean,
  notify: boolean,
  makeBrief: BriefMaker,
  version?: number,
) {
  const row = planRow(deps, agencyId, planId, 'engineer');
  let target: VersionRow | undefined;
  if (!publishIt) {
    deps.db.transaction((tx) => {
      tx.update(plans)
        .set({ status: 'draft', publishedAt: null, publishedVersionId: null })
        .where(eq(plans.id, planId))
        .run();
      const was = versionRow(deps, row);
      recordAudit(tx, {
        agencyId,
        userId,
        action: 'plan.unpublish',
        entity: 'plan',
        entityId: planId,
        detail: {
          name: row.name,
          note: was ? `Version ${was.version} withdrawn; viewers no longer see the plan` : undefined,
        },
      });
    });
    return { ...getPlan(deps, agencyId, planId, 'engineer'), notified: 0 };
  }
  if (version !== undefined) {
    target = versionRow(deps, row, version);
    if (!target) throw notFound(`No published version ${version}`);
  } else {
    target = versionRow(deps, row, row.version);
    if (!target) {
      const last = runs.latestDone(deps, agencyId, 'plan', planId);
      if (!last) throw new HttpError(409, 'not_run', 'Run the plan before publishing it');
      if (last.createdAt < row.updatedAt)
        throw new HttpError(409, 'not_run', 'The plan changed after its last run: run it again before publishing it');
      const settings = JSON.parse(row.settings) as PlanSettingsInput;
      const brief = await makeBrief({
        plan: { name: row.name, status: 'published', settings, version: row.version },
        runId: last.id,
      });
      const id = newId();
      const now = new Date().toISOString();
      deps.db
        .insert(planVersions)
        .values({
          id,
          planId,
          agencyId,
          version: row.version,
          name: row.name,
          settings: row.settings,
          runId: last.id,
          brief,
          publishedBy: userId,
          publishedAt: now,
        })
        .run();
      target = versionRow(deps, row, row.version)!;
    }
  }
  const before = versionRow(deps, row);
  const t = target;
  deps.db.transaction((tx) => {
    tx.update(plans)
      .set({ status: 'published', publishedAt: t.publishedAt, publishedVersionId: t.id })
      .where(eq(plans.id, planId))
      .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'plan.publish',
      entity: 'plan',
      entityId: planId,
      detail: {
        name: t.name,
        note:
          before && before.id !== t.id
            ? `Version ${t.version} published in place of version ${before.version}`
            : `Version ${t.version} published`,
      },
    });
  });
  let notified = 0;
  if (notify) {
    const agency = agencyById(deps, agencyId)!;
    const viewers = deps.db
      .select({ email: users.email, name: users.name })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.agencyId, agencyId), eq(memberships.role, 'viewer')))
      .all();
    const link = `${deps.config.appUrl}/a/${agencyId}/plans/${planId}`;
    const lines = headlineLines(headline(runResult(deps, agencyId, t.runId) as AnyPlanResult));
    for (const v of viewers) {
      await deps.mailer.send({
        to: v.email,
        agencyId,
        subject: `${agency.name}: paving plan "${t.name}" is published`,
        text: `${v.name},\n\nThe paving plan "${t.name}" (version ${t.version}) for ${agency.name} is published in Wearcourse.\n\n${lines.join('\n')}\n\nRead it, with its council brief, here:\n${link}\n\nThe plan is a planning estimate; local codes, agency specifications and licensed engineering judgement govern the work itself.`,
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

/** Each segment's road name, from–to limits and class, by row id (for work items stored before they carried them). */
export function segmentLimits(deps: Pick<Deps, 'db'>, agencyId: string) {
  const rows = deps.db
    .select({
      ref: segments.id,
      fromDesc: segments.fromDesc,
      toDesc: segments.toDesc,
      functionalClass: segments.functionalClass,
      roadName: segments.roadName,
    })
    .from(segments)
    .where(eq(segments.agencyId, agencyId))
    .all();
  return new Map(rows.map((r) => [r.ref, r]));
}

export const agencyName = (deps: Pick<Deps, 'db'>, agencyId: string) => agencyById(deps, agencyId)!.name;
