import { and, asc, desc, eq, inArray, isNotNull, isNull, or, sql, type SQL } from 'drizzle-orm';
import { CONDITION_BANDS } from '../../shared/condition';
import { areaSy, laneMiles } from '../../shared/engine/quantities';
import type { Segment, SegmentListQuery } from '../../shared/schemas/segments';
import type { Db } from '../db/client';
import { segments, surveys } from '../db/schema';
import { fitVertices, type LineGeometry } from '../imports/geometry';

export type SegmentRow = typeof segments.$inferSelect;

export function toSegment(r: SegmentRow): Segment {
  return {
    id: r.id,
    segmentId: r.segmentId,
    roadName: r.roadName,
    fromDesc: r.fromDesc,
    toDesc: r.toDesc,
    lengthMi: r.lengthMi,
    widthFt: r.widthFt,
    lanes: r.lanes,
    functionalClass: r.functionalClass,
    surface: r.surface,
    adt: r.adt,
    truckPct: r.truckPct,
    district: r.district,
    lastTreatment: r.lastTreatment,
    lastTreatmentYear: r.lastTreatmentYear,
    pci: r.pci,
    pciDate: r.pciDate,
    laneMiles: laneMiles(r.lengthMi, r.lanes),
    areaSy: areaSy(r.lengthMi, r.widthFt),
  };
}

export type SegmentFilter = Omit<SegmentListQuery, 'limit' | 'offset' | 'sort' | 'dir'>;

function filters(agencyId: string, q: SegmentFilter): SQL {
  const parts: (SQL | undefined)[] = [eq(segments.agencyId, agencyId)];
  if (q.q) {
    const pattern = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    parts.push(
      or(sql`${segments.roadName} LIKE ${pattern} ESCAPE '\\'`, sql`${segments.segmentId} LIKE ${pattern} ESCAPE '\\'`),
    );
  }
  if (q.class?.length) parts.push(inArray(segments.functionalClass, q.class));
  if (q.surface?.length) parts.push(inArray(segments.surface, q.surface));
  // Districts are typed by people and imported from files: match them whatever the case.
  if (q.district) parts.push(sql`trim(${segments.district}) = ${q.district} COLLATE NOCASE`);
  if (q.ids?.length) parts.push(inArray(segments.id, q.ids));
  if (q.band?.length) {
    const bandParts: SQL[] = [];
    for (const id of q.band) {
      if (id === 'none') {
        bandParts.push(isNull(segments.pci));
        continue;
      }
      const b = CONDITION_BANDS.find((x) => x.id === id)!;
      // Bands are defined on the rounded PCI.
      bandParts.push(sql`round(${segments.pci}) BETWEEN ${b.min} AND ${b.max}`);
    }
    parts.push(or(...bandParts));
  }
  return and(...parts)!;
}

const sortColumns = {
  segmentId: segments.segmentId,
  roadName: segments.roadName,
  lengthMi: segments.lengthMi,
  widthFt: segments.widthFt,
  lanes: segments.lanes,
  adt: segments.adt,
  surface: segments.surface,
  pci: segments.pci,
  functionalClass: segments.functionalClass,
  district: segments.district,
} as const;

export function listSegments(db: Db, agencyId: string, q: SegmentListQuery) {
  const where = filters(agencyId, q);
  const col = sortColumns[q.sort];
  const rows = db
    .select()
    .from(segments)
    .where(where)
    .orderBy(q.dir === 'asc' ? asc(col) : desc(col), asc(segments.id))
    .limit(q.limit)
    .offset(q.offset)
    .all();
  const t = db
    .select({
      count: sql<number>`count(*)`,
      miles: sql<number>`coalesce(sum(${segments.lengthMi}), 0)`,
      laneMiles: sql<number>`coalesce(sum(${segments.lengthMi} * ${segments.lanes}), 0)`,
      areaSy: sql<number>`coalesce(sum(${segments.lengthMi} * 5280 * ${segments.widthFt} / 9.0), 0)`,
      weightedPci: sql<
        number | null
      >`sum(${segments.pci} * ${segments.lengthMi}) / nullif(sum(case when ${segments.pci} is not null then ${segments.lengthMi} end), 0)`,
    })
    .from(segments)
    .where(where)
    .get()!;
  return { total: t.count, items: rows.map(toSegment), totals: t };
}

