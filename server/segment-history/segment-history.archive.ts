// Treatment records in the per-agency export (one CSV keyed by segment id, the
// catalog treatment by name) and back in on restore. Who recorded a job is not
// carried: the restored agency has other members.
import { and, asc, eq } from 'drizzle-orm';
import Papa from 'papaparse';
import type { Db } from '../db/client';
import { treatmentRecords, treatments } from '../db/schema';

const FIELDS = [
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
  const rows = db
    .select({ r: treatmentRecords, catalog: treatments.name })
    .from(treatmentRecords)
    .leftJoin(treatments, eq(treatments.id, treatmentRecords.treatmentId))
    .where(eq(treatmentRecords.agencyId, agencyId))
    .orderBy(asc(treatmentRecords.treatedOn), asc(treatmentRecords.id))
    .all();
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
  return { csv: `${Papa.unparse({ fields: [...FIELDS], data })}\n`, count: rows.length };
}

type Tx = Pick<Db, 'insert' | 'select'>;

/** Writes the records of an export into the new agency; unknown segment ids are the caller's error to raise. */
export function restoreTreatmentRecords(
  tx: Tx,
  agencyId: string,
  csv: string,
  refOf: Map<string, number>,
  onUnknown: (segmentId: string) => Error,
) {
  const rows = Papa.parse<Record<(typeof FIELDS)[number], string>>(csv.trim(), {
    header: true,
    skipEmptyLines: true,
  }).data;
  const num = (v: string) => (v === '' ? null : Number(v));
  for (const r of rows) {
    const ref = refOf.get(r.segment_id);
    if (ref === undefined) throw onUnknown(r.segment_id);
    const catalog = r.catalog_treatment
      ? tx
          .select({ id: treatments.id })
          .from(treatments)
          .where(and(eq(treatments.agencyId, agencyId), eq(treatments.name, r.catalog_treatment)))
          .get()
      : undefined;
    tx.insert(treatmentRecords)
      .values({
        agencyId,
        segmentRef: ref,
        treatedOn: r.treated_on,
        kind: r.kind,
        name: r.name,
        treatmentId: catalog?.id ?? null,
        mix: r.mix || null,
        thicknessIn: num(r.thickness_in),
        costUsd: num(r.cost_usd),
        notes: r.notes || null,
      })
      .run();
  }
}
