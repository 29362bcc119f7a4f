// Restore of an agency export into a new agency, in one transaction: all of it
// or nothing. Every id is the server's own (archive ids only link rows inside the
// archive), and the report and the audit entry count what was written.
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import type { Deps } from '../deps';
import {
  agencies,
  analyses,
  curveOverrides,
  importMappings,
  memberships,
  mixes,
  plans,
  segments,
  surveys,
  treatments,
} from '../db/schema';
import { restoreTreatmentRecords } from '../segment-history/segment-history.archive';
import { badArchive, readArchive } from './archive-read';
import { validateArchive } from './archive-validate';

export type RestoreReport = {
  agencyId: string;
  counts: {
    segments: number;
    surveys: number;
    treatmentRecords: number;
    mixes: number;
    treatments: number;
    plans: number;
    analyses: number;
    curves: number;
  };
  /** Saved comparisons come back with their inputs; their results are computed again when re-run. */
  analysesToRerun: number;
};

/** In the pool's worker, `db` is the worker's writable connection and the route bumps the list cache. */
export async function restoreAgency(
  deps: Pick<Deps, 'db'> & Partial<Pick<Deps, 'listCache'>>,
  userId: string,
  buf: Buffer,
  name?: string,
): Promise<RestoreReport> {
  const archive = await readArchive(buf);
  const { data, issues } = validateArchive(archive);
  if (issues.length) throw badArchive(issues);
  const a = archive.manifest.agency;
  const agencyId = newId();
  const counts: RestoreReport['counts'] = {
    segments: 0,
    surveys: 0,
    treatmentRecords: 0,
    mixes: 0,
    treatments: 0,
    plans: 0,
    analyses: 0,
    curves: 0,
  };
  deps.db.transaction((tx) => {
    tx.insert(agencies)
      .values({
        id: agencyId,
        name: (name ?? `${a.name} (restored)`).slice(0, 120),
        kind: a.kind,
        state: a.state,
        units: a.units,
        discountRate: a.economics.discountRate,
        discountRateSource: a.economics.discountRateSource,
        analysisPeriodYears: a.economics.analysisPeriodYears,
        baseYear: a.economics.baseYear,
        mobilizationPerJob: a.economics.mobilizationPerJob,
        trafficControlPerDay: a.economics.trafficControlPerDay,
        engineeringFraction: a.economics.engineeringFraction,
        contingencyFraction: a.economics.contingencyFraction,
      })
      .run();
    tx.insert(memberships).values({ agencyId, userId, role: 'admin' }).run();

    const mixId = new Map<string, string>();
    for (const m of data.mixes) {
      const id = newId();
      mixId.set(m.oldId, id);
      const i = m.input;
      tx.insert(mixes)
        .values({
          id,
          agencyId,
          name: i.name,
          binderGrade: i.binderGrade,
          modifier: i.modifier,
          pricePerTon: i.pricePerTon,
          spreadRateLbPerSyIn: i.spreadRateLbPerSyIn,
          minLiftIn: i.minLiftIn,
          maxLiftIn: i.maxLiftIn,
          refLiftIn: i.refLiftIn,
          refLifeYears: i.refLifeYears,
          coldWeatherNote: i.coldWeatherNote,
          priceEffectiveDate: i.priceEffectiveDate,
          isDemo: m.isDemo,
        })
        .run();
      counts.mixes++;
    }
    const treatmentId = new Map<string, string>();
    for (const t of data.treatments) {
      const id = newId();
      treatmentId.set(t.oldId, id);
      const i = t.input;
      tx.insert(treatments)
        .values({
          id,
          agencyId,
          name: i.name,
          category: i.category,
          kind: i.kind,
          mixId: i.mixId ? mixId.get(i.mixId)! : null,
          defaultThicknessIn: i.defaultThicknessIn,
          millDepthIn: i.millDepthIn,
          lifeYears: i.lifeYears,
          productionSyPerDay: i.productionSyPerDay,
          costItems: i.costItems,
          effect: i.effect,
          applicability: i.applicability,
          priceEffectiveDate: i.priceEffectiveDate,
          isDemo: t.isDemo,
        })
        .run();
      counts.treatments++;
    }

    const refOf = new Map<string, number>();
    for (const { seg: s, geometry } of data.segments) {
      const row = tx
        .insert(segments)
        .values({
          agencyId,
          segmentId: s.segmentId,
          roadName: s.roadName,
          fromDesc: s.fromDesc,
          toDesc: s.toDesc,
          lengthMi: s.lengthMi!,
          widthFt: s.widthFt,
          lanes: s.lanes,
          functionalClass: s.functionalClass,
          surface: s.surface,
          adt: s.adt,
          truckPct: s.truckPct,
          pci: s.pci,
          pciDate: s.pciDate,
          lastTreatment: s.lastTreatment,
          lastTreatmentYear: s.lastTreatmentYear,
          district: s.district,
          notes: s.notes,
          geometry: geometry ? JSON.stringify(geometry) : null,
        })
        .returning({ id: segments.id })
        .get();
      refOf.set(s.segmentId, row.id);
      counts.segments++;
    }
    for (const v of data.surveys) {
      tx.insert(surveys)
        .values({
          agencyId,
          segmentRef: refOf.get(v.segmentId)!,
          surveyDate: v.surveyDate,
          pci: v.pci,
          source: v.source,
        })
        .run();
      counts.surveys++;
    }
    counts.treatmentRecords = restoreTreatmentRecords(tx, agencyId, data.treatmentRecords, refOf);
    for (const p of data.plans) {
      const settings = { ...p.settings, treatmentIds: p.settings.treatmentIds.map((id) => treatmentId.get(id)!) };
      tx.insert(plans)
        .values({
          id: newId(),
          agencyId,
          name: p.name,
          status: p.status,
          publishedAt: p.publishedAt,
          settings: JSON.stringify(settings),
          createdBy: userId,
        })
        .run();
      counts.plans++;
    }
    for (const an of data.analyses) {
      tx.insert(analyses)
        .values({
          id: newId(),
          agencyId,
          name: an.name,
          createdBy: userId,
          input: JSON.stringify(an.input),
          result: null,
        })
        .run();
      counts.analyses++;
    }
    for (const c of data.curves) {
      tx.insert(curveOverrides).values({ agencyId, familyKey: c.familyKey, p0: c.p0, a: c.a, b: c.b }).run();
      counts.curves++;
    }
    for (const m of data.mappings)
      tx.insert(importMappings)
        .values({ agencyId, kind: m.kind, mapping: JSON.stringify(m.mapping) })
        .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'agency.restore',
      entity: 'agency',
      entityId: agencyId,
      detail: { from: a.name, exportedAt: archive.manifest.exportedAt, counts },
    });
  });
  deps.listCache?.bump(agencyId);
  return { agencyId, counts, analysesToRerun: counts.analyses };
}
