import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import type { InviteBody } from '../../shared/schemas/members';
import type { Role } from '../../shared/schemas/common';
import { agencyById } from '../agencies/agencies.repo';
import { recordAudit } from '../audit';
import { INVITATION_TTL_MS } from '../auth/auth.service';
import { isoIn, newId, newToken } from '../auth/tokens';
import type { Deps } from '../deps';
import { caughtMail, invitations, memberships, users } from '../db/schema';
import { HttpError, notFound } from '../http/errors';

export function listMembers(deps: Deps, agencyId: string) {
  const members = deps.db
    .select({
      userId: users.id,
      email: users.email,
      name: users.name,
      role: memberships.role,
      since: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.agencyId, agencyId))
    .orderBy(users.name)
    .all();
  const pending = deps.db
    .select({
      id: invitations.id,
      email: invitations.email,
      role: invitations.role,
      expiresAt: invitations.expiresAt,
      createdAt: invitations.createdAt,
    })
    .from(invitations)
    .where(
      and(
        eq(invitations.agencyId, agencyId),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, new Date().toISOString()),
      ),
    )
    .orderBy(desc(invitations.createdAt))
    .all();
  return { members, invitations: pending };
}

export async function invite(deps: Deps, agencyId: string, byUserId: string, input: InviteBody) {
  const agency = agencyById(deps.db, agencyId)!;
  const already = deps.db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.agencyId, agencyId), eq(users.email, input.email)))
    .get();
  if (already) throw new HttpError(409, 'already_member', `${input.email} is already a member of ${agency.name}`);
  const { token, hash } = newToken();
  const id = newId();
  deps.db.transaction((tx) => {
    tx.insert(invitations)
      .values({
        id,
        agencyId,
        email: input.email,
        role: input.role,
        tokenHash: hash,
        invitedBy: byUserId,
        expiresAt: isoIn(INVITATION_TTL_MS),
      })
      .run();
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
    const res = tx
      .update(invitations)
      .set({ revokedAt: new Date().toISOString() })
      .where(and(eq(invitations.id, invitationId), eq(invitations.agencyId, agencyId), isNull(invitations.acceptedAt)))
      .run();
    if (res.changes !== 1) throw notFound('No such pending invitation');
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'invitation.revoke',
      entity: 'invitation',
      entityId: invitationId,
    });
  });
}

function adminCount(deps: Deps, agencyId: string) {
  return deps.db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.agencyId, agencyId), eq(memberships.role, 'admin')))
    .all().length;
}

export function changeRole(deps: Deps, agencyId: string, byUserId: string, userId: string, role: Role) {
  deps.db.transaction((tx) => {
    const current = tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.agencyId, agencyId), eq(memberships.userId, userId)))
      .get();
    if (!current) throw notFound('No such member');
    if (current.role === 'admin' && role !== 'admin' && adminCount(deps, agencyId) <= 1) {
      throw new HttpError(409, 'last_admin', 'An agency keeps at least one admin');
    }
    tx.update(memberships).set({ role }).where(eq(memberships.id, current.id)).run();
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'membership.role',
      entity: 'membership',
      entityId: userId,
      detail: { before: current.role, after: role },
    });
  });
}

export function removeMember(deps: Deps, agencyId: string, byUserId: string, userId: string) {
  deps.db.transaction((tx) => {
    const current = tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.agencyId, agencyId), eq(memberships.userId, userId)))
      .get();
    if (!current) throw notFound('No such member');
    if (current.role === 'admin' && adminCount(deps, agencyId) <= 1) {
      throw new HttpError(409, 'last_admin', 'An agency keeps at least one admin');
    }
    tx.delete(memberships).where(eq(memberships.id, current.id)).run();
    recordAudit(tx, {
      agencyId,
      userId: byUserId,
      action: 'membership.remove',
      entity: 'membership',
      entityId: userId,
      detail: { role: current.role },
    });
  });
}

export function caughtMailFor(deps: Deps, agencyId: string) {
  if (!deps.mailer.usesCatcher) return { enabled: false, items: [] };
  const items = deps.db
    .select({
      id: caughtMail.id,
      fromAddress: caughtMail.fromAddress,
      toAddress: caughtMail.toAddress,
      subject: caughtMail.subject,
      textBody: caughtMail.textBody,
      receivedAt: caughtMail.receivedAt,
    })
    .from(caughtMail)
    .where(eq(caughtMail.agencyId, agencyId))
    .orderBy(desc(caughtMail.id))
    .limit(200)
    .all();
  return { enabled: true, items };
}
