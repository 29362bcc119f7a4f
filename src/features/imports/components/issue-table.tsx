import type { ImportIssue } from '@shared/schemas/imports';
import { fmtInt } from '@/lib/format';

export function IssueTable({
  title,
  issues,
  more,
  testId,
}: {
  title: string;
  issues: ImportIssue[];
  more: number;
  testId: string;
}) {
  return (
    <div className="mt-4">
      <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">{title}</h3>
      <div className="max-h-64 overflow-y-auto rounded border border-asphalt-line">
        <table className="num w-full text-sm" data-testid={testId}>
          <thead className="sticky top-0 bg-paper text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="px-2 py-1">Row</th>
              <th className="pr-3">Column</th>
              <th className="pr-3">Value</th>
              <th>Reason</th>
            </tr>
          </thead>
          <tbody>
            {issues.slice(0, 500).map((e, i) => (
              <tr key={i} className="border-t border-asphalt-line/60">
                <td className="px-2 py-1">{e.row}</td>
                <td className="pr-3">{e.column}</td>
                <td className="max-w-xs truncate pr-3 font-mono text-xs" title={e.value}>
                  {e.value || '—'}
                </td>
                <td>{e.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {issues.length + more > 500 && (
        <p className="mt-1 text-xs text-asphalt-muted">The first 500 of {fmtInt(issues.length + more)} are shown.</p>
      )}
    </div>
  );
}
