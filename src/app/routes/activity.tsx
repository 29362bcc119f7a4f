import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Select, TextInput } from '@/components/ui/field';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { api } from '@/lib/api-client';
import { useAgency } from '../use-agency';

type AuditItem = {
  id: number;
  at: string;
  action: string;
  entity: string;
  entityId: string | null;
  detail: unknown;
  userName: string | null;
  userEmail: string | null;
};

const ENTITIES = [
  'segment',
  'import',
  'mix',
  'treatment',
  'agency',
  'plan',
  'analysis',
  'membership',
  'invitation',
  'curve',
];

export function ActivityPage() {
  const { agencyId } = useAgency();
  const [entity, setEntity] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const params = new URLSearchParams();
  if (entity) params.set('entity', entity);
  if (from) params.set('from', from);
  if (to) params.set('to', to);
  const audit = useQuery({
    queryKey: ['audit', agencyId, params.toString()],
    queryFn: () => api<{ total: number; items: AuditItem[] }>(`/api/agencies/${agencyId}/audit?${params}`),
  });
  return (
    <div className="space-y-4">
      <PageHeader
        title="Activity"
        caption="Every change to roads, surveys, prices, plans and members: who, when, and what changed."
        actions={
          <a
            className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold"
            href={`/api/agencies/${agencyId}/audit.csv?${params}`}
          >
            Export CSV
          </a>
        }
      />
      <div className="flex flex-wrap items-end gap-2 text-sm">
        <Select aria-label="Entity" className="w-40" value={entity} onChange={(e) => setEntity(e.target.value)}>
          <option value="">Everything</option>
          {ENTITIES.map((x) => (
            <option key={x} value={x}>
              {x}
            </option>
          ))}
        </Select>
        <label>
          From{' '}
          <TextInput
            aria-label="From"
            type="date"
            className="w-40"
            value={from}
            onChange={(e) => setFrom(e.target.value)}
          />
        </label>
        <label>
          To{' '}
          <TextInput aria-label="To" type="date" className="w-40" value={to} onChange={(e) => setTo(e.target.value)} />
        </label>
        <span className="num text-asphalt-muted">{audit.data?.total ?? 0} entries</span>
      </div>
      {audit.data?.items.length ? (
        <Card>
          <table className="num w-full text-sm" data-testid="audit-table">
            <thead className="text-left text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1">When</th>
                <th>Who</th>
                <th>Action</th>
                <th>What</th>
                <th>Change</th>
              </tr>
            </thead>
            <tbody>
              {audit.data.items.map((a) => (
                <tr key={a.id} className="border-t border-asphalt-line/60 align-top">
                  <td className="whitespace-nowrap py-1">{a.at.replace('T', ' ').slice(0, 19)}</td>
                  <td>{a.userName ?? '—'}</td>
                  <td>{a.action}</td>
                  <td>
                    {a.entity}{' '}
                    {a.entityId ? (
                      <span className="text-asphalt-muted">
                        {a.entityId.length > 20 ? `${a.entityId.slice(0, 8)}…` : a.entityId}
                      </span>
                    ) : null}
                  </td>
                  <td className="max-w-md truncate font-mono text-xs" title={JSON.stringify(a.detail)}>
                    {a.detail ? JSON.stringify(a.detail) : ''}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
      ) : (
        <EmptyState>No activity matches.</EmptyState>
      )}
    </div>
  );
}
