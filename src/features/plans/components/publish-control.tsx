import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { usePublishPlan } from '@/features/plans/api/publish-plan';
import type { PlanSummary } from '@/features/plans/api/keys';
import { money } from './money';

/**
 * Publish with a confirmation that says what viewers will see; withdraw likewise. Publishing is
 * refused (with the reason) while the result is older than the last change.
 */
export function PublishControl({
  agencyId,
  plan,
  budgetPerYear,
  dirty,
}: {
  agencyId: string;
  plan: PlanSummary;
  budgetPerYear: number;
  dirty: boolean;
}) {
  const publish = usePublishPlan(agencyId, plan.id);
  const [asking, setAsking] = useState<'publish' | 'withdraw' | null>(null);
  const [notify, setNotify] = useState(true);
  const version = plan.version ?? 1;
  const draftOpen = !(plan.frozen ?? plan.status === 'published');
  const isPublished = plan.published ? plan.published.version === version : plan.status === 'published';
  const stale = dirty || plan.resultCurrent === false;
  return (
    <span className="ml-auto flex flex-wrap items-center gap-2 text-sm">
      {draftOpen || !isPublished ? (
        <Button onClick={() => setAsking('publish')} disabled={publish.isPending}>
          Publish
        </Button>
      ) : null}
      {plan.status === 'published' && (
        <Button variant="secondary" onClick={() => setAsking('withdraw')} disabled={publish.isPending}>
          Withdraw
        </Button>
      )}
      {asking && (
        <div
          role="dialog"
          aria-label={asking === 'publish' ? 'Publish this plan?' : 'Withdraw this plan?'}
          className="basis-full rounded border border-accent bg-white p-3 text-sm shadow"
        >
          {asking === 'publish' ? (
            <>
              <p className="font-semibold">
                Publish version {version} of “{plan.name}”?
              </p>
              <p className="mt-1 text-asphalt-muted">
                Viewers will see this version — {money(budgetPerYear)} a year, its results and its council brief, frozen
                as they are now — until you publish another version or withdraw it.
                {plan.published && plan.published.version !== version
                  ? ` It replaces version ${plan.published.version}.`
                  : ''}
              </p>
              {stale && (
                <p className="mt-1 font-semibold text-band-failed">
                  The inputs changed after the last run: run the plan first, so what you publish is what you see.
                </p>
              )}
              <label className="mt-2 flex items-center gap-1">
                <input type="checkbox" checked={notify} onChange={(e) => setNotify(e.target.checked)} /> e-mail the
                agency’s viewers the headline numbers and a link
              </label>
            </>
          ) : (
            <p className="font-semibold">Withdraw “{plan.name}”? Viewers will no longer see any version of it.</p>
          )}
          <div className="mt-2 flex gap-2">
            <Button
              disabled={publish.isPending || (asking === 'publish' && stale)}
              onClick={() =>
                publish.mutate(
                  { publish: asking === 'publish', notifyViewers: asking === 'publish' && notify },
                  {
                    onSuccess: (x) => {
                      setAsking(null);
                      toast.success(
                        x.status === 'published'
                          ? `Published${x.notified ? `; ${x.notified} viewer(s) e-mailed` : ''}`
                          : 'Withdrawn; viewers no longer see it',
                      );
                    },
                    onError: (e) => toast.error(e.message),
                  },
                )
              }
            >
              {asking === 'publish' ? 'Yes, publish' : 'Yes, withdraw'}
            </Button>
            <Button variant="ghost" onClick={() => setAsking(null)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
    </span>
  );
}
