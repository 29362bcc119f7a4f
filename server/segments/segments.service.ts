import { CONDITION_BANDS, conditionBand } from '../../shared/condition';
import type {
  NetworkSummary,
  SegmentListQuery,
  SegmentListResponse,
  SegmentUpdate,
} from '../../shared/schemas/segments';
import { agencyById } from '../agencies/agencies.service';
import { recordAudit } from '../audit';
import type { Db } from '../db/client';
import type { Deps } from '../deps';
import { notFound } from '../http/errors';
import {
  districtsOf,
  listSegments,
  networkStats,
  type SegmentFilter,
  type SegmentRow,
  segmentById,
  segmentsByRefs as segmentRowsByRefs,
  segmentsGeoJson,
  surveysOf,
  toSegment,
  updateSegmentRow,
} from './segments.repo';

export type { SegmentRow };

export function segmentList(deps: Deps, agencyId: string, q: SegmentListQuery): SegmentListResponse {
  return listSegments(deps.db, agencyId, q);
}

/** The page as JSON text, from the list cache when it holds it (every segment or survey write empties it). */
export function segmentListJson(deps: Deps, agencyId: string, q: SegmentListQuery): string {
  const cache = deps.listCache;
  if (!cache) return JSON.stringify(segmentList(deps, agencyId, q));
  const key = cache.key(agencyId, q);
  let json = cache.get(key);
  if (!json) {
    json = JSON.stringify(segmentList(deps, agencyId, q));
    cache.set(key, json);
  }
  return json;
}

/** The map's features as GeoJSON text (same filters as the list). */
export const segmentMap = (deps: Deps, agencyId: string, q: SegmentFilter) => segmentsGeoJson(deps.db, agencyId, q);

export function districtList(deps: Deps, agencyId: string) {
  return { items: districtsOf(deps.db, agencyId) };
}

export function networkSummary(deps: Deps, agencyId: string): NetworkSummary {
  const agency = agencyById(deps, agencyId)!;
  const rows = networkStats(deps.db, agencyId);
  let miles = 0;
  let lm = 0;
  let pciMiles = 0;
  let pciSum = 0;
  let latest: number | null = null;
  const byBand = new Map<string, number>([...CONDITION_BANDS.map((b) => [b.id, 0] as [string, number]), ['none', 0]]);
  for (const r of rows) {
    miles += r.lengthMi;
    lm += r.lengthMi * r.lanes;
    const band = conditionBand(r.pci);
    byBand.set(band?.id ?? 'none', (byBand.get(band?.id ?? 'none') ?? 0) + r.lengthMi * r.lanes);
    if (r.pci !== null) {
      pciMiles += r.lengthMi;
      pciSum += r.pci * r.lengthMi;
    }
    if (r.pciDate) {
      const y = Number(r.pciDate.slice(0, 4));
      if (latest === null || y > latest) latest = y;
    }
  }
  return {
    agencyName: agency.name,
    segments: rows.length,
    centrelineMiles: miles,
    laneMiles: lm,
    weightedPci: pciMiles > 0 ? pciSum / pciMiles : null,
    laneMilesByBand: [...byBand.entries()].map(([band, laneMiles]) => ({ band, laneMiles })),
    latestSurveyYear: latest,
  };
}

// For the segment's history (surveys and work done), inside its transaction.
/** The segment's stored row, or undefined when the agency has no such segment. */
export const segmentRowIn = (tx: Pick<Db, 'select'>, agencyId: string, segmentRef: number) =>
  segmentById(tx, agencyId, segmentRef);

/** Sets columns of the segment the history keeps current (latest PCI, last treatment). */
/** The agency's segments among `segmentRefs` (a comparison's group). */
export const segmentsByRefs = (deps: Pick<Deps, 'db'>, agencyId: string, segmentRefs: number[]) =>
  segmentRowsByRefs(deps.db, agencyId, segmentRefs);

export const touchSegment = (
  tx: Pick<Db, 'update'>,
  agencyId: string,
  segmentRef: number,
  set: Partial<Pick<SegmentRow, 'pci' | 'pciDate' | 'lastTreatment' | 'lastTreatmentYear'>>,
) => updateSegmentRow(tx, agencyId, segmentRef, set);

export function segmentDetail(deps: Deps, agencyId: string, segmentRef: number) {
  const row = segmentById(deps.db, agencyId, segmentRef);
  if (!row) throw notFound('No such segment');
  return {
    ...toSegment(row),
    notes: row.notes,
    geometry: row.geometry ? JSON.parse(row.geometry) : null,
    surveys: surveysOf(deps.db, agencyId, segmentRef),
  };
}

export function updateSegment(deps: Deps, agencyId: string, userId: string, segmentRef: number, patch: SegmentUpdate) {
  deps.db.transaction((tx) => {
    const before = segmentById(tx, agencyId, segmentRef);
    if (!before) throw notFound('No such segment');
    const changed: Record<string, { before: unknown; after: unknown }> = {};
    for (const [k, v] of Object.entries(patch)) {
      const old = before[k as keyof typeof before];
      if (old !== v) changed[k] = { before: old, after: v };
    }
    if (Object.keys(changed).length === 0) return;
    updateSegmentRow(tx, agencyId, segmentRef, patch);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'segment.update',
      entity: 'segment',
      entityId: before.segmentId,
      detail: changed,
    });
  });
  deps.listCache?.bump(agencyId);
  return segmentDetail(deps, agencyId, segmentRef);
}
