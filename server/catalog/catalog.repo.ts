import { and, desc, eq } from 'drizzle-orm';
import type { Economics, Mix, Treatment } from '../../shared/schemas/catalog';
import type { Db } from '../db/client';
import { agencies, mixes, priceHistory, treatments, users } from '../db/schema';

type MixRow = typeof mixes.$inferSelect;
type TreatmentRow = typeof treatments.$inferSelect;

export const toMix = (r: MixRow): Mix => ({
  id: r.id,
  name: r.name,
  binderGrade: r.binderGrade,
  modifier: r.modifier as Mix['modifier'],
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
  category: r.category as Treatment['category'],
  kind: r.kind as Treatment['kind'],
  mixId: r.mixId,
  defaultThicknessIn: r.defaultThicknessIn,
  millDepthIn: r.millDepthIn,
  lifeYears: r.lifeYears,
  productionSyPerDay: r.productionSyPerDay,
  costItems: JSON.parse(r.costItems),
  effect: JSON.parse(r.effect),
  applicability: JSON.parse(r.applicability),
  priceEffectiveDate: r.priceEffectiveDate,
  isDemo: r.isDemo,
});

export function listMixes(db: Db, agencyId: string) {
  return db.select().from(mixes).where(eq(mixes.agencyId, agencyId)).orderBy(mixes.name).all().map(toMix);
}

export function listTreatments(db: Db, agencyId: string) {
  return db
    .select()
    .from(treatments)
    .where(eq(treatments.agencyId, agencyId))
    .orderBy(treatments.createdAt)
    .all()
    .map(toTreatment);
}

export function mixRow(db: Db, agencyId: string, id: string) {
  return db
    .select()
    .from(mixes)
    .where(and(eq(mixes.agencyId, agencyId), eq(mixes.id, id)))
    .get();
}

export function treatmentRow(db: Db, agencyId: string, id: string) {
  return db
    .select()
    .from(treatments)
    .where(and(eq(treatments.agencyId, agencyId), eq(treatments.id, id)))
    .get();
}

export function economicsOf(db: Db, agencyId: string): Economics {
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

export function history(db: Db, agencyId: string) {
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
      before: h.before ? JSON.parse(h.before) : null,
      after: h.after ? JSON.parse(h.after) : null,
      effectiveDate: h.effectiveDate,
      at: h.at,
      userName,
    }));
}
