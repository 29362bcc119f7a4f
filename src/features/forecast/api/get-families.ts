import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FamilyList } from '@shared/schemas/forecast';
import { api } from '@/lib/api-client';
import { forecastKeys, forecastPath } from './keys';

export const getFamilies = (agencyId: string) => api<FamilyList>(`${forecastPath(agencyId)}/families`);

export const familiesQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: forecastKeys.families(agencyId), queryFn: () => getFamilies(agencyId) });

export const useFamilies = (agencyId: string) => useQuery(familiesQueryOptions(agencyId));
