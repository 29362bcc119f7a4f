import type { ImportMode, ImportReport, ValueMap } from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { fmtInt } from '@/lib/format';
import { LENGTH_UNIT_WORDS, previewValue, PREVIEW_LABELS, READ_DATE_WORDS, WIDTH_UNIT_WORDS } from './import-labels';
import { IssueTable } from './issue-table';
import { UpdateChanges } from './update-changes';
import { ValueMatching } from './value-matching';

function Count({ label, value, tone }: { label: string; value: number; tone?: 'bad' }) {
  return (
    <div className="rounded border border-asphalt-line p-2">
      <div className="text-xs uppercase text-asphalt-muted">{label}</div>
      <div className={`text-xl font-bold ${tone === 'bad' ? 'text-band-failed' : ''}`}>{fmtInt(value)}</div>
    </div>
  );
}

/** How the file was read, in words: units, decimal mark, dates, coordinate system. */
function ReadNotes({ report }: { report: ImportReport }) {
  const notes = [
    report.kind === 'segments' &&
      `Lengths read in ${LENGTH_UNIT_WORDS[report.units.length]}, widths in ${WIDTH_UNIT_WORDS[report.units.width]}.`,
    report.decimalComma && 'Numbers are read with a decimal comma (0,125 is 0.125).',
    report.dateFormat && `Dates with slashes are read as ${READ_DATE_WORDS[report.dateFormat]}.`,
    report.crsNote,
  ].filter(Boolean);
  if (!notes.length) return null;
  return (
    <ul className="mt-3 list-disc pl-5 text-sm text-asphalt-muted" data-testid="import-read-notes">
      {notes.map((n) => (
        <li key={String(n)}>{n}</li>
      ))}
    </ul>
  );
}

export function CheckStep({
  report,
  mode,
  onMode,
  values,
  onValues,
  busy,
  onCheckAgain,
  onBack,
  onWrite,
}: {
  report: ImportReport;
  mode: ImportMode;
  onMode: (m: ImportMode) => void;
  values: ValueMap;
  onValues: (v: ValueMap) => void;
  busy: boolean;
  onCheckAgain: () => void;
  onBack: () => void;
  onWrite: () => void;
}) {
  // The counts follow the mode chosen here: all or nothing writes nothing while a row is
  // rejected; skipping writes exactly the rows without problems (what the write will report).
  const refused = mode === 'all-or-nothing' && report.rejected > 0;
  const shown = refused ? { added: 0, updated: 0, unchanged: 0 } : report.acceptedRows;
  const good = report.totalRows - report.rejected;
  return (
    <Card title="Check">
      <div className="num grid grid-cols-2 gap-3 text-sm md:grid-cols-5" data-testid="import-counts">
        <Count label="Rows read" value={report.totalRows} />
        <Count label="Would add" value={shown.added} />
        <Count label="Would update" value={shown.updated} />
        <Count label="Unchanged" value={shown.unchanged} />
        <Count label="Rejected" value={report.rejected} tone={report.rejected ? 'bad' : undefined} />
      </div>
      {refused && (
        <p className="mt-3 text-sm text-band-failed" data-testid="import-refused">
          With “all or nothing”, this file would be refused and nothing written. Skipping the {fmtInt(report.rejected)}{' '}
          rejected row{report.rejected === 1 ? '' : 's'} would add {fmtInt(report.acceptedRows.added)}, update{' '}
          {fmtInt(report.acceptedRows.updated)} and leave {fmtInt(report.acceptedRows.unchanged)} unchanged.
        </p>
      )}
      <ReadNotes report={report} />
      <ValueMatching report={report} values={values} onChange={onValues} busy={busy} onCheckAgain={onCheckAgain} />
      {report.errors.length > 0 && (
        <IssueTable
          title={`Problems (${fmtInt(report.errors.length + report.moreErrors)})`}
          issues={report.errors}
          more={report.moreErrors}
          testId="import-errors"
        />
      )}
      {report.warnings.length > 0 && (
        <IssueTable
          title={`Warnings (${fmtInt(report.warnings.length + report.moreWarnings)})`}
          issues={report.warnings}
          more={report.moreWarnings}
          testId="import-warnings"
        />
      )}
      <UpdateChanges changes={report.changes} updated={report.acceptedRows.updated} />
      {report.preview.length > 0 && (
        <div className="mt-4 overflow-x-auto">
          <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">First rows as they will be written</h3>
          <table className="num text-xs">
            <thead>
              <tr>
                {Object.keys(report.preview[0]).map((k) => (
                  <th key={k} className="px-2 py-1 text-left">
                    {PREVIEW_LABELS[k] ?? k}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {report.preview.map((r, i) => (
                <tr key={i} className="border-t border-asphalt-line/60">
                  {Object.entries(r).map(([k, v]) => (
                    <td key={k} className="max-w-[16rem] truncate px-2 py-1">
                      {previewValue(k, v)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <fieldset className="mt-4 text-sm">
        <legend className="mb-1 font-semibold">When some rows have problems</legend>
        <label className="mr-4">
          <input
            type="radio"
            name="mode"
            checked={mode === 'all-or-nothing'}
            onChange={() => onMode('all-or-nothing')}
          />{' '}
          All or nothing (write nothing)
        </label>
        <label>
          <input type="radio" name="mode" checked={mode === 'skip-invalid'} onChange={() => onMode('skip-invalid')} />{' '}
          Skip the rejected rows, write the rest
        </label>
      </fieldset>
      <div className="mt-4 flex gap-2">
        <Button variant="secondary" onClick={onBack}>
          Back to columns
        </Button>
        <Button disabled={busy || refused || good === 0} onClick={onWrite}>
          {busy ? 'Writing…' : `Write ${fmtInt(good)} rows`}
        </Button>
      </div>
    </Card>
  );
}
