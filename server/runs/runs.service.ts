// Runs: heavy work that outlives its request (plan runs, budget searches,
// comparisons). A module starts one with the snapshot of its input; the run's
// task turns that text into a result text in a worker; both are kept in the
// runs table, so results survive a restart. Polling and cancelling are the same
// for every kind (runs.routes.ts).
import { randomUUID } from 'node:crypto';
import type { RunError, RunKind, RunView } from '../../shared/schemas/runs';
import type { Db } from '../db/client';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import { PoolClosedError, type Slot, TaskFailedError, type TaskOwner } from '../pool/pool';
import type { TaskRef } from '../pool/task';
import * as repo from './runs.repo';

export const INTERRUPTED: RunError = { message: 'interrupted by a server restart — run it again' };

export type RunSpec = {
  kind: RunKind;
  subjectId: string | null;
  /** The whole input as JSON text: what the task gets, and what a later re-run would need. */
  input: string;
  /** input text → result text, in a worker. */
  task: TaskRef<string, string>;
  /** Written in the same transaction as the new run, e.g. its audit entry. */
  alsoInTx?: (tx: Pick<Db, 'insert'>) => void;
  /** Called with the result text once the run is done. */
  onDone?: (result: string) => void;
};

/** Takes a pool slot for a new run (429 when over a cap); the slot's key is the run's id. */
export function reserve(deps: Deps, owner: TaskOwner & { agencyId: string }) {
  return deps.pool.reserve(owner, randomUUID());
}

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

/** Starts a run in a slot from reserve() (perhaps already used for the snapshot); the slot is freed when it ends. */
export function startRun(deps: Deps, slot: Slot, spec: RunSpec): RunView {
  const id = slot.key!;
  const agencyId = slot.owner.agencyId!;
  try {
    deps.db.transaction((tx) => {
      repo.insertRun(tx, {
        id,
        agencyId,
        userId: slot.owner.userId,
        kind: spec.kind,
        subjectId: spec.subjectId,
        input: spec.input,
      });
      spec.alsoInTx?.(tx);
    });
  } catch (err) {
    slot.release();
    throw err;
  }
  slot
    .run(spec.task, spec.input)
    .then(
      (result) => {
        if (repo.finishRun(deps.db, id, { status: 'done', result })) spec.onDone?.(result);
      },
      (err) => {
        // Stopping: the database closes next; the next start marks the run interrupted.
        if (err instanceof PoolClosedError) return;
        repo.finishRun(
          deps.db,
          id,
          slot.cancelled ? { status: 'cancelled' } : { status: 'failed', error: errorOf(err) },
        );
      },
    )
    .catch((err) => console.error(`run ${id}: could not record its end`, err))
    .finally(() => slot.release());
  return toView(deps, repo.runMeta(deps.db, agencyId, id)!);
}

/**
 * reserve → snapshot task (awaited; its 4xx answers the request) → startRun. The snapshot is built in a
 * worker because reading and shaping a large inventory would hold the request thread for seconds.
 */
export async function snapshotThenRun<P, S extends { input: string }>(
  deps: Deps,
  owner: TaskOwner & { agencyId: string },
  snapshot: { task: TaskRef<P, S>; payload: P },
  spec: (snap: S, runId: string) => RunSpec,
) {
  const slot = reserve(deps, owner);
  let snap: S;
  try {
    snap = await slot.run(snapshot.task, snapshot.payload);
  } catch (err) {
    slot.release();
    throw err;
  }
  return startRun(deps, slot, spec(snap, slot.key!));
}

function metaOr404(deps: Pick<Deps, 'db'>, agencyId: string, runId: string) {
  const m = repo.runMeta(deps.db, agencyId, runId);
  if (!m) throw notFound('No such run');
  return m;
}

export function getRun(deps: Deps, agencyId: string, runId: string): RunView {
  const v = toView(deps, metaOr404(deps, agencyId, runId));
  const texts = v.status === 'done' ? repo.runTexts(deps.db, agencyId, runId) : undefined;
  return { ...v, result: texts?.result ? JSON.parse(texts.result) : null };
}

/** The poll answer as JSON text: the stored result is spliced in as it is, never parsed on the request thread. */
export function runJson(deps: Deps, agencyId: string, runId: string): string {
  const v = toView(deps, metaOr404(deps, agencyId, runId));
  const result = v.status === 'done' ? (repo.runTexts(deps.db, agencyId, runId)?.result ?? 'null') : 'null';
  const head = JSON.stringify({ ...v, result: null });
  return `${head.slice(0, -'null}'.length)}${result}}`;
}

export function cancelRun(deps: Deps, agencyId: string, runId: string): RunView {
  const m = metaOr404(deps, agencyId, runId);
  if (m.status === 'running') {
    repo.finishRun(deps.db, runId, { status: 'cancelled' });
    deps.pool.find(runId)?.cancel();
  }
  return toView(deps, metaOr404(deps, agencyId, runId));
}

/** The input and result texts of a finished run of this kind (409 while it is not done). */
export function finishedTexts(deps: Pick<Deps, 'db'>, agencyId: string, runId: string, kind: RunKind) {
  const m = metaOr404(deps, agencyId, runId);
  if (m.kind !== kind) throw notFound('No such run');
  if (m.status !== 'done')
    throw new HttpError(409, 'not_finished', 'Only a finished run can be used here; wait for it to finish');
  const t = repo.runTexts(deps.db, agencyId, runId)!;
  return { input: t.input, result: t.result! };
}

export function latest(deps: Pick<Deps, 'db'>, agencyId: string, kind: RunKind, subjectId: string) {
  return repo.latestOf(deps.db, agencyId, kind, subjectId) ?? null;
}

/** The latest finished run of a subject, without its result. */
export function latestDone(deps: Pick<Deps, 'db'>, agencyId: string, kind: RunKind, subjectId: string) {
  return repo.latestOf(deps.db, agencyId, kind, subjectId, 'done') ?? null;
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
