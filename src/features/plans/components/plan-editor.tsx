import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { toast } from 'sonner';
import { budgetsOf } from '@shared/schemas/plans';
import { Button } from '@/components/ui/button';
import { planQueryOptions } from '@/features/plans/api/get-plan';
import { type PlanSummary, plansKeys } from '@/features/plans/api/keys';
import { usePlanRun, useRunPlan } from '@/features/plans/api/run-plan';
import { useUpdatePlan } from '@/features/plans/api/update-plan';
import { type PlanDraft, PlanInputs } from './plan-inputs';
import { PublishControl } from './publish-control';

/** JSON with sorted keys, so two drafts compare by content. */
const stable = (v: unknown): string =>
  JSON.stringify(v, (_, x) =>
    x && typeof x === 'object' && !Array.isArray(x)
      ? Object.fromEntries(Object.entries(x).sort(([a], [b]) => a.localeCompare(b)))
      : x,
  );
const draftOf = (p: PlanSummary): PlanDraft => ({ name: p.name, settings: p.settings });

/** The engineer's half of the plan page: inputs, save, run (which saves unsaved edits first), publish. */
export function PlanEditor({ agencyId, plan, hasResult }: { agencyId: string; plan: PlanSummary; hasResult: boolean }) {
  const [draft, setDraft] = useState<PlanDraft>(() => draftOf(plan));
  const [runId, setRunId] = useState<string | null>(null);
  const update = useUpdatePlan(agencyId, plan.id);
  const runPlan = useRunPlan(agencyId, plan.id);
  const run = usePlanRun(agencyId, runId);
  const qc = useQueryClient();
  const dirty = stable(draft) !== stable(draftOf(plan));
  const runStatus = run.data?.status;
  useEffect(() => {
    if (runStatus && runStatus !== 'running') qc.invalidateQueries({ queryKey: plansKeys.all(agencyId) });
  }, [runStatus, qc, agencyId]);
  const refresh = async () =>
    setDraft(draftOf(await qc.fetchQuery({ ...planQueryOptions(agencyId, plan.id), staleTime: 0 })));
  const frozen = plan.frozen ?? false;
  return (
    <>
      <PlanInputs agencyId={agencyId} value={draft} onChange={setDraft} />
      {frozen && dirty && (
        <p className="text-sm" data-testid="new-version-note">
          This version is published. Saving or running these changes opens version {(plan.version ?? 1) + 1} as a draft;
          viewers keep seeing version {plan.published?.version ?? plan.version ?? 1} until you publish again.
        </p>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button
          variant="secondary"
          disabled={update.isPending || !dirty}
          onClick={() =>
            update.mutate(draft, {
              onSuccess: (p) => {
                setDraft(draftOf(p));
                toast.success('Scenario saved');
              },
              onError: (e) => toast.error(e.message),
            })
          }
        >
          Save inputs
        </Button>
        <Button
          disabled={runStatus === 'running' || runPlan.isPending}
          onClick={() =>
            runPlan.mutate(dirty ? draft : undefined, {
              onSuccess: (r) => {
                setRunId(r.id);
                void refresh();
              },
              onError: (e) => toast.error(e.message),
            })
          }
        >
          {dirty ? 'Run the plan (saves your changes)' : 'Run the plan'}
        </Button>
        {runStatus === 'running' && (
          <>
            <div
              className="h-2 w-48 overflow-hidden rounded bg-asphalt-line"
              role="progressbar"
              aria-valuenow={Math.round((run.data?.progress ?? 0) * 100)}
            >
              <div className="h-full bg-accent" style={{ width: `${Math.round((run.data?.progress ?? 0) * 100)}%` }} />
            </div>
            <Button variant="ghost" onClick={run.cancel}>
              Cancel
            </Button>
          </>
        )}
        {runStatus === 'failed' && (
          <span role="alert" className="text-sm text-band-failed">
            {run.data?.error?.message}
          </span>
        )}
        {runStatus === 'cancelled' && <span className="text-sm text-asphalt-muted">Cancelled.</span>}
        {dirty && (
          <span className="text-xs font-semibold text-band-poor" data-testid="unsaved-note">
            Unsaved changes
          </span>
        )}
        {hasResult && (
          <PublishControl
            agencyId={agencyId}
            plan={plan}
            budgetPerYear={(() => {
              const b = budgetsOf(plan.settings);
              return b.length ? b.reduce((s, x) => s + x, 0) / b.length : 0;
            })()}
            dirty={dirty}
          />
        )}
      </div>
    </>
  );
}
