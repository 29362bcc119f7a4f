import { useState } from 'react';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { useSentMail } from '@/features/members/api/get-sent-mail';
import { useAgency } from '../use-agency';

/** Mail the local catcher received for this agency: the desk install's outbox. */
export function SentMailPage() {
  const { agencyId } = useAgency();
  const mail = useSentMail(agencyId);
  const [open, setOpen] = useState<number | null>(null);
  return (
    <div>
      <PageHeader
        title="Sent mail"
        caption="While no SMTP server is configured, Wearcourse keeps its outgoing mail here instead of sending it."
      />
      {mail.data && !mail.data.enabled && (
        <EmptyState>Mail goes through the configured SMTP server; nothing is kept here.</EmptyState>
      )}
      {mail.data?.enabled && mail.data.items.length === 0 && (
        <EmptyState>No mail yet. Invitations and plan notices will appear here.</EmptyState>
      )}
      <div className="space-y-2">
        {mail.data?.items.map((m) => (
          <Card key={m.id}>
            <button type="button" className="w-full text-left" onClick={() => setOpen(open === m.id ? null : m.id)}>
              <div className="flex justify-between text-sm">
                <span className="font-semibold">{m.subject}</span>
                <span className="num text-asphalt-muted">{m.receivedAt.replace('T', ' ').slice(0, 16)}</span>
              </div>
              <div className="text-xs text-asphalt-muted">to {m.toAddress}</div>
            </button>
            {open === m.id && (
              <pre className="mt-3 whitespace-pre-wrap font-sans text-sm" data-testid="mail-body">
                {linkify(m.textBody)}
              </pre>
            )}
          </Card>
        ))}
      </div>
    </div>
  );
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="text-accent underline">
        {part}
      </a>
    ) : (
      part
    ),
  );
}
