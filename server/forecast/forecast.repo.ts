// Every query of the forecast: the survey points of an agency's segments and
// the curves the agency set by hand. Each takes the agency id.
import { and, eq } from 'drizzle-orm';
import type { Curve } from '../../shared/engine/forecast/curve';
import type { Db } from '../db/client';
import { curveOverrides, segments, surveys } from '../db/schema';

/** The database or a transaction on it: writes go through the caller's transaction. */
export type Conn = Pick<Db, 'select' | 'insert' | 'delete'>;

/** One row per segment and survey (a segment without surveys comes once, with a null date and PCI). */
export function surveyPoints(db: Conn, agencyId: string) {
  return db
    .select({
      ref: segments.id,
      surface: segments.surface,
      cls: segments.functionalClass,
      lastTreatment: segments.lastTreatment,
      lastYear: segments.lastTreatmentYear,
      date: surveys.surveyDate,
      pci: surveys.pci,
    })
    .from(segments)
    .leftJoin(surveys, eq(surveys.segmentRef, segments.id))
    .where(eq(segments.agencyId, agencyId))
    .all();
}

/** The agency's hand-set curves by family key. */
export function overrides(db: Conn, agencyId: string): Map<string, Curve> {
  return new Map(
    db
      .select()
      .from(curveOverrides)
      .where(eq(curveOverrides.agencyId, agencyId))
      .all()
      .map((o) => [o.familyKey, { p0: o.p0, a: o.a, b: o.b }]),
  );
}

export function clearOverride(db: Conn, agencyId: string, familyKey: string) {
  db.delete(curveOverrides)
    .where(and(eq(curveOverrides.agencyId, agencyId), eq(curveOverrides.familyKey, familyKey)))
    .run();
}

export function insertOverride(db: Conn, agencyId: string, familyKey: string, curve: Curve) {
  db.insert(curveOverrides)
    .values({ agencyId, familyKey, ...curve })
    .run();
}
