import { CONDITION_BANDS, conditionBand } from '../../shared/condition';
import { and, eq } from 'drizzle-orm';
import type { NetworkSummary, SegmentListQuery, SegmentUpdate } from '../../shared/schemas/segments';
import { agencyById } from '../agencies/agencies.repo';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import { segments } from '../db/schema';
import { notFound } from '../http/errors';
import { districtsOf, listSegments, networkStats, segmentById, surveysOf, toSegment } from './segments.repo';

export function segmentList(deps: Deps, agencyId: string, q: SegmentListQuery) {
  return listSegments(deps.db, agencyId, q);
}

export function districtList(deps: Deps, agencyId: string) {
  return { items: districtsOf(deps.db, agencyId) };
}

export function networkSummary(deps: Deps, agencyId: string): NetworkSummary {
  const agency = agencyById(deps.db, agencyId)!;
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

export function segmentDetail(deps: Deps, agencyId: string, id: number) {
  const row = segmentById(deps.db, agencyId, id);
  if (!row) throw notFound('No such segment');
  return {
    ...toSegment(row),
    notes: row.notes,
    geometry: row.geometry ? JSON.parse(row.geometry) : null,
    surveys: surveysOf(deps.db, agencyId, id),
  };
}

export function updateSegment(deps: Deps, agencyId: string, userId: string, id: number, patch: SegmentUpdate) {
  deps.db.transaction((tx) => {
    const before = tx
      .select()
      .from(segments)
      .where(and(eq(segments.agencyId, agencyId), eq(segments.id, id)))
      .get();
    if (!before) throw notFound('No such segment');
    const changed: Record<string, { before: unknown; after: unknown }> = {};
    for (const [k, v] of Object.entries(patch)) {
      const old = before[k as keyof typeof before];
      if (old !== v) changed[k] = { before: old, after: v };
    }
    if (Object.keys(changed).length === 0) return;
    tx.update(segments)
      .set({ ...patch, updatedAt: new Date().toISOString() })
      .where(eq(segments.id, id))
      .run();
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
  return segmentDetail(deps, agencyId, id);
}
