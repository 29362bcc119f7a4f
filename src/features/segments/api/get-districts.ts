import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DistrictList } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';
import { segmentKeys } from './keys';

export const getDistricts = (agencyId: string) => api<DistrictList>(`/api/agencies/${agencyId}/districts`);

export const districtsQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: segmentKeys.districts(agencyId), queryFn: () => getDistricts(agencyId) });

export const useDistricts = (agencyId: string) => useQuery(districtsQueryOptions(agencyId));
