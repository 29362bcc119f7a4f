import { scaleLinear } from 'd3-scale';
import { CHART_GRID, ChartText, textWidth, useChartWidth } from '@/components/charts';
import { moneyTick } from './money';

/**
 * PCI against the annual budget, on a numeric dollar axis (the budgets tried are not evenly
 * spaced, so a category axis would bend the curve). Ticks are round amounts, thinned so none touch.
 */
export function BudgetCurve({
  points,
  target,
  found,
  height = 200,
  testId,
}: {
  points: { budget: number; finalPci: number; minPci: number }[];
  target: number;
  found: number | null;
  height?: number;
  testId?: string;
}) {
  const { ref, width: w } = useChartWidth(560);
  const pts = [...points].sort((a, b) => a.budget - b.budget);
  const m = { top: 22, right: 90, bottom: 34, left: 44 };
  const maxB = Math.max(1, ...pts.map((p) => p.budget));
  const sx = scaleLinear()
    .domain([0, maxB])
    .range([m.left, w - m.right])
    .nice();
  const sy = scaleLinear()
    .domain([0, 100])
    .range([height - m.bottom, m.top]);
  let ticks = sx.ticks(6);
  const widest = Math.max(...ticks.map((t) => textWidth(moneyTick(t))));
  while (ticks.length > 2 && (w - m.left - m.right) / (ticks.length - 1) < widest + 12)
    ticks = ticks.filter((_, i) => i % 2 === 0);
  const path = (key: 'finalPci' | 'minPci') =>
    pts.map((p, i) => `${i ? 'L' : 'M'}${sx(p.budget).toFixed(1)},${sy(p[key]).toFixed(1)}`).join('');
  const end = pts[pts.length - 1];
  return (
    <div ref={ref} className="w-full">
      <svg width={w} height={height} role="img" aria-label="PCI against annual budget" data-testid={testId}>
        <ChartText kind="note" x={m.left} y={11}>
          PCI
        </ChartText>
        {[0, 25, 50, 75, 100].map((t) => (
          <g key={t}>
            <line x1={m.left} x2={w - m.right} y1={sy(t)} y2={sy(t)} stroke={CHART_GRID} />
            <ChartText kind="tick" x={m.left - 6} y={sy(t) + 4} textAnchor="end">
              {t}
            </ChartText>
          </g>
        ))}
        {ticks.map((t) => (
          <ChartText key={t} kind="tick" x={sx(t)} y={height - m.bottom + 16} textAnchor="middle">
            {moneyTick(t)}
          </ChartText>
        ))}
        <ChartText kind="note" x={(m.left + w - m.right) / 2} y={height - 3} textAnchor="middle">
          annual budget ($ a year)
        </ChartText>
        <line x1={m.left} x2={w - m.right} y1={sy(target)} y2={sy(target)} stroke="#b45309" strokeDasharray="4 3" />
        {found !== null && (
          <line
            x1={sx(found)}
            x2={sx(found)}
            y1={m.top}
            y2={height - m.bottom}
            stroke="#b45309"
            strokeDasharray="2 2"
          />
        )}
        <path d={path('finalPci')} fill="none" stroke="#0f766e" strokeWidth={2} />
        <path d={path('minPci')} fill="none" stroke="#8c8574" strokeWidth={1.5} strokeDasharray="4 3" />
        {pts.map((p) => (
          <circle key={p.budget} cx={sx(p.budget)} cy={sy(p.finalPci)} r={2.5} fill="#0f766e">
            <title>{`${moneyTick(p.budget)} a year: PCI ${p.finalPci.toFixed(1)} at the end, lowest ${p.minPci.toFixed(1)}`}</title>
          </circle>
        ))}
        {end && (
          <>
            <ChartText kind="label" x={sx(end.budget) + 6} y={sy(end.finalPci) + 4} fill="#0f766e">
              last year
            </ChartText>
            <ChartText
              kind="label"
              x={sx(end.budget) + 6}
              y={Math.max(sy(end.minPci) + 4, sy(end.finalPci) + 18)}
              fill="#8c8574"
            >
              lowest year
            </ChartText>
          </>
        )}
      </svg>
    </div>
  );
}
