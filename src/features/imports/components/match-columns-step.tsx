import {
  DATE_FORMAT_LABELS,
  type DateFormat,
  DateFormatSchema,
  FIELD_LABELS,
  type ImportReport,
  REQUIRED_SEGMENT_FIELDS,
  SEGMENT_FIELDS,
  SURVEY_FIELDS,
} from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { fmtInt } from '@/lib/format';

const SURVEY_REQUIRED = ['segment_id', 'survey_date', 'pci'];

export type ReadChoices = {
  mapping: Record<string, string>;
  units: { length: string; width: string };
  crs: string;
  dateFormat: DateFormat;
};

export function MatchColumnsStep({
  kind,
  fileName,
  report,
  choices,
  onChange,
  busy,
  onBack,
  onCheck,
}: {
  kind: 'segments' | 'surveys';
  fileName: string;
  report: ImportReport;
  choices: ReadChoices;
  onChange: (c: ReadChoices) => void;
  busy: boolean;
  onBack: () => void;
  onCheck: () => void;
}) {
  const fields = kind === 'segments' ? SEGMENT_FIELDS : SURVEY_FIELDS;
  const required: string[] = kind === 'segments' ? REQUIRED_SEGMENT_FIELDS : SURVEY_REQUIRED;
  const geo = report.format === 'geojson' || report.format === 'shapefile';
  const set = (patch: Partial<ReadChoices>) => onChange({ ...choices, ...patch });
  return (
    <Card title={`Match columns — ${fileName} (${fmtInt(report.totalRows)} rows, ${report.format.toUpperCase()})`}>
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
            const col = choices.mapping[f] ?? '';
            const samples = report.columns.find((c) => c.name === col)?.samples ?? [];
            return (
              <tr key={f} className="border-t border-asphalt-line/60">
                <td className="py-1.5 pr-3">
                  {FIELD_LABELS[f]}
                  {required.includes(f) && <span className="text-band-failed"> *</span>}
                </td>
                <td className="pr-3">
                  <Select
                    aria-label={`Column for ${FIELD_LABELS[f]}`}
                    value={col}
                    onChange={(e) => set({ mapping: { ...choices.mapping, [f]: e.target.value } })}
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
      <div className="mt-4 flex flex-wrap gap-4 text-sm">
        {kind === 'segments' && (
          <>
            <label>
              Length unit{' '}
              <Select
                aria-label="Length unit"
                className="w-32"
                value={choices.units.length}
                onChange={(e) => set({ units: { ...choices.units, length: e.target.value } })}
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
                value={choices.units.width}
                onChange={(e) => set({ units: { ...choices.units, width: e.target.value } })}
              >
                <option value="ft">feet</option>
                <option value="m">metres</option>
              </Select>
            </label>
          </>
        )}
        <label>
          Dates written as{' '}
          <Select
            aria-label="Dates written as"
            className="w-64"
            value={choices.dateFormat}
            onChange={(e) => set({ dateFormat: DateFormatSchema.parse(e.target.value) })}
          >
            {DateFormatSchema.options.map((f) => (
              <option key={f} value={f}>
                {DATE_FORMAT_LABELS[f]}
              </option>
            ))}
          </Select>
        </label>
        {kind === 'segments' && geo && (
          <label>
            Coordinate system{' '}
            <TextInput
              aria-label="Coordinate system"
              className="w-48"
              placeholder={report.crsNote ? 'as the file says' : 'EPSG:3419 (blank = lon/lat)'}
              value={choices.crs}
              onChange={(e) => set({ crs: e.target.value.trim() })}
            />
          </label>
        )}
      </div>
      {report.crsNote && <p className="mt-2 text-xs text-asphalt-muted">{report.crsNote}</p>}
      <div className="mt-4 flex gap-2">
        <Button variant="secondary" onClick={onBack}>
          Back
        </Button>
        <Button disabled={busy} onClick={onCheck}>
          {busy ? 'Checking…' : 'Check the file'}
        </Button>
      </div>
    </Card>
  );
}
