import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InvitationInfo, Me } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { meQueryOptions } from './get-me';
import { authKeys } from './keys';

export const getInvitation = (token: string) => api<InvitationInfo>(`/api/invitations/${encodeURIComponent(token)}`);

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: authKeys.invitation(token), queryFn: () => getInvitation(token), retry: false });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));

export function useAcceptInvitation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name?: string; password: string }) =>
      api<Me>(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST', json: body }),
    onSuccess: (me) => {
      qc.clear();
      qc.setQueryData(meQueryOptions().queryKey, me);
    },
  });
}
