import type { AuditItem } from '@shared/schemas/audit';

/** An entry's changes as "Field: before → after", then its facts, in words. */
export function AuditChanges({ item }: { item: AuditItem }) {
  if (!item.changes.length && !item.facts.length) return <span className="text-asphalt-muted">—</span>;
  return (
    <ul className="space-y-0.5">
      {item.changes.map((c) => (
        <li key={`c-${c.field}`}>
          <span className="text-asphalt-muted">{c.field}:</span>{' '}
          <span className="line-through decoration-asphalt-muted/50">{c.before}</span> →{' '}
          <span className="font-semibold">{c.after}</span>
        </li>
      ))}
      {item.facts.map((f) => (
        <li key={`f-${f.field}`}>
          <span className="text-asphalt-muted">{f.field}:</span> {f.value}
        </li>
      ))}
    </ul>
  );
}

/** The sentence for lists: "Dana Whitlock edited a segment: segment BC-E10-05 (County Highway 14)". */
export const auditSentence = (i: AuditItem) => `${i.userName ?? 'Someone'} ${i.actionText}: ${i.what}`;
