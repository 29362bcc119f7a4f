import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SegmentUpdate } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';

export const updateSegment = (agencyId: string, id: number, patch: SegmentUpdate) =>
  api(`/api/agencies/${agencyId}/segments/${id}`, { method: 'PATCH', json: patch });

export function useUpdateSegment(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: number; patch: SegmentUpdate }) => updateSegment(agencyId, v.id, v.patch),
    // Everything under ['segments', agencyId] — lists, pages, map, details — may show the change.
    onSuccess: () => qc.invalidateQueries({ queryKey: ['segments', agencyId] }),
  });
}
