import Papa from 'papaparse';
import {
  type ImportIssue,
  type ImportOptions,
  type ImportReport,
  REQUIRED_SEGMENT_FIELDS,
  SEGMENT_FIELDS,
  SURVEY_FIELDS,
} from '../../shared/schemas/imports';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import type { Deps } from '../deps';
import { imports } from '../db/schema';
import { HttpError } from '../http/errors';
import {
  crsDefinition,
  geometryProblem,
  type LineGeometry,
  lengthMiles,
  looksLonLat,
  reproject,
  to2d,
} from './geometry';
import * as repo from './imports.repo';
import { guessMapping, unitsFromHeaders } from './mapping';
import { normalizeSegmentRow, normalizeSurveyRow, type SegmentInput, type SurveyInput, type Units } from './normalize';
import wkx from 'wkx';
import { type Geometry, type RawTable, readTable } from './read-file';

export type ImportResult = { status: 200 | 422; report: ImportReport };

const LENGTH_MISMATCH = 0.1; // warn when stated length and geometry differ by more than 10%

function checkMapping(table: RawTable, kind: 'segments' | 'surveys', mapping: Record<string, string>) {
  const known: readonly string[] = kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS;
  const issues: { path: string; message: string }[] = [];
  for (const [field, column] of Object.entries(mapping)) {
    if (!known.includes(field))
      issues.push({ path: `mapping.${field}`, message: `is not a field Wearcourse imports (${known.join(', ')})` });
    else if (!table.columns.includes(column))
      issues.push({ path: `mapping.${field}`, message: `column "${column}" is not in the file` });
  }
  if (issues.length)
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid mapping: ${issues.map((i) => `${i.path} — ${i.message}`).join('; ')}`,
      issues,
    );
}

function rejectedRowsCsv(table: RawTable, errors: ImportIssue[]) {
  const byRow = new Map<number, string[]>();
  for (const e of errors) {
    if (!byRow.has(e.row)) byRow.set(e.row, []);
    byRow.get(e.row)!.push(`${e.column}: ${e.message}${e.value ? ` (${e.value})` : ''}`);
  }
  const rows = table.rows
    .filter((r) => byRow.has(r.row))
    .map((r) => ({
      row: r.row,
      ...Object.fromEntries(table.columns.map((c) => [c, r.values[c] ?? ''])),
      reason: byRow.get(r.row)!.join('; '),
    }));
  return Papa.unparse({
    fields: ['row', ...table.columns, 'reason'],
    data: rows.map((r) => ['row', ...table.columns, 'reason'].map((k) => (r as Record<string, unknown>)[k])),
  });
}

function baseReport(
  table: RawTable,
  opts: ImportOptions,
  mapping: Record<string, string>,
  units: Units,
  crs: string | null,
): ImportReport {
  return {
    dryRun: opts.dryRun,
    kind: opts.kind,
    format: table.format,
    added: 0,
    updated: 0,
    unchanged: 0,
    rejected: 0,
    totalRows: table.rows.length,
    errors: [],
    warnings: [],
    columns: table.columns.map((name) => ({
      name,
      samples: table.rows
        .map((r) => r.values[name])
        .filter((v) => v !== null && v !== undefined)
        .slice(0, 3)
        .map(String),
    })),
    mapping,
    units,
    crs,
    preview: [],
    importId: null,
  };
}

/** A spreadsheet column of WKT (or GeoJSON geometry text) becomes each row's geometry. */
function geometryFromColumn(table: RawTable, column: string) {
  table.hasGeometry = true;
  for (const r of table.rows) {
    const text = r.values[column];
    if (text === null || text === undefined || String(text).trim() === '') {
      r.geometry = null;
      continue;
    }
    const t = String(text).trim();
    try {
      r.geometry = t.startsWith('{') ? (JSON.parse(t) as Geometry) : (wkx.Geometry.parse(t).toGeoJSON() as Geometry);
    } catch {
      r.geometry = { type: 'unreadable WKT', coordinates: null };
    }
  }
}

const headerRow = (table: RawTable) => (table.format === 'geojson' || table.format === 'shapefile' ? 0 : 1);

/** Reads, checks and (unless a dry run or refused) writes one upload in one transaction. */
export async function runImport(
  deps: Deps,
  agencyId: string,
  userId: string,
  file: { name: string; buffer: Buffer },
  opts: ImportOptions,
): Promise<ImportResult> {
  const table = await readTable(file.name, file.buffer);
  const saved = repo.savedMapping(deps.db, agencyId, opts.kind);
  if (opts.mapping) checkMapping(table, opts.kind, opts.mapping);
  const mapping = opts.mapping ?? guessMapping(table.columns, opts.kind, saved);
  if (!table.hasGeometry && mapping.geometry) geometryFromColumn(table, mapping.geometry);
  const detected = unitsFromHeaders(mapping);
  const units: Units = { length: opts.lengthUnit ?? detected.length, width: opts.widthUnit ?? detected.width };
  let crs = opts.crs?.toUpperCase() ?? table.crsHint;
  const report = baseReport(table, opts, mapping, units, crs);

  // Fields no column feeds: the whole file is refused, row by row would only repeat it.
  const required = opts.kind === 'segments' ? [...REQUIRED_SEGMENT_FIELDS] : ['segment_id', 'survey_date', 'pci'];
  if (opts.kind === 'segments' && !table.hasGeometry) required.push('length_mi');
  const missing = required.filter((f) => !mapping[f]);
  if (missing.length) {
    report.errors = missing.map((f) => ({
      row: headerRow(table),
      column: f,
      value: '',
      message: 'no column of the file is matched to this required field',
    }));
    report.rejected = table.rows.length;
    return { status: 422, report };
  }

  let proj: string | null = null;
  if (crs) {
    const def = await crsDefinition(crs);
    if (!def)
      throw new HttpError(
        400,
        'invalid_request',
        `Invalid request: crs — ${crs} is not a known EPSG coordinate system`,
        [{ path: 'crs', message: `${crs} is not a known EPSG coordinate system` }],
      );
    proj = def.proj4;
  }
  if (table.hasGeometry && !proj) {
    const projected = table.rows.find(
      (r) => r.geometry && !geometryProblem(r.geometry) && !looksLonLat(r.geometry as LineGeometry),
    );
    if (projected) {
      report.errors = [
        {
          row: projected.row,
          column: 'geometry',
          value: JSON.stringify((projected.geometry as LineGeometry).coordinates).slice(0, 60),
          message:
            'coordinates are not longitude/latitude; choose the coordinate system the file uses (for a State Plane export, its EPSG code)',
        },
      ];
      report.rejected = table.rows.length;
      return { status: 422, report };
    }
    crs = null;
  }

  return opts.kind === 'segments'
    ? importSegments(deps, agencyId, userId, file.name, table, opts, report, proj)
    : importSurveys(deps, agencyId, userId, file.name, table, opts, report);
}

type Accepted = { row: number; seg: SegmentInput; geometry: LineGeometry | null };

async function importSegments(
  deps: Deps,
  agencyId: string,
  userId: string,
  fileName: string,
  table: RawTable,
  opts: ImportOptions,
  report: ImportReport,
  proj: string | null,
): Promise<ImportResult> {
  const { mapping, units } = report;
  const errors: ImportIssue[] = [];
  const warnings: ImportIssue[] = [];
  const firstRowOf = new Map<string, number>();
  const accepted: Accepted[] = [];
  for (const r of table.rows) {
    const { seg, errors: rowErrors, warnings: rowWarnings } = normalizeSegmentRow(r, mapping, units);
    let geometry: LineGeometry | null = null;
    if (table.hasGeometry) {
      const problem = geometryProblem(r.geometry);
      const geoColumn = mapping.geometry ?? 'geometry';
      const spreadsheet = table.format === 'csv' || table.format === 'xlsx';
      if (!r.geometry) {
        // A GIS feature must carry its line; a spreadsheet row may leave the WKT cell blank.
        if (!spreadsheet)
          rowErrors.push({ row: r.row, column: geoColumn, value: '', message: 'the feature has no geometry' });
      } else if (problem)
        rowErrors.push({
          row: r.row,
          column: geoColumn,
          value: spreadsheet ? String(r.values[geoColumn] ?? '').slice(0, 60) : String(r.geometry.type),
          message: problem,
        });
      else {
        geometry = to2d(r.geometry as LineGeometry);
        if (proj) geometry = reproject(geometry, proj);
        if (!looksLonLat(geometry)) {
          rowErrors.push({
            row: r.row,
            column: 'geometry',
            value: '',
            message: 'coordinates fall outside longitude/latitude after reprojection; check the coordinate system',
          });
          geometry = null;
        }
      }
    }
    if (geometry) {
      const geomMi = lengthMiles(geometry);
      if (seg.lengthMi === null && !rowErrors.some((e) => e.column === (mapping.length_mi ?? 'length_mi')))
        seg.lengthMi = Math.round(geomMi * 1e6) / 1e6;
      else if (seg.lengthMi !== null && geomMi > 0 && Math.abs(seg.lengthMi - geomMi) / geomMi > LENGTH_MISMATCH) {
        rowWarnings.push({
          row: r.row,
          column: mapping.length_mi ?? 'length_mi',
          value: String(seg.lengthMi),
          message: `stated length differs from the geometry's ${geomMi.toFixed(3)} mi by more than 10%`,
        });
      }
    }
    if (
      seg.lengthMi === null &&
      !rowErrors.some((e) => e.column === (mapping.length_mi ?? 'length_mi') || e.column === 'geometry')
    ) {
      rowErrors.push({
        row: r.row,
        column: mapping.length_mi ?? 'length_mi',
        value: '',
        message: 'is required when the row has no geometry',
      });
    }
    if (seg.segmentId) {
      const first = firstRowOf.get(seg.segmentId);
      if (first !== undefined)
        rowErrors.push({
          row: r.row,
          column: mapping.segment_id,
          value: seg.segmentId,
          message: `repeats the segment id of row ${first}`,
        });
      else firstRowOf.set(seg.segmentId, r.row);
    }
    errors.push(...rowErrors);
    warnings.push(...rowWarnings);
    if (rowErrors.length === 0) accepted.push({ row: r.row, seg, geometry });
  }

  const rejectedRows = new Set(errors.map((e) => e.row));
  report.errors = errors;
  report.warnings = warnings;
  report.rejected = rejectedRows.size;

  // Which fields this file carries: a re-import never blanks a field the file does not have.
  const carries = (field: string) => !!mapping[field];
  const existing = repo.existingSegments(deps.db, agencyId);
  type Plan = { a: Accepted; kind: 'add' | 'update' | 'same'; id?: number; patch: Record<string, unknown> };
  const plans: Plan[] = accepted.map((a) => {
    const s = a.seg;
    const patch: Record<string, unknown> = {
      roadName: s.roadName,
      widthFt: s.widthFt,
      lanes: s.lanes,
      functionalClass: s.functionalClass,
      surface: s.surface,
    };
    if (s.lengthMi !== null) patch.lengthMi = s.lengthMi;
    const optional: [string, keyof SegmentInput][] = [
      ['from_desc', 'fromDesc'],
      ['to_desc', 'toDesc'],
      ['adt', 'adt'],
      ['truck_pct', 'truckPct'],
      ['last_treatment', 'lastTreatment'],
      ['last_treatment_year', 'lastTreatmentYear'],
      ['district', 'district'],
      ['notes', 'notes'],
    ];
    for (const [field, prop] of optional) if (carries(field)) patch[prop] = s[prop];
    if (a.geometry) patch.geometry = JSON.stringify(a.geometry);
    const old = existing.get(s.segmentId);
    if (!old) return { a, kind: 'add', patch };
    const changed = Object.entries(patch).some(([k, v]) => (old as Record<string, unknown>)[k] !== v);
    const newSurvey =
      s.pci !== null &&
      (s.pciDate === null
        ? old.pci !== s.pci
        : old.pciDate === null || s.pciDate > old.pciDate || (s.pciDate === old.pciDate && old.pci !== s.pci));
    return { a, kind: changed || newSurvey ? 'update' : 'same', id: old.id, patch };
  });
  report.added = plans.filter((p) => p.kind === 'add').length;
  report.updated = plans.filter((p) => p.kind === 'update').length;
  report.unchanged = plans.filter((p) => p.kind === 'same').length;
  report.preview = accepted.slice(0, 10).map((a) => ({ row: a.row, ...a.seg, hasGeometry: !!a.geometry }));

  if (errors.length > 0 && opts.mode === 'all-or-nothing') {
    report.added = report.updated = report.unchanged = 0;
    return { status: 422, report };
  }
  if (opts.dryRun) return { status: 200, report };

  const importId = newId();
  const now = new Date().toISOString();
  deps.db.transaction((tx) => {
    const write = repo.segmentWriter(deps.sqlite, agencyId);
    for (const p of plans) {
      const s = p.a.seg;
      let id = p.id;
      if (p.kind === 'add') {
        id = write.insert(s.segmentId, { lengthMi: s.lengthMi ?? 0, ...p.patch });
        write.audit(userId, 'segment.import.add', s.segmentId, {
          importId,
          after: { ...p.patch, geometry: p.patch.geometry ? '(geometry)' : undefined },
        });
      } else if (p.kind === 'update') {
        const old = existing.get(s.segmentId) as Record<string, unknown>;
        const changed = Object.fromEntries(
          Object.entries(p.patch)
            .filter(([k, v]) => old[k] !== v)
            .map(([k, v]) => [
              k,
              k === 'geometry' ? { before: '(geometry)', after: '(geometry)' } : { before: old[k], after: v },
            ]),
        );
        write.update(id!, p.patch, now);
        write.audit(userId, 'segment.import.update', s.segmentId, {
          importId,
          changed,
          pci: s.pci !== null && s.pciDate ? { date: s.pciDate, pci: s.pci } : undefined,
        });
      }
      if (s.pci !== null && p.kind !== 'same') {
        if (s.pciDate) write.survey(id!, s.pciDate, s.pci, `import ${fileName}`.slice(0, 120));
        else write.latestPci(id!, s.pci);
      }
    }
    tx.insert(imports)
      .values({
        id: importId,
        agencyId,
        userId,
        fileName: fileName.slice(0, 200),
        kind: 'segments',
        format: table.format,
        mode: opts.mode,
        added: report.added,
        updated: report.updated,
        unchanged: report.unchanged,
        rejected: report.rejected,
        rejectedCsv: errors.length ? rejectedRowsCsv(table, errors) : null,
      })
      .run();
    if (opts.saveMapping) repo.saveMapping(tx, agencyId, 'segments', mapping);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'import.segments',
      entity: 'import',
      entityId: importId,
      detail: {
        fileName,
        added: report.added,
        updated: report.updated,
        unchanged: report.unchanged,
        rejected: report.rejected,
      },
    });
  });
  deps.listCache?.bump(agencyId);
  report.importId = importId;
  return { status: 200, report };
}

