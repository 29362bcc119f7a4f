// A run's first step, in a worker: the module's snapshot task builds the input, and the run's row (with
// its input bytes and the module's audit entry) is written here in one transaction, so a large snapshot
// never crosses to the request thread. A 4xx from the snapshot answers the request; nothing is written.
import type { RunKind } from '../../shared/schemas/runs';
import { recordAudit } from '../audit';
import { defineTask, type Task } from '../pool/task';
import * as repo from './runs.repo';
import type { Snapshot } from './runs.service';

export type RunStart = {
  runId: string;
  agencyId: string;
  userId: string;
  kind: RunKind;
  subjectId: string | null;
  snapshot: { href: string; payload: unknown };
};

export default defineTask(async (p: RunStart, ctx) => {
  const build = ((await import(p.snapshot.href)) as { default: Task<unknown, Snapshot> }).default;
  const snap = await build(p.snapshot.payload, ctx);
  const input = Buffer.from(snap.input);
  ctx.writer().transaction((tx) => {
    repo.insertRun(tx, {
      id: p.runId,
      agencyId: p.agencyId,
      userId: p.userId,
      kind: p.kind,
      subjectId: p.subjectId,
      input,
    });
    if (snap.audit) recordAudit(tx, snap.audit);
  });
  return { inputBytes: input.byteLength };
});
