// An upload → one table → checked rows → (unless a dry run or refused) one
// transaction. The steps live beside this file: reading (read-file), how cells are
// written (cell-formats), the coordinate system (crs), rows (normalize), the
// segment and survey imports, and the report.
import {
  type ImportOptions,
  REQUIRED_SEGMENT_FIELDS,
  SEGMENT_FIELDS,
  SURVEY_FIELDS,
  type ValueMap,
  ValueMapSchema,
} from '../../shared/schemas/imports';
import type { Deps } from '../deps';
import { HttpError } from '../http/errors';
import wkx from 'wkx';
import { detectCellFormats } from './cell-formats';
import { resolveCrs } from './crs';
import { geometryProblem, type LineGeometry, looksLonLat } from './geometry';
import { baseReport, headerRow, type ImportDeps, type ImportResult } from './import-report';
import { importSegments } from './import-segments';
import { importSurveys } from './import-surveys';
import * as repo from './imports.repo';
import { guessMapping, unitsFromHeaders } from './mapping';
import type { Units } from './normalize';
import { type Geometry, type RawTable, readTable } from './read-file';

export type { ImportResult } from './import-report';

function checkMapping(table: RawTable, kind: 'segments' | 'surveys', mapping: Record<string, string>) {
  const known: readonly string[] = kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS;
  const issues: { path: string; message: string }[] = [];
  for (const [field, column] of Object.entries(mapping)) {
    if (!known.includes(field))
      issues.push({ path: `mapping.${field}`, message: `is not a field Wearcourse imports (${known.join(', ')})` });
    else if (!table.columns.includes(column))
      issues.push({ path: `mapping.${field}`, message: `column "${column.slice(0, 60)}" is not in the file` });
  }
  if (issues.length)
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid mapping: ${issues.map((i) => `${i.path} — ${i.message}`).join('; ')}`,
      issues,
    );
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

const savedColumns = (v: unknown) =>
  v && typeof v === 'object' && Object.values(v).every((c) => typeof c === 'string')
    ? (v as Record<string, string>)
    : null;

/** The remembered value matching, overridden by the one sent with this upload. */
function valueMapFor(saved: unknown, chosen: ValueMap | undefined): ValueMap {
  const base = ValueMapSchema.safeParse(saved ?? {});
  const old = base.success ? base.data : {};
  return {
    ...(old.functional_class || chosen?.functional_class
      ? { functional_class: { ...old.functional_class, ...chosen?.functional_class } }
      : {}),
    ...(old.surface || chosen?.surface ? { surface: { ...old.surface, ...chosen?.surface } } : {}),
  };
}

/** Reads, checks and (unless a dry run or refused) writes one upload in one transaction. */
export async function runImport(
  deps: ImportDeps,
  agencyId: string,
  userId: string,
  file: { name: string; buffer: Buffer },
  opts: ImportOptions,
): Promise<ImportResult> {
  const table = await readTable(file.name, file.buffer);
  const saved = savedColumns(repo.savedMapping(deps.db, agencyId, opts.kind));
  if (opts.mapping) checkMapping(table, opts.kind, opts.mapping);
  const mapping = opts.mapping ?? guessMapping(table.columns, opts.kind, saved);
  if (!table.hasGeometry && mapping.geometry) geometryFromColumn(table, mapping.geometry);
  const detected = unitsFromHeaders(mapping);
  const units: Units = { length: opts.lengthUnit ?? detected.length, width: opts.widthUnit ?? detected.width };
  const report = baseReport(table, opts, mapping, units);

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

  const crs = await resolveCrs(table, opts.crs);
  report.crs = crs.crs;
  report.crsNote = crs.note;
  if (table.hasGeometry && !crs.proj) {
    const projected = table.rows.find(
      (r) => r.geometry && !geometryProblem(r.geometry) && !looksLonLat(r.geometry as LineGeometry),
    );
    if (projected) {
      const g = projected.geometry as LineGeometry;
      const first = g.type === 'LineString' ? g.coordinates[0] : g.coordinates[0][0];
      report.errors = [
        {
          row: projected.row,
          column: 'geometry',
          value: JSON.stringify(first).slice(0, 60),
          message:
            'coordinates are not longitude/latitude; choose the coordinate system the file uses (for a State Plane export, its EPSG code)',
        },
      ];
      report.warnings = crs.warnings;
      report.rejected = table.rows.length;
      return { status: 422, report };
    }
  }

  const formats = detectCellFormats(table, mapping, opts.dateFormat);
  report.dateFormat = formats.dateFormat;
  report.decimalComma = formats.decimalComma;
  report.warnings = [...crs.warnings, ...formats.warnings];
  const ctx = { deps, agencyId, userId, fileName: file.name, table, opts, report };
  if (opts.kind === 'surveys') return importSurveys(ctx, { formats });
  const values = valueMapFor(repo.savedMapping(deps.db, agencyId, 'segments-values'), opts.values);
  report.valueMap = values;
  return importSegments(ctx, { units, formats, values }, crs.proj);
}

export function history(deps: Deps, agencyId: string) {
  return { items: repo.importHistory(deps.db, agencyId) };
}

/** Path tricks in a client's file name are cut to the bare name; it is only ever a label. */
export function uploadName(originalName: string) {
  return (
    originalName
      .split(/[\\/]/)
      .pop()!
      .replace(/[^\w.\- ()]/g, '_')
      .slice(0, 200) || 'upload'
  );
}

export function rejectedFile(deps: Deps, agencyId: string, importId: string) {
  const row = repo.rejectedCsv(deps.db, agencyId, importId);
  if (!row) throw new HttpError(404, 'not_found', 'No such import');
  return { base: `${row.fileName.replace(/\.[^.]+$/, '')}-rejected`, csv: row.csv ?? 'row,reason\n' };
}

export function mappingFor(deps: Deps, agencyId: string, kind: 'segments' | 'surveys') {
  return { mapping: savedColumns(repo.savedMapping(deps.db, agencyId, kind)) };
}
