import { BAND_MAPPING_NOTE, CONDITION_BANDS, NO_DATA_COLOR } from '@shared/condition';
import { fmtInt } from '@/lib/format';

/** Lane-miles by condition band as one horizontal bar; the legend always carries numbers. */
export function ConditionBar({ byBand }: { byBand: { band: string; laneMiles: number }[] }) {
  const bands = [
    ...CONDITION_BANDS.map((b) => ({
      id: b.id as string,
      label: `${b.label} (PCI ${b.min}–${b.max})`,
      color: b.color,
    })),
    { id: 'none', label: 'Unpaved or no survey', color: NO_DATA_COLOR },
  ];
  const total = byBand.reduce((s, b) => s + b.laneMiles, 0) || 1;
  const value = (id: string) => byBand.find((b) => b.band === id)?.laneMiles ?? 0;
  return (
    <div>
      <div className="flex h-6 w-full overflow-hidden rounded" role="img" aria-label="Lane-miles by condition band">
        {bands.map((b) => (
          <div
            key={b.id}
            style={{ width: `${(100 * value(b.id)) / total}%`, background: b.color }}
            title={`${b.label}: ${fmtInt(value(b.id))} lane-mi`}
          />
        ))}
      </div>
      <ul className="mt-2 grid grid-cols-2 gap-x-4 gap-y-1 text-xs md:grid-cols-3">
        {bands.map((b) => (
          <li key={b.id} className="flex items-center gap-2">
            <span className="inline-block h-3 w-3 rounded-sm" style={{ background: b.color }} />
            <span className="text-asphalt-muted">{b.label}</span>
            <span className="num ml-auto font-semibold">{fmtInt(value(b.id))} lane-mi</span>
            <span className="num w-10 text-right text-asphalt-muted">{Math.round((100 * value(b.id)) / total)}%</span>
          </li>
        ))}
      </ul>
      <p className="mt-1 text-[11px] text-asphalt-muted">{BAND_MAPPING_NOTE}</p>
    </div>
  );
}
