import { Card, PageHeader } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { EconomicsCard } from '@/features/catalog/components/economics-card';
import { MixTable } from '@/features/catalog/components/mix-table';
import { PriceHistoryCard } from '@/features/catalog/components/price-history-card';
import { TreatmentTable } from '@/features/catalog/components/treatment-table';
import { useAgency } from '../use-agency';

export function CatalogPage() {
  const { agencyId, membership } = useAgency();
  const canEdit = membership?.role === 'admin';
  const c = useCatalog(agencyId);
  if (c.isError) return <Card>The catalog could not be read: {c.error.message}</Card>;
  if (c.isLoading || !c.data) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  const d = c.data;
  return (
    <div className="space-y-5">
      <PageHeader
        title="Catalog"
        caption={
          canEdit
            ? 'The agency’s mixes, treatments and economics. Each price keeps the date it takes effect; saved comparisons keep the prices they used.'
            : 'The agency’s mixes, treatments and economics (admins change them).'
        }
        actions={
          d.demoValues ? (
            <span className="rounded bg-caution-bg px-2 py-1 text-xs font-semibold text-caution">
              Items tagged “demo values” are invented for the demo county
            </span>
          ) : undefined
        }
      />
      <MixTable mixes={d.mixes} canEdit={canEdit} agencyId={agencyId} />
      <TreatmentTable treatments={d.treatments} mixes={d.mixes} canEdit={canEdit} agencyId={agencyId} />
      <EconomicsCard e={d.economics} canEdit={canEdit} agencyId={agencyId} />
      {membership?.role !== 'viewer' && <PriceHistoryCard agencyId={agencyId} />}
    </div>
  );
}
