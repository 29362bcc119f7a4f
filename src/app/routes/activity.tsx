import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { auditParams, useAudit } from '@/features/activity/api/get-audit';
import { AuditChanges } from '@/features/activity/components/audit-changes';
import { fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';

import { ENTITIES, when } from '@/features/activity/components/activity-words';

export function ActivityPage() {
  const { agencyId } = useAgency();
  const [entity, setEntity] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const filters = { entity, from, to };
  const audit = useAudit(agencyId, filters);
  return (
    <div className="space-y-4">
      <PageHeader
        title="Activity"
        caption="Every change to roads, surveys, treatments, prices, plans and members: who, when, and what changed, before and after."
        actions={
          <a
            className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold hover:border-asphalt-muted"
            href={`/api/agencies/${agencyId}/audit.csv?${auditParams(filters)}`}
          >
            Export CSV
          </a>
        }
      />
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <Field label="Show" className="w-60">
          <Select value={entity} onChange={(e) => setEntity(e.target.value)}>
            <option value="">Everything</option>
            {ENTITIES.map(([v, label]) => (
              <option key={v} value={v}>
                {label}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="From" className="w-40">
          <TextInput type="date" value={from} onChange={(e) => setFrom(e.target.value)} />
        </Field>
        <Field label="To" className="w-40">
          <TextInput type="date" value={to} onChange={(e) => setTo(e.target.value)} />
        </Field>
        <span className="num pb-2 text-asphalt-muted" data-testid="audit-total">
          {fmtInt(audit.data?.total ?? 0)} entries
          {(audit.data?.total ?? 0) > 200 ? ' (the latest 200 shown; the CSV has all)' : ''}
        </span>
      </div>
      {audit.data?.items.length ? (
        <Card>
          <table className="w-full text-sm" data-testid="audit-table">
            <thead className="text-left text-xs font-bold text-asphalt-muted">
              <tr>
                <th className="w-36 py-1 pr-3">When</th>
                <th className="w-40 pr-3">Who</th>
                <th className="pr-3">What happened</th>
                <th>Changes</th>
              </tr>
            </thead>
            <tbody>
              {audit.data.items.map((a) => (
                <tr key={a.id} className="border-t border-asphalt-line/60 align-top" data-action={a.action}>
                  <td className="num whitespace-nowrap py-1.5 pr-3">{when(a.at)}</td>
                  <td className="py-1.5 pr-3" title={a.userEmail ?? undefined}>
                    {a.userName ?? '—'}
                  </td>
                  <td className="py-1.5 pr-3">
                    <span>{a.actionText.charAt(0).toUpperCase() + a.actionText.slice(1)}</span>
                    <div className="text-asphalt-muted">
                      {a.entity === 'segment' && a.entityId ? (
                        <Link
                          className="text-accent hover:underline"
                          to={`../roads?q=${encodeURIComponent(a.entityId)}`}
                        >
                          {a.what}
                        </Link>
                      ) : (
                        a.what
                      )}
                    </div>
                  </td>
                  <td className="num py-1.5">
                    <AuditChanges item={a} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
      ) : (
        <EmptyState>{audit.isLoading ? 'Loading…' : 'No activity matches these filters.'}</EmptyState>
      )}
    </div>
  );
}
