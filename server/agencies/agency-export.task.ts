// The agency's whole data as one zip, read and packed in a worker.
import type { Deps } from '../deps';
import { defineTask } from '../pool/task';
import { exportAgency } from './agency-archive';

export default defineTask(async (p: { agencyId: string }, ctx) => {
  // exportAgency reads deps.db and nothing else; the worker's read-only connection is that.
  const out = await exportAgency({ db: ctx.db() } as Deps, p.agencyId);
  return { buffer: out.buffer, counts: out.manifest.counts, exportedAt: out.manifest.exportedAt, name: out.name };
});
