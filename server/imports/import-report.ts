// The import's answer: its empty shape, the issue lists (capped, with the rest
// counted) and the rejected rows kept for download.
import {
  type ImportIssue,
  type ImportOptions,
  type ImportReport,
  MAX_LISTED_ISSUES,
} from '../../shared/schemas/imports';
import type { Db, Sqlite } from '../db/client';
import { toCsv } from '../csv';
import { echo } from './normalize';
import type { RawTable } from './read-file';
import type { Units } from './normalize';

export type ImportResult = { status: 200 | 422; report: ImportReport };

/**
 * What an import needs: a database it may write. In the pool's worker that is the worker's own writable
 * connection (`ctx.writer()`), and the list cache is bumped by the route on the request thread.
 */
export type ImportDeps = {
  db: Db;
  sqlite: Sqlite;
  listCache?: { bump(agencyId: string): void };
  /** 0 to 1: 0.5 once every row is checked and the write begins, then along the write. */
  progress?: (fraction: number) => void;
};

/** One import as both importers (segments, surveys) take it: where it writes, who sends what, and its report. */
export type ImportContext = {
  deps: ImportDeps;
  agencyId: string;
  userId: string;
  fileName: string;
  table: RawTable;
  opts: ImportOptions;
  report: ImportReport;
};

/** A cell kept in the rejected-rows file is cut here: the file is for fixing rows, not for storing 20 MB cells. */
export const MAX_KEPT_CELL_CHARS = 100_000;

const SAMPLE_CHARS = 60;

export function baseReport(
  table: RawTable,
  opts: ImportOptions,
  mapping: Record<string, string>,
  units: Units,
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
    acceptedRows: { added: 0, updated: 0, unchanged: 0 },
    errors: [],
    warnings: [],
    moreErrors: 0,
    moreWarnings: 0,
    columns: table.columns.map((name) => ({
      name,
      samples: table.rows
        .map((r) => (r.unreadable?.[name] ? '(nested value)' : r.values[name]))
        .filter((v) => v !== null && v !== undefined)
        .slice(0, 3)
        .map((v) => (String(v).length > SAMPLE_CHARS ? `${String(v).slice(0, SAMPLE_CHARS)}…` : String(v))),
    })),
    mapping,
    units,
    dateFormat: null,
    decimalComma: false,
    crs: null,
    crsNote: null,
    valueMap: {},
    unknownValues: [],
    changes: [],
    preview: [],
    importId: null,
  };
}

/** Lists at most MAX_LISTED_ISSUES of each kind in the answer; the rest are counted. */
export function setIssues(report: ImportReport, errors: ImportIssue[], warnings: ImportIssue[]) {
  report.errors = errors.slice(0, MAX_LISTED_ISSUES);
  report.moreErrors = Math.max(0, errors.length - MAX_LISTED_ISSUES);
  report.warnings = warnings.slice(0, MAX_LISTED_ISSUES);
  report.moreWarnings = Math.max(0, warnings.length - MAX_LISTED_ISSUES);
  report.rejected = new Set(errors.map((e) => e.row)).size;
}

const keep = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  return s.length > MAX_KEPT_CELL_CHARS ? `${s.slice(0, MAX_KEPT_CELL_CHARS)}… (cut)` : s;
};

export function rejectedRowsCsv(table: RawTable, errors: ImportIssue[]) {
  const byRow = new Map<number, string[]>();
  for (const e of errors) {
    if (!byRow.has(e.row)) byRow.set(e.row, []);
    byRow.get(e.row)!.push(`${e.column}: ${e.message}${e.value ? ` (${echo(e.value)})` : ''}`);
  }
  const rows = table.rows
    .filter((r) => byRow.has(r.row))
    .map((r) => [r.row, ...table.columns.map((c) => keep(r.values[c])), byRow.get(r.row)!.join('; ')]);
  return toCsv(['Row', ...table.columns, 'Reason'], rows);
}

export const headerRow = (table: RawTable) => (table.format === 'geojson' || table.format === 'shapefile' ? 0 : 1);
