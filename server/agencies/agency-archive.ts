// Per-agency export as one zip (GeoJSON, CSV and JSON with a manifest of
// SHA-256 hashes), and restore of such an archive into a new agency.
import crypto from 'node:crypto';
import { asc, eq } from 'drizzle-orm';
import JSZip from 'jszip';
import Papa from 'papaparse';
import type { Mix, Treatment } from '../../shared/schemas/catalog';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import * as catalogRepo from '../catalog/catalog.repo';
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
import { HttpError } from '../http/errors';
import { zipExpandedBytes } from '../imports/read-file';
import { segmentsCsv } from '../segments/segments.export';

export const ARCHIVE_FORMAT = 'wearcourse-agency-export';
const sha256 = (s: string) => crypto.createHash('sha256').update(s).digest('hex');

export async function exportAgency(deps: Deps, agencyId: string) {
  const agency = deps.db.select().from(agencies).where(eq(agencies.id, agencyId)).get()!;
  const segRows = deps.db
    .select()
    .from(segments)
    .where(eq(segments.agencyId, agencyId))
    .orderBy(asc(segments.segmentId))
    .all();
  const idToSeg = new Map(segRows.map((s) => [s.id, s.segmentId]));
  const surveyRows = deps.db.select().from(surveys).where(eq(surveys.agencyId, agencyId)).all();
  const mixList = catalogRepo.listMixes(deps.db, agencyId);
  const treatmentList = catalogRepo.listTreatments(deps.db, agencyId);
  const planRows = deps.db.select().from(plans).where(eq(plans.agencyId, agencyId)).orderBy(asc(plans.name)).all();
  const analysisRows = deps.db
    .select()
    .from(analyses)
    .where(eq(analyses.agencyId, agencyId))
    .orderBy(asc(analyses.name))
    .all();
  const curveRows = deps.db
    .select()
    .from(curveOverrides)
    .where(eq(curveOverrides.agencyId, agencyId))
    .orderBy(asc(curveOverrides.familyKey))
    .all();
  const mappingRows = deps.db
    .select()
    .from(importMappings)
    .where(eq(importMappings.agencyId, agencyId))
    .orderBy(asc(importMappings.kind))
    .all();

  const files: Record<string, string> = {
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
    'surveys.csv': `${Papa.unparse({ fields: ['segment_id', 'survey_date', 'pci', 'source'], data: surveyRows.map((v) => [idToSeg.get(v.segmentRef), v.surveyDate, v.pci, v.source ?? '']).sort((a, b) => String(a[0]).localeCompare(String(b[0])) || String(a[1]).localeCompare(String(b[1]))) })}\n`,
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
      economics: catalogRepo.economicsOf(deps.db, agencyId),
    },
    counts: {
      segments: segRows.length,
      surveys: surveyRows.length,
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

const bad = (message: string) => new HttpError(400, 'bad_archive', message);

export async function restoreAgency(deps: Deps, userId: string, buf: Buffer, name?: string) {
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(buf);
  } catch {
    throw bad('This file is not a Wearcourse agency export (not a zip).');
  }
  if (zipExpandedBytes(zip) > 500 * 1024 * 1024) throw bad('The archive expands to more than 500 MB.');
  const read = async (n: string) => {
    const f = zip.file(n);
    if (!f) throw bad(`The archive has no ${n}.`);
    return f.async('string');
  };
  const manifest = JSON.parse(await read('manifest.json'));
  if (manifest.format !== ARCHIVE_FORMAT || manifest.version !== 1)
    throw bad('This is not a Wearcourse agency export (version 1).');
  const files: Record<string, string> = {};
  for (const [n, hash] of Object.entries(manifest.files as Record<string, string>)) {
    files[n] = await read(n);
    if (sha256(files[n]) !== hash)
      throw bad(`${n} does not match its hash in the manifest; the archive is damaged or was edited.`);
  }
  const geo = JSON.parse(files['segments.geojson']) as {
    features: { properties: Record<string, unknown>; geometry: unknown }[];
  };
  const surveyRows = Papa.parse<string[]>(files['surveys.csv'].trim(), { skipEmptyLines: true }).data.slice(1);
  const catalog = JSON.parse(files['catalog.json']) as { mixes: Mix[]; treatments: Treatment[] };
  const planList = JSON.parse(files['plans.json']) as {
    name: string;
    status: 'draft' | 'published';
    publishedAt: string | null;
    settings: { treatmentIds: string[] };
  }[];
  const analysisList = JSON.parse(files['analyses.json']) as { name: string; input: unknown; result: unknown }[];
  const curves = JSON.parse(files['curves.json']) as { familyKey: string; p0: number; a: number; b: number }[];
  const mappings = JSON.parse(files['import-mappings.json']) as { kind: string; mapping: unknown }[];

  const agencyId = newId();
  const a = manifest.agency;
  deps.db.transaction((tx) => {
    tx.insert(agencies)
      .values({
        id: agencyId,
        name: (name ?? `${a.name} (restored)`).slice(0, 120),
        kind: a.kind,
        state: a.state,
        units: a.units,
        ...a.economics,
      })
      .run();
    tx.insert(memberships).values({ agencyId, userId, role: 'admin' }).run();
    const mixIds = new Map<string, string>();
    for (const m of catalog.mixes) {
      const id = newId();
      mixIds.set(m.id, id);
      const { id: _old, ...rest } = m;
      tx.insert(mixes)
        .values({ ...rest, id, agencyId })
        .run();
    }
    const treatmentIds = new Map<string, string>();
    for (const t of catalog.treatments) {
      const id = newId();
      treatmentIds.set(t.id, id);
      const { id: _old, ...rest } = t;
      tx.insert(treatments)
        .values({
          ...rest,
          id,
          agencyId,
          mixId: t.mixId ? (mixIds.get(t.mixId) ?? null) : null,
        })
        .run();
    }
    const refOf = new Map<string, number>();
    for (const f of geo.features) {
      const p = f.properties as Record<string, string | number | null>;
      const row = tx
        .insert(segments)
        .values({
          agencyId,
          segmentId: String(p.segment_id),
          roadName: String(p.road_name),
          fromDesc: p.from_desc as string | null,
          toDesc: p.to_desc as string | null,
          lengthMi: Number(p.length_mi),
          widthFt: Number(p.width_ft),
          lanes: Number(p.lanes),
          functionalClass: String(p.functional_class),
          surface: String(p.surface),
          adt: p.adt as number | null,
          truckPct: p.truck_pct as number | null,
          pci: p.pci as number | null,
          pciDate: p.pci_date as string | null,
          lastTreatment: p.last_treatment as string | null,
          lastTreatmentYear: p.last_treatment_year as number | null,
          district: p.district as string | null,
          notes: p.notes as string | null,
          geometry: f.geometry ? JSON.stringify(f.geometry) : null,
        })
        .returning({ id: segments.id })
        .get();
      refOf.set(String(p.segment_id), row.id);
    }
    for (const [sid, date, pci, source] of surveyRows) {
      const ref = refOf.get(sid);
      if (ref === undefined) throw bad(`surveys.csv names segment ${sid}, which segments.geojson does not have.`);
      tx.insert(surveys)
        .values({ agencyId, segmentRef: ref, surveyDate: date, pci: Number(pci), source: source || null })
        .run();
    }
    for (const p of planList) {
      const settings = { ...p.settings, treatmentIds: p.settings.treatmentIds.map((id) => treatmentIds.get(id) ?? id) };
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
    }
    for (const an of analysisList)
      tx.insert(analyses)
        .values({
          id: newId(),
          agencyId,
          name: an.name,
          createdBy: userId,
          input: JSON.stringify(an.input),
          result: an.result ? JSON.stringify(an.result) : null,
        })
        .run();
    for (const c of curves)
      tx.insert(curveOverrides)
        .values({ agencyId, ...c })
        .run();
    for (const m of mappings)
      tx.insert(importMappings)
        .values({ agencyId, kind: m.kind, mapping: JSON.stringify(m.mapping) })
        .run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'agency.restore',
      entity: 'agency',
      entityId: agencyId,
      detail: { from: a.name, exportedAt: manifest.exportedAt, counts: manifest.counts },
    });
  });
  return { agencyId, counts: manifest.counts };
}
