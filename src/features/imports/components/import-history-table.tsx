import { Card } from '@/components/ui/page';
import { useImportHistory } from '@/features/imports/api/get-import-history';
import { fmtInt } from '@/lib/format';

const KIND_WORDS: Record<string, string> = { segments: 'segments', surveys: 'condition surveys' };

export function ImportHistoryTable({ agencyId }: { agencyId: string }) {
  const history = useImportHistory(agencyId);
  return (
    <Card title="Past imports">
      {history.data?.items.length ? (
        <table className="num w-full text-sm" data-testid="import-history">
          <thead className="text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="py-1">When (UTC)</th>
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
                <td>{KIND_WORDS[h.kind] ?? h.kind}</td>
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
        <p className="text-sm text-asphalt-muted">
          No imports yet. Choose a file above to bring in segments or surveys.
        </p>
      )}
    </Card>
  );
}
