import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { Card } from '@/components/ui/page';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { laneWidthFt } from '../lib/result-figures';
import { Swatch } from './ranked-table';

const th = 'px-2 py-1 font-semibold';
const td = 'whitespace-nowrap px-2 py-1.5';

function Two({ top, bottom, tone }: { top: string; bottom: string; tone?: 'good' | 'bad' }) {
  return (
    <td className={td}>
      <div className={tone === 'good' ? 'text-accent' : tone === 'bad' ? 'text-band-poor' : ''}>{top}</div>
      <div className="text-xs text-asphalt-muted">{bottom}</div>
    </td>
  );
}

const tone = (v: number) => (v > 0 ? 'good' : v < 0 ? 'bad' : undefined);

/** Each alternative against the baseline: for the job and per lane-mile, money and mix. */
export function SavingsTable({ r }: { r: ComparisonResult }) {
  const base = r.alternatives[r.baselineIndex];
  return (
    <Card title={`Against the baseline, ${base.name}`}>
      <div className="overflow-x-auto">
        <table className="num w-full text-sm" data-testid="savings-table">
          <thead className="text-right align-bottom text-xs uppercase text-asphalt-muted">
            <tr>
              <th className={`${th} text-left`}>Alternative</th>
              <th className={th}>Saves over {r.analysisPeriodYears} yr (PV)</th>
              <th className={th}>First cost saved</th>
              <th className={th}>Mix saved</th>
            </tr>
          </thead>
          <tbody>
            {r.ranking.map((i) => {
              const a = r.alternatives[i];
              const v = r.vsBaseline[i];
              const isBase = i === r.baselineIndex;
              const fc = v.firstCostSavings ?? base.firstCost - a.firstCost;
              return (
                <tr key={i} className="border-t border-asphalt-line/60 text-right align-top">
                  <td className="min-w-[10rem] px-2 py-1.5 text-left">
                    <div className="flex items-baseline">
                      <Swatch i={i} />
                      <span>{a.name}</span>
                    </div>
                  </td>
                  {isBase ? (
                    <td colSpan={3} className={`${td} text-center text-asphalt-muted`}>
                      baseline
                    </td>
                  ) : (
                    <>
                      <Two
                        top={fmtMoney(v.savings)}
                        bottom={`${fmtMoney(v.savingsPerLaneMile)}/lane-mi`}
                        tone={tone(v.savings)}
                      />
                      <Two
                        top={fmtMoney(fc)}
                        bottom={`${fmtMoney(v.firstCostSavingsPerLaneMile)}/lane-mi`}
                        tone={tone(fc)}
                      />
                      <Two
                        top={`${fmtInt(v.tonsSaved)} tons`}
                        bottom={`${fmtInt(v.tonsSavedPerLaneMile)} tons/lane-mi`}
                      />
                    </>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-asphalt-muted">
        Negative figures cost more than the baseline. Per lane-mile at these roads’ average lane width of{' '}
        {fmt1(laneWidthFt(r))} ft (the lane-mile is one mile of one lane).
      </p>
    </Card>
  );
}
