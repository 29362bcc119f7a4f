import type { Mix, Treatment } from '@shared/schemas/catalog';
import { Card } from '@/components/ui/page';
import { CatalogTable, type Column } from './catalog-table';
import { TreatmentRow } from './treatment-row';

const COLUMNS: Column[] = [
  { label: 'Treatment' },
  { label: 'Kind' },
  { label: 'Mix and costs' },
  { label: 'Life', right: true },
  { label: 'Effect on condition' },
  { label: 'Given to roads at' },
  { label: 'Takes effect', right: true },
  { label: '' },
];

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
      <CatalogTable testId="treatment-table" columns={COLUMNS}>
        {treatments.map((t) => (
          <TreatmentRow key={t.id} t={t} mixes={mixes} columns={COLUMNS.length} canEdit={canEdit} agencyId={agencyId} />
        ))}
      </CatalogTable>
      <p className="mt-2 text-xs text-asphalt-muted">
        Every job also carries mobilisation, traffic control by the day (at the treatment’s production rate) and the
        engineering and contingency add-ons below.
      </p>
    </Card>
  );
}
