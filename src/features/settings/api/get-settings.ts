import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { settingsKeys, settingsPath } from './keys';

export type AgencySettings = { id: string; name: string; kind: string; units: 'us' | 'metric' };

export const getSettings = (agencyId: string) => api<AgencySettings>(settingsPath(agencyId));

export const settingsQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: settingsKeys.agency(agencyId), queryFn: () => getSettings(agencyId) });

export const useAgencySettings = (agencyId: string) => useQuery(settingsQueryOptions(agencyId));
