import type { InviteBody } from '../../shared/schemas/members';
import { ROLE_RANK, type Role } from '../../shared/schemas/common';
import { agencyById } from '../agencies/agencies.service';
import { recordAudit } from '../audit';
import { isoIn, newId, newToken } from '../ids';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import * as repo from './members.repo';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000; // one week

export function listMembers(deps: Deps, agencyId: string) {
  return { members: repo.membersOf(deps.db, agencyId), invitations: repo.pendingInvitations(deps.db, agencyId) };
}

/** The caller's role in the agency, or null when not a member (the API's access check asks this). */
export const roleIn = (deps: Pick<Deps, 'db'>, userId: string, agencyId: string) =>
  repo.roleIn(deps.db, userId, agencyId);

/** The agencies a person belongs to, with their role in each. */
export const agenciesOfUser = (deps: Pick<Deps, 'db'>, userId: string) => repo.agenciesOfUser(deps.db, userId);

/** Whether the person is an admin of at least one agency (who may restore an archive). */
export const isAdminOfAny = (deps: Pick<Deps, 'db'>, userId: string) => repo.isAdminOfAny(deps.db, userId);

/**
 * Joins the agency with an invitation's role. An invitation grants access; it never lowers a role
 * someone already has: a stale viewer invitation accepted by the agency's only admin leaves them admin.
 */
export function joinByInvitation(
  tx: Parameters<Parameters<Deps['db']['transaction']>[0]>[0],
  agencyId: string,
  userId: string,
  invitedAs: Role,
) {
  const current = repo.membership(tx, agencyId, userId);
  const role = current && ROLE_RANK[current.role] >= ROLE_RANK[invitedAs] ? current.role : invitedAs;
  repo.upsertMembership(tx, agencyId, userId, role);
  return { role, before: current?.role ?? null };
}

export async function invite(deps: Deps, agencyId: string, byUserId: string, input: InviteBody) {
  const agency = agencyById(deps, agencyId)!;
  const already = repo.memberByEmail(deps.db, agencyId, input.email);
  if (already) throw new HttpError(409, 'already_member', `${input.email} is already a member of ${agency.name}`);
  const { token, hash } = newToken();
  const id = newId();
  deps.db.transaction((tx) => {
    repo.insertInvitation(tx, {
      id,
      agencyId,
      email: input.email,
      role: input.role,
      tokenHash: hash,
      invitedBy: byUserId,
      expiresAt: isoIn(INVITATION_TTL_MS),
    });
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'invitation.create',
      entity: 'invitation',
      entityId: id,
      detail: { email: input.email, role: input.role },
    });
  });
  const link = `${deps.config.appUrl}/invite/${token}`;
  await deps.mailer.send({
    to: input.email,
    agencyId,
    subject: `You are invited to ${agency.name} on Wearcourse`,
    text: `You have been invited to join ${agency.name} on Wearcourse as ${input.role}.\n\nAccept within seven days:\n${link}\n\nWearcourse holds the agency's road inventory, condition surveys and paving budget plans.`,
  });
  return { id, email: input.email, role: input.role };
}

export function revokeInvitation(deps: Deps, agencyId: string, byUserId: string, invitationId: string) {
  deps.db.transaction((tx) => {
    if (repo.revokePending(tx, agencyId, invitationId) !== 1) throw notFound('No such pending invitation');
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'invitation.revoke',
      entity: 'invitation',
      entityId: invitationId,
    });
  });
  return { ok: true as const };
}

export function changeRole(deps: Deps, agencyId: string, byUserId: string, userId: string, role: Role) {
  deps.db.transaction((tx) => {
    const current = repo.membership(tx, agencyId, userId);
    if (!current) throw notFound('No such member');
    if (current.role === 'admin' && role !== 'admin' && repo.adminCount(tx, agencyId) <= 1) {
      throw new HttpError(409, 'last_admin', 'An agency keeps at least one admin');
    }
    repo.setRole(tx, current.id, role);
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'membership.role',
      entity: 'membership',
      entityId: userId,
      detail: { before: current.role, after: role },
    });
  });
  return { ok: true as const };
}

export function removeMember(deps: Deps, agencyId: string, byUserId: string, userId: string) {
  deps.db.transaction((tx) => {
    const current = repo.membership(tx, agencyId, userId);
    if (!current) throw notFound('No such member');
    if (current.role === 'admin' && repo.adminCount(tx, agencyId) <= 1) {
      throw new HttpError(409, 'last_admin', 'An agency keeps at least one admin');
    }
    repo.deleteMembership(tx, current.id);
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'membership.remove',
      entity: 'membership',
      entityId: userId,
      detail: { role: current.role },
    });
  });
  return { ok: true as const };
}

export function caughtMailFor(deps: Deps, agencyId: string) {
  if (!deps.mailer.usesCatcher) return { enabled: false, items: [] };
  const items = repo.caughtMailOf(deps.db, agencyId);
  return { enabled: true, items };
}
