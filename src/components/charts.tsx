import { scaleLinear } from 'd3-scale';

// Small SVG charts with direct labels (no legends to decode).
export type Series = { label: string; color: string; values: number[]; dashed?: boolean };

export function LineChart({
  x,
  series,
  yMin = 0,
  yMax = 100,
  height = 200,
  width = 560,
  format = (v: number) => v.toFixed(0),
  testId,
  label = 'Line chart',
}: {
  x: (string | number)[];
  series: Series[];
  yMin?: number;
  yMax?: number;
  height?: number;
  width?: number;
  format?: (v: number) => string;
  testId?: string;
  label?: string;
}) {
  const m = { top: 10, right: 110, bottom: 22, left: 40 };
  const sx = scaleLinear()
    .domain([0, Math.max(1, x.length - 1)])
    .range([m.left, width - m.right]);
  const sy = scaleLinear()
    .domain([yMin, yMax])
    .range([height - m.bottom, m.top])
    .nice();
  return (
    <svg viewBox={`0 0 ${width} ${height}`} className="w-full" role="img" aria-label={label} data-testid={testId}>
      {sy.ticks(5).map((t) => (
        <g key={t}>
          <line x1={m.left} x2={width - m.right} y1={sy(t)} y2={sy(t)} stroke="#e4dfd3" />
          <text x={m.left - 6} y={sy(t) + 3} textAnchor="end" className="num fill-asphalt-muted text-[10px]">
            {format(t)}
          </text>
        </g>
      ))}
      {x.map((v, i) => (
        <text
          key={String(v)}
          x={sx(i)}
          y={height - 6}
          textAnchor="middle"
          className="num fill-asphalt-muted text-[10px]"
        >
          {v}
        </text>
      ))}
      {series.map((s) => (
        <g key={s.label}>
          <path
            d={s.values.map((v, i) => `${i ? 'L' : 'M'}${sx(i).toFixed(1)},${sy(v).toFixed(1)}`).join('')}
            fill="none"
            stroke={s.color}
            strokeWidth={2}
            strokeDasharray={s.dashed ? '4 3' : undefined}
          />
          {s.values.map((v, i) => (
            <circle key={i} cx={sx(i)} cy={sy(v)} r={2} fill={s.color}>
              <title>{`${s.label}, ${x[i]}: ${format(v)}`}</title>
            </circle>
          ))}
          <text
            x={sx(s.values.length - 1) + 6}
            y={sy(s.values[s.values.length - 1]) + 3}
            className="text-[10px] font-bold"
            fill={s.color}
          >{`${s.label} ${format(s.values[s.values.length - 1])}`}</text>
        </g>
      ))}
    </svg>
  );
}

export function StackedBars({
  x,
  stacks,
  height = 180,
  width = 560,
  format = (v: number) => v.toFixed(0),
  testId,
  label = 'Bar chart',
}: {
  x: (string | number)[];
  stacks: { label: string; color: string; values: number[] }[];
  height?: number;
  width?: number;
  format?: (v: number) => string;
  testId?: string;
  label?: string;
}) {
  const m = { top: 10, right: 10, bottom: 22, left: 46 };
  const totals = x.map((_, i) => stacks.reduce((s, st) => s + st.values[i], 0));
  const sy = scaleLinear()
    .domain([0, Math.max(1, ...totals)])
    .range([height - m.bottom, m.top])
    .nice();
  const bw = ((width - m.left - m.right) / x.length) * 0.7;
  const cx = (i: number) => m.left + ((width - m.left - m.right) / x.length) * (i + 0.5);
  return (
    <svg viewBox={`0 0 ${width} ${height}`} className="w-full" role="img" aria-label={label} data-testid={testId}>
      {sy.ticks(4).map((t) => (
        <g key={t}>
          <line x1={m.left} x2={width - m.right} y1={sy(t)} y2={sy(t)} stroke="#e4dfd3" />
          <text x={m.left - 6} y={sy(t) + 3} textAnchor="end" className="num fill-asphalt-muted text-[10px]">
            {format(t)}
          </text>
        </g>
      ))}
      {x.map((v, i) => {
        let acc = 0;
        return (
          <g key={String(v)}>
            {stacks.map((s) => {
              const y0 = sy(acc);
              acc += s.values[i];
              const y1 = sy(acc);
              return (
                <rect key={s.label} x={cx(i) - bw / 2} width={bw} y={y1} height={Math.max(0, y0 - y1)} fill={s.color}>
                  <title>{`${s.label}, ${v}: ${format(s.values[i])}`}</title>
                </rect>
              );
            })}
            <text x={cx(i)} y={height - 6} textAnchor="middle" className="num fill-asphalt-muted text-[10px]">
              {v}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
