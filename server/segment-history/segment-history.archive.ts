// Treatment records in the per-agency export (one CSV keyed by segment id, the
// catalog treatment by name) and back in on restore, where each row is checked
// with the API's own schema before anything is written. Who recorded a job is
// not carried: the restored agency has other members.
import Papa from 'papaparse';
import { type TreatmentRecordInput, TreatmentRecordInputSchema } from '../../shared/schemas/segment-history';
import { toCsv, unescapeFormula } from '../csv';
import type { Db } from '../db/client';
import * as repo from './segment-history.repo';

export const TREATMENT_RECORD_FIELDS = [
  'segment_id',
  'treated_on',
  'kind',
  'name',
  'catalog_treatment',
  'mix',
  'thickness_in',
  'cost_usd',
  'notes',
] as const;

export function treatmentRecordsCsv(db: Db, agencyId: string, segmentIdOf: Map<number, string>) {
  const rows = repo.agencyTreatmentRecords(db, agencyId);
  const data = rows
    .map(({ r, catalog }) => [
      segmentIdOf.get(r.segmentRef) ?? '',
      r.treatedOn,
      r.kind,
      r.name,
      catalog ?? '',
      r.mix ?? '',
      r.thicknessIn ?? '',
      r.costUsd ?? '',
      r.notes ?? '',
    ])
    .sort((a, b) => String(a[0]).localeCompare(String(b[0])) || String(a[1]).localeCompare(String(b[1])));
  return { csv: toCsv([...TREATMENT_RECORD_FIELDS], data), count: rows.length };
}

export type ArchivedTreatmentRecord = {
  segmentId: string;
  catalogTreatment: string | null;
  input: TreatmentRecordInput;
};

/** Reads the archive's CSV row by row with the API's schema; problems name the row and field. */
export function parseTreatmentRecords(
  csv: string,
  add: (at: string, message: string) => void,
): ArchivedTreatmentRecord[] {
  const parsed = Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true }).data;
  if (parsed[0]?.join(',') !== TREATMENT_RECORD_FIELDS.join(',')) {
    add('row 1', `the header must be ${TREATMENT_RECORD_FIELDS.join(',')}`);
    return [];
  }
  const out: ArchivedTreatmentRecord[] = [];
  parsed.slice(1).forEach((raw, i) => {
    const row = i + 2;
    if (raw.length !== TREATMENT_RECORD_FIELDS.length)
      return add(`row ${row}`, `has ${raw.length} values for ${TREATMENT_RECORD_FIELDS.length} columns`);
    const cells = raw.map(unescapeFormula);
    const [segmentId, treatedOn, kind, name, catalogTreatment, mix, thickness, cost, notes] = cells;
    const num = (v: string) => (v === '' ? null : Number(v));
    const r = TreatmentRecordInputSchema.safeParse({
      treatedOn,
      kind,
      name,
      mix: mix || null,
      thicknessIn: num(thickness),
      costUsd: num(cost),
      notes: notes || null,
    });
    if (!segmentId) add(`row ${row}, segment_id`, 'is required');
    if (!r.success) return r.error.issues.forEach((iss) => add(`row ${row}, ${iss.path.join('.')}`, iss.message));
    if (segmentId) out.push({ segmentId, catalogTreatment: catalogTreatment || null, input: r.data });
  });
  return out;
}

type Tx = Pick<Db, 'insert' | 'select'>;

/** Writes checked records into the new agency; returns how many were written. */
export function restoreTreatmentRecords(
  tx: Tx,
  agencyId: string,
  records: ArchivedTreatmentRecord[],
  refOf: Map<string, number>,
) {
  let n = 0;
  for (const { segmentId, catalogTreatment, input } of records) {
    const catalog = catalogTreatment ? repo.catalogTreatmentNamed(tx, agencyId, catalogTreatment) : undefined;
    repo.insertTreatmentRecord(tx, {
      agencyId,
      segmentRef: refOf.get(segmentId)!,
      treatedOn: input.treatedOn,
      kind: input.kind,
      name: input.name,
      treatmentId: catalog?.id ?? null,
      mix: input.mix,
      thicknessIn: input.thicknessIn,
      costUsd: input.costUsd,
      notes: input.notes,
    });
    n++;
  }
  return n;
}
