import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/page';
import { usePlanVersions } from '@/features/plans/api/get-plan-versions';
import { usePublishPlan } from '@/features/plans/api/publish-plan';
import { budgetsOf } from '@shared/schemas/plans';
import { money } from './money';

/** The plan's versions: the draft being edited and every published one, the one viewers see marked. */
export function PlanVersionsCard({ agencyId, planId }: { agencyId: string; planId: string }) {
  const versions = usePlanVersions(agencyId, planId);
  const publish = usePublishPlan(agencyId, planId);
  const v = versions.data;
  if (!v) return null;
  return (
    <Card title="Versions">
      <ul className="space-y-1 text-sm" data-testid="plan-versions">
        {v.editing.draft && (
          <li className="flex flex-wrap items-center gap-2">
            <span className="font-semibold">Version {v.editing.version}</span>
            <span className="rounded bg-paper px-1.5 py-0.5 text-xs">draft, being edited</span>
          </li>
        )}
        {v.items.map((x) => (
          <li key={x.id} className="flex flex-wrap items-center gap-2">
            <span className="font-semibold">Version {x.version}</span>
            <span className="text-asphalt-muted">
              “{x.name}”, {money(budgetsOf(x.settings)[0] ?? 0)} a year, published {x.publishedAt.slice(0, 10)}
              {x.publishedBy ? ` by ${x.publishedBy}` : ''}
            </span>
            {x.current ? (
              <span className="rounded bg-accent-light px-1.5 py-0.5 text-xs font-bold text-accent">
                viewers see this one
              </span>
            ) : (
              <Button
                variant="ghost"
                disabled={publish.isPending}
                onClick={() =>
                  publish.mutate(
                    { publish: true, notifyViewers: false, version: x.version },
                    {
                      onSuccess: () => toast.success(`Version ${x.version} published again`),
                      onError: (e) => toast.error(e.message),
                    },
                  )
                }
              >
                Publish version {x.version} again
              </Button>
            )}
            <a
              className="text-accent hover:underline"
              href={`/api/agencies/${agencyId}/plans/${planId}/brief.pdf?version=${x.version}`}
              target="_blank"
              rel="noreferrer"
            >
              its brief (PDF)
            </a>
          </li>
        ))}
        {v.items.length === 0 && <li className="text-asphalt-muted">Not published yet.</li>}
      </ul>
    </Card>
  );
}
