import type { PlanSummary } from '@/features/plans/api/keys';

/** Which version this is and which one viewers see, in one line. */
export function VersionBanner({ plan, canEdit }: { plan: PlanSummary; canEdit: boolean }) {
  const v = plan.version ?? 1;
  const pub = plan.published ?? null;
  let text: string;
  if (!canEdit) text = `Published version ${v}${plan.publishedAt ? `, ${plan.publishedAt.slice(0, 10)}` : ''}.`;
  else if (!pub)
    text = plan.status === 'published' ? `Version ${v}, published.` : `Version ${v}, draft — viewers do not see it.`;
  else if (pub.version === v)
    text = `Version ${v}, published ${pub.publishedAt.slice(0, 10)}: viewers see this version.`;
  else
    text = `Version ${v}, draft. Viewers see version ${pub.version} (published ${pub.publishedAt.slice(0, 10)}) until you publish this one.`;
  return (
    <p
      data-testid="version-banner"
      className={`rounded px-2 py-1 text-sm ${pub && (pub.version === v || !canEdit) ? 'bg-accent-light text-accent' : 'bg-paper'}`}
    >
      {text}
    </p>
  );
}
