import { useQueries } from '@tanstack/react-query';
import { useState } from 'react';
import { EmptyState, PageHeader } from '@/components/ui/page';
import { planResultQueryOptions } from '@/features/plans/api/get-plan-result';
import { usePlans } from '@/features/plans/api/list-plans';
import { NewScenarioForm } from '@/features/plans/components/new-scenario-form';
import { PlansTable } from '@/features/plans/components/plans-table';
import { ScenarioComparison } from '@/features/plans/components/scenario-comparison';
import { useAgency } from '../use-agency';

export function PlansPage() {
  const { agencyId, membership } = useAgency();
  const plans = usePlans(agencyId);
  const [picked, setPicked] = useState<string[]>([]);
  const canEdit = membership?.role !== 'viewer';
  const results = useQueries({ queries: picked.map((id) => planResultQueryOptions(agencyId, id)) });
  const items = plans.data?.items ?? [];
  const compared = picked.flatMap((id, i) => {
    const plan = items.find((p) => p.id === id);
    const r = results[i]?.data?.latest?.result;
    return plan && r ? [{ plan, r }] : [];
  });
  const notRun = picked.filter((_id, i) => results[i]?.data && !results[i].data.latest);
  return (
    <div className="space-y-5">
      <PageHeader
        title="Plans"
        caption={
          canEdit
            ? 'Budget scenarios: which roads get what, when, and what each budget does to the network.'
            : 'Published paving plans and their council briefs.'
        }
      />
      {canEdit && <NewScenarioForm agencyId={agencyId} />}
      {items.length === 0 ? (
        <EmptyState>{canEdit ? 'No scenarios yet — create one above.' : 'No plan has been published yet.'}</EmptyState>
      ) : (
        <PlansTable items={items} picked={picked} onPick={setPicked} />
      )}
      {notRun.length > 0 && (
        <p className="text-sm text-asphalt-muted">
          {notRun.map((id) => items.find((p) => p.id === id)?.name).join(', ')}: not run yet, so not compared.
        </p>
      )}
      <ScenarioComparison compared={compared} />
    </div>
  );
}
