import type { Mix } from '@shared/schemas/catalog';
import { Card } from '@/components/ui/page';
import { CatalogTable, type Column } from './catalog-table';
import { MixRow } from './mix-row';

const COLUMNS: Column[] = [
  { label: 'Mix' },
  { label: 'Binder grade' },
  { label: 'Modifier' },
  { label: 'Price ($/ton)', right: true },
  { label: 'Spread (lb/SY-in)', right: true },
  { label: 'Lifts (in)', right: true },
  { label: 'Life (yr at lift)', right: true },
  { label: 'Takes effect', right: true },
  { label: '' },
];

export function MixTable({ mixes, canEdit, agencyId }: { mixes: Mix[]; canEdit: boolean; agencyId: string }) {
  return (
    <Card title="Mixes">
      <CatalogTable testId="mix-table" columns={COLUMNS}>
        {mixes.map((m) => (
          <MixRow key={m.id} m={m} columns={COLUMNS.length} canEdit={canEdit} agencyId={agencyId} />
        ))}
      </CatalogTable>
    </Card>
  );
}
