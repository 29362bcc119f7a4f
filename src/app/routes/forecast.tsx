import { scaleLinear } from 'd3-scale';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { type Curve, type Family, useFamilies, useSetCurve } from '@/features/forecast/api/forecast';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { fmt2 } from '@/lib/format';
import { useAgency } from '../use-agency';

const pciAt = (c: Curve, t: number) => Math.min(100, Math.max(0, c.p0 - c.a * Math.max(0, t) ** c.b));
const SURFACE: Record<string, string> = {
  asphalt: 'Asphalt',
  chip_seal: 'Chip seal',
  concrete: 'Concrete',
  other: 'Other',
  gravel: 'Gravel',
};

function FitChart({ f, width = 620, height = 300 }: { f: Family; width?: number; height?: number }) {
  const m = { top: 10, right: 14, bottom: 30, left: 36 };
  const maxAge = Math.max(20, ...f.points.map((p) => p.age));
  const x = scaleLinear()
    .domain([0, maxAge])
    .range([m.left, width - m.right]);
  const y = scaleLinear()
    .domain([0, 100])
    .range([height - m.bottom, m.top]);
  const path = (c: Curve) =>
    Array.from({ length: 81 }, (_, i) => (maxAge * i) / 80)
      .map((t, i) => `${i ? 'L' : 'M'}${x(t).toFixed(1)},${y(pciAt(c, t)).toFixed(1)}`)
      .join('');
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      className="w-full"
      role="img"
      aria-label="Fitted curve over survey points"
      data-testid="fit-chart"
    >
      {[0, 25, 50, 75, 100].map((v) => (
        <g key={v}>
          <line x1={m.left} x2={width - m.right} y1={y(v)} y2={y(v)} stroke="#e4dfd3" />
          <text x={m.left - 6} y={y(v) + 3} textAnchor="end" className="num fill-asphalt-muted text-[10px]">
            {v}
          </text>
        </g>
      ))}
      {x.ticks(8).map((t) => (
        <text key={t} x={x(t)} y={height - 12} textAnchor="middle" className="num fill-asphalt-muted text-[10px]">
          {t}
        </text>
      ))}
      <text x={(width + m.left) / 2} y={height - 1} textAnchor="middle" className="fill-asphalt-muted text-[10px]">
        years since last treatment
      </text>
      {f.points.map((p, i) => (
        <circle key={i} cx={x(p.age)} cy={y(p.pci)} r={1.8} fill="#1f2328" opacity={0.35} />
      ))}
      {f.fitted && f.source !== 'fitted' && (
        <path d={path(f.fitted.curve)} fill="none" stroke="#8c8574" strokeDasharray="4 3" strokeWidth={1.5} />
      )}
      <path d={path(f.curve)} fill="none" stroke="#0f766e" strokeWidth={2.5} />
    </svg>
  );
}

