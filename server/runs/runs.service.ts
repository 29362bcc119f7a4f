// Runs: heavy work that outlives its request (plan runs, budget searches,
// comparisons). A module starts one with two task files of its own — one that
// builds the input snapshot, one that turns the snapshot's text into a result
// text — and both run in the worker pool, in one slot, where the run's row and
// its bytes are written (run-start.task.ts, run-work.task.ts). Results survive a
// restart; polling and cancelling are the same for every kind (runs.routes.ts).
import { randomUUID } from 'node:crypto';
import type { RunError, RunKind, RunView } from '../../shared/schemas/runs';
import type { AuditEntry } from '../audit';
import type { Db } from '../db/client';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import { PoolClosedError, TaskFailedError, type TaskOwner } from '../pool/pool';
import type { TaskRef } from '../pool/task';
import * as repo from './runs.repo';
import { runStartTask, runWorkTask } from './runs.tasks';

export const INTERRUPTED: RunError = { message: 'interrupted by a server restart — run it again' };

/** What a module's snapshot task returns: the whole input as JSON text, and the audit entry to write with it. */
export type Snapshot = { input: string; audit?: AuditEntry };

export type RunSpec<P> = {
  kind: RunKind;
  subjectId: string | null;
  /** Builds the input in a worker from payload + runId; a 4xx it throws answers the request. */
  snapshot: TaskRef<P & { runId: string }, Snapshot>;
  payload: P;
  /** input text → result text, in a worker. */
  work: TaskRef<string, string>;
  /** Called on the request thread once the run is done (small follow-ups, e.g. a saved comparison's result). */
  onDone?: (runId: string) => void;
};

function toView(deps: Deps, m: repo.RunMeta): RunView {
  const slot = m.status === 'running' ? deps.pool.find(m.id) : null;
  return {
    id: m.id,
    kind: m.kind,
    subjectId: m.subjectId,
    status: m.status,
    progress: slot ? slot.progress : m.progress,
    error: m.error,
    createdAt: m.createdAt,
    startedAt: m.startedAt,
    endedAt: m.endedAt,
    result: null,
  };
}

function errorOf(err: unknown): RunError {
  if (err instanceof HttpError) return { message: err.message, path: err.issues?.[0]?.path };
  if (err instanceof TaskFailedError)
    return err.path ? { message: err.message, path: err.path } : { message: err.message };
  return { message: (err as Error).message ?? String(err) };
}

/**
 * Takes a pool slot (429 when over a cap), builds the snapshot and writes the run (awaited: its 4xx
 * answers the request), then runs the work in the same slot and answers at once with the run.
 */
export async function startRun<P>(deps: Deps, owner: TaskOwner & { agencyId: string }, spec: RunSpec<P>) {
  const runId = randomUUID();
  const slot = deps.pool.reserve(owner, runId);
  try {
    await slot.run(runStartTask, {
      runId,
      agencyId: owner.agencyId,
      userId: owner.userId,
      kind: spec.kind,
      subjectId: spec.subjectId,
      snapshot: { href: spec.snapshot.href, payload: { ...spec.payload, runId } },
    });
  } catch (err) {
    slot.release();
    throw err;
  }
  slot
    .run(runWorkTask, { runId, agencyId: owner.agencyId, work: spec.work.href })
    .then(
      ({ written }) => {
        if (written) spec.onDone?.(runId);
      },
      (err) => {
        // Stopping: the database closes next; the next start marks the run interrupted.
        if (err instanceof PoolClosedError) return;
        repo.finishRun(
          deps.db,
          runId,
          slot.cancelled ? { status: 'cancelled' } : { status: 'failed', error: errorOf(err) },
        );
      },
    )
    .catch((err) => console.error(`run ${runId}: could not record its end`, err))
    .finally(() => slot.release());
  return toView(deps, repo.runMeta(deps.db, owner.agencyId, runId)!);
}

function metaOr404(deps: Pick<Deps, 'db'>, agencyId: string, runId: string) {
  const m = repo.runMeta(deps.db, agencyId, runId);
  if (!m) throw notFound('No such run');
  return m;
}

/** JSON bytes with the stored result bytes spliced in: the request thread copies them, never parses them. */
export function withResult(head: object, result: Buffer | null): Buffer {
  const text = JSON.stringify({ ...head, result: null });
  return Buffer.concat([Buffer.from(text.slice(0, -'null}'.length)), result ?? Buffer.from('null'), Buffer.from('}')]);
}

/** The poll answer as JSON bytes. */
export function runJson(deps: Deps, agencyId: string, runId: string): Buffer {
  const v = toView(deps, metaOr404(deps, agencyId, runId));
  return withResult(v, v.status === 'done' ? repo.runResult(deps.db, agencyId, runId) : null);
}

export function cancelRun(deps: Deps, agencyId: string, runId: string): RunView {
  const m = metaOr404(deps, agencyId, runId);
  if (m.status === 'running') {
    repo.finishRun(deps.db, runId, { status: 'cancelled' });
    deps.pool.find(runId)?.cancel();
  }
  return toView(deps, metaOr404(deps, agencyId, runId));
}

/** The input and result bytes of a finished run of this kind (409 while it is not done). */
export function finishedRun(deps: Pick<Deps, 'db'>, agencyId: string, runId: string, kind: RunKind) {
  const m = metaOr404(deps, agencyId, runId);
  if (m.kind !== kind) throw notFound('No such run');
  if (m.status !== 'done')
    throw new HttpError(409, 'not_finished', 'Only a finished run can be used here; wait for it to finish');
  return { input: repo.runInput(deps.db, agencyId, runId)!, result: repo.runResult(deps.db, agencyId, runId)! };
}

export function latest(deps: Pick<Deps, 'db'>, agencyId: string, kind: RunKind, subjectId: string) {
  return repo.latestOf(deps.db, agencyId, kind, subjectId) ?? null;
}

/** The latest finished run of a subject, without its result. */
export function latestDone(deps: Pick<Deps, 'db'>, agencyId: string, kind: RunKind, subjectId: string) {
  return repo.latestOf(deps.db, agencyId, kind, subjectId, 'done') ?? null;
}

export function resultOf(deps: Pick<Deps, 'db'>, agencyId: string, runId: string) {
  return repo.runResult(deps.db, agencyId, runId);
}

export function deleteForSubject(tx: Pick<Db, 'delete'>, agencyId: string, subjectId: string) {
  repo.deleteForSubject(tx, agencyId, subjectId);
}

/** At start: older plan runs are adopted, and runs a stop cut off are marked failed with a message saying so. */
export function recoverRuns(deps: Pick<Deps, 'db'>) {
  const adopted = repo.copyLegacyPlanRuns(deps.db);
  const interrupted = repo.failRunning(deps.db, INTERRUPTED);
  return { adopted, interrupted };
}
