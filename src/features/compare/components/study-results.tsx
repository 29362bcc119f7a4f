import { Fragment, useState } from 'react';
import type { StudyResult } from '@shared/engine/lcca/study';
import { Caution, Card } from '@/components/ui/page';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { ALT_COLORS, CashFlowChart, McHistogram, money, TornadoChart } from './charts';

export function StudyResults({ r }: { r: StudyResult }) {
  const [open, setOpen] = useState<number | null>(null);
  const [tornadoAlt, setTornadoAlt] = useState(r.ranking[0]);
  const best = r.alternatives[r.ranking[0]];
  const second = r.ranking.length > 1 ? r.alternatives[r.ranking[1]] : null;
  const mc = r.monteCarlo;
  const caption = second
    ? `Over ${r.analysisPeriodYears} years at ${(r.discountRate * 100).toFixed(1)} % (real), ${best.name} costs least: ${money(best.presentValue)} present value, ${money(second.presentValue - best.presentValue)} less than ${second.name}${mc ? `; it is cheapest in ${Math.round(mc.probabilityCheapest[r.ranking[0]] * 100)} % of ${fmtInt(mc.iterations)} simulated futures` : ''}.`
    : '';
  return (
    <div className="space-y-4" data-testid="study-results">
      <p className="text-sm" data-testid="study-caption">
        {caption}
      </p>
      {r.cautions.length > 0 && (
        <div className="space-y-2" data-testid="cautions">
          {r.cautions.map((c, i) => (
            <Caution key={i}>
              <strong>{c.alternative}:</strong> {c.message}
            </Caution>
          ))}
        </div>
      )}
      <Card title={`Ranked by present value — ${fmt1(r.group.laneMiles)} lane-mi, ${fmtInt(r.group.areaSy)} SY`}>
        <div className="overflow-x-auto">
          <table className="num w-full text-sm" data-testid="ranked-table">
            <thead className="text-right text-xs uppercase text-asphalt-muted">
              <tr>
                <th className="py-1 text-left">#</th>
                <th className="text-left">Alternative</th>
                <th>Present value</th>
                <th>EUAC</th>
                <th>PV per lane-mi</th>
                <th>First cost</th>
                <th>Mix (tons)</th>
                <th>Saves vs baseline per lane-mi</th>
                <th>Mix saved per lane-mi (tons)</th>
                {mc && <th>Cheapest in</th>}
              </tr>
            </thead>
            <tbody>
              {r.ranking.map((i, rank) => {
                const a = r.alternatives[i];
                const v = r.vsBaseline[i];
                return (
                  <Fragment key={i}>
                    <tr
                      className="cursor-pointer border-t border-asphalt-line/60 text-right hover:bg-paper"
                      onClick={() => setOpen(open === i ? null : i)}
                    >
                      <td className="py-1.5 text-left">{rank + 1}</td>
                      <td className="text-left">
                        <span
                          className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm"
                          style={{ background: ALT_COLORS[i % ALT_COLORS.length] }}
                        />
                        {a.name}
                        {i === r.baselineIndex && <span className="ml-1 text-xs text-asphalt-muted">(baseline)</span>}
                      </td>
                      <td>{fmtMoney(a.presentValue)}</td>
                      <td>{fmtMoney(a.euac)}</td>
                      <td>{fmtMoney(a.perLaneMile)}</td>
                      <td>{fmtMoney(a.firstCost)}</td>
                      <td>{fmtInt(a.initialTons)}</td>
                      <td
                        className={
                          v.savingsPerLaneMile > 0 ? 'text-accent' : v.savingsPerLaneMile < 0 ? 'text-band-poor' : ''
                        }
                      >
                        {i === r.baselineIndex ? '—' : fmtMoney(v.savingsPerLaneMile)}
                      </td>
                      <td>{i === r.baselineIndex ? '—' : fmtInt(v.tonsSavedPerLaneMile)}</td>
                      {mc && <td>{Math.round(mc.probabilityCheapest[i] * 100)} %</td>}
                    </tr>
                    {open === i && (
                      <tr>
                        <td colSpan={mc ? 10 : 9} className="bg-paper/60 p-3 text-left">
                          <div className="text-xs font-bold uppercase text-asphalt-muted">
                            First application: {a.initial.label} · life {fmt1(a.initial.serviceLifeYears)} yr (
                            {a.initial.lifeSource === 'mix-and-lift'
                              ? 'scaled from the mix’s reference lift — an assumption'
                              : a.initial.lifeSource === 'entered'
                                ? 'entered'
                                : 'catalog'}
                            )
                          </div>
                          <table className="mt-1 w-full text-xs">
                            <tbody>
                              {a.initial.costLines.lines.map((l) => (
                                <tr key={l.label}>
                                  <td className="py-0.5">
                                    {l.label}
                                    {l.note ? <span className="text-asphalt-muted"> — {l.note}</span> : null}
                                  </td>
                                  <td className="text-right">
                                    {l.unit === '$'
                                      ? `${(l.unitCost * 100).toFixed(1)} % of ${fmtMoney(l.quantity)}`
                                      : `${fmtInt(l.quantity)} ${l.unit} × ${fmtMoney(l.unitCost)}`}
                                  </td>
                                  <td className="w-28 text-right">{fmtMoney(l.amount)}</td>
                                </tr>
                              ))}
                              <tr className="border-t border-asphalt-line font-bold">
                                <td className="py-0.5">Total first cost</td>
                                <td />
                                <td className="text-right">{fmtMoney(a.initial.costLines.total)}</td>
                              </tr>
                            </tbody>
                          </table>
                          <div className="mt-2 text-xs text-asphalt-muted">
                            PV of costs {fmtMoney(a.presentValueOfCosts)} − PV of remaining life{' '}
                            {fmtMoney(a.presentValueOfRemainingLife)} (value {fmtMoney(a.remainingServiceLifeValue)} at
                            year {r.analysisPeriodYears}) = {fmtMoney(a.presentValue)}.
                            {r.breakEven[i] !== null && r.breakEven[i] !== undefined && (
                              <>
                                {' '}
                                It breaks even with the baseline at a discount rate of{' '}
                                {((r.breakEven[i] as number) * 100).toFixed(2)} %.
                              </>
                            )}
                          </div>
                        </td>
                      </tr>
                    )}
                  </Fragment>
                );
              })}
            </tbody>
          </table>
        </div>
        <p className="mt-2 text-xs text-asphalt-muted">
          Click a row for its cost lines. Constant dollars of the base year; the remaining service life of the last
          treatment is credited at the end of the period (FHWA method).
        </p>
      </Card>
      <Card title="Cash flows">
        <div className="grid grid-cols-2 gap-3 lg:grid-cols-3">
          {r.alternatives.map((a, i) => (
            <div key={i}>
              <div className="text-xs font-semibold">{a.name}</div>
              <CashFlowChart
                flows={a.cashFlows}
                years={r.analysisPeriodYears}
                rsl={a.remainingServiceLifeValue}
                color={ALT_COLORS[i % ALT_COLORS.length]}
              />
            </div>
          ))}
        </div>
        <p className="mt-1 text-xs text-asphalt-muted">
          Bars: treatments (colour) and maintenance (grey) in the year they are paid; the teal bar below the line at the
          end is the remaining-life credit.
        </p>
      </Card>
      <Card title="Risk">
        <div className="mb-2 flex items-center gap-2 text-sm">
          Sensitivity of
          <select
            aria-label="Tornado alternative"
            className="rounded border border-asphalt-line px-1 py-0.5"
            value={tornadoAlt}
            onChange={(e) => setTornadoAlt(Number(e.target.value))}
          >
            {r.alternatives.map((a, i) => (
              <option key={i} value={i}>
                {a.name}
              </option>
            ))}
          </select>
          to one input at a time (low ↔ high):
        </div>
        <TornadoChart rows={r.sensitivity.rows} alt={tornadoAlt} base={r.sensitivity.base[tornadoAlt]} />
        <ul className="mt-2 text-xs text-asphalt-muted">
          {r.alternatives.map((a, i) =>
            i === r.baselineIndex ? null : (
              <li key={i}>
                {a.name} vs {r.alternatives[r.baselineIndex].name}:{' '}
                {r.breakEven[i] === null
                  ? 'no break-even discount rate between 0 and 12 %'
                  : `break-even at ${((r.breakEven[i] as number) * 100).toFixed(2)} %`}
              </li>
            ),
          )}
        </ul>
        {mc && (
          <div className="mt-4">
            <div className="text-sm">
              Monte Carlo: {fmtInt(mc.iterations)} draws (seed {mc.seed}) of prices, lives and the discount rate over
              their ranges.
            </div>
            <McHistogram
              edges={mc.histogram.edges}
              counts={mc.histogram.counts}
              names={r.alternatives.map((a) => a.name)}
            />
            <table className="num mt-2 w-full text-right text-xs" data-testid="mc-table">
              <thead className="uppercase text-asphalt-muted">
                <tr>
                  <th className="text-left">Alternative</th>
                  <th>Mean</th>
                  <th>SD</th>
                  <th>P5</th>
                  <th>P50</th>
                  <th>P95</th>
                  <th>Cheapest in</th>
                </tr>
              </thead>
              <tbody>
                {r.alternatives.map((a, i) => (
                  <tr key={i} className="border-t border-asphalt-line/60">
                    <td className="py-0.5 text-left">
                      <span
                        className="mr-1 inline-block h-2 w-2 rounded-sm"
                        style={{ background: ALT_COLORS[i % ALT_COLORS.length] }}
                      />
                      {a.name}
                    </td>
                    <td>{fmtMoney(mc.stats[i].mean)}</td>
                    <td>{fmtMoney(mc.stats[i].sd)}</td>
                    <td>{fmtMoney(mc.stats[i].p5)}</td>
                    <td>{fmtMoney(mc.stats[i].p50)}</td>
                    <td>{fmtMoney(mc.stats[i].p95)}</td>
                    <td>{Math.round(mc.probabilityCheapest[i] * 100)} %</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
      <p className="text-xs text-asphalt-muted">
        Planning estimate for comparing alternatives, not a pavement design. Structural adequacy, work-zone traffic
        control and cold-weather paving are governed by local codes, agency specifications and a licensed engineer’s
        judgement.
      </p>
    </div>
  );
}
