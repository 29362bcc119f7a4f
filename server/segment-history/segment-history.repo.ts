import { and, asc, desc, eq } from 'drizzle-orm';
import type { TreatmentRecord } from '../../shared/schemas/segment-history';
import type { Db } from '../db/client';
import { surveys, treatmentRecords, treatments, users } from '../db/schema';

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
    .all();
}

export function catalogTreatmentOf(db: Pick<Db, 'select'>, agencyId: string, id: string) {
  return db
    .select({ id: treatments.id })
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .get();
}

export function insertTreatmentRecord(tx: Pick<Db, 'insert'>, row: typeof treatmentRecords.$inferInsert) {
  return tx.insert(treatmentRecords).values(row).returning({ id: treatmentRecords.id }).get();
}

export function catalogTreatmentNamed(db: Pick<Db, 'select'>, agencyId: string, name: string) {
  return db
    .select({ id: treatments.id })
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.name, name)))
    .get();
}

/** Every treatment record of the agency with its catalog treatment's name, oldest first (the archive). */
export function agencyTreatmentRecords(db: Pick<Db, 'select'>, agencyId: string) {
  return db
    .select({ r: treatmentRecords, catalog: treatments.name })
    .from(treatmentRecords)
    .leftJoin(treatments, eq(treatments.id, treatmentRecords.treatmentId))
    .where(eq(treatmentRecords.agencyId, agencyId))
    .orderBy(asc(treatmentRecords.treatedOn), asc(treatmentRecords.id))
    .all();
}

export function surveyOn(db: Pick<Db, 'select'>, segmentRef: number, surveyDate: string) {
  return db
    .select({ id: surveys.id })
    .from(surveys)
    .where(and(eq(surveys.segmentRef, segmentRef), eq(surveys.surveyDate, surveyDate)))
    .get();
}

export function insertSurvey(tx: Pick<Db, 'insert'>, row: typeof surveys.$inferInsert) {
  tx.insert(surveys).values(row).run();
}
