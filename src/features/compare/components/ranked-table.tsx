import { Fragment, useState } from 'react';
import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { Card } from '@/components/ui/page';
import { fmtMoney } from '@/lib/format';
import { kindsFor } from '../lib/cautions';
import { perTon } from '../lib/result-figures';
import { ALT_COLORS } from './charts';
import { CostLines } from './cost-lines';

const th = 'px-2 py-1 align-bottom font-semibold';
const td = 'whitespace-nowrap px-2 py-1.5';

export function Swatch({ i }: { i: number }) {
  return (
    <span
      className="mr-1.5 inline-block h-2.5 w-2.5 shrink-0 rounded-sm"
      style={{ background: ALT_COLORS[i % ALT_COLORS.length] }}
    />
  );
}

/** Ranked by present value; each row names the kinds of caution that concern it and opens its cost lines. */
export function RankedTable({ r }: { r: ComparisonResult }) {
  const [open, setOpen] = useState<number | null>(null);
  const mc = r.monteCarlo;
  const names = r.alternatives.map((a) => a.name);
  const cols = mc ? 5 : 4;
  return (
    <Card title={`Ranked by present value over ${r.analysisPeriodYears} years`}>
      <div className="overflow-x-auto">
        <table className="num w-full text-sm" data-testid="ranked-table">
          <thead className="text-right text-xs uppercase text-asphalt-muted">
            <tr>
              <th className={`${th} text-left`}>#</th>
              <th className={`${th} text-left`}>Alternative</th>
              <th className={th}>Present value · EUAC</th>
              <th className={th}>First cost</th>
              {mc && <th className={th}>Cheapest</th>}
            </tr>
          </thead>
          <tbody>
            {r.ranking.map((i, rank) => {
              const a = r.alternatives[i];
              const tags = kindsFor(r.cautions, names, i);
              return (
                <Fragment key={i}>
                  <tr
                    className="cursor-pointer border-t border-asphalt-line/60 text-right align-top hover:bg-paper"
                    onClick={() => setOpen(open === i ? null : i)}
                    data-testid={`ranked-row-${i}`}
                  >
                    <td className={`${td} text-left`}>{rank + 1}</td>
                    <td className="min-w-[9rem] px-2 py-1.5 text-left">
                      <div className="flex items-baseline">
                        <Swatch i={i} />
                        <span>
                          {a.name}
                          {i === r.baselineIndex && <span className="ml-1 text-xs text-asphalt-muted">(baseline)</span>}
                        </span>
                      </div>
                      {tags.length > 0 && (
                        <div className="mt-0.5 flex flex-wrap gap-1 pl-4">
                          {tags.map((t) => (
                            <a
                              key={t.kind}
                              href={`#cautions-${t.kind}`}
                              onClick={(e) => e.stopPropagation()}
                              className={`rounded px-1.5 text-[11px] ${t.kind === 'service' ? 'bg-band-failed/10 text-band-failed' : 'bg-caution-bg text-caution'}`}
                            >
                              {t.tag}
                            </a>
                          ))}
                        </div>
                      )}
                    </td>
                    <td className={td}>
                      <div>{fmtMoney(a.presentValue)}</div>
                      <div className="text-xs text-asphalt-muted">{fmtMoney(a.euac)} a year</div>
                    </td>
                    <td className={td}>
                      <div>{fmtMoney(a.firstCost)}</div>
                      <div className="text-xs text-asphalt-muted">
                        {perTon(a) === null ? 'no mix' : `${fmtMoney(perTon(a))}/ton in place`}
                      </div>
                    </td>
                    {mc && <td className={td}>{Math.round(mc.probabilityCheapest[i] * 100)} %</td>}
                  </tr>
                  {open === i && (
                    <tr>
                      <td colSpan={cols} className="bg-paper/60 p-3 text-left">
                        <CostLines r={r} i={i} />
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
        treatment is credited at the end of the period (FHWA method). EUAC: the equivalent uniform annual cost. In
        place: first cost ÷ tons of mix laid. Cheapest: share of the Monte Carlo draws in which it costs least.
      </p>
    </Card>
  );
}
