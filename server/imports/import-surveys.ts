// Condition surveys: each row names a segment of the agency, a date and a PCI;
// written (unless a dry run or refused) in one transaction.
import type { ImportIssue } from '../../shared/schemas/imports';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import { type ImportContext, type ImportResult, rejectedRowsCsv, setIssues } from './import-report';
import * as repo from './imports.repo';
import { normalizeSurveyRow, type ReadOptions, type SurveyInput } from './normalize';

export async function importSurveys(ctx: ImportContext, read: Pick<ReadOptions, 'formats'>): Promise<ImportResult> {
  const { deps, agencyId, userId, fileName, table, opts, report } = ctx;
  const { mapping } = report;
  const existing = repo.existingSegments(deps.db, agencyId);
  const known = repo.existingSurveyKeys(deps.db, agencyId);
  const errors: ImportIssue[] = [...report.errors];
  const warnings: ImportIssue[] = [...report.warnings];
  const seen = new Map<string, number>();
  const accepted: { row: number; survey: SurveyInput; segmentRef: number; kind: 'add' | 'update' | 'same' }[] = [];
  for (const r of table.rows) {
    const { survey, errors: rowErrors, warnings: rowWarnings } = normalizeSurveyRow(r, mapping, read);
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
  setIssues(report, errors, warnings);
  report.acceptedRows = {
    added: accepted.filter((a) => a.kind === 'add').length,
    updated: accepted.filter((a) => a.kind === 'update').length,
    unchanged: accepted.filter((a) => a.kind === 'same').length,
  };
  report.preview = accepted.slice(0, 10).map((a) => ({ row: a.row, ...a.survey }));
  if ((errors.length > 0 && opts.mode === 'all-or-nothing') || accepted.length === 0) return { status: 422, report };
  Object.assign(report, report.acceptedRows);
  if (opts.dryRun) return { status: 200, report };
  const importId = newId();
  // Built before the transaction opens: the transaction only writes.
  const rejectedCsv = errors.length ? rejectedRowsCsv(table, errors) : null;
  // Staged outside the transaction (see stagedSurveys); the transaction writes them in two statements.
  const staged = repo.stagedSurveys(deps.sqlite);
  deps.progress?.(0.5);
  for (const [i, a] of accepted.entries()) {
    if (i % 1000 === 0) deps.progress?.(0.5 + (0.4 * i) / accepted.length);
    if (a.kind !== 'same')
      staged.add(
        a.segmentRef,
        a.survey.surveyDate,
        a.survey.pci,
        a.survey.source ?? `import ${fileName}`.slice(0, 120),
      );
  }
  deps.progress?.(0.9);
  try {
    deps.db.transaction((tx) => {
      staged.commit(agencyId);
      repo.insertImport(tx, {
        id: importId,
        agencyId,
        userId,
        fileName,
        kind: 'surveys',
        format: table.format,
        mode: opts.mode,
        report,
        rejectedCsv,
      });
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
  } finally {
    staged.clear();
  }
  deps.listCache?.bump(agencyId);
  report.importId = importId;
  return { status: 200, report };
}
