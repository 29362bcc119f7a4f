import type { SegmentChange } from '@shared/schemas/imports';
import { fmtInt } from '@/lib/format';

/** "Would update", field by field: what each changed segment has now and what the file would write. */
export function UpdateChanges({ changes, updated }: { changes: SegmentChange[]; updated: number }) {
  if (!changes.length) return null;
  return (
    <div className="mt-4">
      <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">
        What would change
        {updated > changes.length ? ` (the first ${fmtInt(changes.length)} of ${fmtInt(updated)})` : ''}
      </h3>
      <div className="max-h-72 overflow-y-auto rounded border border-asphalt-line">
        <table className="w-full text-sm" data-testid="import-changes">
          <thead className="sticky top-0 bg-paper text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="px-2 py-1">Row</th>
              <th>Segment</th>
              <th>Field</th>
              <th>Now</th>
              <th>From the file</th>
            </tr>
          </thead>
          <tbody>
            {changes.flatMap((c) =>
              c.fields.map((f, i) => (
                <tr key={`${c.row}|${f.field}`} className={i === 0 ? 'border-t border-asphalt-line/60' : ''}>
                  <td className="num px-2 py-1">{i === 0 ? c.row : ''}</td>
                  <td>{i === 0 ? c.segmentId : ''}</td>
                  <td>{f.label}</td>
                  <td className="text-asphalt-muted line-through decoration-asphalt-muted/40">{f.before}</td>
                  <td className="font-semibold">{f.after}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
