// Restore of an agency export into a new agency, in one transaction: all of it
// or nothing. Every id is the server's own (archive ids only link rows inside the
// archive), and the report and the audit entry count what was written.
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import type { Sqlite } from '../db/client';
import type { Deps } from '../deps';
import {
  agencies,
  analyses,
  curveOverrides,
  importMappings,
  memberships,
  mixes,
  plans,
  treatments,
} from '../db/schema';
import { restoreTreatmentRecords } from '../segment-history/segment-history.archive';
import { badArchive, readArchive } from './archive-read';
import { validateArchive } from './archive-validate';
import type { RestoreReport } from '../../shared/schemas/agency';

export type { RestoreReport } from '../../shared/schemas/agency';

/** In the pool's worker, `db` is the worker's writable connection and the route bumps the list cache. */
type Checked = ReturnType<typeof validateArchive>['data'];

const SEGMENT_COLUMNS = [
  'segment_id',
  'road_name',
  'from_desc',
  'to_desc',
  'length_mi',
  'width_ft',
  'lanes',
  'functional_class',
  'surface',
  'adt',
  'truck_pct',
  'pci',
  'pci_date',
  'last_treatment',
  'last_treatment_year',
  'district',
  'notes',
  'geometry',
];

/**
 * The archive's segments and surveys, staged before the restore's transaction opens: row by row into TEMP
 * tables of this connection (the temp database is its own, so filling them takes no lock on the app's file).
 * The transaction then copies them into the new agency in two INSERT … SELECT statements, so the write
 * lock is held for the set-based copy only — not for tens of thousands of single-row inserts.
 */
function stageRows(sqlite: Sqlite, data: Checked) {
  sqlite.exec(
    `CREATE TEMP TABLE IF NOT EXISTS restore_segments (seq INTEGER PRIMARY KEY, ${SEGMENT_COLUMNS.join(', ')})`,
  );
  sqlite.exec(
    'CREATE TEMP TABLE IF NOT EXISTS restore_surveys (seq INTEGER PRIMARY KEY, segment_id, survey_date, pci, source)',
  );
  const clear = () => {
    sqlite.exec('DELETE FROM temp.restore_segments');
    sqlite.exec('DELETE FROM temp.restore_surveys');
  };
  clear();
  const seg = sqlite.prepare(
    `INSERT INTO temp.restore_segments (${SEGMENT_COLUMNS.join(', ')}) VALUES (${SEGMENT_COLUMNS.map(() => '?').join(', ')})`,
  );
  const sur = sqlite.prepare(
    'INSERT INTO temp.restore_surveys (segment_id, survey_date, pci, source) VALUES (?, ?, ?, ?)',
  );
  sqlite.transaction(() => {
    for (const { seg: s, geometry } of data.segments)
      seg.run(
        s.segmentId,
        s.roadName,
        s.fromDesc,
        s.toDesc,
        s.lengthMi,
        s.widthFt,
        s.lanes,
        s.functionalClass,
        s.surface,
        s.adt,
        s.truckPct,
        s.pci,
        s.pciDate,
        s.lastTreatment,
        s.lastTreatmentYear,
        s.district,
        s.notes,
        geometry ? JSON.stringify(geometry) : null,
      );
    for (const v of data.surveys) sur.run(v.segmentId, v.surveyDate, v.pci, v.source);
  })();
  return {
    /** Inside the restore's transaction: the staged rows become the agency's; what was written, and archive id → new row id. */
    commit(agencyId: string) {
      const segments = sqlite
        .prepare(
          `INSERT INTO segments (agency_id, ${SEGMENT_COLUMNS.join(', ')}) SELECT ?, ${SEGMENT_COLUMNS.join(', ')} FROM temp.restore_segments ORDER BY seq`,
        )
        .run(agencyId).changes;
      const surveys = sqlite
        .prepare(
          'INSERT INTO surveys (agency_id, segment_ref, survey_date, pci, source) SELECT ?, s.id, v.survey_date, v.pci, v.source FROM temp.restore_surveys v JOIN segments s ON s.agency_id = ? AND s.segment_id = v.segment_id ORDER BY v.seq',
        )
        .run(agencyId, agencyId).changes;
      const rows = sqlite
        .prepare('SELECT id, segment_id AS segmentId FROM segments WHERE agency_id = ?')
        .all(agencyId) as {
        id: number;
        segmentId: string;
      }[];
      return { refOf: new Map(rows.map((r) => [r.segmentId, r.id])), segments, surveys };
    },
    clear,
  };
}

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
  const staged = stageRows(deps.db.$client, data);
  try {
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

      // The staged segments and surveys become the new agency's in two set-based statements (see stageRows).
      const { refOf, segments, surveys } = staged.commit(agencyId);
      counts.segments = segments;
      counts.surveys = surveys;
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
  } finally {
    staged.clear();
  }
  deps.listCache?.bump(agencyId);
  return { agencyId, counts, analysesToRerun: counts.analyses };
}
