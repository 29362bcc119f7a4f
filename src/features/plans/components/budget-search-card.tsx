import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { useBudgetSearch, useStartBudgetSearch } from '@/features/plans/api/budget-search';
import { BudgetCurve } from './budget-curve';
import { money } from './money';

export function BudgetSearchCard({
  agencyId,
  planId,
  startPci,
}: {
  agencyId: string;
  planId: string;
  startPci?: number;
}) {
  const [target, setTarget] = useState(startPci !== undefined ? String(Math.round(startPci)) : '70');
  const [jobId, setJobId] = useState<string | null>(null);
  const start = useStartBudgetSearch(agencyId, planId);
  const job = useBudgetSearch(agencyId, jobId);
  const res = job.data?.status === 'done' ? job.data.result : undefined;
  return (
    <Card title="Find the budget">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        What flat annual budget holds the network at PCI
        <span className="inline-block w-20">
          <TextInput
            aria-label="Target PCI"
            type="number"
            min={1}
            max={100}
            value={target}
            onChange={(e) => setTarget(e.target.value)}
          />
        </span>
        in every year?
        <Button
          variant="secondary"
          disabled={job.data?.status === 'running' || start.isPending}
          onClick={() =>
            start.mutate(Number(target), { onSuccess: (j) => setJobId(j.id), onError: (e) => toast.error(e.message) })
          }
        >
          {job.data?.status === 'running' ? `Searching… ${Math.round(job.data.progress * 100)} %` : 'Find'}
        </Button>
      </div>
      {job.data?.status === 'failed' && (
        <p role="alert" className="mt-2 text-sm text-band-failed">
          {job.data.error?.message}
        </p>
      )}
      {res && (
        <div className="mt-3" data-testid="budget-search">
          <p className="text-sm font-semibold">
            {res.reachable && res.budget !== null
              ? `About ${money(res.budget)} a year reaches PCI ${res.targetPci}.`
              : `PCI ${res.targetPci} is out of reach even funding every candidate.`}
            {res.tolerance && <span className="font-normal text-asphalt-muted"> ({res.tolerance})</span>}
          </p>
          <BudgetCurve
            testId="budget-curve"
            points={res.points}
            target={res.targetPci}
            found={res.reachable ? res.budget : null}
          />
          <p className="text-xs text-asphalt-muted">
            Teal: network PCI in the last year at each budget tried; grey dashed: the lowest year’s PCI. Dashed amber:
            the target, and the budget found.
          </p>
        </div>
      )}
    </Card>
  );
}
