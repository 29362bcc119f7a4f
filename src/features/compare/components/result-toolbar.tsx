import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { TextInput } from '@/components/ui/field';
import { useRerunComparison, useSaveComparison } from '../api/comparisons';
import type { ComparePage } from '../hooks/use-compare-page';
import { basisOfSaved } from '../lib/run-basis';

/** Above the result: save a finished run, or a saved comparison's exports and re-run; the out-of-date mark. */
export function ResultToolbar({ page, agencyId }: { page: ComparePage; agencyId: string }) {
  const save = useSaveComparison(agencyId);
  const rerun = useRerunComparison(agencyId);
  const { runId, comparisonId, saved } = page;
  const finished = runId && page.run.data?.status === 'done';
  return (
    <div className="mb-3 space-y-2">
      <div className="flex flex-wrap items-center gap-2">
        {finished && (
          <>
            <TextInput
              aria-label="Comparison name"
              placeholder="Name this comparison"
              className="w-64"
              value={page.name}
              onChange={(e) => page.setName(e.target.value)}
            />
            <Button
              variant="secondary"
              disabled={save.isPending}
              onClick={() =>
                save.mutate(
                  { name: page.name || page.group?.label || 'Comparison', runId },
                  {
                    onSuccess: (s) => {
                      toast.success('Saved with all its inputs');
                      page.openSaved(s.id);
                    },
                    onError: (e) => toast.error(e.message),
                  },
                )
              }
            >
              Save
            </Button>
          </>
        )}
        {comparisonId && !runId && saved.data && (
          <>
            <span className="text-sm text-asphalt-muted" data-testid="saved-name">
              Saved: {saved.data.name}
            </span>
            <a
              className="text-sm font-semibold text-accent hover:underline"
              href={`/api/agencies/${agencyId}/analyses/${comparisonId}/export?format=csv`}
            >
              CSV
            </a>
            <a
              className="text-sm font-semibold text-accent hover:underline"
              href={`/api/agencies/${agencyId}/analyses/${comparisonId}/export?format=xlsx`}
            >
              XLSX
            </a>
            <Button
              variant="ghost"
              onClick={() => {
                const basis = basisOfSaved(saved.data!.input);
                rerun.mutate(comparisonId, {
                  onSuccess: (r) => {
                    page.setRunId(r.id);
                    page.setRunBasis(basis);
                  },
                  onError: (e) => toast.error(e.message),
                });
              }}
            >
              Re-run at its own prices
            </Button>
          </>
        )}
      </div>
      {page.changes.length > 0 && (
        <div
          role="status"
          data-testid="out-of-date"
          className="rounded border border-caution/40 bg-caution-bg px-3 py-1.5 text-sm text-caution"
        >
          <strong>Out of date.</strong> Changed since this result was run: {page.changes.join(', ')}. Press Compare to
          run it on the inputs shown.
        </div>
      )}
    </div>
  );
}
