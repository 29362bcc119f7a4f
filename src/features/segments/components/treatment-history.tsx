import { TREATMENT_KIND_LABELS } from '@shared/schemas/catalog';
import type { TreatmentRecord } from '@shared/schemas/segment-history';
import { fmtMoney } from '@/lib/format';

type Props = {
  records: TreatmentRecord[];
  /** The inventory's own "last treatment" (from an import or the first inventory), shown when no record matches it. */
  inventory: { name: string | null; year: number | null };
};

/** Every job recorded on the segment, newest first, and the inventory's last treatment if it predates them. */
export function TreatmentHistory({ records, inventory }: Props) {
  const inventoryShown =
    inventory.name !== null && !records.some((r) => Number(r.treatedOn.slice(0, 4)) === inventory.year);
  if (records.length === 0 && !inventoryShown)
    return <p className="text-sm text-asphalt-muted">No treatment recorded.</p>;
  return (
    <table className="num w-full text-sm" data-testid="treatment-history">
      <thead className="text-left text-xs font-bold text-asphalt-muted">
        <tr>
          <th className="py-1 pr-3">Date</th>
          <th className="pr-3">Treatment</th>
          <th className="pr-3">Mix and lift</th>
          <th className="pr-3 text-right">Cost</th>
          <th>Recorded by</th>
        </tr>
      </thead>
      <tbody>
        {records.map((r) => (
          <tr key={r.id} className="border-t border-asphalt-line/60 align-top">
            <td className="whitespace-nowrap py-1 pr-3">{r.treatedOn}</td>
            <td className="pr-3">
              <div className="font-semibold">{r.name}</div>
              {TREATMENT_KIND_LABELS[r.kind] !== r.name.toLowerCase() && (
                <div className="text-xs text-asphalt-muted">{TREATMENT_KIND_LABELS[r.kind]}</div>
              )}
              {r.notes && <div className="text-xs text-asphalt-muted">{r.notes}</div>}
            </td>
            <td className="pr-3">
              {[r.mix, r.thicknessIn !== null ? `${r.thicknessIn} in` : null].filter(Boolean).join(', ') || '—'}
            </td>
            <td className="pr-3 text-right">{r.costUsd === null ? '—' : fmtMoney(r.costUsd)}</td>
            <td className="text-asphalt-muted">{r.recordedBy ?? '—'}</td>
          </tr>
        ))}
        {inventoryShown && (
          <tr className="border-t border-asphalt-line/60 align-top">
            <td className="py-1 pr-3">{inventory.year ?? 'year not recorded'}</td>
            <td className="pr-3">
              <div className="font-semibold">{inventory.name}</div>
              <div className="text-xs text-asphalt-muted">from the inventory; no details recorded</div>
            </td>
            <td className="pr-3">—</td>
            <td className="pr-3 text-right">—</td>
            <td className="text-asphalt-muted">—</td>
          </tr>
        )}
      </tbody>
    </table>
  );
}
