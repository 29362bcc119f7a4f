import { and, desc, eq, inArray } from 'drizzle-orm';
import { evaluateAlternative } from '../../shared/engine/lcca/evaluate';
import { evaluatePlanForGroup } from '../../shared/engine/lcca/network';
import { runStudy, StudyInputError } from '../../shared/engine/lcca/study';
import { areaSy, laneMiles } from '../../shared/engine/quantities';
import type { EvaluateBody, Group, StudyInput, StudyRequest } from '../../shared/schemas/lcca';
import type { FunctionalClass } from '../../shared/schemas/segments';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import * as catalogRepo from '../catalog/catalog.repo';
import type { Deps } from '../deps';
import { analyses, segments, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import * as runs from '../runs/runs.service';
import { comparisonSnapshotTask, comparisonTask } from './lcca.tasks';

export const MAX_MC_ITERATIONS = 20_000;

/** The stateless evaluation for scripts: minimal activities, or plans priced per unit. */
export function evaluate(body: EvaluateBody) {
  return {
    discountRate: body.discountRate,
    analysisPeriodYears: body.analysisPeriodYears,
    alternatives: body.alternatives.map((a) => {
      const r = a.activities?.length
        ? evaluateAlternative(a.activities, body.discountRate, body.analysisPeriodYears)
        : evaluatePlanForGroup(a.plan!, body.quantities!, body.discountRate, body.analysisPeriodYears).result;
      return {
        name: a.name,
        presentValue: r.presentValue,
        presentValueOfCosts: r.presentValueOfCosts,
        euac: r.euac,
        remainingServiceLifeValue: r.remainingServiceLifeValue,
        presentValueOfRemainingLife: r.presentValueOfRemainingLife,
        cashFlows: r.cashFlows,
      };
    }),
  };
}

/** Recomputes the group from the agency's own segments; a typed-in section stands as given. */
function resolveGroup(deps: Pick<Deps, 'db'>, agencyId: string, g: Group): Group {
  if (g.segmentIds.length === 0) return g;
  const ids = [...new Set(g.segmentIds)];
  const rows = [] as (typeof segments.$inferSelect)[];
  for (let i = 0; i < ids.length; i += 900) {
    rows.push(
      ...deps.db
        .select()
        .from(segments)
        .where(and(eq(segments.agencyId, agencyId), inArray(segments.id, ids.slice(i, i + 900))))
        .all(),
    );
  }
  if (rows.length !== ids.length) {
    const found = new Set(rows.map((r) => r.id));
    const missing = ids.filter((id) => !found.has(id)).slice(0, 5);
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: group.segmentIds — no segment ${missing.join(', ')} in this agency`,
      [{ path: 'group.segmentIds', message: `no segment ${missing.join(', ')} in this agency` }],
    );
  }
  return {
    label: g.label,
    segmentIds: ids,
    areaSy: rows.reduce((s, r) => s + areaSy(r.lengthMi, r.widthFt), 0),
    laneMiles: rows.reduce((s, r) => s + laneMiles(r.lengthMi, r.lanes), 0),
    centrelineMiles: rows.reduce((s, r) => s + r.lengthMi, 0),
    segments: rows.map((r) => ({
      segmentId: r.segmentId,
      adt: r.adt,
      truckPct: r.truckPct,
      functionalClass: r.functionalClass as FunctionalClass,
      pci: r.pci,
      lengthMi: r.lengthMi,
      name: r.fromDesc && r.toDesc ? `${r.roadName}, ${r.fromDesc} to ${r.toDesc}` : r.roadName,
    })),
  };
}

/** Builds the full, self-contained study input: the catalog items and economics as they are now. */
export function studyInput(deps: Pick<Deps, 'db'>, agencyId: string, req: StudyRequest): StudyInput {
  const econ = { ...catalogRepo.economicsOf(deps.db, agencyId), ...(req.economics ?? {}) };
  const input: StudyInput = {
    economics: econ,
    group: resolveGroup(deps, agencyId, req.group),
    alternatives: req.alternatives,
    baselineIndex: req.baselineIndex,
    risk: req.risk,
    catalog: {
      mixes: catalogRepo.listMixes(deps.db, agencyId),
      treatments: catalogRepo.listTreatments(deps.db, agencyId),
    },
  };
  if (input.risk.iterations > MAX_MC_ITERATIONS)
    throw new HttpError(400, 'invalid_request', `Invalid request: risk.iterations — at most ${MAX_MC_ITERATIONS}`);
  checkStudy(input);
  return input;
}

/** Runs the deterministic part at once so that bad input answers 400 before any worker starts. */
function checkStudy(input: StudyInput) {
  try {
    runStudy({ ...input, risk: { ...input.risk, iterations: 100 } }, { monteCarlo: false });
  } catch (err) {
    if (err instanceof StudyInputError)
      throw new HttpError(400, 'invalid_request', `Invalid request: ${err.path} — ${err.message}`, [
        { path: err.path, message: err.message },
      ]);
    throw err;
  }
}

/** Snapshot (catalog, economics, the group's quantities) and the cheap check in a worker, then the run: 202. */
export function startComparison(deps: Deps, agencyId: string, userId: string, request: StudyRequest) {
  return runs.startRun(
    deps,
    { agencyId, userId },
    {
      kind: 'comparison',
      subjectId: null,
      snapshot: comparisonSnapshotTask,
      payload: { agencyId, request },
      work: comparisonTask,
    },
  );
}

/** A saved comparison's stored input snapshot, as text. */
export function savedInput(deps: Pick<Deps, 'db'>, agencyId: string, analysisId: string) {
  const row = deps.db
    .select({ input: analyses.input })
    .from(analyses)
    .where(and(eq(analyses.agencyId, agencyId), eq(analyses.id, analysisId)))
    .get();
  if (!row) throw notFound('No such analysis');
  return row.input;
}

/** A saved comparison run again from its own snapshot; the saved result is replaced when it finishes. */
export function rerunAnalysis(deps: Deps, agencyId: string, userId: string, analysisId: string) {
  savedInput(deps, agencyId, analysisId);
  return runs.startRun(
    deps,
    { agencyId, userId },
    {
      kind: 'comparison',
      subjectId: analysisId,
      snapshot: comparisonSnapshotTask,
      payload: { agencyId, analysisId },
      work: comparisonTask,
      onDone: (runId) => {
        const result = runs.resultOf(deps, agencyId, runId)!.toString('utf8');
        deps.db
          .update(analyses)
          .set({ result, updatedAt: new Date().toISOString() })
          .where(and(eq(analyses.agencyId, agencyId), eq(analyses.id, analysisId)))
          .run();
      },
    },
  );
}

/** Saves a finished comparison run with exactly the input snapshot it ran on. */
export function saveAnalysis(deps: Deps, agencyId: string, userId: string, name: string, runId: string) {
  const run = runs.finishedRun(deps, agencyId, runId, 'comparison');
  const id = newId();
  deps.db.transaction((tx) => {
    tx.insert(analyses)
      .values({
        id,
        agencyId,
        name,
        createdBy: userId,
        input: run.input.toString('utf8'),
        result: run.result.toString('utf8'),
      })
      .run();
    recordAudit(tx, { agencyId, userId, action: 'analysis.save', entity: 'analysis', entityId: id, detail: { name } });
  });
  return { id };
}

export function listAnalyses(deps: Deps, agencyId: string) {
  return {
    items: deps.db
      .select({
        id: analyses.id,
        name: analyses.name,
        createdAt: analyses.createdAt,
        updatedAt: analyses.updatedAt,
        createdBy: users.name,
        input: analyses.input,
      })
      .from(analyses)
      .leftJoin(users, eq(users.id, analyses.createdBy))
      .where(eq(analyses.agencyId, agencyId))
      .orderBy(desc(analyses.updatedAt))
      .all()
      .map(({ input, ...a }) => {
        const i = JSON.parse(input) as StudyInput;
        return { ...a, alternatives: i.alternatives.length, group: i.group.label, laneMiles: i.group.laneMiles };
      }),
  };
}

export function getAnalysis(deps: Deps, agencyId: string, id: string) {
  const row = deps.db
    .select()
    .from(analyses)
    .where(and(eq(analyses.agencyId, agencyId), eq(analyses.id, id)))
    .get();
  if (!row) throw notFound('No such analysis');
  return {
    id: row.id,
    name: row.name,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    input: JSON.parse(row.input) as StudyInput,
    result: row.result ? JSON.parse(row.result) : null,
  };
}

export function deleteAnalysis(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    const res = tx
      .delete(analyses)
      .where(and(eq(analyses.agencyId, agencyId), eq(analyses.id, id)))
      .run();
    if (res.changes !== 1) throw notFound('No such analysis');
    runs.deleteForSubject(tx, agencyId, id);
    recordAudit(tx, { agencyId, userId, action: 'analysis.delete', entity: 'analysis', entityId: id });
  });
  return { ok: true as const };
}