export function ForecastPage() {
  const { agencyId } = useAgency();
  const fams = useFamilies(agencyId);
  const catalog = useCatalog(agencyId);
  const set = useSetCurve(agencyId);
  const [key, setKey] = useState<string | null>(null);
  const [edit, setEdit] = useState<Curve | null>(null);
  if (fams.isLoading) return <div className="text-sm text-asphalt-muted">Fitting curves…</div>;
  const list = fams.data?.families ?? [];
  if (!list.length)
    return <EmptyState>No paved segments with surveys yet — import segments and condition surveys first.</EmptyState>;
  const f = list.find((x) => x.key === (key ?? list[0].key)) ?? list[0];
  const lifeTo = (c: Curve, p: number) => ((c.p0 - p) / c.a) ** (1 / c.b);
  return (
    <div>
      <PageHeader
        title="Forecast"
        caption="Deterioration curves per pavement family (surface × class × last treatment), fitted by least squares to the agency’s own surveys. Plans use these to forecast condition."
      />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[20rem_minmax(0,1fr)]">
        <Card title="Families">
          <ul className="space-y-1 text-sm" data-testid="families">
            {list.map((x) => (
              <li key={x.key}>
                <button
                  type="button"
                  onClick={() => {
                    setKey(x.key);
                    setEdit(null);
                  }}
                  className={`w-full rounded px-2 py-1 text-left ${x.key === f.key ? 'bg-accent-light' : 'hover:bg-paper'}`}
                >
                  <div className="font-semibold">
                    {SURFACE[x.surface] ?? x.surface} · {x.classGroup} · {x.treatmentGroup}
                  </div>
                  <div className="num text-xs text-asphalt-muted">
                    {x.segments} segments · n = {x.n} · {x.source}
                    {x.rmse !== null ? ` · RMSE ${x.rmse.toFixed(1)}` : ''}
                  </div>
                </button>
              </li>
            ))}
          </ul>
        </Card>
        <div className="space-y-4">
          <Card
            title={`${SURFACE[f.surface] ?? f.surface}, ${f.classGroup} roads, last treatment: ${f.treatmentGroup}`}
          >
            <p className="mb-2 text-sm" data-testid="fit-caption">
              PCI = {fmt2(f.curve.p0)} − {f.curve.a.toFixed(3)} × age^{f.curve.b.toFixed(2)} (
              {f.source === 'fitted'
                ? `fitted to ${f.n} surveys, RMSE ${f.rmse?.toFixed(1)} PCI points`
                : f.source === 'edited'
                  ? 'set by hand for this agency'
                  : `a default curve (planning value, not fitted): ${f.n} surveys are fewer than the 20 a fit needs`}
              ). It reaches PCI 70 after {lifeTo(f.curve, 70).toFixed(1)} years and 40 after{' '}
              {lifeTo(f.curve, 40).toFixed(1)} years.
            </p>
            <FitChart f={f} />
            {f.fitted && f.source !== 'fitted' && (
              <p className="text-xs text-asphalt-muted">
                Dashed: the least-squares fit to these {f.n} points (RMSE {f.fitted.rmse.toFixed(1)}), shown for
                comparison.
              </p>
            )}
            <div className="mt-3 flex flex-wrap items-end gap-2 text-sm">
              {edit ? (
                <>
                  {(['p0', 'a', 'b'] as const).map((k) => (
                    <label key={k}>
                      <span className="block text-xs text-asphalt-muted">
                        {k === 'p0' ? 'P0 (new)' : k === 'a' ? 'a (rate)' : 'b (shape, 1–3)'}
                      </span>
                      <TextInput
                        aria-label={`Curve ${k}`}
                        type="number"
                        step="0.01"
                        className="w-24"
                        value={edit[k]}
                        onChange={(e) => setEdit({ ...edit, [k]: Number(e.target.value) })}
                      />
                    </label>
                  ))}
                  <Button
                    onClick={() =>
                      set.mutate(
                        { familyKey: f.key, curve: edit },
                        {
                          onSuccess: () => {
                            toast.success('Curve saved');
                            setEdit(null);
                          },
                          onError: (e) => toast.error(e.message),
                        },
                      )
                    }
                  >
                    Save curve
                  </Button>
                  <Button variant="ghost" onClick={() => setEdit(null)}>
                    Cancel
                  </Button>
                </>
              ) : (
                <>
                  <Button variant="secondary" onClick={() => setEdit({ ...f.curve })}>
                    Edit this curve
                  </Button>
                  {f.source === 'edited' && (
                    <Button variant="ghost" onClick={() => set.mutate({ familyKey: f.key, curve: null })}>
                      Go back to the fit / default
                    </Button>
                  )}
                </>
              )}
            </div>
          </Card>
          <Card title="How treatments change condition">
            <table className="w-full text-sm">
              <thead className="text-left text-xs uppercase text-asphalt-muted">
                <tr>
                  <th className="py-1">Treatment</th>
                  <th>Effect</th>
                  <th>Then</th>
                  <th>Applies at PCI</th>
                </tr>
              </thead>
              <tbody>
                {catalog.data?.treatments.map((t) => (
                  <tr key={t.id} className="border-t border-asphalt-line/60">
                    <td className="py-1">{t.name}</td>
                    <td>
                      {t.effect.type === 'reset'
                        ? `PCI set to ${t.effect.value}`
                        : `PCI + ${t.effect.value} (capped at 100)`}
                    </td>
                    <td className="text-asphalt-muted">
                      {t.effect.resetsAge
                        ? 'follows the family curve from that PCI'
                        : 'keeps ageing on the curve, shifted up'}
                    </td>
                    <td className="num">
                      {t.applicability.pciMin}–{t.applicability.pciMax}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </Card>
        </div>
      </div>
    </div>
  );
}
