import { scaleLinear } from 'd3-scale';
import { fmtMoney } from '@/lib/format';

const money = (v: number) =>
  Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : Math.abs(v) >= 1e3 ? `$${(v / 1e3).toFixed(0)}k` : fmtMoney(v);

// Alternatives get the asphalt-and-teal family of the look; condition colours stay for condition.
export const ALT_COLORS = ['#1f2328', '#0f766e', '#7c6f57', '#4b7fa3', '#9a5b8a', '#a0a55b'];

/** Cash-flow diagram: one bar per activity year, up for cost, the remaining-life credit down at year N. */
export function CashFlowChart({
  flows,
  years,
  rsl,
  color,
  width = 320,
  height = 110,
}: {
  flows: { year: number; cost: number; kind?: string }[];
  years: number;
  rsl: number;
  color: string;
  width?: number;
  height?: number;
}) {
  const m = { top: 6, right: 6, bottom: 16, left: 6 };
  const max = Math.max(1, ...flows.map((f) => f.cost), rsl);
  const x = scaleLinear()
    .domain([0, years])
    .range([m.left, width - m.right]);
  const y = scaleLinear()
    .domain([-max * 0.6, max])
    .range([height - m.bottom, m.top]);
  return (
    <svg viewBox={`0 0 ${width} ${height}`} className="w-full" role="img" aria-label="Cash-flow diagram">
      <line x1={m.left} x2={width - m.right} y1={y(0)} y2={y(0)} stroke="#8c8574" />
      {flows.map((f, i) => (
        <rect
          key={i}
          x={x(f.year) - 2}
          width={4}
          y={y(f.cost)}
          height={Math.max(1, y(0) - y(f.cost))}
          fill={f.kind === 'maintenance' ? '#b9b2a2' : color}
        >
          <title>{`Year ${f.year}: ${money(f.cost)}`}</title>
        </rect>
      ))}
      {rsl > 0 && (
        <rect
          x={x(years) - 2}
          width={4}
          y={y(0)}
          height={y(-rsl * 0.6 * (max / max)) - y(0)}
          fill="#0f766e"
          opacity={0.5}
        >
          <title>{`Remaining life value at year ${years}: ${money(rsl)}`}</title>
        </rect>
      )}
      {[0, Math.round(years / 2), years].map((t) => (
        <text
          key={t}
          x={x(t)}
          y={height - 4}
          textAnchor="middle"
          className="num fill-asphalt-muted text-[9px]"
        >{`yr ${t}`}</text>
      ))}
    </svg>
  );
}

/** Monte Carlo: the distribution of each alternative's NPV on shared bins, as outlines. */
export function McHistogram({
  edges,
  counts,
  names,
  width = 560,
  height = 170,
}: {
  edges: number[];
  counts: number[][];
  names: string[];
  width?: number;
  height?: number;
}) {
  const m = { top: 8, right: 10, bottom: 22, left: 10 };
  const x = scaleLinear()
    .domain([edges[0], edges[edges.length - 1]])
    .range([m.left, width - m.right]);
  const max = Math.max(1, ...counts.flat());
  const y = scaleLinear()
    .domain([0, max])
    .range([height - m.bottom, m.top]);
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      className="w-full"
      role="img"
      aria-label="Monte Carlo distribution of net present value"
      data-testid="mc-histogram"
    >
      {counts.map((c, a) => {
        const d = c
          .map(
            (v, i) =>
              `${i === 0 ? 'M' : 'L'}${x(edges[i]).toFixed(1)},${y(v).toFixed(1)}L${x(edges[i + 1]).toFixed(1)},${y(v).toFixed(1)}`,
          )
          .join('');
        return (
          <path
            key={names[a]}
            d={`M${x(edges[0])},${y(0)}${d.replace(/^M/, 'L')}L${x(edges[edges.length - 1])},${y(0)}`}
            fill={ALT_COLORS[a % ALT_COLORS.length]}
            fillOpacity={0.12}
            stroke={ALT_COLORS[a % ALT_COLORS.length]}
            strokeWidth={1.3}
          >
            <title>{names[a]}</title>
          </path>
        );
      })}
      {x.ticks(5).map((t) => (
        <text key={t} x={x(t)} y={height - 6} textAnchor="middle" className="num fill-asphalt-muted text-[9px]">
          {money(t)}
        </text>
      ))}
    </svg>
  );
}

export { money };
