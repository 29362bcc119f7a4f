import { type QueryClient, useMutation, useQueryClient } from '@tanstack/react-query';
import type { SegmentUpdate } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';
import { networkKeys } from '@/features/network/api/keys';
import { segmentKeys } from './keys';

export const updateSegment = (agencyId: string, id: number, patch: SegmentUpdate) =>
  api(`/api/agencies/${agencyId}/segments/${id}`, { method: 'PATCH', json: patch });

export function useUpdateSegment(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: number; patch: SegmentUpdate }) => updateSegment(agencyId, v.id, v.patch),
    onSuccess: () => invalidateSegmentViews(qc, agencyId),
  });
}

/**
 * After any write to a segment or its history: everything under ['segments',
 * agencyId] (lists, pages, map, details, districts, treatments) and the
 * network summary may show the change.
 */
export function invalidateSegmentViews(qc: QueryClient, agencyId: string) {
  return Promise.all([
    qc.invalidateQueries({ queryKey: segmentKeys.all(agencyId) }),
    qc.invalidateQueries({ queryKey: networkKeys.summary(agencyId) }),
  ]);
}
