import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DistrictList } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';

export const getDistricts = (agencyId: string) => api<DistrictList>(`/api/agencies/${agencyId}/districts`);

// Under ['segments', agencyId] so that any segment write refreshes the choice list too.
export const districtsQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: ['segments', agencyId, 'districts'], queryFn: () => getDistricts(agencyId) });

export const useDistricts = (agencyId: string) => useQuery(districtsQueryOptions(agencyId));
