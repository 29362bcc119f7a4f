import { EXPORT_HEADERS, FIELD_LABELS, SURVEY_FIELDS } from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';

export function ChooseFileStep({
  kind,
  onKind,
  file,
  onFile,
  busy,
  onRead,
}: {
  kind: 'segments' | 'surveys';
  onKind: (k: 'segments' | 'surveys') => void;
  file: File | null;
  onFile: (f: File | null) => void;
  busy: boolean;
  onRead: () => void;
}) {
  const headers =
    kind === 'segments'
      ? [EXPORT_HEADERS.segment_id, EXPORT_HEADERS.road_name, EXPORT_HEADERS.length_mi, EXPORT_HEADERS.width_ft]
      : SURVEY_FIELDS.map((f) => FIELD_LABELS[f]);
  return (
    <Card>
      <div className="flex flex-wrap items-end gap-6">
        <fieldset className="text-sm">
          <legend className="mb-1 font-semibold">What the file holds</legend>
          <label className="mr-4">
            <input type="radio" name="kind" checked={kind === 'segments'} onChange={() => onKind('segments')} />{' '}
            Segments (inventory)
          </label>
          <label>
            <input type="radio" name="kind" checked={kind === 'surveys'} onChange={() => onKind('surveys')} /> Condition
            surveys (segment id, date, PCI)
          </label>
        </fieldset>
        <label className="text-sm">
          <span className="mb-1 block font-semibold">File</span>
          <input
            type="file"
            aria-label="File"
            className="text-sm file:mr-3 file:rounded file:border file:border-asphalt-line file:bg-white file:px-3 file:py-1.5 file:text-sm file:font-semibold file:text-asphalt hover:file:border-asphalt-muted"
            accept=".csv,.txt,.xlsx,.geojson,.json,.zip"
            onChange={(e) => onFile(e.target.files?.[0] ?? null)}
          />
        </label>
        <Button disabled={!file || busy} onClick={onRead}>
          {busy ? 'Reading…' : 'Read the file'}
        </Button>
      </div>
      <p className="mt-3 text-xs text-asphalt-muted">
        A file exported from Wearcourse, or one with headers like {headers.map((h) => `“${h}”`).join(', ')}, needs no
        matching. Units in headers (“Length (km)”, “width_m”) are read. Up to 25 MB and 100,000 rows per file.
      </p>
    </Card>
  );
}
