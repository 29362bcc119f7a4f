// Segments: every row checked (values, geometry, plausibility), compared with the
// inventory, then — unless a dry run or refused — written in one transaction.
import type { ImportIssue } from '../../shared/schemas/imports';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import {
  fitVertices,
  geometryProblem,
  type LineGeometry,
  lengthMiles,
  looksLonLat,
  MAX_VERTICES_STORED,
  reproject,
  to2d,
} from './geometry';
import { type ImportContext, type ImportResult, rejectedRowsCsv, setIssues } from './import-report';
import * as repo from './imports.repo';
import { normalizeSegmentRow, type ReadOptions, type UnknownValues } from './normalize';
import { plausibilityWarnings } from './plausibility';
import type { RawRow, RawTable } from './read-file';
import { type Accepted, describeChanges, planSegment } from './segment-changes';

const LENGTH_MISMATCH = 0.1; // warn when stated length and geometry differ by more than 10%

/** The row's line in WGS84 with at most MAX_VERTICES_STORED positions, and its length before simplifying. */
function lineOf(
  r: RawRow,
  table: RawTable,
  mapping: Record<string, string>,
  proj: string | null,
  errors: ImportIssue[],
  warnings: ImportIssue[],
): { geometry: LineGeometry; miles: number } | null {
  const geoColumn = mapping.geometry ?? 'geometry';
  const spreadsheet = table.format === 'csv' || table.format === 'xlsx';
  if (!r.geometry) {
    // A GIS feature must carry its line; a spreadsheet row may leave the WKT cell blank.
    if (!spreadsheet) errors.push({ row: r.row, column: geoColumn, value: '', message: 'the feature has no geometry' });
    return null;
  }
  const problem = geometryProblem(r.geometry);
  if (problem) {
    errors.push({
      row: r.row,
      column: geoColumn,
      value: spreadsheet ? String(r.values[geoColumn] ?? '').slice(0, 60) : String(r.geometry.type).slice(0, 60),
      message: problem,
    });
    return null;
  }
  let geometry = to2d(r.geometry as LineGeometry);
  if (proj) geometry = reproject(geometry, proj);
  if (!looksLonLat(geometry)) {
    errors.push({
      row: r.row,
      column: 'geometry',
      value: '',
      message: 'coordinates fall outside longitude/latitude after reprojection; check the coordinate system',
    });
    return null;
  }
  const miles = lengthMiles(geometry);
  const fitted = fitVertices(geometry);
  if (fitted.simplifiedFrom !== null)
    warnings.push({
      row: r.row,
      column: geoColumn,
      value: `${fitted.simplifiedFrom.toLocaleString('en-US')} positions`,
      message: `the line is simplified to at most ${MAX_VERTICES_STORED.toLocaleString('en-US')} positions for storage and the map; its length is measured on the full line`,
    });
  return { geometry: fitted.geometry, miles };
}

