import { queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import type { SegmentDetailSchema } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';
import { segmentKeys } from './keys';

export type SegmentDetail = z.infer<typeof SegmentDetailSchema> & { geometry: GeoJSON.Geometry | null };

export const getSegment = (agencyId: string, id: number) =>
  api<SegmentDetail>(`/api/agencies/${agencyId}/segments/${id}`);

export const segmentQueryOptions = (agencyId: string, id: number) =>
  queryOptions({ queryKey: segmentKeys.detail(agencyId, id), queryFn: () => getSegment(agencyId, id) });

export const useSegment = (agencyId: string, id: number) => useQuery(segmentQueryOptions(agencyId, id));
