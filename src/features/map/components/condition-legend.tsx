import { CONDITION_BANDS, NO_DATA_COLOR } from '@shared/condition';

/** Map legend: every colour carries its PCI range in numbers. */
export function ConditionLegend() {
  return (
    <div
      className="absolute bottom-2 left-2 rounded border border-asphalt-line bg-white/95 px-2 py-1.5 text-[11px] shadow-sm"
      data-testid="map-legend"
    >
      <div className="mb-0.5 font-bold">PCI</div>
      {CONDITION_BANDS.map((b) => (
        <div key={b.id} className="flex items-center gap-1.5">
          <span className="inline-block h-1.5 w-4 rounded" style={{ background: b.color }} />
          <span className="num w-12">
            {b.min}–{b.max}
          </span>
          <span className="text-asphalt-muted">{b.label}</span>
          <span className="text-[10px] text-asphalt-muted/80">(ASTM {b.standard.join(' + ')})</span>
        </div>
      ))}
      <div className="flex items-center gap-1.5">
        <span className="inline-block h-1.5 w-4 rounded" style={{ background: NO_DATA_COLOR }} />
        <span className="text-asphalt-muted">no PCI (unpaved / unsurveyed)</span>
      </div>
      <div className="mt-0.5 text-asphalt-muted">Line width: functional class</div>
    </div>
  );
}
