import { scaleLinear } from 'd3-scale';
import { type ReactNode, type SVGProps, useLayoutEffect, useRef, useState } from 'react';

// Small SVG charts with direct labels (no legends to decode). Every chart in the
// app draws its text through CHART_TEXT, and at the pixel size of its box (the
// SVG is measured, never stretched by a viewBox), so an 11 px tick is 11 px on
// every screen and in print.
export const CHART_TEXT = {
  /** Axis values. */
  tick: { fontSize: 11, className: 'num fill-asphalt-muted' },
  /** Direct labels at a series' end or a bar's side. */
  label: { fontSize: 11, fontWeight: 700 },
  /** Axis titles and notes inside a chart. */
  note: { fontSize: 10, className: 'fill-asphalt-muted' },
} as const;

export const CHART_GRID = '#e4dfd3';

/** Text in one of the chart styles: `<ChartText kind="tick" x=… y=…>2027</ChartText>`. */
export function ChartText({
  kind,
  className = '',
  children,
  ...rest
}: SVGProps<SVGTextElement> & { kind: keyof typeof CHART_TEXT; children: ReactNode }) {
  const { className: base = '', ...style } = CHART_TEXT[kind] as { className?: string; fontSize: number };
  return (
    <text {...style} {...rest} className={`${base} ${className}`}>
      {children}
    </text>
  );
}

/** Width in px a label of `chars` characters takes in a chart style (Lato is narrow; this errs wide). */
export const textWidth = (text: string, kind: keyof typeof CHART_TEXT = 'tick') =>
  text.length * CHART_TEXT[kind].fontSize * 0.6;

/** The chart's box width, followed as the page resizes; `fallback` until measured. */
export function useChartWidth(fallback: number) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(fallback);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    const measure = () => {
      const w = Math.round(el.getBoundingClientRect().width);
      if (w > 0) setWidth(w);
    };
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);
  return { ref, width };
}

/** Every `step`-th index so that labels of this width never touch on this band width. */
export function tickStep(labels: string[], band: number) {
  const widest = Math.max(0, ...labels.map((l) => textWidth(l)));
  return Math.max(1, Math.ceil((widest + 10) / Math.max(band, 1)));
}

/** Which of n evenly spaced labels to draw: every `step`-th, stretched a little when that lands on both ends. */
export function tickIndices(n: number, step: number) {
  if (n <= 0) return [];
  let s = step;
  for (let t = step; t <= step * 2 && t < n; t++)
    if ((n - 1) % t === 0) {
      s = t;
      break;
    }
  const out: number[] = [];
  for (let i = 0; i < n; i += s) out.push(i);
  return out;
}

/** Spreads label positions (sorted by y) so none is closer than `gap` px, kept within [top, bottom]. */
export function spreadLabels<T extends { y: number }>(items: T[], gap: number, top: number, bottom: number): T[] {
  const out = [...items].sort((a, b) => a.y - b.y).map((i) => ({ ...i }));
  for (let i = 1; i < out.length; i++) if (out[i].y < out[i - 1].y + gap) out[i].y = out[i - 1].y + gap;
  const overflow = out.length ? out[out.length - 1].y - bottom : 0;
  if (overflow > 0) for (const o of out) o.y -= overflow;
  for (let i = 0; i < out.length; i++) if (out[i].y < top + i * gap) out[i].y = top + i * gap;
  return out;
}

export type Series = { label: string; color: string; values: number[]; dashed?: boolean };

/** What every chart takes: its categories, its box, how values read, and its names. */
type ChartBox = {
  /** Category labels, evenly spaced. */
  x: (string | number)[];
  height?: number;
  /** Width used until the box is measured. */
  width?: number;
  format?: (v: number) => string;
  /** A short axis title drawn above the values ("PCI", "$ a year"). */
  yLabel?: string;
  testId?: string;
  label?: string;
};

/** The y axis of a chart: its label above, and a grid line with its value at each tick. */
function YGrid({
  label,
  sy,
  ticks,
  left,
  right,
  format,
}: {
  label?: string;
  sy: ReturnType<typeof scaleLinear<number, number>>;
  ticks: number;
  left: number;
  right: number;
  format: (v: number) => string;
}) {
  return (
    <>
      {label && (
        <ChartText kind="note" x={left} y={11} textAnchor="start">
          {label}
        </ChartText>
      )}
      {sy.ticks(ticks).map((t) => (
        <g key={t}>
          <line x1={left} x2={right} y1={sy(t)} y2={sy(t)} stroke={CHART_GRID} />
          <ChartText kind="tick" x={left - 6} y={sy(t) + 4} textAnchor="end">
            {format(t)}
          </ChartText>
        </g>
      ))}
    </>
  );
}

