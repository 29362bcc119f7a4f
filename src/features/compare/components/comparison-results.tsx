import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { Card } from '@/components/ui/page';
import { AnswerCard } from './answer-card';
import { CautionsPanel } from './cautions-panel';
import { ALT_COLORS, CashFlowChart } from './charts';
import { RankedTable } from './ranked-table';
import { RiskCard } from './risk-card';
import { SavingsTable } from './savings-table';

/** The result, answer first: the sentence, the ranking, savings, cautions by kind, cash flows, then the risk. */
export function ComparisonResults({ r }: { r: ComparisonResult }) {
  return (
    <div
      className="space-y-4"
      data-testid="study-results"
      data-group={`${r.group.segments} segments, ${r.group.laneMiles.toFixed(3)} lane-mi`}
    >
      <AnswerCard r={r} />
      <RankedTable r={r} />
      <CautionsPanel r={r} />
      <SavingsTable r={r} />
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
      <RiskCard r={r} />
      <p className="text-xs text-asphalt-muted">
        Planning estimate for comparing alternatives, not a pavement design. Structural adequacy, work-zone traffic
        control and cold-weather paving are governed by local codes, agency specifications and a licensed engineer’s
        judgement.
      </p>
    </div>
  );
}
