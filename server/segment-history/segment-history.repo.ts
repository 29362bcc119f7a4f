import { and, desc, eq } from 'drizzle-orm';
import type { TreatmentRecord } from '../../shared/schemas/segment-history';
import type { Db } from '../db/client';
import { treatmentRecords, treatments, users } from '../db/schema';

type Tx = Pick<Db, 'select' | 'insert' | 'update'>;

export function treatmentRecordsOf(db: Pick<Db, 'select'>, agencyId: string, segmentRef: number): TreatmentRecord[] {
  return db
    .select({
      id: treatmentRecords.id,
      treatedOn: treatmentRecords.treatedOn,
      kind: treatmentRecords.kind,
      name: treatmentRecords.name,
      mix: treatmentRecords.mix,
      thicknessIn: treatmentRecords.thicknessIn,
      costUsd: treatmentRecords.costUsd,
      notes: treatmentRecords.notes,
      recordedBy: users.name,
      recordedAt: treatmentRecords.createdAt,
    })
    .from(treatmentRecords)
    .leftJoin(users, eq(users.id, treatmentRecords.userId))
    .where(and(eq(treatmentRecords.agencyId, agencyId), eq(treatmentRecords.segmentRef, segmentRef)))
    .orderBy(desc(treatmentRecords.treatedOn), desc(treatmentRecords.id))
    .all() as TreatmentRecord[];
}

export function catalogTreatmentOf(db: Pick<Db, 'select'>, agencyId: string, id: string) {
  return db
    .select({ id: treatments.id })
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .get();
}

export function insertTreatmentRecord(tx: Tx, row: typeof treatmentRecords.$inferInsert) {
  return tx.insert(treatmentRecords).values(row).returning({ id: treatmentRecords.id }).get();
}
