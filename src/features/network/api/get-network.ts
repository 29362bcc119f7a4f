import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NetworkSummary } from '@shared/schemas/segments';
import { api } from '@/lib/api-client';
import { networkKeys } from './keys';

export const getNetwork = (agencyId: string) => api<NetworkSummary>(`/api/agencies/${agencyId}/network`);

export const networkQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: networkKeys.summary(agencyId), queryFn: () => getNetwork(agencyId) });

export const useNetwork = (agencyId: string) => useQuery(networkQueryOptions(agencyId));
