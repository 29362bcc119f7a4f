import { type Headline, headline } from '@shared/plan-headline';
import { LineChart } from '@/components/charts';
import { Card } from '@/components/ui/page';
import type { PlanSummary, StoredResult } from '@/features/plans/api/keys';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { money } from './money';

export const COMPARE_COLORS = ['#0f766e', '#1f2328', '#b45309', '#4b7fa3'];

type Compared = { plan: PlanSummary; r: StoredResult };

const perLaneMile = (h: Headline) => (h.laneMilesTreated > 0 ? h.totalSpent / h.laneMilesTreated : null);
const signed = (v: number, f: (x: number) => string) => (v > 0 ? `${f(v)} more` : v < 0 ? `${f(-v)} less` : 'the same');

/** The saving of `b` against `a`, said plainly: money first, then what the money buys. */
export function savingWords(aName: string, a: Headline, bName: string, b: Headline) {
  const parts: string[] = [];
  const lcc = a.lifeCycleCost !== null && b.lifeCycleCost !== null ? b.lifeCycleCost - a.lifeCycleCost : null;
  if (lcc !== null)
    parts.push(
      lcc < 0
        ? `saves ${money(-lcc)} of life-cycle cost (present value)`
        : lcc > 0
          ? `costs ${money(lcc)} more in life-cycle cost (present value)`
          : 'has the same life-cycle cost',
    );
  const spent = b.totalSpent - a.totalSpent;
  parts.push(`spends ${signed(spent, money)} over ${b.years} years`);
  const pa = perLaneMile(a);
  const pb = perLaneMile(b);
  if (pa !== null && pb !== null)
    parts.push(
      Math.abs(pb - pa) < 0.5
        ? 'at the same cost per lane-mile treated'
        : `at ${money(Math.abs(pb - pa))} ${pb > pa ? 'more' : 'less'} per lane-mile treated`,
    );
  parts.push(
    `ends at network PCI ${b.finalPci.toFixed(1)} against ${a.finalPci.toFixed(1)}`,
    `with ${fmtInt(b.failedEnd)} failed lane-miles against ${fmtInt(a.failedEnd)}`,
  );
  return `“${bName}” against “${aName}”: ${parts.join(', ')}.`;
}

