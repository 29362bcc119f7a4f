// Saved comparisons (the `analyses` table keeps its name for existing databases and archives).
import { and, asc, desc, eq, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { analyses, users } from '../db/schema';

type Read = Pick<Db, 'select'>;
const own = (agencyId: string, id: string) => and(eq(analyses.agencyId, agencyId), eq(analyses.id, id));

export function savedInput(db: Read, agencyId: string, id: string) {
  return db.select({ input: analyses.input }).from(analyses).where(own(agencyId, id)).get()?.input ?? null;
}

export function setResult(db: Pick<Db, 'update'>, agencyId: string, id: string, result: string) {
  db.update(analyses).set({ result, updatedAt: new Date().toISOString() }).where(own(agencyId, id)).run();
}

export function insertComparison(tx: Pick<Db, 'insert'>, row: typeof analyses.$inferInsert) {
  tx.insert(analyses).values(row).run();
}

export function listRows(db: Read, agencyId: string) {
  return db
    .select({
      id: analyses.id,
      name: analyses.name,
      createdAt: analyses.createdAt,
      updatedAt: analyses.updatedAt,
      createdBy: users.name,
      input: analyses.input,
    })
    .from(analyses)
    .leftJoin(users, eq(users.id, analyses.createdBy))
    .where(eq(analyses.agencyId, agencyId))
    .orderBy(desc(analyses.updatedAt))
    .all();
}

export function comparisonRow(db: Read, agencyId: string, id: string) {
  return db.select().from(analyses).where(own(agencyId, id)).get() ?? null;
}

/** Deletes the agency's comparison; true when there was one. */
export function deleteRow(tx: Pick<Db, 'delete'>, agencyId: string, id: string) {
  return tx.delete(analyses).where(own(agencyId, id)).run().changes === 1;
}

/** The name and whether a result is stored, never the result itself. */
export function exportable(db: Read, agencyId: string, id: string) {
  return (
    db
      .select({ name: analyses.name, hasResult: sql<number>`${analyses.result} IS NOT NULL` })
      .from(analyses)
      .where(own(agencyId, id))
      .get() ?? null
  );
}

export function withResult(db: Read, agencyId: string, id: string) {
  return (
    db
      .select({ name: analyses.name, result: analyses.result })
      .from(analyses)
      .where(and(own(agencyId, id), isNotNull(analyses.result)))
      .get() ?? null
  );
}

/** Every saved comparison of the agency, by name, for its archive. */
export function archiveRows(db: Read, agencyId: string) {
  return db.select().from(analyses).where(eq(analyses.agencyId, agencyId)).orderBy(asc(analyses.name)).all();
}
