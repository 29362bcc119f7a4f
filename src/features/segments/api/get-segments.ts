import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { SegmentListResponse } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';
import { segmentKeys } from './keys';

export type SegmentFilters = {
  q?: string;
  class?: string;
  surface?: string;
  band?: string;
  district?: string;
  ids?: string;
  sort?: string;
  dir?: 'asc' | 'desc';
  limit?: number;
  offset?: number;
};

export function getSegments(agencyId: string, f: SegmentFilters) {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== '') params.set(k, String(v));
  return api<SegmentListResponse>(`/api/agencies/${agencyId}/segments?${params}`);
}

export const segmentsQueryOptions = (agencyId: string, f: SegmentFilters = {}) =>
  queryOptions({
    queryKey: segmentKeys.list(agencyId, f),
    queryFn: () => getSegments(agencyId, f),
    placeholderData: keepPreviousData,
  });

export const useSegments = (agencyId: string, f: SegmentFilters) => useQuery(segmentsQueryOptions(agencyId, f));
