import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { Card } from '@/components/ui/page';
import { fmtInt, fmtMoney } from '@/lib/format';
import { McHistogram } from './charts';
import { Swatch } from './ranked-table';
import { Tornado } from './tornado';

export function RiskCard({ r }: { r: ComparisonResult }) {
  const mc = r.monteCarlo;
  return (
    <Card title="How sure is the answer">
      <Tornado r={r} />
      <ul className="mt-3 text-xs text-asphalt-muted">
        {r.alternatives.map((a, i) =>
          i === r.baselineIndex ? null : (
            <li key={i}>
              {a.name} against {r.alternatives[r.baselineIndex].name}:{' '}
              {r.breakEven[i] === null
                ? 'no break-even discount rate between 0 and 12 %'
                : `break-even at a discount rate of ${((r.breakEven[i] as number) * 100).toFixed(2)} %`}
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
          <div className="max-w-3xl">
            <McHistogram
              edges={mc.histogram.edges}
              counts={mc.histogram.counts}
              names={r.alternatives.map((a) => a.name)}
            />
          </div>
          <div className="overflow-x-auto">
            <table className="num mt-2 w-full text-right text-xs" data-testid="mc-table">
              <thead className="uppercase text-asphalt-muted">
                <tr>
                  <th className="px-2 text-left">Alternative</th>
                  <th className="px-2">Mean</th>
                  <th className="px-2">SD</th>
                  <th className="px-2">P5</th>
                  <th className="px-2">P50</th>
                  <th className="px-2">P95</th>
                  <th className="px-2">Cheapest in</th>
                </tr>
              </thead>
              <tbody>
                {r.alternatives.map((a, i) => (
                  <tr key={i} className="border-t border-asphalt-line/60">
                    <td className="px-2 py-0.5 text-left">
                      <span className="flex items-baseline">
                        <Swatch i={i} />
                        {a.name}
                      </span>
                    </td>
                    {[mc.stats[i].mean, mc.stats[i].sd, mc.stats[i].p5, mc.stats[i].p50, mc.stats[i].p95].map(
                      (v, k) => (
                        <td key={k} className="whitespace-nowrap px-2">
                          {fmtMoney(v)}
                        </td>
                      ),
                    )}
                    <td className="whitespace-nowrap px-2">{Math.round(mc.probabilityCheapest[i] * 100)} %</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      )}
    </Card>
  );
}
