import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Economics } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogKeys, catalogPath } from './keys';

export const updateEconomics = (agencyId: string, e: Economics) =>
  api<Economics>(`${catalogPath(agencyId)}/economics`, { method: 'PUT', json: e });

export function useUpdateEconomics(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (e: Economics) => updateEconomics(agencyId, e),
    onSuccess: () => qc.invalidateQueries({ queryKey: catalogKeys.all(agencyId) }),
  });
}