/** Two (up to four) plans side by side: condition, money, tons by mix and year, failed lane-miles, saving. */
export function ScenarioComparison({ compared }: { compared: Compared[] }) {
  if (compared.length === 0) return null;
  const hs = compared.map((c) => headline(c.r));
  const n = Math.min(...compared.map((c) => c.r.years.length));
  const years = compared[0].r.years.slice(0, n).map((y) => y.calendarYear);
  const sameYears = compared.every((c) => c.r.years.length === years.length && c.r.years[0]?.calendarYear === years[0]);
  const mixes = [...new Set(hs.flatMap((h) => Object.keys(h.tonsTotal)))].sort();
  const [a, ...rest] = compared;
  const rows: [string, (h: Headline, c: Compared) => string][] = [
    ['Budget a year', (h) => money(h.budgetPerYear)],
    ['Spent in all', (h) => fmtMoney(h.totalSpent)],
    [
      'Life-cycle cost (present value)',
      (h) => (h.lifeCycleCost === null ? 'not in this result' : fmtMoney(h.lifeCycleCost)),
    ],
    [
      'Mix policy',
      (h) => (h.mixPolicy ? `${h.mixPolicy.mixName}, ${h.mixPolicy.thicknessIn} in` : 'each treatment’s own mix'),
    ],
    ['Network PCI at start', (h) => fmt1(h.startPci)],
    [`Network PCI at end`, (h) => fmt1(h.finalPci)],
    ['Lane-miles treated', (h) => fmtInt(h.laneMilesTreated)],
    ['Cost per lane-mile treated', (h) => (perLaneMile(h) === null ? '—' : fmtMoney(perLaneMile(h)))],
    ['Failed lane-miles at end', (h) => fmtInt(h.failedEnd)],
    ['Backlog at end', (h) => fmtMoney(h.backlogEnd)],
    ...mixes.map(
      (m) => [`Tons of ${m}`, (h: Headline) => fmtInt(h.tonsTotal[m] ?? 0)] as [string, (h: Headline) => string],
    ),
  ];
  const maxFailed = Math.max(10, ...hs.flatMap((h) => h.failedByYear));
  return (
    <Card title="Scenarios compared">
      <div className="space-y-4" data-testid="scenario-compare">
        {compared.length === 1 ? (
          <p className="text-sm text-asphalt-muted">Tick a second scenario to compare it with “{a.plan.name}”.</p>
        ) : (
          <div data-testid="compare-answer" className="space-y-1 text-sm font-semibold">
            {rest.map((c, i) => (
              <p key={c.plan.id}>{savingWords(a.plan.name, hs[0], c.plan.name, hs[i + 1])}</p>
            ))}
          </div>
        )}
        {!sameYears && (
          <p className="text-sm text-band-poor">
            These scenarios cover different years; the charts show the years they share by position, from the first
            one’s start.
          </p>
        )}
        <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">
          <div>
            <h3 className="text-sm font-semibold">Network PCI by year</h3>
            <LineChart
              testId="scenario-compare-chart"
              yLabel="PCI"
              x={years}
              series={compared.map((c, i) => ({
                label: c.plan.name,
                color: COMPARE_COLORS[i],
                dashed: i > 0 && i % 2 === 1,
                values: years.map((_, k) => c.r.years[k].networkPci),
              }))}
            />
          </div>
          <div>
            <h3 className="text-sm font-semibold">Failed lane-miles by year</h3>
            <LineChart
              testId="compare-failed-chart"
              yLabel="lane-miles, PCI 25 or less"
              yMax={maxFailed}
              x={years}
              format={(v) => fmtInt(v)}
              series={compared.map((c, i) => ({
                label: c.plan.name,
                color: COMPARE_COLORS[i],
                dashed: i > 0 && i % 2 === 1,
                values: years.map((_, k) => hs[i].failedByYear[k]),
              }))}
            />
          </div>
        </div>
        <div className="overflow-x-auto">
          <table className="num w-full text-sm" data-testid="compare-table">
            <thead className="text-xs text-asphalt-muted">
              <tr>
                <th className="px-2 py-1 text-left" />
                {compared.map((c, i) => (
                  <th key={c.plan.id} className="px-2 py-1 text-right">
                    <span
                      className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm"
                      style={{ background: COMPARE_COLORS[i] }}
                    />
                    {c.plan.name}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map(([label, f]) => (
                <tr key={label} className="border-t border-asphalt-line/60">
                  <td className="px-2 py-1 text-asphalt-muted">{label}</td>
                  {compared.map((c, i) => (
                    <td key={c.plan.id} className="px-2 text-right">
                      {f(hs[i], c)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div className="overflow-x-auto">
          <h3 className="text-sm font-semibold">Tons of mix placed, by year</h3>
          {mixes.length === 0 ? (
            <p className="text-sm text-asphalt-muted">No scenario places any mix.</p>
          ) : (
            <table className="num w-full text-xs" data-testid="compare-tons">
              <thead className="text-asphalt-muted">
                <tr>
                  <th className="px-2 text-left">Year</th>
                  {compared.map((c, i) => (
                    <th
                      key={c.plan.id}
                      colSpan={mixes.length}
                      className="border-l border-asphalt-line px-2 text-center"
                    >
                      <span
                        className="mr-1 inline-block h-2 w-2 rounded-sm"
                        style={{ background: COMPARE_COLORS[i] }}
                      />
                      {c.plan.name}
                    </th>
                  ))}
                </tr>
                <tr>
                  <th />
                  {compared.map((c) =>
                    mixes.map((m, k) => (
                      <th
                        key={`${c.plan.id}-${m}`}
                        className={`px-2 text-right font-normal ${k === 0 ? 'border-l border-asphalt-line' : ''}`}
                      >
                        {m}
                      </th>
                    )),
                  )}
                </tr>
              </thead>
              <tbody>
                {years.map((y, yi) => (
                  <tr key={y} className="border-t border-asphalt-line/60">
                    <td className="px-2">{y}</td>
                    {compared.map((c, i) =>
                      mixes.map((m, k) => (
                        <td
                          key={`${c.plan.id}-${m}`}
                          className={`px-2 text-right ${k === 0 ? 'border-l border-asphalt-line' : ''}`}
                        >
                          {fmtInt(hs[i].tonsByYear[yi]?.[m] ?? 0)}
                        </td>
                      )),
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </div>
      </div>
    </Card>
  );
}
