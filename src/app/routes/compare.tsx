import { useEffect, useRef } from 'react';
import { EmptyState, PageHeader } from '@/components/ui/page';
import { useComparePage } from '@/features/compare/hooks/use-compare-page';
import { ResultToolbar } from '@/features/compare/components/result-toolbar';
import { RoadsCard } from '@/features/compare/components/roads-card';
import { RunBar } from '@/features/compare/components/run-bar';
import { SavedList } from '@/features/compare/components/saved-list';
import { SetupControls } from '@/features/compare/components/setup-controls';
import { ComparisonResults } from '@/features/compare/components/comparison-results';
import { useAgency } from '../use-agency';

export function ComparePage() {
  const { agencyId } = useAgency();
  const page = useComparePage(agencyId);
  const { catalog } = page;
  const resultTop = useRef<HTMLDivElement>(null);
  // A new result (a finished run, an opened comparison) brings its answer into view.
  const shownKey = page.result ? `${page.runId ?? ''}|${page.comparisonId ?? ''}` : null;
  useEffect(() => {
    const el = resultTop.current;
    if (!shownKey || !el) return;
    const top = el.getBoundingClientRect().top;
    if (top < 0 || top > window.innerHeight - 160) el.scrollIntoView({ block: 'start' });
  }, [shownKey]);

  if (catalog.isLoading || (catalog.data && !page.alts))
    return <div className="text-sm text-asphalt-muted">Loading the catalog…</div>;
  if (!catalog.data || catalog.data.treatments.length === 0)
    return <EmptyState>The catalog has no treatments yet — an admin adds them under Catalog.</EmptyState>;

  return (
    <div>
      <PageHeader
        title="Compare"
        caption="Life-cycle cost of 2–6 alternatives on one group of roads: the answer, the cost lines behind it, and how sure it is."
        actions={
          catalog.data.demoValues ? (
            <span className="rounded bg-caution-bg px-2 py-1 text-xs font-semibold text-caution">
              catalog holds demo values
            </span>
          ) : undefined
        }
      />
      <div className="grid grid-cols-1 gap-5 xl:grid-cols-[minmax(22rem,2fr)_minmax(0,3fr)] 2xl:grid-cols-[minmax(24rem,1fr)_minmax(0,2fr)]">
        <div className="space-y-3">
          <RoadsCard page={page} />
          <SetupControls page={page} catalog={catalog.data} />
          <div className="sticky bottom-0 z-10 border-t border-asphalt-line bg-paper py-2 shadow-[0_-4px_8px_-6px_rgba(0,0,0,0.2)]">
            <RunBar page={page} agencyId={agencyId} />
          </div>
          <SavedList page={page} agencyId={agencyId} />
        </div>
        <div className="min-w-0 scroll-mt-4" ref={resultTop}>
          {page.result ? (
            <>
              <ResultToolbar page={page} agencyId={agencyId} />
              <ComparisonResults r={page.result} />
            </>
          ) : (
            <EmptyState>
              Set up the alternatives and choose Compare. The answer appears here first, then the ranked present values,
              savings per lane-mile, cautions, cash flows, sensitivity and the Monte Carlo spread.
            </EmptyState>
          )}
        </div>
      </div>
    </div>
  );
}
