import { useState } from 'react';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { useFamilies } from '@/features/forecast/api/get-families';
import { CurveCard } from '@/features/forecast/components/curve-card';
import { FamilyList } from '@/features/forecast/components/family-list';
import { TreatmentEffectsCard } from '@/features/forecast/components/treatment-effects-card';
import { useAgency } from '../use-agency';

export function ForecastPage() {
  const { agencyId } = useAgency();
  const fams = useFamilies(agencyId);
  const catalog = useCatalog(agencyId);
  const [key, setKey] = useState<string | null>(null);
  if (fams.isError) return <Card>The curves could not be read: {fams.error.message}</Card>;
  if (fams.isLoading) return <div className="text-sm text-asphalt-muted">Fitting curves…</div>;
  const list = fams.data?.families ?? [];
  if (!list.length)
    return <EmptyState>No paved segments with surveys yet — import segments and condition surveys first.</EmptyState>;
  const f = list.find((x) => x.key === key) ?? list[0];
  return (
    <div>
      <PageHeader
        title="Forecast"
        caption="Deterioration curves per pavement family (surface, road class and last treatment), fitted by least squares to the agency’s own surveys. Plans use these to forecast condition."
      />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[20rem_minmax(0,1fr)]">
        <FamilyList families={list} selected={f.key} onSelect={setKey} />
        <div className="space-y-4">
          <CurveCard key={f.key} f={f} agencyId={agencyId} />
          <TreatmentEffectsCard treatments={catalog.data?.treatments ?? []} />
        </div>
      </div>
    </div>
  );
}
