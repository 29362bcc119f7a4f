import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMailList } from '@shared/schemas/members';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

export const getSentMail = (agencyId: string) => api<CaughtMailList>(`/api/agencies/${agencyId}/sent-mail`);

export const sentMailQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: memberKeys.sentMail(agencyId), queryFn: () => getSentMail(agencyId), staleTime: 2_000 });

export const useSentMail = (agencyId: string) => useQuery(sentMailQueryOptions(agencyId));
