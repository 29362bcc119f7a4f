import { fmtInt } from '@/lib/format';
import { LATER_YEARS_COLOR, NO_WORK_COLOR, YEAR_COLORS, yearColor } from '../year-colors';

type Props = { plannedYear: Map<number, number>; yearLabels: string[] };

/** Plan map legend: colour, year number, calendar year and how many segments get work that year. */
export function YearLegend({ plannedYear, yearLabels }: Props) {
  const counts = new Map<number, number>();
  for (const y of plannedYear.values()) counts.set(y, (counts.get(y) ?? 0) + 1);
  const distinct = yearLabels.slice(0, YEAR_COLORS.length);
  const later = yearLabels.slice(YEAR_COLORS.length);
  const laterCount = [...counts.entries()].filter(([y]) => y >= YEAR_COLORS.length).reduce((s, [, n]) => s + n, 0);
  const row = (key: string, color: string, label: string, n: number | null) => (
    <div key={key} className="grid grid-cols-[1rem_auto_auto] items-center gap-x-1.5">
      <span className="inline-block h-1.5 w-4 rounded" style={{ background: color }} />
      <span className="num">{label}</span>
      <span className="num text-right text-asphalt-muted">{n === null ? '' : `${fmtInt(n)} seg.`}</span>
    </div>
  );
  return (
    <div
      className="absolute bottom-2 left-2 rounded border border-asphalt-line bg-white/95 px-2 py-1.5 text-[11px] shadow-sm"
      data-testid="year-legend"
    >
      <div className="mb-0.5 font-bold">Work planned in</div>
      {distinct.map((label, i) => row(label, yearColor(i), `${i + 1} · ${label}`, counts.get(i) ?? 0))}
      {later.length > 0 &&
        row(
          'later',
          LATER_YEARS_COLOR,
          `${YEAR_COLORS.length + 1}–${yearLabels.length} · ${later[0]}–${later.at(-1)}`,
          laterCount,
        )}
      {row('none', NO_WORK_COLOR, 'no work planned', null)}
    </div>
  );
}
