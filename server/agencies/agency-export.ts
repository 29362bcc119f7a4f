// Per-agency export as one zip: GeoJSON, CSV and JSON files with a manifest of
// their SHA-256 hashes. (Restore: agency-restore.ts.)
import crypto from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import JSZip from 'jszip';
import * as catalog from '../catalog/catalog.service';
import * as comparisonsRepo from '../comparisons/comparisons.repo';
import { toCsv } from '../csv';
import type { Deps } from '../deps';
import { curveOverrides, plans, segments, surveys } from '../db/schema';
import * as importsRepo from '../imports/imports.repo';
import { treatmentRecordsCsv } from '../segment-history/segment-history.archive';
import { segmentsCsv } from '../segments/segments.export';
import { agencyById } from './agencies.repo';
import { ARCHIVE_FORMAT, type ArchiveFile, type OptionalArchiveFile } from './archive-schemas';

export const sha256 = (s: string) => crypto.createHash('sha256').update(s).digest('hex');

export async function exportAgency(deps: Deps, agencyId: string) {
  const agency = agencyById(deps.db, agencyId)!;
  const segRows = deps.db
    .select()
    .from(segments)
    .where(eq(segments.agencyId, agencyId))
    .orderBy(asc(segments.segmentId))
    .all();
  const idToSeg = new Map(segRows.map((s) => [s.id, s.segmentId]));
  const surveyRows = deps.db.select().from(surveys).where(eq(surveys.agencyId, agencyId)).all();
  const mixList = catalog.listMixes(deps, agencyId);
  const treatmentList = catalog.listTreatments(deps, agencyId);
  const planRows = deps.db.select().from(plans).where(eq(plans.agencyId, agencyId)).orderBy(asc(plans.name)).all();
  const analysisRows = comparisonsRepo.archiveRows(deps.db, agencyId);
  const done = treatmentRecordsCsv(deps.db, agencyId, idToSeg);
  const curveRows = deps.db
    .select()
    .from(curveOverrides)
    .where(eq(curveOverrides.agencyId, agencyId))
    .orderBy(asc(curveOverrides.familyKey))
    .all();
  const mappingRows = importsRepo.archiveMappings(deps.db, agencyId);

  const files: Record<ArchiveFile | OptionalArchiveFile, string> = {
    'segments.csv': segmentsCsv(segRows),
    'segments.geojson': JSON.stringify({
      type: 'FeatureCollection',
      features: segRows.map((s) => ({
        type: 'Feature',
        properties: {
          segment_id: s.segmentId,
          road_name: s.roadName,
          from_desc: s.fromDesc,
          to_desc: s.toDesc,
          length_mi: s.lengthMi,
          width_ft: s.widthFt,
          lanes: s.lanes,
          functional_class: s.functionalClass,
          surface: s.surface,
          adt: s.adt,
          truck_pct: s.truckPct,
          pci: s.pci,
          pci_date: s.pciDate,
          last_treatment: s.lastTreatment,
          last_treatment_year: s.lastTreatmentYear,
          district: s.district,
          notes: s.notes,
        },
        geometry: s.geometry ? JSON.parse(s.geometry) : null,
      })),
    }),
    // Machine-read headers (the restore reads them back); cells escaped like every CSV we write.
    'surveys.csv': toCsv(
      ['segment_id', 'survey_date', 'pci', 'source'],
      surveyRows
        .map((v) => [idToSeg.get(v.segmentRef) ?? '', v.surveyDate, v.pci, v.source ?? ''])
        .sort((a, b) => String(a[0]).localeCompare(String(b[0])) || String(a[1]).localeCompare(String(b[1]))),
    ),
    'treatment-records.csv': done.csv,
    'catalog.json': JSON.stringify({ mixes: mixList, treatments: treatmentList }, null, 1),
    'plans.json': JSON.stringify(
      planRows.map((p) => ({
        id: p.id,
        name: p.name,
        status: p.status,
        publishedAt: p.publishedAt,
        settings: JSON.parse(p.settings),
      })),
      null,
      1,
    ),
    'analyses.json': JSON.stringify(
      analysisRows.map((a) => ({
        name: a.name,
        input: JSON.parse(a.input),
        result: a.result ? JSON.parse(a.result) : null,
      })),
    ),
    'curves.json': JSON.stringify(
      curveRows.map((c) => ({ familyKey: c.familyKey, p0: c.p0, a: c.a, b: c.b })),
      null,
      1,
    ),
    'import-mappings.json': JSON.stringify(
      mappingRows.map((m) => ({ kind: m.kind, mapping: JSON.parse(m.mapping) })),
      null,
      1,
    ),
  };
  const manifest = {
    format: ARCHIVE_FORMAT,
    version: 1,
    exportedAt: new Date().toISOString(),
    agency: {
      name: agency.name,
      kind: agency.kind,
      state: agency.state,
      units: agency.units,
      economics: catalog.economicsOf(deps, agencyId),
    },
    counts: {
      segments: segRows.length,
      surveys: surveyRows.length,
      treatmentRecords: done.count,
      mixes: mixList.length,
      treatments: treatmentList.length,
      plans: planRows.length,
      analyses: analysisRows.length,
      curves: curveRows.length,
    },
    files: Object.fromEntries(Object.entries(files).map(([name, text]) => [name, sha256(text)])),
  };
  const zip = new JSZip();
  zip.file('manifest.json', JSON.stringify(manifest, null, 1));
  for (const [name, text] of Object.entries(files)) zip.file(name, text);
  return {
    buffer: await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' }),
    manifest,
    name: agency.name,
  };
}
