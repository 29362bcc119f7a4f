import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { toast } from 'sonner';
import { budgetsOf } from '@shared/schemas/plans';
import { LineChart } from '@/components/charts';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { planResultQueryOptions, useCreatePlan, usePlans } from '@/features/plans/api/plans';
import { useQueries } from '@tanstack/react-query';
import { fmtMoney } from '@/lib/format';
import { useAgency } from '../use-agency';

const COMPARE_COLORS = ['#0f766e', '#1f2328', '#7c6f57', '#4b7fa3'];

export function PlansPage() {
  const { agencyId, membership } = useAgency();
  const plans = usePlans(agencyId);
  const create = useCreatePlan(agencyId);
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [budget, setBudget] = useState('2400000');
  const [picked, setPicked] = useState<string[]>([]);
  const canEdit = membership?.role !== 'viewer';
  const year = new Date().getFullYear() + 1;
  const results = useQueries({ queries: picked.map((id) => planResultQueryOptions(agencyId, id)) });
  const items = plans.data?.items ?? [];
  const compared = picked
    .map((id, i) => ({ plan: items.find((p) => p.id === id), r: results[i]?.data?.latest?.result }))
    .filter((x) => x.plan && x.r);
  return (
    <div className="space-y-5">
      <PageHeader
        title="Plans"
        caption={
          canEdit
            ? 'Budget scenarios: which roads get what, when, and what each budget does to the network.'
            : 'Published paving plans and their council briefs.'
        }
      />
      {canEdit && (
        <Card title="New scenario">
          <form
            className="flex flex-wrap items-end gap-3"
            onSubmit={(e) => {
              e.preventDefault();
              create.mutate(
                {
                  name: name || `$${(Number(budget) / 1e6).toFixed(1)}M a year`,
                  settings: {
                    startYear: year,
                    horizonYears: 10,
                    budgetMode: 'flat',
                    annualBudget: Number(budget),
                    escalationPct: 0,
                    minNetworkPci: null,
                    method: 'fast',
                    weighting: 'lane-miles',
                    treatmentIds: [],
                    needsWorkBelow: 71,
                  },
                },
                { onSuccess: (p) => navigate(p.id), onError: (err) => toast.error(err.message) },
              );
            }}
          >
            <label className="text-sm">
              <span className="block text-xs text-asphalt-muted">Name</span>
              <TextInput
                aria-label="Scenario name"
                className="w-64"
                placeholder="e.g. Council ask, $2.4M"
                value={name}
                onChange={(e) => setName(e.target.value)}
              />
            </label>
            <label className="text-sm">
              <span className="block text-xs text-asphalt-muted">Annual budget ($, base-year)</span>
              <TextInput
                aria-label="Annual budget"
                type="number"
                min={0}
                step={100000}
                className="w-40"
                value={budget}
                onChange={(e) => setBudget(e.target.value)}
              />
            </label>
            <Button type="submit" disabled={create.isPending}>
              Create scenario
            </Button>
            <span className="text-xs text-asphalt-muted">
              {year}–{year + 9}, flat budget, fast method; change anything on the next screen.
            </span>
          </form>
        </Card>
      )}
      {items.length === 0 ? (
        <EmptyState>{canEdit ? 'No scenarios yet — create one above.' : 'No plan has been published yet.'}</EmptyState>
      ) : (
        <Card title="Scenarios">
          <table className="num w-full text-sm" data-testid="plan-list">
            <thead className="text-left text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1">Compare</th>
                <th>Scenario</th>
                <th>Status</th>
                <th className="text-right">Budget (first year)</th>
                <th>Years</th>
                <th>Method</th>
                <th>Last run</th>
              </tr>
            </thead>
            <tbody>
              {items.map((p) => (
                <tr key={p.id} className="border-t border-asphalt-line/60">
                  <td className="py-1.5">
                    <input
                      type="checkbox"
                      aria-label={`Compare ${p.name}`}
                      checked={picked.includes(p.id)}
                      disabled={!picked.includes(p.id) && picked.length >= 4}
                      onChange={(e) =>
                        setPicked(e.target.checked ? [...picked, p.id] : picked.filter((x) => x !== p.id))
                      }
                    />
                  </td>
                  <td>
                    <Link to={p.id} className="font-semibold text-accent hover:underline">
                      {p.name}
                    </Link>
                  </td>
                  <td>
                    {p.status === 'published' ? (
                      <span className="rounded bg-accent-light px-1.5 py-0.5 text-xs font-bold text-accent">
                        published
                      </span>
                    ) : (
                      <span className="text-xs text-asphalt-muted">draft</span>
                    )}
                  </td>
                  <td className="text-right">{fmtMoney(budgetsOf(p.settings)[0] ?? 0)}</td>
                  <td>
                    {p.settings.startYear}–{p.settings.startYear + p.settings.horizonYears - 1}
                  </td>
                  <td>{p.settings.method}</td>
                  <td className="text-xs text-asphalt-muted">
                    {p.lastRun
                      ? `${p.lastRun.status}, ${p.lastRun.startedAt.slice(0, 16).replace('T', ' ')}`
                      : 'not run'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-2 text-xs text-asphalt-muted">Tick up to four scenarios to compare them on one chart.</p>
        </Card>
      )}
      {compared.length > 0 && (
        <Card title="Scenarios compared">
          <LineChart
            testId="scenario-compare-chart"
            x={compared[0].r!.years.map((y) => y.calendarYear)}
            series={compared.map((c, i) => ({
              label: c.plan!.name,
              color: COMPARE_COLORS[i],
              values: c.r!.years.map((y) => y.networkPci),
            }))}
          />
          <table className="num mt-2 w-full text-sm">
            <thead className="text-right text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="text-left">Scenario</th>
                <th>Spent</th>
                <th>PCI at start</th>
                <th>PCI at end</th>
                <th>Backlog at end</th>
                <th>Segments treated</th>
              </tr>
            </thead>
            <tbody>
              {compared.map((c, i) => (
                <tr key={c.plan!.id} className="border-t border-asphalt-line/60 text-right">
                  <td className="py-1 text-left">
                    <span
                      className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm"
                      style={{ background: COMPARE_COLORS[i] }}
                    />
                    {c.plan!.name}
                  </td>
                  <td>{fmtMoney(c.r!.summary.totalSpent)}</td>
                  <td>{c.r!.summary.startPci.toFixed(1)}</td>
                  <td>{c.r!.summary.finalPci.toFixed(1)}</td>
                  <td>{fmtMoney(c.r!.summary.backlogEnd)}</td>
                  <td>{c.r!.summary.segmentsTreated}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
      )}
    </div>
  );
}
