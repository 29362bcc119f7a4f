import type { Mix } from '@shared/schemas/catalog';
import { Card } from '@/components/ui/page';
import { MixRow } from './mix-row';

export function MixTable({ mixes, canEdit, agencyId }: { mixes: Mix[]; canEdit: boolean; agencyId: string }) {
  return (
    <Card title="Mixes">
      <div className="overflow-x-auto">
        <table className="num w-full text-sm [&_td]:px-2 [&_th]:px-2 [&_th]:align-bottom" data-testid="mix-table">
          <thead className="text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="py-1">Mix</th>
              <th>Binder grade</th>
              <th>Modifier</th>
              <th className="text-right">Price ($/ton)</th>
              <th className="text-right">Spread (lb/SY-in)</th>
              <th className="text-right">Lifts (in)</th>
              <th className="text-right">Life (yr at lift)</th>
              <th className="text-right">Takes effect</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {mixes.map((m) => (
              <MixRow key={m.id} m={m} canEdit={canEdit} agencyId={agencyId} />
            ))}
          </tbody>
        </table>
      </div>
    </Card>
  );
}
