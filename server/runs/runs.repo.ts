import { and, desc, eq, sql } from 'drizzle-orm';
import type { RunError, RunKind, RunStatus } from '../../shared/schemas/runs';
import type { Db } from '../db/client';
import { runs } from '../db/schema';

// Everything but the input and result bytes, which can be megabytes.
const meta = {
  id: runs.id,
  agencyId: runs.agencyId,
  userId: runs.userId,
  kind: runs.kind,
  subjectId: runs.subjectId,
  status: runs.status,
  progress: runs.progress,
  error: runs.error,
  createdAt: runs.createdAt,
  startedAt: runs.startedAt,
  endedAt: runs.endedAt,
};
export type RunMeta = {
  id: string;
  agencyId: string;
  userId: string | null;
  kind: RunKind;
  subjectId: string | null;
  status: RunStatus;
  progress: number;
  error: RunError | null;
  createdAt: string;
  startedAt: string | null;
  endedAt: string | null;
};

const now = () => new Date().toISOString();

export function insertRun(
  db: Pick<Db, 'insert'>,
  r: { id: string; agencyId: string; userId: string; kind: RunKind; subjectId: string | null; input: Buffer },
) {
  db.insert(runs)
    .values({ ...r, status: 'running', startedAt: now() })
    .run();
}

export function runMeta(db: Db, agencyId: string, id: string): RunMeta | undefined {
  return db
    .select(meta)
    .from(runs)
    .where(and(eq(runs.agencyId, agencyId), eq(runs.id, id)))
    .get();
}

export function runInput(db: Db, agencyId: string, id: string) {
  return db
    .select({ input: runs.input })
    .from(runs)
    .where(and(eq(runs.agencyId, agencyId), eq(runs.id, id)))
    .get()?.input;
}

export function runResult(db: Db, agencyId: string, id: string) {
  return (
    db
      .select({ result: runs.result })
      .from(runs)
      .where(and(eq(runs.agencyId, agencyId), eq(runs.id, id)))
      .get()?.result ?? null
  );
}

export function latestOf(db: Db, agencyId: string, kind: RunKind, subjectId: string, status?: RunStatus) {
  return db
    .select(meta)
    .from(runs)
    .where(
      and(
        eq(runs.agencyId, agencyId),
        eq(runs.kind, kind),
        eq(runs.subjectId, subjectId),
        status ? eq(runs.status, status) : undefined,
      ),
    )
    .orderBy(desc(runs.createdAt))
    .limit(1)
    .get();
}

/** Ends a run that is still running (a run already cancelled stays cancelled); 1 when it did. */
export function finishRun(
  db: Db,
  id: string,
  end: { status: Exclude<RunStatus, 'running'>; result?: Buffer; error?: RunError },
) {
  return db
    .update(runs)
    .set({
      status: end.status,
      result: end.result ?? null,
      error: end.error ?? null,
      progress: end.status === 'done' ? 1 : sql`${runs.progress}`,
      endedAt: now(),
    })
    .where(and(eq(runs.id, id), eq(runs.status, 'running')))
    .run().changes;
}

export function deleteForSubject(db: Pick<Db, 'delete'>, agencyId: string, subjectId: string) {
  db.delete(runs)
    .where(and(eq(runs.agencyId, agencyId), eq(runs.subjectId, subjectId)))
    .run();
}

/** Rows of the older plan_runs table, copied once (ids are kept, so a second copy adds nothing). */
export function copyLegacyPlanRuns(db: Db) {
  return db.run(sql`
    INSERT OR IGNORE INTO runs (id, agency_id, user_id, kind, subject_id, status, progress, input, result, error, created_at, started_at, ended_at)
    SELECT p.id, p.agency_id, NULL, 'plan', p.plan_id, p.status, CASE p.status WHEN 'done' THEN 1 ELSE 0 END,
           CAST(p.input AS BLOB), CAST(p.result AS BLOB),
           CASE WHEN p.error IS NULL THEN NULL ELSE json_object('message', p.error) END,
           p.started_at, p.started_at, p.ended_at
    FROM plan_runs p JOIN agencies a ON a.id = p.agency_id`).changes;
}

/** At start no worker is left: every run still marked running was cut off. */
export function failRunning(db: Db, error: RunError) {
  return db.update(runs).set({ status: 'failed', error, endedAt: now() }).where(eq(runs.status, 'running')).run()
    .changes;
}
