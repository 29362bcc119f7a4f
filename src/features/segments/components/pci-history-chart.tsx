import { scaleLinear, scaleTime } from 'd3-scale';
import { CONDITION_BANDS } from '@shared/condition';
import { CHART_GRID, ChartText, textWidth, useChartWidth } from '@/components/charts';

type Props = {
  surveys: { surveyDate: string; pci: number }[];
  /** Work done, as date (or year) and words; each gets a dashed line and a label. */
  treatments: { date: string; label: string }[];
  height?: number;
};

const asDate = (d: string) => new Date(d.length === 4 ? `${d}-07-01` : d);

/** PCI over time: survey points on the condition bands, every recorded treatment marked. */
export function PciHistoryChart({ surveys, treatments, height = 240 }: Props) {
  const { ref, width } = useChartWidth(640);
  // Treatment labels sit above the plot, one or two lines, clear of the survey line.
  const m = { top: treatments.length ? 38 : 12, right: 16, bottom: 26, left: 36 };
  const dates = [...surveys.map((s) => asDate(s.surveyDate)), ...treatments.map((t) => asDate(t.date))];
  const first = new Date(Math.min(...dates.map(Number)));
  const last = new Date(Math.max(...dates.map(Number)));
  const x = scaleTime()
    .domain([new Date(Date.UTC(first.getUTCFullYear(), 0, 1)), new Date(Date.UTC(last.getUTCFullYear() + 1, 0, 1))])
    .range([m.left, width - m.right]);
  const y = scaleLinear()
    .domain([0, 100])
    .range([height - m.bottom, m.top]);
  const path = surveys
    .map((s, i) => `${i ? 'L' : 'M'}${x(asDate(s.surveyDate)).toFixed(1)},${y(s.pci).toFixed(1)}`)
    .join('');
  const span = last.getUTCFullYear() - first.getUTCFullYear() + 1;
  // One tick per year while they fit at 44 px apart, fewer on a long history.
  const years = x.ticks(Math.max(2, Math.min(span, Math.floor((width - m.left - m.right) / 44))));
  // Treatment labels read along the top; a label that would run into the one before drops a line.
  let nextFree = Number.NEGATIVE_INFINITY;
  const placed = [...treatments]
    .sort((a, b) => a.date.localeCompare(b.date))
    .map((t, i) => {
      const at = x(asDate(t.date));
      const row = at < nextFree ? 1 : 0;
      if (row === 0) nextFree = at + textWidth(t.label, 'note') + 8;
      return { t, at, row, i };
    });
  return (
    <div ref={ref} className="w-full">
      <svg width={width} height={height} role="img" aria-label="PCI survey history" data-testid="pci-chart">
        {CONDITION_BANDS.map((b) => (
          <g key={b.id}>
            <rect
              x={m.left}
              width={width - m.left - m.right}
              y={y(b.max + (b.max === 100 ? 0 : 1))}
              height={y(b.min) - y(b.max + (b.max === 100 ? 0 : 1))}
              fill={b.color}
              opacity={0.1}
            />
            <ChartText kind="note" x={width - m.right - 4} y={y(b.min) - 3} textAnchor="end">
              {b.label}
            </ChartText>
          </g>
        ))}
        {[0, 25, 50, 75, 100].map((v) => (
          <g key={v}>
            <line x1={m.left} x2={width - m.right} y1={y(v)} y2={y(v)} stroke={CHART_GRID} strokeWidth={0.75} />
            <ChartText kind="tick" x={m.left - 6} y={y(v) + 4} textAnchor="end">
              {v}
            </ChartText>
          </g>
        ))}
        {years.map((d) => (
          <ChartText key={d.toISOString()} kind="tick" x={x(d)} y={height - 8} textAnchor="middle">
            {d.getUTCFullYear()}
          </ChartText>
        ))}
        {placed.map(({ t, at, row, i }) => {
          return (
            <g key={`${t.date}-${i}`} data-testid="treatment-mark">
              <line x1={at} x2={at} y1={row ? 26 : 14} y2={height - m.bottom} stroke="#0f766e" strokeDasharray="3 3" />
              <ChartText
                kind="note"
                // A label that would run off the right edge reads leftwards from its line.
                {...(at + 4 + textWidth(t.label, 'note') > width ? { x: at - 4, textAnchor: 'end' } : { x: at + 4 })}
                y={row ? 34 : 22}
                className="fill-accent font-bold"
              >
                {t.label}
              </ChartText>
            </g>
          );
        })}
        <path d={path} fill="none" stroke="#1f2328" strokeWidth={1.5} />
        {surveys.map((s) => (
          <circle key={s.surveyDate} cx={x(asDate(s.surveyDate))} cy={y(s.pci)} r={3.5} fill="#1f2328">
            <title>{`${s.surveyDate}: PCI ${s.pci}`}</title>
          </circle>
        ))}
      </svg>
    </div>
  );
}
