import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { importMappings, imports, segments, surveys, users } from '../db/schema';

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export function savedMapping(db: Db, agencyId: string, kind: string): Record<string, string> | null {
  const row = db
    .select({ mapping: importMappings.mapping })
    .from(importMappings)
    .where(and(eq(importMappings.agencyId, agencyId), eq(importMappings.kind, kind)))
    .get();
  return row ? (JSON.parse(row.mapping) as Record<string, string>) : null;
}

export function saveMapping(tx: Tx, agencyId: string, kind: string, mapping: Record<string, string>) {
  tx.insert(importMappings)
    .values({ agencyId, kind, mapping: JSON.stringify(mapping) })
    .onConflictDoUpdate({
      target: [importMappings.agencyId, importMappings.kind],
      set: { mapping: JSON.stringify(mapping), updatedAt: new Date().toISOString() },
    })
    .run();
}

export function existingSegments(db: Db, agencyId: string) {
  const rows = db.select().from(segments).where(eq(segments.agencyId, agencyId)).all();
  return new Map(rows.map((r) => [r.segmentId, r]));
}

export function existingSurveyKeys(db: Db, agencyId: string) {
  const rows = db
    .select({ segmentRef: surveys.segmentRef, surveyDate: surveys.surveyDate, pci: surveys.pci })
    .from(surveys)
    .where(eq(surveys.agencyId, agencyId))
    .all();
  return new Map(rows.map((r) => [`${r.segmentRef}|${r.surveyDate}`, r.pci]));
}

export function importHistory(db: Db, agencyId: string) {
  return db
    .select({
      id: imports.id,
      fileName: imports.fileName,
      kind: imports.kind,
      format: imports.format,
      mode: imports.mode,
      added: imports.added,
      updated: imports.updated,
      unchanged: imports.unchanged,
      rejected: imports.rejected,
      userName: users.name,
      createdAt: imports.createdAt,
    })
    .from(imports)
    .leftJoin(users, eq(users.id, imports.userId))
    .where(eq(imports.agencyId, agencyId))
    .orderBy(desc(imports.createdAt))
    .limit(100)
    .all();
}

export function rejectedCsv(db: Db, agencyId: string, importId: string) {
  return db
    .select({ csv: imports.rejectedCsv, fileName: imports.fileName })
    .from(imports)
    .where(and(eq(imports.agencyId, agencyId), eq(imports.id, importId)))
    .get();
}

/** Upserts a survey row and lifts the segment's latest PCI when the survey is newer. */
export function upsertSurvey(tx: Tx, agencyId: string, segmentRef: number, surveyDate: string, pci: number, source: string | null) {
  tx.insert(surveys)
    .values({ agencyId, segmentRef, surveyDate, pci, source })
    .onConflictDoUpdate({ target: [surveys.segmentRef, surveys.surveyDate], set: { pci, source } })
    .run();
  tx.update(segments)
    .set({ pci, pciDate: surveyDate })
    .where(and(eq(segments.id, segmentRef), sql`(${segments.pciDate} IS NULL OR ${segments.pciDate} <= ${surveyDate})`))
    .run();
}
