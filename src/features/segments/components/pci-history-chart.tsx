import { scaleLinear, scaleTime } from 'd3-scale';
import { CONDITION_BANDS } from '@shared/condition';

type Props = {
  surveys: { surveyDate: string; pci: number }[];
  treatmentYear: number | null;
  treatment: string | null;
  width?: number;
  height?: number;
};

/** PCI over time: survey points on the condition bands, the last treatment marked. */
export function PciHistoryChart({ surveys, treatmentYear, treatment, width = 640, height = 240 }: Props) {
  const m = { top: 10, right: 16, bottom: 28, left: 36 };
  const dates = surveys.map((s) => new Date(s.surveyDate));
  const first = new Date(Math.min(...dates.map(Number), treatmentYear ? Date.UTC(treatmentYear, 0, 1) : Infinity));
  const last = new Date(Math.max(...dates.map(Number)));
  const x = scaleTime()
    .domain([new Date(Date.UTC(first.getUTCFullYear(), 0, 1)), new Date(Date.UTC(last.getUTCFullYear() + 1, 0, 1))])
    .range([m.left, width - m.right]);
  const y = scaleLinear()
    .domain([0, 100])
    .range([height - m.bottom, m.top]);
  const path = surveys
    .map((s, i) => `${i ? 'L' : 'M'}${x(new Date(s.surveyDate)).toFixed(1)},${y(s.pci).toFixed(1)}`)
    .join('');
  const years = x.ticks(Math.min(10, Math.max(2, last.getUTCFullYear() - first.getUTCFullYear() + 1)));
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      className="w-full"
      role="img"
      aria-label="PCI survey history"
      data-testid="pci-chart"
    >
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
          <text x={width - m.right - 4} y={y(b.min) - 3} textAnchor="end" className="fill-asphalt-muted text-[9px]">
            {b.label}
          </text>
        </g>
      ))}
      {[0, 25, 50, 75, 100].map((v) => (
        <g key={v}>
          <line x1={m.left} x2={width - m.right} y1={y(v)} y2={y(v)} stroke="#d9d4c7" strokeWidth={0.5} />
          <text x={m.left - 6} y={y(v) + 3} textAnchor="end" className="num fill-asphalt-muted text-[10px]">
            {v}
          </text>
        </g>
      ))}
      {years.map((d) => (
        <text
          key={d.toISOString()}
          x={x(d)}
          y={height - 8}
          textAnchor="middle"
          className="num fill-asphalt-muted text-[10px]"
        >
          {d.getUTCFullYear()}
        </text>
      ))}
      {treatmentYear && (
        <g>
          <line
            x1={x(new Date(Date.UTC(treatmentYear, 6, 1)))}
            x2={x(new Date(Date.UTC(treatmentYear, 6, 1)))}
            y1={m.top}
            y2={height - m.bottom}
            stroke="#0f766e"
            strokeDasharray="3 3"
          />
          <text
            x={x(new Date(Date.UTC(treatmentYear, 6, 1))) + 4}
            y={m.top + 10}
            className="fill-accent text-[10px] font-bold"
          >
            {treatment ?? 'treated'} {treatmentYear}
          </text>
        </g>
      )}
      <path d={path} fill="none" stroke="#1f2328" strokeWidth={1.5} />
      {surveys.map((s) => (
        <circle key={s.surveyDate} cx={x(new Date(s.surveyDate))} cy={y(s.pci)} r={3.5} fill="#1f2328">
          <title>{`${s.surveyDate}: PCI ${s.pci}`}</title>
        </circle>
      ))}
    </svg>
  );
}
