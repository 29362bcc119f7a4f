import { Link, useParams } from 'react-router-dom';
import { BAND_MAPPING_NOTE, CONDITION_BANDS } from '@shared/condition';
import { BRIEF_CAUTIONS, briefMethod, briefSummary } from '@shared/engine/plan/brief-text';
import { LineChart, StackedBars } from '@/components/charts';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { usePlan, usePlanResult } from '@/features/plans/api/plans';
import { moneyTick } from '@/features/plans/components/money';
import { fmtInt, fmtMoney } from '@/lib/format';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

/** The first two years' work drawn as SVG: prints sharply, needs no WebGL. */
function WorkMap({ agencyId, years }: { agencyId: string; years: Map<number, number> }) {
  const geo = useSegmentsGeoJson(agencyId, {});
  const fc = geo.data;
  if (!fc?.features.length) return null;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const lines = (g: GeoJSON.LineString | GeoJSON.MultiLineString) =>
    g.type === 'LineString' ? [g.coordinates] : g.coordinates;
  for (const f of fc.features)
    for (const l of lines(f.geometry))
      for (const [x, y] of l) {
        minX = Math.min(minX, x);
        maxX = Math.max(maxX, x);
        minY = Math.min(minY, y);
        maxY = Math.max(maxY, y);
      }
  const k = Math.cos((((minY + maxY) / 2) * Math.PI) / 180);
  const W = 700;
  const H = Math.max(200, Math.min(520, (W * (maxY - minY)) / ((maxX - minX) * k || 1)));
  const s = Math.min(W / ((maxX - minX) * k || 1), H / (maxY - minY || 1));
  const d = (l: number[][]) =>
    l
      .map(([x, y], i) => `${i ? 'L' : 'M'}${((x - minX) * k * s).toFixed(1)},${(H - (y - minY) * s).toFixed(1)}`)
      .join('');
  const color = (id: number) => (years.get(id) === 0 ? '#0f766e' : years.get(id) === 1 ? '#d6b25e' : '#d3cdbf');
  const sorted = [...fc.features].sort(
    (a, b) => (years.has(a.properties.id) ? 1 : 0) - (years.has(b.properties.id) ? 1 : 0),
  );
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      className="w-full"
      role="img"
      aria-label="Map of the first two years' work"
      data-testid="brief-map"
    >
      {sorted.map((f) => (
        <path
          key={f.properties.id}
          d={lines(f.geometry).map(d).join('')}
          fill="none"
          stroke={color(f.properties.id)}
          strokeWidth={years.has(f.properties.id) ? 2.4 : 0.6}
        />
      ))}
    </svg>
  );
}

export function BriefPage() {
  const { agencyId, membership } = useAgency();
  const { planId = '' } = useParams();
  const plan = usePlan(agencyId, planId);
  const latest = usePlanResult(agencyId, planId);
  if (plan.isLoading || latest.isLoading) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  const r = latest.data?.latest?.result;
  if (!plan.data || !r) return <NotFoundPage inline />;
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  const x = r.years.map((y) => y.calendarYear);
  const work12 = r.work.filter((w) => w.year <= 1);
  const years = new Map(work12.map((w) => [w.ref, w.year]));
  const agencyName = membership?.agencyName ?? '';
  return (
    <article className="mx-auto max-w-3xl bg-white p-8 text-asphalt print:max-w-none print:p-0" data-testid="brief">
      <div className="no-print mb-4 flex gap-3 text-sm">
        <Link to=".." relative="path" className="text-accent hover:underline">
          ← Plan
        </Link>
        <button type="button" className="text-accent hover:underline" onClick={() => window.print()}>
          Print
        </button>
        <a className="text-accent hover:underline" href={`/api/agencies/${agencyId}/plans/${planId}/brief.pdf`}>
          PDF
        </a>
      </div>
      <h1 className="text-2xl font-black">
        {agencyName}: {plan.data.name}
      </h1>
      <p className="text-sm text-asphalt-muted">
        Paving plan {first.calendarYear}–{last.calendarYear} · {plan.data.status} ·{' '}
        {new Date().toISOString().slice(0, 10)}
      </p>
      <h2 className="mt-5 text-lg font-bold">Summary</h2>
      <p className="text-sm leading-relaxed">{briefSummary(r, agencyName)}</p>
      <h2 className="mt-5 text-lg font-bold">Network condition</h2>
      <LineChart
        x={x}
        label="Network PCI by year"
        yLabel="PCI"
        series={[
          { label: 'this plan', color: '#0f766e', values: r.years.map((y) => y.networkPci) },
          { label: 'worst-first', color: '#8c8574', dashed: true, values: r.baseline.years.map((y) => y.networkPci) },
          { label: 'no work', color: '#7f1d1d', dashed: true, values: r.years.map((y) => y.networkPciDoNothing) },
        ]}
      />
      <h2 className="mt-5 text-lg font-bold">Lane-miles by condition band</h2>
      <StackedBars
        x={x}
        label="Lane-miles by condition band"
        yLabel="lane-miles"
        format={(v) => fmtInt(v)}
        stacks={CONDITION_BANDS.slice()
          .reverse()
          .map((b) => ({ label: b.label, color: b.color, values: r.years.map((y) => y.laneMilesByBand[b.id] ?? 0) }))}
        height={150}
      />
      <p className="text-xs">
        {CONDITION_BANDS.map(
          (b) =>
            `${b.label} (PCI ${b.min}–${b.max}): ${fmtInt(first.laneMilesByBand[b.id])} → ${fmtInt(last.laneMilesByBand[b.id])} lane-mi`,
        ).join(' · ')}
      </p>
      <p className="text-xs">{BAND_MAPPING_NOTE}</p>
      <h2 className="mt-5 text-lg font-bold">Backlog</h2>
      <StackedBars
        x={x}
        label="Backlog by year"
        yLabel="backlog, $"
        format={moneyTick}
        stacks={[{ label: 'backlog', color: '#b45309', values: r.years.map((y) => y.backlog) }]}
        height={120}
      />
      <h2 className="mt-5 text-lg font-bold print:break-before-page">Map of the first two years’ work</h2>
      <WorkMap agencyId={agencyId} years={years} />
      <p className="text-xs">
        Teal: {first.calendarYear} work. Sand: {first.calendarYear + 1} work. Grey: other roads.
      </p>
      <h2 className="mt-5 text-lg font-bold">Work list, first two years</h2>
      <table className="num w-full text-xs">
        <thead className="text-left uppercase text-asphalt-muted">
          <tr>
            <th>Year</th>
            <th>Segment</th>
            <th>Road</th>
            <th>Treatment</th>
            <th className="text-right">Tons</th>
            <th className="text-right">SY</th>
            <th className="text-right">Cost</th>
          </tr>
        </thead>
        <tbody>
          {work12.map((w) => (
            <tr key={`${w.ref}-${w.year}`} className="border-t border-asphalt-line/60">
              <td>{w.calendarYear}</td>
              <td>{w.segmentId}</td>
              <td>{w.roadName}</td>
              <td>{w.treatment}</td>
              <td className="text-right">{w.tons ? fmtInt(w.tons) : '—'}</td>
              <td className="text-right">{fmtInt(w.areaSy)}</td>
              <td className="text-right">{fmtMoney(w.cost)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <h2 className="mt-5 text-lg font-bold">Method</h2>
      <p className="text-xs leading-relaxed">{briefMethod(r)}</p>
      <h2 className="mt-5 text-lg font-bold">Cautions</h2>
      <p className="text-xs leading-relaxed">{BRIEF_CAUTIONS}</p>
    </article>
  );
}
