import { Button } from '@/components/ui/button';
import type { ComparePage } from '../hooks/use-compare-page';

/** Compare, its progress while the worker runs, cancel, and how a run ended. */
export function RunBar({ page }: { page: ComparePage; agencyId: string }) {
  const run = page.run.data;
  return (
    <div className="flex items-center gap-3">
      <Button onClick={page.compare} disabled={page.running || !page.group || !page.alts}>
        {page.running ? 'Running…' : 'Compare'}
      </Button>
      {run?.status === 'running' && (
        <>
          <div
            className="h-2 w-40 overflow-hidden rounded bg-asphalt-line"
            role="progressbar"
            aria-label="Comparison progress"
            aria-valuenow={Math.round(run.progress * 100)}
          >
            <div className="h-full bg-accent" style={{ width: `${Math.round(run.progress * 100)}%` }} />
          </div>
          <Button variant="ghost" onClick={page.run.cancel}>
            Cancel
          </Button>
        </>
      )}
      {run?.status === 'failed' && (
        <span role="alert" className="text-sm text-band-failed">
          {run.error?.message}
        </span>
      )}
      {run?.status === 'cancelled' && <span className="text-sm text-asphalt-muted">Cancelled.</span>}
    </div>
  );
}