export function LineChart({
  x,
  series,
  yMin = 0,
  yMax = 100,
  height = 200,
  width = 560,
  format = (v: number) => v.toFixed(0),
  yLabel,
  testId,
  label = 'Line chart',
}: ChartBox & {
  series: Series[];
  yMin?: number;
  yMax?: number;
}) {
  const { ref, width: w } = useChartWidth(width);
  const ends = series.map((s) => `${s.label} ${format(s.values[s.values.length - 1])}`);
  const right = Math.min(w * 0.4, Math.max(40, ...ends.map((e) => textWidth(e, 'label') + 10)));
  const m = { top: yLabel ? 22 : 12, right, bottom: 24, left: 44 };
  const sx = scaleLinear()
    .domain([0, Math.max(1, x.length - 1)])
    .range([m.left, w - m.right]);
  const sy = scaleLinear()
    .domain([yMin, yMax])
    .range([height - m.bottom, m.top])
    .nice();
  const labels = x.map(String);
  const step = tickStep(labels, (w - m.left - m.right) / Math.max(1, x.length - 1));
  const endLabels = spreadLabels(
    series.map((s, i) => ({ s, text: ends[i], y: sy(s.values[s.values.length - 1]) + 4 })),
    13,
    m.top,
    height - m.bottom,
  );
  return (
    <div ref={ref} className="w-full">
      <svg width={w} height={height} role="img" aria-label={label} data-testid={testId} className="block">
        <YGrid label={yLabel} sy={sy} ticks={5} left={m.left} right={w - m.right} format={format} />
        {tickIndices(labels.length, step).map((i) => (
          <ChartText key={labels[i]} kind="tick" x={sx(i)} y={height - 7} textAnchor="middle">
            {labels[i]}
          </ChartText>
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
          </g>
        ))}
        {endLabels.map(({ s, text, y }) => (
          <ChartText key={s.label} kind="label" x={sx(s.values.length - 1) + 6} y={y} fill={s.color}>
            {text}
          </ChartText>
        ))}
      </svg>
    </div>
  );
}

export function StackedBars({
  x,
  stacks,
  height = 180,
  width = 560,
  format = (v: number) => v.toFixed(0),
  yLabel,
  testId,
  label = 'Bar chart',
  directLabels = stacks.length > 1,
}: ChartBox & {
  stacks: { label: string; color: string; values: number[] }[];
  /** Name each stack beside the last bar (on by default when there is more than one). */
  directLabels?: boolean;
}) {
  const { ref, width: w } = useChartWidth(width);
  const right = directLabels
    ? Math.min(w * 0.35, Math.max(...stacks.map((s) => textWidth(s.label, 'label'))) + 16)
    : 10;
  const totals = x.map((_, i) => stacks.reduce((s, st) => s + st.values[i], 0));
  const tickLabelWidth = Math.max(...[0, Math.max(1, ...totals)].map((v) => textWidth(format(v))));
  const m = { top: yLabel ? 22 : 12, right, bottom: 24, left: Math.max(44, tickLabelWidth + 12) };
  const sy = scaleLinear()
    .domain([0, Math.max(1, ...totals)])
    .range([height - m.bottom, m.top])
    .nice();
  const band = (w - m.left - m.right) / x.length;
  const bw = band * 0.7;
  const cx = (i: number) => m.left + band * (i + 0.5);
  const labels = x.map(String);
  const step = tickStep(labels, band);
  const lastI = x.length - 1;
  const shown = new Set(tickIndices(x.length, step));
  let acc = 0;
  const sides = directLabels
    ? spreadLabels(
        stacks.map((s) => {
          const y0 = sy(acc);
          acc += s.values[lastI] ?? 0;
          return { s, y: (y0 + sy(acc)) / 2 + 4 };
        }),
        13,
        m.top + 4,
        height - m.bottom,
      )
    : [];
  return (
    <div ref={ref} className="w-full">
      <svg width={w} height={height} role="img" aria-label={label} data-testid={testId} className="block">
        <YGrid label={yLabel} sy={sy} ticks={4} left={m.left} right={w - m.right} format={format} />
        {x.map((v, i) => {
          let a = 0;
          return (
            <g key={String(v)}>
              {stacks.map((s) => {
                const y0 = sy(a);
                a += s.values[i];
                const y1 = sy(a);
                return (
                  <rect key={s.label} x={cx(i) - bw / 2} width={bw} y={y1} height={Math.max(0, y0 - y1)} fill={s.color}>
                    <title>{`${s.label}, ${v}: ${format(s.values[i])}`}</title>
                  </rect>
                );
              })}
              {shown.has(i) && (
                <ChartText kind="tick" x={cx(i)} y={height - 7} textAnchor="middle">
                  {v}
                </ChartText>
              )}
            </g>
          );
        })}
        {sides.map(({ s, y }) => (
          <ChartText key={s.label} kind="label" x={cx(lastI) + bw / 2 + 6} y={y} fill={s.color}>
            {s.label}
          </ChartText>
        ))}
      </svg>
    </div>
  );
}