export async function importSegments(
  ctx: ImportContext,
  read: ReadOptions,
  proj: string | null,
): Promise<ImportResult> {
  const { deps, agencyId, userId, fileName, table, opts, report } = ctx;
  const { mapping } = report;
  const lengthColumn = mapping.length_mi ?? 'length_mi';
  const errors: ImportIssue[] = [...report.errors];
  const warnings: ImportIssue[] = [...report.warnings];
  const unknown: UnknownValues = new Map();
  const firstRowOf = new Map<string, number>();
  const accepted: Accepted[] = [];
  for (const r of table.rows) {
    const { seg, errors: rowErrors, warnings: rowWarnings } = normalizeSegmentRow(r, mapping, read, unknown);
    const line = table.hasGeometry ? lineOf(r, table, mapping, proj, rowErrors, rowWarnings) : null;
    const lengthRefused = rowErrors.some((e) => e.column === lengthColumn);
    if (line) {
      if (line.miles === 0) {
        const message = 'the line has zero length (all its positions are the same point)';
        if (seg.lengthMi === null && !lengthRefused)
          rowErrors.push({ row: r.row, column: mapping.geometry ?? 'geometry', value: '', message });
        else rowWarnings.push({ row: r.row, column: mapping.geometry ?? 'geometry', value: '', message });
      } else if (seg.lengthMi === null && !lengthRefused) seg.lengthMi = Math.round(line.miles * 1e6) / 1e6;
      else if (seg.lengthMi !== null && Math.abs(seg.lengthMi - line.miles) / line.miles > LENGTH_MISMATCH)
        rowWarnings.push({
          row: r.row,
          column: lengthColumn,
          value: String(seg.lengthMi),
          message: `stated length differs from the geometry's ${line.miles.toFixed(3)} mi by more than 10%`,
        });
    }
    const geometryRefused = rowErrors.some(
      (e) => e.column === (mapping.geometry ?? 'geometry') || e.column === 'geometry',
    );
    if (seg.lengthMi === null && !lengthRefused && !geometryRefused) {
      rowErrors.push({
        row: r.row,
        column: lengthColumn,
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
    if (rowErrors.length === 0) rowWarnings.push(...plausibilityWarnings(r.row, seg, mapping));
    errors.push(...rowErrors);
    warnings.push(...rowWarnings);
    if (rowErrors.length === 0) accepted.push({ row: r.row, seg, geometry: line?.geometry ?? null });
  }

  setIssues(report, errors, warnings);
  report.unknownValues = [...unknown.values()].slice(0, 100);
  const existing = repo.existingSegments(deps.db, agencyId);
  const planned = accepted.map((a) => planSegment(a, existing.get(a.seg.segmentId), (f) => !!mapping[f]));
  report.acceptedRows = {
    added: planned.filter((p) => p.kind === 'add').length,
    updated: planned.filter((p) => p.kind === 'update').length,
    unchanged: planned.filter((p) => p.kind === 'same').length,
  };
  report.changes = describeChanges(planned, existing);
  report.preview = accepted.slice(0, 10).map((a) => ({ row: a.row, ...a.seg, hasGeometry: !!a.geometry }));

  // Refused: all or nothing with a bad row, or nothing left to write. Nothing is stored.
  if ((errors.length > 0 && opts.mode === 'all-or-nothing') || accepted.length === 0) return { status: 422, report };
  Object.assign(report, report.acceptedRows);
  if (opts.dryRun) return { status: 200, report };

  const importId = newId();
  // Built before the transaction opens: the transaction only writes.
  const rejectedCsv = errors.length ? rejectedRowsCsv(table, errors) : null;
  const now = new Date().toISOString();
  // New segments are staged first, outside the transaction (see stagedAdds); the transaction then makes
  // them visible in a few set-based statements, and writes updates row by row (an update names its row).
  const source = `import ${fileName}`.slice(0, 120);
  const adds = repo.stagedAdds(deps.sqlite);
  deps.progress?.(0.5);
  for (const [i, p] of planned.entries()) {
    if (p.kind !== 'add') continue;
    if (i % 1000 === 0) deps.progress?.(0.5 + (0.4 * i) / planned.length);
    const s = p.a.seg;
    adds.add(s.segmentId, { lengthMi: s.lengthMi ?? 0, ...p.patch }, s.pci, s.pciDate, {
      importId,
      after: { ...p.patch, geometry: p.patch.geometry ? '(geometry)' : undefined },
    });
  }
  deps.progress?.(0.9);
  try {
    deps.db.transaction((tx) => {
      adds.commit(agencyId, userId, source);
      const write = repo.segmentWriter(deps.sqlite, agencyId);
      for (const p of planned) {
        if (p.kind !== 'update') continue;
        const s = p.a.seg;
        const segmentRef = p.segmentRef!;
        const old = existing.get(s.segmentId) as Record<string, unknown>;
        const changed = Object.fromEntries(
          p.changed.map((k) => [
            k,
            k === 'geometry' ? { before: '(geometry)', after: '(geometry)' } : { before: old[k], after: p.patch[k] },
          ]),
        );
        write.update(segmentRef, p.patch, now);
        write.audit(userId, 'segment.import.update', s.segmentId, {
          importId,
          changed,
          pci: s.pci !== null && s.pciDate ? { date: s.pciDate, pci: s.pci } : undefined,
        });
        if (s.pci !== null) {
          if (s.pciDate) write.survey(segmentRef, s.pciDate, s.pci, source);
          else write.latestPci(segmentRef, s.pci);
        }
      }
      repo.insertImport(tx, {
        id: importId,
        agencyId,
        userId,
        fileName,
        kind: 'segments',
        format: table.format,
        mode: opts.mode,
        report,
        rejectedCsv,
      });
      if (opts.saveMapping) {
        repo.saveMapping(tx, agencyId, 'segments', mapping);
        if (Object.keys(read.values).length) repo.saveMapping(tx, agencyId, 'segments-values', read.values);
      }
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
  } finally {
    adds.clear();
  }
  deps.listCache?.bump(agencyId);
  report.importId = importId;
  return { status: 200, report };
}
