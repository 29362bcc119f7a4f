import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AgencyView } from '@shared/schemas/agency';
import { api } from '@/lib/api-client';
import { settingsKeys, settingsPath } from './keys';

/** The agency as the settings route answers it (AgencyViewSchema). */
export type AgencySettings = AgencyView;

export const getSettings = (agencyId: string) => api<AgencySettings>(settingsPath(agencyId));

export const settingsQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: settingsKeys.agency(agencyId), queryFn: () => getSettings(agencyId) });

export const useAgencySettings = (agencyId: string) => useQuery(settingsQueryOptions(agencyId));
