import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { getSegments, type SegmentFilters } from './get-segments';
import { segmentKeys } from './keys';

export const PAGE_SIZE = 500;

/** The filtered list in pages of 500, for the virtualised table. */
export const segmentPagesQueryOptions = (agencyId: string, f: SegmentFilters) =>
  infiniteQueryOptions({
    queryKey: segmentKeys.pages(agencyId, f),
    queryFn: ({ pageParam }) => getSegments(agencyId, { ...f, limit: PAGE_SIZE, offset: pageParam }),
    initialPageParam: 0,
    getNextPageParam: (last, pages) => {
      const loaded = pages.length * PAGE_SIZE;
      return loaded < last.total ? loaded : undefined;
    },
  });

export const useSegmentPages = (agencyId: string, f: SegmentFilters) =>
  useInfiniteQuery(segmentPagesQueryOptions(agencyId, f));
