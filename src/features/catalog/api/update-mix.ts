import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Mix, MixInput } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogKeys, catalogPath } from './keys';

export const updateMix = (agencyId: string, id: string, input: MixInput) =>
  api<Mix>(`${catalogPath(agencyId)}/mixes/${id}`, { method: 'PUT', json: input });

/** Saves a changed mix; the catalog and its price history are read again. */
export function useUpdateMix(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string; input: MixInput }) => updateMix(agencyId, v.id, v.input),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.all(agencyId) }),
  });
}