export function networkStats(db: Db, agencyId: string) {
  const rows = db
    .select({ lengthMi: segments.lengthMi, lanes: segments.lanes, pci: segments.pci, pciDate: segments.pciDate })
    .from(segments)
    .where(eq(segments.agencyId, agencyId))
    .all();
  return rows;
}

export function districtsOf(db: Db, agencyId: string) {
  const name = sql<string>`min(trim(${segments.district}))`;
  return db
    .select({ name, segments: sql<number>`count(*)` })
    .from(segments)
    .where(and(eq(segments.agencyId, agencyId), sql`trim(coalesce(${segments.district}, '')) <> ''`))
    .groupBy(sql`trim(${segments.district}) COLLATE NOCASE`)
    .orderBy(sql`trim(${segments.district}) COLLATE NOCASE`)
    .all();
}

export function segmentById(db: Pick<Db, 'select'>, agencyId: string, segmentRef: number) {
  return db
    .select()
    .from(segments)
    .where(and(eq(segments.agencyId, agencyId), eq(segments.id, segmentRef)))
    .get();
}

/** The agency's segments among `segmentRefs` (read 900 at a time, under SQLite's parameter limit). */
export function segmentsByRefs(db: Pick<Db, 'select'>, agencyId: string, segmentRefs: number[]) {
  const rows: SegmentRow[] = [];
  for (let i = 0; i < segmentRefs.length; i += 900) {
    rows.push(
      ...db
        .select()
        .from(segments)
        .where(and(eq(segments.agencyId, agencyId), inArray(segments.id, segmentRefs.slice(i, i + 900))))
        .all(),
    );
  }
  return rows;
}

/** The segment's own columns changed, its `updatedAt` set now. */
export function updateSegmentRow(
  tx: Pick<Db, 'update'>,
  agencyId: string,
  segmentRef: number,
  set: Partial<Omit<SegmentRow, 'id' | 'agencyId'>>,
) {
  tx.update(segments)
    .set({ ...set, updatedAt: new Date().toISOString() })
    .where(and(eq(segments.agencyId, agencyId), eq(segments.id, segmentRef)))
    .run();
}

export function surveysOf(db: Db, agencyId: string, segmentRef: number) {
  return db
    .select({ surveyDate: surveys.surveyDate, pci: surveys.pci, source: surveys.source })
    .from(surveys)
    .where(and(eq(surveys.agencyId, agencyId), eq(surveys.segmentRef, segmentRef)))
    .orderBy(asc(surveys.surveyDate))
    .all();
}

// A stored line of more than this much text may have more positions than the map takes
// (lines stored before the import's vertex limit, or written by other means): it is
// parsed and simplified on the way out. Shorter text cannot hold more than the limit.
const LONG_GEOMETRY_CHARS = 20_000;

function mapGeometry(text: string) {
  if (text.length <= LONG_GEOMETRY_CHARS) return text;
  try {
    return JSON.stringify(fitVertices(JSON.parse(text) as LineGeometry).geometry);
  } catch {
    return 'null';
  }
}

/** Map features as one JSON string: the stored geometry text is spliced in, parsed only when very long. */
export function segmentsGeoJson(db: Db, agencyId: string, q: SegmentFilter): string {
  const rows = db
    .select({
      id: segments.id,
      segmentId: segments.segmentId,
      roadName: segments.roadName,
      pci: segments.pci,
      cls: segments.functionalClass,
      geometry: segments.geometry,
    })
    .from(segments)
    .where(and(filters(agencyId, q), isNotNull(segments.geometry)))
    .all();
  const parts = rows.map(
    (r) =>
      `{"type":"Feature","id":${r.id},"properties":${JSON.stringify({ id: r.id, s: r.segmentId, r: r.roadName, p: r.pci === null ? -1 : Math.round(r.pci), c: r.cls })},"geometry":${mapGeometry(r.geometry!)}}`,
  );
  return `{"type":"FeatureCollection","features":[${parts.join(',')}]}`;
}

export function allSegments(db: Db, agencyId: string, q: SegmentListQuery) {
  const col = sortColumns[q.sort];
  return db
    .select()
    .from(segments)
    .where(filters(agencyId, q))
    .orderBy(q.dir === 'asc' ? asc(col) : desc(col), asc(segments.id))
    .all();
}
