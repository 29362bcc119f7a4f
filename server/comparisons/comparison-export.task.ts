// A saved comparison as CSV or XLSX, read and written in a worker of the pool.
import { defineTask } from '../pool/task';
import { comparisonFile } from './comparisons.export';

export default defineTask((p: { agencyId: string; analysisId: string; format: 'csv' | 'xlsx' }, ctx) =>
  comparisonFile(ctx.db(), p.agencyId, p.analysisId, p.format),
);
