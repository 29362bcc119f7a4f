import { evaluateAlternative } from '../../shared/engine/lcca/evaluate';
import { evaluateScheduleForGroup } from '../../shared/engine/lcca/network';
import { runComparison, ComparisonInputError } from '../../shared/engine/lcca/comparison';
import { areaSy, laneMiles } from '../../shared/engine/quantities';
import type { EvaluateBody, Group, ComparisonInput, ComparisonRequest } from '../../shared/schemas/comparisons';
import type { FunctionalClass } from '../../shared/schemas/segments';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import * as catalog from '../catalog/catalog.service';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import * as runs from '../runs/runs.service';
import { segmentsByRefs } from '../segments/segments.service';
import * as repo from './comparisons.repo';
import { comparisonSnapshotTask, comparisonTask } from './comparisons.tasks';

export const MAX_MC_ITERATIONS = 20_000;

/** The stateless evaluation for scripts: minimal activities, or plans priced per unit. */
export function evaluate(body: EvaluateBody) {
  return {
    discountRate: body.discountRate,
    analysisPeriodYears: body.analysisPeriodYears,
    alternatives: body.alternatives.map((a) => {
      const r = a.activities?.length
        ? evaluateAlternative(a.activities, body.discountRate, body.analysisPeriodYears)
        : evaluateScheduleForGroup(a.plan!, body.quantities!, body.discountRate, body.analysisPeriodYears).result;
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
  const rows = segmentsByRefs(deps, agencyId, ids);
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
export function comparisonInput(deps: Pick<Deps, 'db'>, agencyId: string, req: ComparisonRequest): ComparisonInput {
  const econ = { ...catalog.economicsOf(deps, agencyId), ...(req.economics ?? {}) };
  const input: ComparisonInput = {
    economics: econ,
    group: resolveGroup(deps, agencyId, req.group),
    alternatives: req.alternatives,
    baselineIndex: req.baselineIndex,
    risk: req.risk,
    catalog: {
      mixes: catalog.listMixes(deps, agencyId),
      treatments: catalog.listTreatments(deps, agencyId),
    },
  };
  if (input.risk.iterations > MAX_MC_ITERATIONS)
    throw new HttpError(400, 'invalid_request', `Invalid request: risk.iterations — at most ${MAX_MC_ITERATIONS}`);
  checkComparison(input);
  return input;
}

/** Runs the deterministic part at once so that bad input answers 400 before any worker starts. */
function checkComparison(input: ComparisonInput) {
  try {
    runComparison({ ...input, risk: { ...input.risk, iterations: 100 } }, { monteCarlo: false });
  } catch (err) {
    if (err instanceof ComparisonInputError)
      throw new HttpError(400, 'invalid_request', `Invalid request: ${err.path} — ${err.message}`, [
        { path: err.path, message: err.message },
      ]);
    throw err;
  }
}

/** Snapshot (catalog, economics, the group's quantities) and the cheap check in a worker, then the run: 202. */
export function startComparison(deps: Deps, agencyId: string, userId: string, request: ComparisonRequest) {
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
  const input = repo.savedInput(deps.db, agencyId, analysisId);
  if (input === null) throw notFound('No such analysis');
  return input;
}

/** A saved comparison run again from its own snapshot; the saved result is replaced when it finishes. */
export function rerunComparison(deps: Deps, agencyId: string, userId: string, analysisId: string) {
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
        repo.setResult(deps.db, agencyId, analysisId, runs.resultOf(deps, agencyId, runId)!.toString('utf8'));
      },
    },
  );
}

/** Saves a finished comparison run with exactly the input snapshot it ran on. */
export function saveComparison(deps: Deps, agencyId: string, userId: string, name: string, runId: string) {
  const run = runs.finishedRun(deps, agencyId, runId, 'comparison');
  const id = newId();
  deps.db.transaction((tx) => {
    repo.insertComparison(tx, {
      id,
      agencyId,
      name,
      createdBy: userId,
      input: run.input.toString('utf8'),
      result: run.result.toString('utf8'),
    });
    recordAudit(tx, { agencyId, userId, action: 'analysis.save', entity: 'analysis', entityId: id, detail: { name } });
  });
  return { id };
}

export function listComparisons(deps: Deps, agencyId: string) {
  return {
    items: repo.listRows(deps.db, agencyId).map(({ input, ...a }) => {
      const i = JSON.parse(input) as ComparisonInput;
      return { ...a, alternatives: i.alternatives.length, group: i.group.label, laneMiles: i.group.laneMiles };
    }),
  };
}

export function getComparison(deps: Deps, agencyId: string, id: string) {
  const row = repo.comparisonRow(deps.db, agencyId, id);
  if (!row) throw notFound('No such analysis');
  return {
    id: row.id,
    name: row.name,
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
    input: JSON.parse(row.input) as ComparisonInput,
    result: row.result ? JSON.parse(row.result) : null,
  };
}

export function deleteComparison(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    if (!repo.deleteRow(tx, agencyId, id)) throw notFound('No such analysis');
    runs.deleteForSubject(tx, agencyId, id);
    recordAudit(tx, { agencyId, userId, action: 'analysis.delete', entity: 'analysis', entityId: id });
  });
  return { ok: true as const };
}
