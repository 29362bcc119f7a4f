import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { planResultQueryOptions, usePlans } from '@/features/plans/api/plans';
import { fmtMoney } from '@/lib/format';

/** The most recently published plan, in one sentence. */
export function LatestPlan({ agencyId }: { agencyId: string }) {
  const plans = usePlans(agencyId);
  const published = plans.data?.items
    .filter((p) => p.status === 'published')
    .sort((a, b) => (b.publishedAt ?? '').localeCompare(a.publishedAt ?? ''))[0];
  const result = useQuery({ ...planResultQueryOptions(agencyId, published?.id ?? ''), enabled: !!published });
  const r = result.data?.latest?.result;
  if (!published) return <p className="text-sm text-asphalt-muted">No plan is published yet.</p>;
  return (
    <div className="text-sm" data-testid="latest-plan">
      <Link to={`../plans/${published.id}`} className="font-semibold text-accent hover:underline">
        {published.name}
      </Link>
      {r && (
        <p className="mt-1">
          {r.years[0].calendarYear}–{r.years[r.years.length - 1].calendarYear}: {fmtMoney(r.summary.totalSpent)} on{' '}
          {r.summary.segmentsTreated} segments; network PCI {r.summary.startPci.toFixed(0)} →{' '}
          {r.summary.finalPci.toFixed(0)} (no work: {r.summary.finalPciDoNothing.toFixed(0)}).
        </p>
      )}
    </div>
  );
}
