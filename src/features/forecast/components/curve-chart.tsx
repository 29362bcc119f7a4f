import { scaleLinear } from 'd3-scale';
import { type Curve, pciAt } from '@shared/engine/forecast/curve';
import type { Family } from '@shared/schemas/forecast';

const W = 620;
const H = 300;
const M = { top: 10, right: 14, bottom: 30, left: 40 };

/** The family's survey points, the curve plans use, the fit when another curve is used, and a draft being edited. */
export function CurveChart({ f, draft }: { f: Family; draft: Curve | null }) {
  const maxAge = Math.max(20, ...f.points.map((p) => p.age));
  const x = scaleLinear()
    .domain([0, maxAge])
    .range([M.left, W - M.right]);
  const y = scaleLinear()
    .domain([0, 100])
    .range([H - M.bottom, M.top]);
  const path = (c: Curve) =>
    Array.from({ length: 81 }, (_, i) => (maxAge * i) / 80)
      .map((t, i) => `${i ? 'L' : 'M'}${x(t).toFixed(1)},${y(pciAt(c, t)).toFixed(1)}`)
      .join('');
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      role="img"
      aria-label="Deterioration curve over the survey points: PCI against years since the last treatment"
      data-testid="fit-chart"
    >
      {[0, 25, 50, 75, 100].map((v) => (
        <g key={v}>
          <line x1={M.left} x2={W - M.right} y1={y(v)} y2={y(v)} stroke="#e4dfd3" />
          <text x={M.left - 6} y={y(v) + 3} textAnchor="end" className="num fill-asphalt-muted text-[10px]">
            {v}
          </text>
        </g>
      ))}
      <text
        transform={`translate(10 ${(H - M.bottom + M.top) / 2}) rotate(-90)`}
        textAnchor="middle"
        className="fill-asphalt-muted text-[10px]"
      >
        PCI
      </text>
      {x.ticks(8).map((t) => (
        <text key={t} x={x(t)} y={H - 12} textAnchor="middle" className="num fill-asphalt-muted text-[10px]">
          {t}
        </text>
      ))}
      <text x={(W + M.left) / 2} y={H - 1} textAnchor="middle" className="fill-asphalt-muted text-[10px]">
        years since the last treatment
      </text>
      {f.points.map((p, i) => (
        <circle key={i} cx={x(p.age)} cy={y(p.pci)} r={1.8} fill="#1f2328" opacity={0.35} />
      ))}
      {f.fitted && f.source !== 'fitted' && (
        <path
          d={path(f.fitted.curve)}
          data-testid="curve-fit"
          fill="none"
          stroke="#8c8574"
          strokeDasharray="4 3"
          strokeWidth={1.5}
        />
      )}
      <path d={path(f.curve)} data-testid="curve-used" fill="none" stroke="#0f766e" strokeWidth={2.5} />
      {draft && (
        <path
          d={path(draft)}
          data-testid="curve-draft"
          fill="none"
          stroke="#b45309"
          strokeDasharray="6 3"
          strokeWidth={2}
        />
      )}
    </svg>
  );
}
