import { Link, useParams } from 'react-router-dom';
import { EmptyState, PageHeader } from '@/components/ui/page';
import { usePlan } from '@/features/plans/api/get-plan';
import { usePlanResult } from '@/features/plans/api/get-plan-result';
import { BudgetSearchCard } from '@/features/plans/components/budget-search-card';
import { PlanDownloads } from '@/features/plans/components/plan-downloads';
import { PlanEditor } from '@/features/plans/components/plan-editor';
import { PlanResults } from '@/features/plans/components/plan-results';
import { PlanVersionsCard } from '@/features/plans/components/plan-versions';
import { VersionBanner } from '@/features/plans/components/version-banner';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

export function PlanPage() {
  const { agencyId, membership } = useAgency();
  const { planId = '' } = useParams();
  const plan = usePlan(agencyId, planId);
  const latest = usePlanResult(agencyId, planId);
  const canEdit = membership?.role !== 'viewer';
  if (plan.isLoading) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  if (!plan.data) return <NotFoundPage inline />;
  const p = plan.data;
  const result = latest.data?.latest?.result;
  return (
    <div className="space-y-4">
      <div className="text-sm">
        <Link to=".." relative="path" className="text-accent hover:underline">
          ← Plans
        </Link>
      </div>
      <PageHeader
        title={p.name}
        caption={`${p.settings.startYear}–${p.settings.startYear + p.settings.horizonYears - 1} · version ${p.version ?? 1}`}
        actions={result ? <PlanDownloads agencyId={agencyId} planId={planId} /> : undefined}
      />
      <VersionBanner plan={p} canEdit={canEdit} />
      {canEdit && <PlanEditor key={p.id} agencyId={agencyId} plan={p} hasResult={!!result} />}
      {canEdit && result && p.resultCurrent === false && (
        <p className="rounded border border-band-poor bg-white p-2 text-sm font-semibold" data-testid="out-of-date">
          Out of date: the results below are from before the last change. Run the plan again.
        </p>
      )}
      {result ? (
        <PlanResults agencyId={agencyId} r={result} />
      ) : (
        <EmptyState>
          {canEdit ? 'Not run yet — set the inputs and choose “Run the plan”.' : 'This plan has no results yet.'}
        </EmptyState>
      )}
      {canEdit && <PlanVersionsCard agencyId={agencyId} planId={planId} />}
      {canEdit && result && <BudgetSearchCard agencyId={agencyId} planId={planId} startPci={result.summary.startPci} />}
      <p className="text-xs text-asphalt-muted">
        A planning estimate in constant base-year dollars, not a pavement design. Structural adequacy (a thin overlay on
        a weak base), work zones and cold-weather paving are governed by local codes, agency specifications and a
        licensed engineer’s judgement.
      </p>
    </div>
  );
}
