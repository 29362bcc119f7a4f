import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  CaughtMailListSchema,
  ChangeRoleBodySchema,
  InvitationParamsSchema,
  InvitationSentSchema,
  InviteBodySchema,
  MemberParamsSchema,
  MembersResponseSchema,
} from '../../shared/schemas/members';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import * as service from './members.service';

export function memberRoutes(api: ApiRoutes, deps: Deps) {
  const admin = { kind: 'agency', role: 'admin' } as const;
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/members',
    tag: 'Members',
    summary: 'Members of the agency and pending invitations',
    access: admin,
    params: AgencyParamsSchema,
    response: MembersResponseSchema,
    handler: ({ agency }) => service.listMembers(deps, agency!.id),
  });
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/invitations',
    tag: 'Members',
    summary: 'Invite someone by e-mail with a role; sends the invitation link',
    access: admin,
    params: AgencyParamsSchema,
    body: InviteBodySchema,
    status: 201,
    response: InvitationSentSchema,
    handler: ({ agency, user, body }) => service.invite(deps, agency!.id, user!.id, body),
  });
  api.typed({
    method: 'delete',
    path: '/api/agencies/:agencyId/invitations/:invitationId',
    tag: 'Members',
    summary: 'Withdraw a pending invitation',
    access: admin,
    params: InvitationParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => service.revokeInvitation(deps, agency!.id, user!.id, params.invitationId),
  });
  api.typed({
    method: 'patch',
    path: '/api/agencies/:agencyId/members/:userId',
    tag: 'Members',
    summary: "Change a member's role",
    access: admin,
    params: MemberParamsSchema,
    body: ChangeRoleBodySchema,
    response: OkSchema,
    handler: ({ agency, user, params, body }) =>
      service.changeRole(deps, agency!.id, user!.id, params.userId, body.role),
  });
  api.typed({
    method: 'delete',
    path: '/api/agencies/:agencyId/members/:userId',
    tag: 'Members',
    summary: 'Remove a member from the agency',
    access: admin,
    params: MemberParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => service.removeMember(deps, agency!.id, user!.id, params.userId),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/sent-mail',
    tag: 'Members',
    summary: 'Messages the local mail catcher received for this agency (empty when real SMTP is used)',
    access: admin,
    params: AgencyParamsSchema,
    response: CaughtMailListSchema,
    handler: ({ agency }) => service.caughtMailFor(deps, agency!.id),
  });
}
