import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { toast } from 'sonner';
import { CONDITION_BANDS } from '@shared/condition';
import type { PlanResult } from '@shared/engine/plan/run-plan';
import { budgetsOf, type PlanSettingsInput } from '@shared/schemas/plans';
import { LineChart, StackedBars } from '@/components/charts';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { Caution, Card, EmptyState, PageHeader } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import {
  useBudgetSearch,
  usePlan,
  usePlanResult,
  usePlanRun,
  usePublishPlan,
  useRunPlan,
  useStartBudgetSearch,
  useUpdatePlan,
} from '@/features/plans/api/plans';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

const money = (v: number) => (Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : fmtMoney(v));

function Inputs({
  agencyId,
  planId,
  name0,
  s0,
}: {
  agencyId: string;
  planId: string;
  name0: string;
  s0: PlanSettingsInput;
}) {
  const [name, setName] = useState(name0);
  const [s, setS] = useState<PlanSettingsInput>(s0);
  const update = useUpdatePlan(agencyId, planId);
  const catalog = useCatalog(agencyId);
  const budgets = budgetsOf(s);
  const set = (patch: Partial<PlanSettingsInput>) => setS({ ...s, ...patch });
  return (
    <Card title="Inputs">
      <div className="grid grid-cols-2 gap-3 text-sm md:grid-cols-4">
        <label className="col-span-2">
          <span className="block text-xs text-asphalt-muted">Scenario name</span>
          <TextInput aria-label="Plan name" value={name} onChange={(e) => setName(e.target.value)} />
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Start year</span>
          <TextInput
            aria-label="Start year"
            type="number"
            value={s.startYear}
            onChange={(e) => set({ startYear: Number(e.target.value) })}
          />
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Horizon (1–20 yr)</span>
          <TextInput
            aria-label="Horizon"
            type="number"
            min={1}
            max={20}
            value={s.horizonYears}
            onChange={(e) =>
              set({
                horizonYears: Number(e.target.value),
                budgets:
                  s.budgetMode === 'custom'
                    ? Array.from({ length: Number(e.target.value) }, (_, i) => s.budgets?.[i] ?? s.budgets?.[0] ?? 0)
                    : s.budgets,
              })
            }
          />
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Budget</span>
          <Select
            aria-label="Budget mode"
            value={s.budgetMode}
            onChange={(e) =>
              set({
                budgetMode: e.target.value as PlanSettingsInput['budgetMode'],
                budgets: e.target.value === 'custom' ? budgets : s.budgets,
                annualBudget: s.annualBudget ?? budgets[0],
              })
            }
          >
            <option value="flat">flat</option>
            <option value="escalating">escalating</option>
            <option value="custom">typed per year</option>
          </Select>
        </label>
        {s.budgetMode !== 'custom' && (
          <label>
            <span className="block text-xs text-asphalt-muted">Annual budget ($)</span>
            <TextInput
              aria-label="Annual budget"
              type="number"
              step={100000}
              value={s.annualBudget ?? 0}
              onChange={(e) => set({ annualBudget: Number(e.target.value) })}
            />
          </label>
        )}
        {s.budgetMode === 'escalating' && (
          <label>
            <span className="block text-xs text-asphalt-muted">Escalation (% a year)</span>
            <TextInput
              aria-label="Escalation"
              type="number"
              step={0.5}
              value={s.escalationPct}
              onChange={(e) => set({ escalationPct: Number(e.target.value) })}
            />
          </label>
        )}
        <label>
          <span className="block text-xs text-asphalt-muted">Method</span>
          <Select
            aria-label="Method"
            value={s.method}
            onChange={(e) => set({ method: e.target.value as PlanSettingsInput['method'] })}
          >
            <option value="fast">fast (Lagrangian, reports its gap)</option>
            <option value="exact">exact (HiGHS MIP)</option>
            <option value="ranking">worst-first ranking</option>
          </Select>
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Benefit weighting</span>
          <Select
            aria-label="Weighting"
            value={s.weighting}
            onChange={(e) => set({ weighting: e.target.value as PlanSettingsInput['weighting'] })}
          >
            <option value="lane-miles">lane-miles</option>
            <option value="lane-miles-traffic">lane-miles × log traffic</option>
          </Select>
        </label>
        <label>
          <span className="block text-xs text-asphalt-muted">Minimum network PCI (exact method enforces it)</span>
          <TextInput
            aria-label="Minimum network PCI"
            type="number"
            min={0}
            max={100}
            value={s.minNetworkPci ?? ''}
            onChange={(e) => set({ minNetworkPci: e.target.value === '' ? null : Number(e.target.value) })}
          />
        </label>
      </div>
      <div className="mt-3 overflow-x-auto">
        <table className="num text-sm" data-testid="budget-row">
          <tbody>
            <tr>
              {budgets.map((_, i) => (
                <th key={i} className="px-1 text-xs font-normal text-asphalt-muted">
                  {s.startYear + i}
                </th>
              ))}
            </tr>
            <tr>
              {budgets.map((b, i) => (
                <td key={i} className="px-1">
                  {s.budgetMode === 'custom' ? (
                    <TextInput
                      aria-label={`Budget ${s.startYear + i}`}
                      type="number"
                      className="w-24 text-right"
                      value={b}
                      onChange={(e) => set({ budgets: budgets.map((x, k) => (k === i ? Number(e.target.value) : x)) })}
                    />
                  ) : (
                    <span className="block w-24 text-right text-xs">{money(b)}</span>
                  )}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
      <fieldset className="mt-3 text-sm">
        <legend className="text-xs text-asphalt-muted">Treatments the plan may use (none ticked = all)</legend>
        <div className="flex flex-wrap gap-3">
          {catalog.data?.treatments.map((t) => (
            <label key={t.id} className="flex items-center gap-1">
              <input
                type="checkbox"
                checked={s.treatmentIds.includes(t.id)}
                onChange={(e) =>
                  set({
                    treatmentIds: e.target.checked
                      ? [...s.treatmentIds, t.id]
                      : s.treatmentIds.filter((x) => x !== t.id),
                  })
                }
              />
              {t.name}
            </label>
          ))}
        </div>
      </fieldset>
      <Button
        className="mt-3"
        variant="secondary"
        disabled={update.isPending}
        onClick={() =>
          update.mutate(
            { name, settings: s },
            { onSuccess: () => toast.success('Scenario saved'), onError: (e) => toast.error(e.message) },
          )
        }
      >
        Save inputs
      </Button>
    </Card>
  );
}

function Results({ agencyId, r }: { agencyId: string; r: PlanResult }) {
  const years = r.years.map((y) => y.calendarYear);
  const geo = useSegmentsGeoJson(agencyId, {});
  const planned = useMemo(() => new Map(r.work.map((w) => [w.ref, w.year])), [r]);
  const [yearFilter, setYearFilter] = useState<number | 'all'>(0);
  const work = r.work.filter((w) => yearFilter === 'all' || w.year === yearFilter);
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  return (
    <div className="space-y-4" data-testid="plan-results">
      <p className="text-sm" data-testid="plan-caption">
        At {money(r.summary.totalBudget / r.years.length)} a year the network PCI goes from{' '}
        {r.summary.startPci.toFixed(0)} in {first.calendarYear} to {r.summary.finalPci.toFixed(0)} by{' '}
        {last.calendarYear} (no work: {r.summary.finalPciDoNothing.toFixed(0)}; the same money spent worst-first:{' '}
        {r.baseline.finalPci.toFixed(0)}). {r.solution.status}; gap to the bound {(r.solution.gap * 100).toFixed(2)} %.
      </p>
      {r.floorMissedIn.length > 0 && (
        <Caution>
          The minimum network PCI of {r.minNetworkPci} is not reached in {r.floorMissedIn.join(', ')}. Try “Find the
          budget” below.
        </Caution>
      )}
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <Card title="Network PCI by year">
          <LineChart
            testId="pci-by-year"
            x={years}
            series={[
              { label: 'this plan', color: '#0f766e', values: r.years.map((y) => y.networkPci) },
              {
                label: 'worst-first',
                color: '#8c8574',
                dashed: true,
                values: r.baseline.years.map((y) => y.networkPci),
              },
              { label: 'no work', color: '#7f1d1d', dashed: true, values: r.years.map((y) => y.networkPciDoNothing) },
            ]}
          />
        </Card>
        <Card title="Lane-miles by condition band">
          <StackedBars
            testId="bands-by-year"
            x={years}
            format={(v) => fmtInt(v)}
            stacks={CONDITION_BANDS.slice()
              .reverse()
              .map((b) => ({
                label: `${b.label} (${b.min}–${b.max})`,
                color: b.color,
                values: r.years.map((y) => y.laneMilesByBand[b.id] ?? 0),
              }))}
          />
          <p className="text-xs text-asphalt-muted">
            {CONDITION_BANDS.map(
              (b) =>
                `${b.label} ${b.min}–${b.max}: ${fmtInt(first.laneMilesByBand[b.id])} → ${fmtInt(last.laneMilesByBand[b.id])} lane-mi`,
            ).join(' · ')}
          </p>
        </Card>
        <Card title="Backlog and spending">
          <StackedBars
            testId="backlog-by-year"
            x={years}
            format={(v) => money(v)}
            stacks={[{ label: 'backlog', color: '#b45309', values: r.years.map((y) => y.backlog) }]}
          />
          <table className="num mt-2 w-full text-right text-xs">
            <thead className="uppercase text-asphalt-muted">
              <tr>
                <th className="text-left">Year</th>
                <th>Budget</th>
                <th>Spent</th>
                <th>Backlog</th>
                <th>PCI</th>
              </tr>
            </thead>
            <tbody>
              {r.years.map((y) => (
                <tr key={y.year} className="border-t border-asphalt-line/60">
                  <td className="text-left">{y.calendarYear}</td>
                  <td>{fmtMoney(y.budget)}</td>
                  <td>{fmtMoney(y.spent)}</td>
                  <td>{fmtMoney(y.backlog)}</td>
                  <td>{fmt1(y.networkPci)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
        <Card title="Map: work by planned year">
          <LazyNetworkMap
            agencyId={agencyId}
            features={geo.data}
            plannedYear={planned}
            yearLabels={years.map(String)}
            height={360}
          />
        </Card>
      </div>
      <Card title="Work list">
        <div className="mb-2 flex items-center gap-2 text-sm">
          <Select
            aria-label="Work list year"
            className="w-36"
            value={String(yearFilter)}
            onChange={(e) => setYearFilter(e.target.value === 'all' ? 'all' : Number(e.target.value))}
          >
            {r.years.map((y) => (
              <option key={y.year} value={y.year}>
                {y.calendarYear}
              </option>
            ))}
            <option value="all">all years</option>
          </Select>
          <span className="num text-asphalt-muted">
            {work.length} jobs · {fmtInt(work.reduce((s, w) => s + w.tons, 0))} tons ·{' '}
            {fmtInt(work.reduce((s, w) => s + w.areaSy, 0))} SY · {fmtMoney(work.reduce((s, w) => s + w.cost, 0))}
          </span>
        </div>
        <div className="max-h-96 overflow-y-auto">
          <table className="num w-full text-sm" data-testid="work-list">
            <thead className="sticky top-0 bg-white text-left text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1">Year</th>
                <th>Segment</th>
                <th>Road</th>
                <th>Treatment</th>
                <th>Mix</th>
                <th className="text-right">Lift (in)</th>
                <th className="text-right">Tons</th>
                <th className="text-right">SY</th>
                <th className="text-right">Cost</th>
                <th className="text-right">PCI</th>
              </tr>
            </thead>
            <tbody>
              {work.slice(0, 500).map((w) => (
                <tr key={`${w.ref}-${w.year}`} className="border-t border-asphalt-line/60">
                  <td className="py-1">{w.calendarYear}</td>
                  <td>
                    <Link className="text-accent hover:underline" to={`../../roads/${w.ref}`} relative="path">
                      {w.segmentId}
                    </Link>
                  </td>
                  <td>{w.roadName}</td>
                  <td>{w.treatment}</td>
                  <td>{w.mix ?? '—'}</td>
                  <td className="text-right">{w.thicknessIn ?? '—'}</td>
                  <td className="text-right">{w.tons ? fmtInt(w.tons) : '—'}</td>
                  <td className="text-right">{fmtInt(w.areaSy)}</td>
                  <td className="text-right">{fmtMoney(w.cost)}</td>
                  <td className="text-right">
                    {fmtInt(w.pciBefore)} → {fmtInt(w.pciAfter)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
    </div>
  );
}

function BudgetSearchCard({ agencyId, planId }: { agencyId: string; planId: string }) {
  const [target, setTarget] = useState('70');
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useStartBudgetSearch(agencyId, planId);
  const job = useBudgetSearch(agencyId, jobId);
  const res = job.data?.status === 'done' ? job.data.result : undefined;
  return (
    <Card title="Find the budget">
      <div className="flex items-center gap-2 text-sm">
        What flat annual budget holds the network at PCI
        <TextInput
          aria-label="Target PCI"
          type="number"
          min={1}
          max={100}
          className="w-20"
          value={target}
          onChange={(e) => setTarget(e.target.value)}
        />
        by the last year?
        <Button
          variant="secondary"
          disabled={job.data?.status === 'running' || start.isPending}
          onClick={() =>
            start.mutate(Number(target), { onSuccess: (j) => setJobId(j.id), onError: (e) => toast.error(e.message) })
          }
        >
          {job.data?.status === 'running' ? `Searching… ${Math.round(job.data.progress * 100)} %` : 'Find'}
        </Button>
      </div>
      {job.data?.status === 'failed' && (
        <p role="alert" className="mt-2 text-sm text-band-failed">
          {job.data.error?.message}
        </p>
      )}
      {res && (
        <div className="mt-3" data-testid="budget-search">
          <p className="text-sm font-semibold">
            {res.reachable && res.budget !== null
              ? `About ${money(res.budget)} a year reaches PCI ${res.targetPci}.`
              : `PCI ${res.targetPci} is out of reach even funding every candidate.`}
          </p>
          <LineChart
            x={res.points.map((p) => money(p.budget))}
            series={[{ label: 'PCI at the end', color: '#0f766e', values: res.points.map((p) => p.finalPci) }]}
            height={180}
          />
        </div>
      )}
    </Card>
  );
}

export function PlanPage() {
  const { agencyId, membership } = useAgency();
  const { planId = '' } = useParams();
  const plan = usePlan(agencyId, planId);
  const latest = usePlanResult(agencyId, planId);
  const runPlan = useRunPlan(agencyId, planId);
  const publish = usePublishPlan(agencyId, planId);
  const qc = useQueryClient();
  const [runId, setRunId] = useState<string | null>(null);
  const run = usePlanRun(agencyId, runId);
  const [notify, setNotify] = useState(true);
  const canEdit = membership?.role !== 'viewer';
  useEffect(() => {
    if (run.data && run.data.status !== 'running') qc.invalidateQueries({ queryKey: ['plans', agencyId] });
  }, [run.data, qc, agencyId]);
  if (plan.isLoading) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  if (!plan.data) return <NotFoundPage inline />;
  const p = plan.data;
  const result = latest.data?.latest?.result;
  return (
    <div className="space-y-4">
      <div className="text-sm">
        <Link to=".." relative="path" className="text-accent hover:underline">
          ← Plans
        </Link>
      </div>
      <PageHeader
        title={p.name}
        caption={`${p.settings.startYear}–${p.settings.startYear + p.settings.horizonYears - 1} · ${p.status === 'published' ? `published ${p.publishedAt?.slice(0, 10)}` : 'draft'}`}
        actions={
          result ? (
            <>
              <Link
                className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold"
                to="brief"
              >
                Brief
              </Link>
              <a
                className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold"
                href={`/api/agencies/${agencyId}/plans/${planId}/brief.pdf`}
                target="_blank"
                rel="noreferrer"
              >
                Council brief (PDF)
              </a>
              <a
                className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold"
                href={`/api/agencies/${agencyId}/plans/${planId}/work-list?format=csv`}
              >
                Work list CSV
              </a>
              <a
                className="rounded border border-asphalt-line bg-white px-3 py-1.5 text-sm font-semibold"
                href={`/api/agencies/${agencyId}/plans/${planId}/work-list?format=xlsx`}
              >
                XLSX
              </a>
            </>
          ) : undefined
        }
      />
      {canEdit && (
        <>
          <Inputs key={p.id} agencyId={agencyId} planId={planId} name0={p.name} s0={p.settings} />
          <div className="flex flex-wrap items-center gap-3">
            <Button
              disabled={run.data?.status === 'running' || runPlan.isPending}
              onClick={() =>
                runPlan.mutate(undefined, { onSuccess: (r) => setRunId(r.id), onError: (e) => toast.error(e.message) })
              }
            >
              Run the plan
            </Button>
            {run.data?.status === 'running' && (
              <>
                <div
                  className="h-2 w-48 overflow-hidden rounded bg-asphalt-line"
                  role="progressbar"
                  aria-valuenow={Math.round(run.data.progress * 100)}
                >
                  <div className="h-full bg-accent" style={{ width: `${Math.round(run.data.progress * 100)}%` }} />
                </div>
                <Button variant="ghost" onClick={run.cancel}>
                  Cancel
                </Button>
              </>
            )}
            {run.data?.status === 'failed' && (
              <span role="alert" className="text-sm text-band-failed">
                {run.data.error?.message}
              </span>
            )}
            {run.data?.status === 'cancelled' && <span className="text-sm text-asphalt-muted">Cancelled.</span>}
            {result && (
              <span className="ml-auto flex items-center gap-2 text-sm">
                {p.status === 'draft' && (
                  <label className="flex items-center gap-1">
                    <input type="checkbox" checked={notify} onChange={(e) => setNotify(e.target.checked)} /> e-mail the
                    agency’s viewers
                  </label>
                )}
                <Button
                  variant={p.status === 'draft' ? 'primary' : 'secondary'}
                  onClick={() =>
                    publish.mutate(
                      { publish: p.status === 'draft', notifyViewers: notify },
                      {
                        onSuccess: (x) =>
                          toast.success(
                            x.status === 'published'
                              ? `Published${x.notified ? `; ${x.notified} viewer(s) e-mailed` : ''}`
                              : 'Back to draft',
                          ),
                        onError: (e) => toast.error(e.message),
                      },
                    )
                  }
                >
                  {p.status === 'draft' ? 'Publish' : 'Withdraw to draft'}
                </Button>
              </span>
            )}
          </div>
        </>
      )}
      {result ? (
        <Results agencyId={agencyId} r={result} />
      ) : (
        <EmptyState>
          {canEdit ? 'Not run yet — set the inputs and choose “Run the plan”.' : 'This plan has no results yet.'}
        </EmptyState>
      )}
      {canEdit && result && <BudgetSearchCard agencyId={agencyId} planId={planId} />}
      <p className="text-xs text-asphalt-muted">
        A planning estimate in constant base-year dollars, not a pavement design. Structural adequacy, work zones and
        cold-weather paving are governed by local codes, agency specifications and a licensed engineer’s judgement.
      </p>
    </div>
  );
}
