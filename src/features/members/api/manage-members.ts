import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/common';
import type { InviteBody } from '@shared/schemas/members';
import { api } from '@/lib/api-client';
import { memberKeys } from './keys';

function useMembersMutation<V>(agencyId: string, fn: (v: V) => Promise<unknown>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: memberKeys.list(agencyId) });
      qc.invalidateQueries({ queryKey: memberKeys.sentMail(agencyId) });
    },
  });
}

export const useInvite = (agencyId: string) =>
  useMembersMutation(agencyId, (body: InviteBody) =>
    api(`/api/agencies/${agencyId}/invitations`, { method: 'POST', json: body }),
  );

export const useRevokeInvitation = (agencyId: string) =>
  useMembersMutation(agencyId, (id: string) =>
    api(`/api/agencies/${agencyId}/invitations/${id}`, { method: 'DELETE' }),
  );

export const useChangeRole = (agencyId: string) =>
  useMembersMutation(agencyId, (v: { userId: string; role: Role }) =>
    api(`/api/agencies/${agencyId}/members/${v.userId}`, { method: 'PATCH', json: { role: v.role } }),
  );

export const useRemoveMember = (agencyId: string) =>
  useMembersMutation(agencyId, (userId: string) =>
    api(`/api/agencies/${agencyId}/members/${userId}`, { method: 'DELETE' }),
  );
