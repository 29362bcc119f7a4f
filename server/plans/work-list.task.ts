// A finished run's work list as CSV or XLSX, built in a worker.
import { defineTask } from '../pool/task';
import { workListCsv, workListXlsx } from './plans.export';
import { runResult } from './plans.service';

export default defineTask(
  async (p: { agencyId: string; runId: string; title: string; format: 'csv' | 'xlsx' }, ctx) => {
    const result = runResult({ db: ctx.db() }, p.agencyId, p.runId);
    return p.format === 'xlsx' ? workListXlsx(result, p.title) : workListCsv(result);
  },
);
