// The filtered segment list as CSV or XLSX, read and written in a worker: 55,000 rows take seconds.
import type { SegmentListQuery } from '../../shared/schemas/segments';
import { agencyById } from '../agencies/agencies.service';
import { defineTask } from '../pool/task';
import { segmentsCsv, segmentsXlsx } from './segments.export';
import { allSegments } from './segments.repo';

export default defineTask(
  async (p: { agencyId: string; query: Omit<SegmentListQuery, 'limit' | 'offset'>; format: 'csv' | 'xlsx' }, ctx) => {
    const db = ctx.db();
    const rows = allSegments(db, p.agencyId, { ...p.query, limit: 0, offset: 0 });
    const name = agencyById({ db }, p.agencyId)!.name;
    return { name, body: p.format === 'xlsx' ? await segmentsXlsx(rows, name) : segmentsCsv(rows) };
  },
);
