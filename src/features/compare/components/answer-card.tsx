import { answerFor } from '@shared/engine/lcca/answer';
import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { fmt1, fmtInt, fmtMoney } from '@/lib/format';
import { laneWidthFt, perTon, saving, syPerLaneMile } from '../lib/result-figures';

function Figure({ label, value, detail, testId }: { label: string; value: string; detail: string; testId: string }) {
  return (
    <div className="min-w-0" data-testid={testId}>
      <div className="text-xs uppercase tracking-wide text-asphalt-muted">{label}</div>
      <div className="num text-xl font-bold">{value}</div>
      <div className="num text-xs text-asphalt-muted">{detail}</div>
    </div>
  );
}

/** The answer first: one sentence, then the figures practitioners quote, against the runner-up. */
export function AnswerCard({ r }: { r: ComparisonResult }) {
  const a = answerFor(r);
  const w = a.winner === null ? null : r.alternatives[a.winner];
  const ru = a.runnerUp === null ? null : r.alternatives[a.runnerUp];
  const lm = r.group.laneMiles;
  const tons = (v: number) => `${fmtInt(v)} tons`;
  return (
    <section className="rounded border-2 border-accent/40 bg-white p-4" data-testid="answer">
      <div data-testid="answer-sentence">
        <p className="text-lg font-semibold leading-snug">{a.headline}</p>
        {a.details.map((d) => (
          <p key={d} className="mt-1 text-sm">
            {d}
          </p>
        ))}
      </div>
      {w && ru && (
        <div className="mt-3 grid grid-cols-1 gap-4 border-t border-asphalt-line/60 pt-3 sm:grid-cols-3">
          <Figure
            testId="answer-pv"
            label={`Present value, ${r.analysisPeriodYears} years`}
            value={fmtMoney(w.presentValue)}
            detail={`${saving(a.margin, fmtMoney)} against ${fmtMoney(ru.presentValue)}; ${saving(a.margin / lm, fmtMoney)} per lane-mi`}
          />
          <Figure
            testId="answer-first-cost"
            label="First cost of this job"
            value={fmtMoney(w.firstCost)}
            detail={`${saving(ru.firstCost - w.firstCost, fmtMoney)}; ${saving((ru.firstCost - w.firstCost) / lm, fmtMoney)} per lane-mi`}
          />
          <Figure
            testId="answer-mix"
            label="Mix for this job"
            value={tons(w.initialTons)}
            detail={`${saving(ru.initialTons - w.initialTons, tons)}; ${saving((ru.initialTons - w.initialTons) / lm, (v) => fmt1(v))} tons per lane-mi${perTon(w) !== null ? `; ${fmtMoney(perTon(w))} per ton in place` : ''}`}
          />
        </div>
      )}
      <p className="mt-2 text-xs text-asphalt-muted" data-testid="lane-width">
        {ru ? `Against ${ru.name}. ` : ''}A lane-mile is one mile of one lane; these roads average{' '}
        {fmt1(laneWidthFt(r))}-ft lanes ({fmtInt(syPerLaneMile(r))} SY per lane-mile, {fmt1(lm)} lane-mi in all).
        Present values at {Number((r.discountRate * 100).toFixed(2))} % (real), constant dollars.
      </p>
    </section>
  );
}
