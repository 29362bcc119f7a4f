import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Economics, MixInput, TreatmentInput } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogQueryOptions } from './get-catalog';

function useCatalogMutation<V>(agencyId: string, fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogQueryOptions(agencyId).queryKey }),
  });
}

const base = (agencyId: string) => `/api/agencies/${agencyId}/catalog`;

export const useSaveMix = (agencyId: string) =>
  useCatalogMutation(agencyId, (v: { id: string | null; input: MixInput }) =>
    v.id
      ? api(`${base(agencyId)}/mixes/${v.id}`, { method: 'PUT', json: v.input })
      : api(`${base(agencyId)}/mixes`, { method: 'POST', json: v.input }),
  );

export const useSaveTreatment = (agencyId: string) =>
  useCatalogMutation(agencyId, (v: { id: string | null; input: TreatmentInput }) =>
    v.id
      ? api(`${base(agencyId)}/treatments/${v.id}`, { method: 'PUT', json: v.input })
      : api(`${base(agencyId)}/treatments`, { method: 'POST', json: v.input }),
  );

export const useSaveEconomics = (agencyId: string) =>
  useCatalogMutation(agencyId, (e: Economics) => api(`${base(agencyId)}/economics`, { method: 'PUT', json: e }));

export const useDeleteMix = (agencyId: string) =>
  useCatalogMutation(agencyId, (id: string) => api(`${base(agencyId)}/mixes/${id}`, { method: 'DELETE' }));