async function importSurveys(
  deps: Deps,
  agencyId: string,
  userId: string,
  fileName: string,
  table: RawTable,
  opts: ImportOptions,
  report: ImportReport,
): Promise<ImportResult> {
  const { mapping } = report;
  const existing = repo.existingSegments(deps.db, agencyId);
  const known = repo.existingSurveyKeys(deps.db, agencyId);
  const errors: ImportIssue[] = [];
  const warnings: ImportIssue[] = [];
  const seen = new Map<string, number>();
  const accepted: { row: number; survey: SurveyInput; segmentRef: number; kind: 'add' | 'update' | 'same' }[] = [];
  for (const r of table.rows) {
    const { survey, errors: rowErrors, warnings: rowWarnings } = normalizeSurveyRow(r, mapping);
    const seg = survey.segmentId ? existing.get(survey.segmentId) : undefined;
    if (survey.segmentId && !seg)
      rowErrors.push({
        row: r.row,
        column: mapping.segment_id,
        value: survey.segmentId,
        message: 'no segment with this id in the agency; import the segment first',
      });
    const k = `${survey.segmentId}|${survey.surveyDate}`;
    if (survey.segmentId && survey.surveyDate) {
      const first = seen.get(k);
      if (first !== undefined)
        rowErrors.push({
          row: r.row,
          column: mapping.survey_date,
          value: survey.surveyDate,
          message: `repeats the survey of row ${first} (same segment and date)`,
        });
      else seen.set(k, r.row);
    }
    errors.push(...rowErrors);
    warnings.push(...rowWarnings);
    if (rowErrors.length === 0 && seg) {
      const before = known.get(`${seg.id}|${survey.surveyDate}`);
      accepted.push({
        row: r.row,
        survey,
        segmentRef: seg.id,
        kind: before === undefined ? 'add' : before === survey.pci ? 'same' : 'update',
      });
    }
  }
  report.errors = errors;
  report.warnings = warnings;
  report.rejected = new Set(errors.map((e) => e.row)).size;
  report.added = accepted.filter((a) => a.kind === 'add').length;
  report.updated = accepted.filter((a) => a.kind === 'update').length;
  report.unchanged = accepted.filter((a) => a.kind === 'same').length;
  report.preview = accepted.slice(0, 10).map((a) => ({ row: a.row, ...a.survey }));
  if (errors.length > 0 && opts.mode === 'all-or-nothing') {
    report.added = report.updated = report.unchanged = 0;
    return { status: 422, report };
  }
  if (opts.dryRun) return { status: 200, report };
  const importId = newId();
  deps.db.transaction((tx) => {
    for (const a of accepted) {
      if (a.kind !== 'same')
        repo.upsertSurvey(
          tx,
          agencyId,
          a.segmentRef,
          a.survey.surveyDate,
          a.survey.pci,
          a.survey.source ?? `import ${fileName}`.slice(0, 120),
        );
    }
    tx.insert(imports)
      .values({
        id: importId,
        agencyId,
        userId,
        fileName: fileName.slice(0, 200),
        kind: 'surveys',
        format: table.format,
        mode: opts.mode,
        added: report.added,
        updated: report.updated,
        unchanged: report.unchanged,
        rejected: report.rejected,
        rejectedCsv: errors.length ? rejectedRowsCsv(table, errors) : null,
      })
      .run();
    if (opts.saveMapping) repo.saveMapping(tx, agencyId, 'surveys', mapping);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'import.surveys',
      entity: 'import',
      entityId: importId,
      detail: { fileName, added: report.added, updated: report.updated, rejected: report.rejected },
    });
  });
  deps.listCache?.bump(agencyId);
  report.importId = importId;
  return { status: 200, report };
}

export function history(deps: Deps, agencyId: string) {
  return { items: repo.importHistory(deps.db, agencyId) };
}

export function rejectedFile(deps: Deps, agencyId: string, importId: string) {
  const row = repo.rejectedCsv(deps.db, agencyId, importId);
  if (!row) throw new HttpError(404, 'not_found', 'No such import');
  return { fileName: `${row.fileName.replace(/\.[^.]+$/, '')}-rejected.csv`, csv: row.csv ?? 'row,reason\n' };
}

export function mappingFor(deps: Deps, agencyId: string, kind: 'segments' | 'surveys') {
  return { mapping: repo.savedMapping(deps.db, agencyId, kind) };
}
