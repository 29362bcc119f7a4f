// A write to a segment or its history must refresh every view that shows it, the
// network summary included (its totals and condition bands come from the segments).
// Real TanStack Query client, no server: only the cache's bookkeeping is under test.
import { QueryClient, QueryObserver } from '@tanstack/react-query';
import { afterEach, describe, expect, it } from 'vitest';
import { networkQueryOptions } from '@/features/network/api/get-network';
import { segmentKeys } from '@/features/segments/api/keys';
import { invalidateSegmentViews } from '@/features/segments/api/update-segment';

const qc = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Number.POSITIVE_INFINITY } } });
afterEach(() => qc.clear());

const invalidated = (key: readonly unknown[]) => qc.getQueryState(key)?.isInvalidated;

describe('invalidateSegmentViews', () => {
  it("marks the agency's network summary and every segment view stale, and no other agency's", async () => {
    const network = networkQueryOptions('a1').queryKey;
    const otherNetwork = networkQueryOptions('a2').queryKey;
    const keys = [
      segmentKeys.list('a1', { q: 'mill' }),
      segmentKeys.pages('a1', {}),
      segmentKeys.detail('a1', 7),
      segmentKeys.treatments('a1', 7),
      segmentKeys.districts('a1'),
      segmentKeys.map('a1', {}),
    ];
    for (const k of [network, otherNetwork, segmentKeys.detail('a2', 7), ...keys]) qc.setQueryData(k, { seen: true });

    await invalidateSegmentViews(qc, 'a1');

    expect(invalidated(network)).toBe(true);
    for (const k of keys) expect(invalidated(k), JSON.stringify(k)).toBe(true);
    expect(invalidated(otherNetwork)).toBe(false);
    expect(invalidated(segmentKeys.detail('a2', 7))).toBe(false);
  });

  it('fetches the network summary again when a screen is showing it', async () => {
    let reads = 0;
    const observer = new QueryObserver(qc, {
      queryKey: networkQueryOptions('a1').queryKey,
      queryFn: async () => ({ read: ++reads }),
    });
    const unsubscribe = observer.subscribe(() => {});
    await qc.fetchQuery({ queryKey: networkQueryOptions('a1').queryKey, queryFn: async () => ({ read: ++reads }) });
    const before = reads;

    await invalidateSegmentViews(qc, 'a1');

    expect(reads).toBeGreaterThan(before);
    unsubscribe();
  });
});
