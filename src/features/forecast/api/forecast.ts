import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type Curve = { p0: number; a: number; b: number };
export type Family = {
  key: string;
  surface: string;
  classGroup: string;
  treatmentGroup: string;
  segments: number;
  n: number;
  curve: Curve;
  source: 'fitted' | 'default' | 'edited';
  rmse: number | null;
  fitted: { curve: Curve; rmse: number } | null;
  points: { age: number; pci: number }[];
};

export const familiesQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: ['forecast', agencyId, 'families'], queryFn: () => api<{ families: Family[] }>(`/api/agencies/${agencyId}/forecast/families`) });

export const useFamilies = (agencyId: string) => useQuery(familiesQueryOptions(agencyId));

export function useSetCurve(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { familyKey: string; curve: Curve | null }) => api(`/api/agencies/${agencyId}/forecast/curves`, { method: 'PUT', json: v }),
    onSuccess: () => qc.invalidateQueries({ queryKey: familiesQueryOptions(agencyId).queryKey }),
  });
}
