import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FeatureCollection, LineString, MultiLineString } from 'geojson';
import { api } from '@/lib/api-client';
import { segmentKeys } from '@/features/segments/api/keys';

export type SegmentFeatureProps = { id: number; s: string; r: string; p: number; c: string };
export type SegmentFeatures = FeatureCollection<LineString | MultiLineString, SegmentFeatureProps>;

export function getSegmentsGeoJson(agencyId: string, filters: Record<string, string | undefined>) {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  return api<SegmentFeatures>(`/api/agencies/${agencyId}/segments.geojson?${params}`);
}

export const segmentsGeoJsonQueryOptions = (agencyId: string, filters: Record<string, string | undefined> = {}) =>
  queryOptions({
    queryKey: segmentKeys.map(agencyId, filters),
    queryFn: () => getSegmentsGeoJson(agencyId, filters),
    staleTime: 60_000,
  });

export const useSegmentsGeoJson = (agencyId: string, filters: Record<string, string | undefined>) =>
  useQuery(segmentsGeoJsonQueryOptions(agencyId, filters));
