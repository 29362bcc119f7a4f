import { useState } from 'react';
import {
  FIELD_LABELS,
  type ImportReport,
  REQUIRED_SEGMENT_FIELDS,
  SEGMENT_FIELDS,
  SURVEY_FIELDS,
} from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { Card, PageHeader } from '@/components/ui/page';
import { useImportHistory } from '@/features/imports/api/get-import-history';
import { type ImportRequest, useRunImport } from '@/features/imports/api/run-import';
import { fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';

const STEPS = ['Choose file', 'Match columns', 'Check', 'Write'];
const SURVEY_REQUIRED = ['segment_id', 'survey_date', 'pci'];

export function ImportsPage() {
  const { agencyId } = useAgency();
  const run = useRunImport(agencyId);
  const history = useImportHistory(agencyId);
  const [step, setStep] = useState(0);
  const [kind, setKind] = useState<'segments' | 'surveys'>('segments');
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<Record<string, string>>({});
  const [units, setUnits] = useState({ length: 'mi', width: 'ft' });
  const [crs, setCrs] = useState('');
  const [mode, setMode] = useState<'all-or-nothing' | 'skip-invalid'>('all-or-nothing');
  const [report, setReport] = useState<ImportReport | null>(null);
  const [status, setStatus] = useState(0);
  const [error, setError] = useState<string | null>(null);

  const fields = kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS;
  const required: string[] = kind === 'segments' ? REQUIRED_SEGMENT_FIELDS : SURVEY_REQUIRED;
  const request = (over: Partial<ImportRequest>): ImportRequest => ({
    file: file!,
    kind,
    mapping,
    crs: crs || undefined,
    mode,
    dryRun: true,
    lengthUnit: units.length,
    widthUnit: units.width,
    ...over,
  });
  const go = (req: ImportRequest, next: number) => {
    setError(null);
    run.mutate(req, {
      onSuccess: ({ status: s, report: r }) => {
        setReport(r);
        setStatus(s);
        if (next === 1) {
          setMapping(r.mapping);
          setUnits(r.units);
          setCrs(r.crs ?? '');
        }
        setStep(next);
      },
      onError: (e) => setError(e.message),
    });
  };
  const reset = () => {
    setStep(0);
    setFile(null);
    setReport(null);
    setError(null);
  };
  const geo = report?.format === 'geojson' || report?.format === 'shapefile';

  return (
    <div className="space-y-5">
      <PageHeader
        title="Imports"
        caption="Bring in segments or condition surveys from a spreadsheet (CSV, XLSX) or a GIS export (GeoJSON, zipped shapefile). Nothing is written until the last step, and then all at once."
      />
      <ol className="flex gap-2 text-sm" aria-label="Import steps">
        {STEPS.map((s, i) => (
          <li
            key={s}
            className={`rounded-full px-3 py-1 ${i === step ? 'bg-accent font-bold text-white' : i < step ? 'bg-accent-light text-accent' : 'bg-white text-asphalt-muted'}`}
            aria-current={i === step ? 'step' : undefined}
          >
            {i + 1}. {s}
          </li>
        ))}
      </ol>
      {error && (
        <div role="alert" className="rounded border border-band-failed/40 bg-white p-3 text-sm text-band-failed">
          {error}
        </div>
      )}

      {step === 0 && (
        <Card>
          <div className="flex flex-wrap items-end gap-6">
            <fieldset className="text-sm">
              <legend className="mb-1 font-semibold">What the file holds</legend>
              <label className="mr-4">
                <input type="radio" name="kind" checked={kind === 'segments'} onChange={() => setKind('segments')} />{' '}
                Segments (inventory)
              </label>
              <label>
                <input type="radio" name="kind" checked={kind === 'surveys'} onChange={() => setKind('surveys')} />{' '}
                Condition surveys (segment id, date, PCI)
              </label>
            </fieldset>
            <label className="text-sm">
              <span className="mb-1 block font-semibold">File</span>
              <input
                type="file"
                aria-label="File"
                accept=".csv,.txt,.xlsx,.geojson,.json,.zip"
                onChange={(e) => setFile(e.target.files?.[0] ?? null)}
              />
            </label>
            <Button disabled={!file || run.isPending} onClick={() => go({ file: file!, kind, mode, dryRun: true }, 1)}>
              {run.isPending ? 'Reading…' : 'Read the file'}
            </Button>
          </div>
          <p className="mt-3 text-xs text-asphalt-muted">
            Headers named like ours ({(kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS).join(', ')}) need no
            matching. Up to 25 MB and 100,000 rows per file.
          </p>
        </Card>
      )}

      {step === 1 && report && (
        <Card
          title={`Match columns — ${file?.name} (${fmtInt(report.totalRows)} rows, ${report.format.toUpperCase()})`}
        >
          <table className="w-full text-sm" data-testid="mapping-table">
            <thead className="text-left text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1">Wearcourse field</th>
                <th>Column in your file</th>
                <th>Sample values</th>
              </tr>
            </thead>
            <tbody>
              {fields.map((f) => {
                const col = mapping[f] ?? '';
                const samples = report.columns.find((c) => c.name === col)?.samples ?? [];
                return (
                  <tr key={f} className="border-t border-asphalt-line/60">
                    <td className="py-1.5 pr-3">
                      {FIELD_LABELS[f]}
                      {required.includes(f) && <span className="text-band-failed"> *</span>}
                    </td>
                    <td className="pr-3">
                      <Select
                        aria-label={`Column for ${f}`}
                        value={col}
                        onChange={(e) => setMapping({ ...mapping, [f]: e.target.value })}
                      >
                        <option value="">— not in this file —</option>
                        {report.columns.map((c) => (
                          <option key={c.name} value={c.name}>
                            {c.name}
                          </option>
                        ))}
                      </Select>
                    </td>
                    <td className="num text-xs text-asphalt-muted">{samples.join(' · ') || '—'}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {kind === 'segments' && (
            <div className="mt-4 flex flex-wrap gap-4 text-sm">
              <label>
                Length unit{' '}
                <Select
                  aria-label="Length unit"
                  className="w-28"
                  value={units.length}
                  onChange={(e) => setUnits({ ...units, length: e.target.value })}
                >
                  <option value="mi">miles</option>
                  <option value="km">kilometres</option>
                  <option value="ft">feet</option>
                  <option value="m">metres</option>
                </Select>
              </label>
              <label>
                Width unit{' '}
                <Select
                  aria-label="Width unit"
                  className="w-28"
                  value={units.width}
                  onChange={(e) => setUnits({ ...units, width: e.target.value })}
                >
                  <option value="ft">feet</option>
                  <option value="m">metres</option>
                </Select>
              </label>
              {geo && (
                <label>
                  Coordinate system{' '}
                  <TextInput
                    aria-label="Coordinate system"
                    className="w-40"
                    placeholder="EPSG:3419 (blank = lon/lat)"
                    value={crs}
                    onChange={(e) => setCrs(e.target.value.trim())}
                  />
                </label>
              )}
            </div>
          )}
          <div className="mt-4 flex gap-2">
            <Button variant="secondary" onClick={reset}>
              Back
            </Button>
            <Button
              disabled={run.isPending}
              onClick={() =>
                go(request({ mapping: Object.fromEntries(Object.entries(mapping).filter(([, v]) => v)) }), 2)
              }
            >
              {run.isPending ? 'Checking…' : 'Check the file'}
            </Button>
          </div>
        </Card>
      )}

      {step === 2 && report && (
        <Card title="Check">
          <div className="num grid grid-cols-2 gap-3 text-sm md:grid-cols-5" data-testid="import-counts">
            <Count label="Rows read" value={report.totalRows} />
            <Count label="Would add" value={report.added} />
            <Count label="Would update" value={report.updated} />
            <Count label="Unchanged" value={report.unchanged} />
            <Count label="Rejected" value={report.rejected} tone={report.rejected ? 'bad' : undefined} />
          </div>
          {status === 422 && mode === 'all-or-nothing' && (
            <p className="mt-3 text-sm text-band-failed">
              With “all or nothing”, this file would be refused: fix the rows below, or choose to skip them.
            </p>
          )}
          {report.errors.length > 0 && (
            <IssueTable title={`Problems (${report.errors.length})`} issues={report.errors} testId="import-errors" />
          )}
          {report.warnings.length > 0 && (
            <IssueTable
              title={`Warnings (${report.warnings.length})`}
              issues={report.warnings}
              testId="import-warnings"
            />
          )}
          {report.preview.length > 0 && (
            <div className="mt-4 overflow-x-auto">
              <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">
                First rows as they will be written
              </h3>
              <table className="num text-xs">
                <thead>
                  <tr>
                    {Object.keys(report.preview[0]).map((k) => (
                      <th key={k} className="px-2 py-1 text-left">
                        {k}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {report.preview.map((r, i) => (
                    <tr key={i} className="border-t border-asphalt-line/60">
                      {Object.values(r).map((v, j) => (
                        <td key={j} className="px-2 py-1">
                          {v === null ? '—' : String(v)}
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
                onChange={() => setMode('all-or-nothing')}
              />{' '}
              All or nothing (write nothing)
            </label>
            <label>
              <input
                type="radio"
                name="mode"
                checked={mode === 'skip-invalid'}
                onChange={() => setMode('skip-invalid')}
              />{' '}
              Skip the rejected rows, write the rest
            </label>
          </fieldset>
          <div className="mt-4 flex gap-2">
            <Button variant="secondary" onClick={() => setStep(1)}>
              Back to columns
            </Button>
            <Button
              disabled={
                run.isPending ||
                (mode === 'all-or-nothing' && report.rejected > 0) ||
                report.totalRows === report.rejected
              }
              onClick={() =>
                go(
                  request({ mapping: Object.fromEntries(Object.entries(mapping).filter(([, v]) => v)), dryRun: false }),
                  3,
                )
              }
            >
              {run.isPending ? 'Writing…' : `Write ${fmtInt(report.totalRows - report.rejected)} rows`}
            </Button>
          </div>
        </Card>
      )}

      {step === 3 && report && (
        <Card title="Written">
          <p className="text-sm" role="status" data-testid="import-result">
            {status === 200
              ? `Added ${fmtInt(report.added)}, updated ${fmtInt(report.updated)}, unchanged ${fmtInt(report.unchanged)}, rejected ${fmtInt(report.rejected)}.`
              : 'The file was refused; nothing was written.'}
          </p>
          {report.importId && report.rejected > 0 && (
            <a
              className="mt-2 inline-block text-sm font-semibold text-accent hover:underline"
              href={`/api/agencies/${agencyId}/imports/${report.importId}/rejected.csv`}
            >
              Download the rejected rows (CSV with reasons)
            </a>
          )}
          <div className="mt-4">
            <Button onClick={reset}>Import another file</Button>
          </div>
        </Card>
      )}

      <Card title="Past imports">
        {history.data?.items.length ? (
          <table className="num w-full text-sm" data-testid="import-history">
            <thead className="text-left text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1">When</th>
                <th>File</th>
                <th>Kind</th>
                <th>By</th>
                <th className="text-right">Added</th>
                <th className="text-right">Updated</th>
                <th className="text-right">Unchanged</th>
                <th className="text-right">Rejected</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {history.data.items.map((h) => (
                <tr key={h.id} className="border-t border-asphalt-line/60">
                  <td className="py-1">{h.createdAt.replace('T', ' ').slice(0, 16)}</td>
                  <td>{h.fileName}</td>
                  <td>{h.kind}</td>
                  <td>{h.userName ?? '—'}</td>
                  <td className="text-right">{fmtInt(h.added)}</td>
                  <td className="text-right">{fmtInt(h.updated)}</td>
                  <td className="text-right">{fmtInt(h.unchanged)}</td>
                  <td className="text-right">{fmtInt(h.rejected)}</td>
                  <td className="text-right">
                    {h.rejected > 0 && (
                      <a
                        className="text-accent hover:underline"
                        href={`/api/agencies/${agencyId}/imports/${h.id}/rejected.csv`}
                      >
                        rejected rows
                      </a>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="text-sm text-asphalt-muted">No imports yet.</p>
        )}
      </Card>
    </div>
  );
}

function Count({ label, value, tone }: { label: string; value: number; tone?: 'bad' }) {
  return (
    <div className="rounded border border-asphalt-line p-2">
      <div className="text-xs uppercase text-asphalt-muted">{label}</div>
      <div className={`text-xl font-bold ${tone === 'bad' ? 'text-band-failed' : ''}`}>{fmtInt(value)}</div>
    </div>
  );
}

function IssueTable({ title, issues, testId }: { title: string; issues: ImportReport['errors']; testId: string }) {
  return (
    <div className="mt-4">
      <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">{title}</h3>
      <div className="max-h-64 overflow-y-auto rounded border border-asphalt-line">
        <table className="num w-full text-sm" data-testid={testId}>
          <thead className="sticky top-0 bg-paper text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="px-2 py-1">Row</th>
              <th>Column</th>
              <th>Value</th>
              <th>Reason</th>
            </tr>
          </thead>
          <tbody>
            {issues.slice(0, 500).map((e, i) => (
              <tr key={i} className="border-t border-asphalt-line/60">
                <td className="px-2 py-1">{e.row}</td>
                <td>{e.column}</td>
                <td className="font-mono text-xs">{e.value || '—'}</td>
                <td>{e.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
