import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { CONDITION_BANDS } from '@shared/condition';
import { headline } from '@shared/plan-headline';
import { LineChart, StackedBars } from '@/components/charts';
import { Select } from '@/components/ui/field';
import { Caution, Card } from '@/components/ui/page';
import { MethodNote, PLAN_METHOD_NOTES } from '@/features/help/components/method-note';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import type { StoredResult } from '@/features/plans/api/keys';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { money, moneyTick } from './money';

export function PlanResults({ agencyId, r }: { agencyId: string; r: StoredResult }) {
  const years = r.years.map((y) => y.calendarYear);
  const geo = useSegmentsGeoJson(agencyId, {});
  const planned = useMemo(() => {
    const m = new Map<number, number>();
    for (const w of r.work) if (!m.has(w.ref) || w.year < m.get(w.ref)!) m.set(w.ref, w.year);
    return m;
  }, [r]);
  const [yearFilter, setYearFilter] = useState<number | 'all'>(0);
  const work = r.work.filter((w) => yearFilter === 'all' || w.year === yearFilter);
  const h = headline(r);
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  const method = r.method as keyof typeof PLAN_METHOD_NOTES;
  // Results stored before work items carried their from–to limits leave the column out.
  const hasLimits = r.work.some((w) => w.fromDesc || w.toDesc);
  return (
    <div className="space-y-4" data-testid="plan-results">
      <p className="text-sm" data-testid="plan-caption">
        At {money(r.summary.totalBudget / r.years.length)} a year the network PCI goes from{' '}
        {r.summary.startPci.toFixed(0)} in {first.calendarYear} to {r.summary.finalPci.toFixed(0)} by{' '}
        {last.calendarYear} (no work: {r.summary.finalPciDoNothing.toFixed(0)}; the same money spent worst-first:{' '}
        {r.baseline.finalPci.toFixed(0)}). {r.solution.status}; gap to the bound {(r.solution.gap * 100).toFixed(2)} %.
      </p>
      <p className="text-xs" data-testid="result-method">
        <span className="font-semibold">Method: {PLAN_METHOD_NOTES[method]?.name ?? r.method}</span>{' '}
        {PLAN_METHOD_NOTES[method] && <MethodNote method={method} />}
      </p>
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4" data-testid="plan-headline">
        {[
          ['Budget a year', money(h.budgetPerYear)],
          ['Network PCI', `${h.startPci.toFixed(0)} → ${h.finalPci.toFixed(0)}`],
          ['Lane-miles treated', fmtInt(h.laneMilesTreated)],
          ['Failed lane-miles', `${fmtInt(h.failedStart)} → ${fmtInt(h.failedEnd)}`],
        ].map(([k, v]) => (
          <div key={k} className="rounded border border-asphalt-line bg-white p-2">
            <dt className="text-xs text-asphalt-muted">{k}</dt>
            <dd className="num text-lg font-semibold">{v}</dd>
          </div>
        ))}
      </dl>
      {h.mixPolicy && (
        <p className="text-sm">
          Mix policy: overlays use {h.mixPolicy.mixName} at {h.mixPolicy.thicknessIn} in.
        </p>
      )}
      {r.floorMissedIn.length > 0 && (
        <Caution>
          The minimum network PCI of {r.minNetworkPci} is not reached in {r.floorMissedIn.join(', ')}. Try “Find the
          budget” below.
        </Caution>
      )}
      {(r.solution.targetsMissed ?? []).length > 0 && (
        <Caution>Targets not met: {(r.solution.targetsMissed ?? []).join('; ')}.</Caution>
      )}
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
        <Card title="Network PCI by year">
          <LineChart
            testId="pci-by-year"
            yLabel="PCI"
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
            yLabel="lane-miles"
            x={years}
            format={(v) => fmtInt(v)}
            stacks={CONDITION_BANDS.slice()
              .reverse()
              .map((b) => ({
                label: b.label,
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
            yLabel="backlog, $"
            x={years}
            format={moneyTick}
            stacks={[{ label: 'backlog', color: '#b45309', values: r.years.map((y) => y.backlog) }]}
          />
          <table className="num mt-2 w-full text-right text-xs">
            <thead className="text-asphalt-muted">
              <tr>
                <th className="text-left">Year</th>
                <th>Budget</th>
                <th>Spent</th>
                <th>Backlog</th>
                <th title="Lane-miles under the needs-work PCI where no catalog treatment fits: counted, not priced">
                  No fitting work, lane-mi
                </th>
                <th>Failed lane-mi</th>
                <th>PCI</th>
              </tr>
            </thead>
            <tbody>
              {r.years.map((y, i) => (
                <tr key={y.year} className="border-t border-asphalt-line/60">
                  <td className="text-left">{y.calendarYear}</td>
                  <td>{fmtMoney(y.budget)}</td>
                  <td>{fmtMoney(y.spent)}</td>
                  <td>{fmtMoney(y.backlog)}</td>
                  <td>{y.backlogNoFit ? fmtInt(y.backlogNoFit.laneMiles) : '—'}</td>
                  <td>{fmtInt(h.failedByYear[i])}</td>
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
        <div className="mb-2 flex flex-wrap items-center gap-2 text-sm">
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
        {work.length === 0 ? (
          <p className="text-sm text-asphalt-muted">No work planned in this year; choose another year or all years.</p>
        ) : (
          <div className="max-h-96 overflow-y-auto">
            <table className="num w-full text-sm" data-testid="work-list">
              <thead className="sticky top-0 bg-white text-left text-xs text-asphalt-muted">
                <tr>
                  <th className="py-1">Year</th>
                  <th>Segment</th>
                  <th>Road</th>
                  {hasLimits && <th>From – to</th>}
                  <th>Treatment</th>
                  <th>Mix</th>
                  <th className="text-right">Lift (in)</th>
                  <th className="text-right">Tons</th>
                  <th className="text-right">Cost</th>
                  <th className="text-right">PCI</th>
                </tr>
              </thead>
              <tbody>
                {work.slice(0, 500).map((w) => (
                  <tr key={`${w.ref}-${w.year}-${w.treatment}`} className="border-t border-asphalt-line/60">
                    <td className="py-1">{w.calendarYear}</td>
                    <td>
                      <Link className="text-accent hover:underline" to={`../../roads/${w.ref}`} relative="path">
                        {w.segmentId}
                      </Link>
                    </td>
                    <td>{w.roadName}</td>
                    {hasLimits && (
                      <td className="text-xs">
                        {w.fromDesc || w.toDesc ? `${w.fromDesc ?? '—'} – ${w.toDesc ?? '—'}` : '—'}
                      </td>
                    )}
                    <td>
                      {w.treatment}
                      {w.structuralFlag && (
                        <span className="ml-1 text-xs font-semibold text-band-failed" title={w.structuralFlag}>
                          (structure: {w.structuralFlag})
                        </span>
                      )}
                    </td>
                    <td>{w.mix ?? '—'}</td>
                    <td className="text-right">{w.thicknessIn ?? '—'}</td>
                    <td className="text-right">{w.tons ? fmtInt(w.tons) : '—'}</td>
                    <td className="text-right">{fmtMoney(w.cost)}</td>
                    <td className="text-right">
                      {fmtInt(w.pciBefore)} → {fmtInt(w.pciAfter)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
    </div>
  );
}
