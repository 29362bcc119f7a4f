import { useAudit } from '../api/get-audit';
import { auditSentence } from './audit-changes';

/** The last few entries of the activity trail, one sentence each. */
export function RecentActivity({ agencyId }: { agencyId: string }) {
  const q = useAudit(agencyId, { limit: 6 });
  if (!q.data?.items.length) return <p className="text-sm text-asphalt-muted">Nothing yet.</p>;
  return (
    <ul className="space-y-1.5 text-sm" data-testid="recent-activity">
      {q.data.items.map((a) => (
        <li key={a.id} className="flex justify-between gap-3">
          <span className="min-w-0">{auditSentence(a)}</span>
          <span className="num shrink-0 text-xs text-asphalt-muted">{a.at.slice(0, 10)}</span>
        </li>
      ))}
    </ul>
  );
}
