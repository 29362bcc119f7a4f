// A finished run's work list as CSV or XLSX, built in a worker.
import { defineTask } from '../pool/task';
import { workListCsv, workListXlsx } from './plans.export';
import { runResult, segmentLimits } from './plans.service';

export default defineTask(
  async (p: { agencyId: string; runId: string; title: string; format: 'csv' | 'xlsx' }, ctx) => {
    const deps = { db: ctx.db() };
    const result = runResult(deps, p.agencyId, p.runId);
    const limits = segmentLimits(deps, p.agencyId);
    return p.format === 'xlsx' ? workListXlsx(result, p.title, limits) : workListCsv(result, limits);
  },
);
