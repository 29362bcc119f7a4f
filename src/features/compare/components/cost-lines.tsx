import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import { fmtInt, fmtMoney } from '@/lib/format';

const LIFE_SOURCE: Record<string, string> = {
  'mix-and-lift': 'scaled from the mix’s reference lift — an assumption',
  entered: 'entered',
  treatment: 'catalog',
};

/** The first application's cost lines and how its present value is made up. */
export function CostLines({ r, i }: { r: ComparisonResult; i: number }) {
  const a = r.alternatives[i];
  const be = r.breakEven[i];
  return (
    <div data-testid={`cost-lines-${i}`}>
      <div className="text-xs font-bold uppercase text-asphalt-muted">
        First application: {a.initial.label} · life {Number(a.initial.serviceLifeYears.toFixed(2))} yr (
        {LIFE_SOURCE[a.initial.lifeSource] ?? a.initial.lifeSource})
      </div>
      <table className="mt-1 w-full text-xs">
        <tbody>
          {a.initial.costLines.lines.map((l) => (
            <tr key={l.label}>
              <td className="py-0.5 pr-3">
                {l.label}
                {l.note ? <span className="text-asphalt-muted"> — {l.note}</span> : null}
              </td>
              <td className="whitespace-nowrap px-2 text-right">
                {l.unit === '$'
                  ? `${(l.unitCost * 100).toFixed(1)} % of ${fmtMoney(l.quantity)}`
                  : `${fmtInt(l.quantity)} ${l.unit} × ${fmtMoney(l.unitCost)}`}
              </td>
              <td className="w-28 whitespace-nowrap pl-2 text-right">{fmtMoney(l.amount)}</td>
            </tr>
          ))}
          <tr className="border-t border-asphalt-line font-bold">
            <td className="py-0.5">Total first cost</td>
            <td />
            <td className="pl-2 text-right">{fmtMoney(a.initial.costLines.total)}</td>
          </tr>
        </tbody>
      </table>
      <div className="mt-2 text-xs text-asphalt-muted">
        Work in years {a.cashFlows.map((c) => c.year).join(', ')}. PV of costs {fmtMoney(a.presentValueOfCosts)} − PV of
        remaining life {fmtMoney(a.presentValueOfRemainingLife)} (value {fmtMoney(a.remainingServiceLifeValue)} at year{' '}
        {r.analysisPeriodYears}) = {fmtMoney(a.presentValue)}.
        {be !== null && be !== undefined && (
          <> It breaks even with the baseline at a discount rate of {(be * 100).toFixed(2)} %.</>
        )}
      </div>
    </div>
  );
}
