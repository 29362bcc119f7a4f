import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MembersResponse } from '@shared/schemas/members';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export const getMembers = (agencyId: string) => api<MembersResponse>(`/api/agencies/${agencyId}/members`);

export const membersQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: memberKeys.list(agencyId), queryFn: () => getMembers(agencyId) });

export const useMembers = (agencyId: string) => useQuery(membersQueryOptions(agencyId));
