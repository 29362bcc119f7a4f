import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Treatment, TreatmentInput } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogKeys, catalogPath } from './keys';

export const updateTreatment = (agencyId: string, id: string, input: TreatmentInput) =>
  api<Treatment>(`${catalogPath(agencyId)}/treatments/${id}`, { method: 'PUT', json: input });

/** Saves a changed treatment; the catalog and its price history are read again. */
export function useUpdateTreatment(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string; input: TreatmentInput }) => updateTreatment(agencyId, v.id, v.input),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.all(agencyId) }),
  });
}
