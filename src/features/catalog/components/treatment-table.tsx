import type { Mix, Treatment } from '@shared/schemas/catalog';
import { Card } from '@/components/ui/page';
import { TreatmentRow } from './treatment-row';

export function TreatmentTable({
  treatments,
  mixes,
  canEdit,
  agencyId,
}: {
  treatments: Treatment[];
  mixes: Mix[];
  canEdit: boolean;
  agencyId: string;
}) {
  return (
    <Card title="Treatments">
      <div className="overflow-x-auto">
        <table className="num w-full text-sm [&_td]:px-2 [&_th]:px-2 [&_th]:align-bottom" data-testid="treatment-table">
          <thead className="text-left text-xs uppercase text-asphalt-muted">
            <tr>
              <th className="py-1">Treatment</th>
              <th>Kind</th>
              <th>Mix and costs</th>
              <th className="text-right">Life</th>
              <th>Effect on condition</th>
              <th>Given to roads at</th>
              <th className="text-right">Takes effect</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {treatments.map((t) => (
              <TreatmentRow key={t.id} t={t} mixes={mixes} canEdit={canEdit} agencyId={agencyId} />
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-asphalt-muted">
        Every job also carries mobilisation, traffic control by the day (at the treatment’s production rate) and the
        engineering and contingency add-ons below.
      </p>
    </Card>
  );
}
