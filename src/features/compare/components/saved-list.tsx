import { Card } from '@/components/ui/page';
import { fmt1 } from '@/lib/format';
import { useComparisons } from '../api/comparisons';
import type { ComparePage } from '../hooks/use-compare-page';

export function SavedList({ page, agencyId }: { page: ComparePage; agencyId: string }) {
  const list = useComparisons(agencyId);
  return (
    <Card title="Saved comparisons">
      {list.data?.items.length ? (
        <ul className="divide-y divide-asphalt-line/60 text-sm" data-testid="saved-comparisons">
          {list.data.items.map((s) => (
            <li key={s.id} className="flex items-center justify-between gap-3 py-1">
              <button
                type="button"
                className={`text-left hover:underline ${s.id === page.comparisonId ? 'font-bold text-asphalt' : 'text-accent'}`}
                onClick={() => page.openSaved(s.id)}
              >
                {s.name}
              </button>
              <span className="num shrink-0 text-xs text-asphalt-muted">
                {s.alternatives} alternatives · {fmt1(s.laneMiles)} lane-mi · {s.updatedAt.slice(0, 10)}
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-asphalt-muted">None yet. Run a comparison, then save it with its inputs.</p>
      )}
    </Card>
  );
}
