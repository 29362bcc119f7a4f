// Every query on the catalog's tables (mixes, treatments, price history) and on
// the economics columns of the agency row. Each takes the agency id.
import { and, desc, eq } from 'drizzle-orm';
import type { Economics, Mix, MixInput, PriceChange, Treatment, TreatmentInput } from '../../shared/schemas/catalog';
import type { Db } from '../db/client';
import { agencies, mixes, priceHistory, treatments, users } from '../db/schema';

/** The database or a transaction on it: writes go through the caller's transaction. */
export type Conn = Pick<Db, 'select' | 'insert' | 'update' | 'delete'>;

type MixRow = typeof mixes.$inferSelect;
type TreatmentRow = typeof treatments.$inferSelect;

export const toMix = (r: MixRow): Mix => ({
  id: r.id,
  name: r.name,
  binderGrade: r.binderGrade,
  modifier: r.modifier,
  pricePerTon: r.pricePerTon,
  spreadRateLbPerSyIn: r.spreadRateLbPerSyIn,
  minLiftIn: r.minLiftIn,
  maxLiftIn: r.maxLiftIn,
  refLiftIn: r.refLiftIn,
  refLifeYears: r.refLifeYears,
  coldWeatherNote: r.coldWeatherNote,
  priceEffectiveDate: r.priceEffectiveDate,
  isDemo: r.isDemo,
});

export const toTreatment = (r: TreatmentRow): Treatment => ({
  id: r.id,
  name: r.name,
  category: r.category,
  kind: r.kind,
  mixId: r.mixId,
  defaultThicknessIn: r.defaultThicknessIn,
  millDepthIn: r.millDepthIn,
  lifeYears: r.lifeYears,
  productionSyPerDay: r.productionSyPerDay,
  costItems: r.costItems,
  effect: r.effect,
  applicability: r.applicability,
  priceEffectiveDate: r.priceEffectiveDate,
  isDemo: r.isDemo,
});

export function listMixes(db: Conn, agencyId: string) {
  return db.select().from(mixes).where(eq(mixes.agencyId, agencyId)).orderBy(mixes.name).all().map(toMix);
}

export function listTreatments(db: Conn, agencyId: string) {
  return db
    .select()
    .from(treatments)
    .where(eq(treatments.agencyId, agencyId))
    .orderBy(treatments.createdAt)
    .all()
    .map(toTreatment);
}

export function mixRow(db: Conn, agencyId: string, id: string) {
  return db
    .select()
    .from(mixes)
    .where(and(eq(mixes.agencyId, agencyId), eq(mixes.id, id)))
    .get();
}

export function treatmentRow(db: Conn, agencyId: string, id: string) {
  return db
    .select()
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .get();
}

export function insertMix(db: Conn, agencyId: string, id: string, input: MixInput) {
  db.insert(mixes)
    .values({ ...input, id, agencyId })
    .run();
}

/** A changed mix is the agency's own: it loses the demo tag. */
export function updateMix(db: Conn, agencyId: string, id: string, input: MixInput) {
  db.update(mixes)
    .set({ ...input, isDemo: false })
    .where(and(eq(mixes.agencyId, agencyId), eq(mixes.id, id)))
    .run();
}

export function deleteMix(db: Conn, agencyId: string, id: string) {
  db.delete(mixes)
    .where(and(eq(mixes.agencyId, agencyId), eq(mixes.id, id)))
    .run();
}

/** The treatments that name a mix (a mix in use cannot be removed). */
export function treatmentsUsingMix(db: Conn, agencyId: string, mixId: string) {
  return db
    .select({ id: treatments.id, name: treatments.name })
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.mixId, mixId)))
    .all();
}

export function insertTreatment(db: Conn, agencyId: string, id: string, input: TreatmentInput) {
  db.insert(treatments)
    .values({ ...input, id, agencyId })
    .run();
}

/** A changed treatment is the agency's own: it loses the demo tag. */
export function updateTreatment(db: Conn, agencyId: string, id: string, input: TreatmentInput) {
  db.update(treatments)
    .set({ ...input, isDemo: false })
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .run();
}

export function deleteTreatment(db: Conn, agencyId: string, id: string) {
  db.delete(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .run();
}

export function economicsOf(db: Conn, agencyId: string): Economics {
  const a = db.select().from(agencies).where(eq(agencies.id, agencyId)).get()!;
  return {
    discountRate: a.discountRate,
    discountRateSource: a.discountRateSource,
    analysisPeriodYears: a.analysisPeriodYears,
    baseYear: a.baseYear,
    mobilizationPerJob: a.mobilizationPerJob,
    trafficControlPerDay: a.trafficControlPerDay,
    engineeringFraction: a.engineeringFraction,
    contingencyFraction: a.contingencyFraction,
  };
}

export function setEconomics(db: Conn, agencyId: string, e: Economics) {
  db.update(agencies).set(e).where(eq(agencies.id, agencyId)).run();
}

export type PriceChangeRow = Omit<PriceChange, 'at' | 'userName'> & { userId: string };

export function insertPriceChange(db: Conn, agencyId: string, c: PriceChangeRow) {
  db.insert(priceHistory)
    .values({ ...c, agencyId })
    .run();
}

export function history(db: Conn, agencyId: string): PriceChange[] {
  return db
    .select({ h: priceHistory, userName: users.name })
    .from(priceHistory)
    .leftJoin(users, eq(users.id, priceHistory.userId))
    .where(eq(priceHistory.agencyId, agencyId))
    .orderBy(desc(priceHistory.id))
    .limit(500)
    .all()
    .map(({ h, userName }) => ({
      entity: h.entity,
      entityId: h.entityId,
      name: h.name,
      field: h.field,
      before: h.before ?? null,
      after: h.after ?? null,
      effectiveDate: h.effectiveDate,
      at: h.at,
      userName,
    }));
}
