import type { Treatment } from '@shared/schemas/catalog';
import { Card } from '@/components/ui/page';

/** How each catalog treatment moves a segment on its family's curve. */
export function TreatmentEffectsCard({ treatments }: { treatments: Treatment[] }) {
  return (
    <Card title="How treatments change condition">
      <table className="w-full text-sm">
        <thead className="text-left text-xs uppercase text-asphalt-muted">
          <tr>
            <th className="py-1">Treatment</th>
            <th>Effect on PCI</th>
            <th>Afterwards</th>
            <th>Given to roads at PCI</th>
          </tr>
        </thead>
        <tbody>
          {treatments.map((t) => (
            <tr key={t.id} className="border-t border-asphalt-line/60">
              <td className="py-1">{t.name}</td>
              <td>{t.effect.type === 'reset' ? `set to ${t.effect.value}` : `+ ${t.effect.value} (capped at 100)`}</td>
              <td className="text-asphalt-muted">
                {t.effect.resetsAge
                  ? 'follows the family curve from that PCI'
                  : 'keeps ageing on the curve; the gain fades to none over its life'}
              </td>
              <td className="num">
                {t.applicability.pciMin}–{t.applicability.pciMax}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Card>
  );
}
