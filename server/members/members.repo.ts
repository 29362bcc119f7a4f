// Memberships, invitations and the mail the local catcher kept for an agency.
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/common';
import type { Db } from '../db/client';
import { statement } from '../db/statements';
import { agencies, caughtMail, invitations, memberships, users } from '../db/schema';

type Read = Pick<Db, 'select'>;

export function roleIn(db: Db, userId: string, agencyId: string): Role | null {
  // Asked on every agency request: a cached prepared statement rather than the query builder.
  const row = statement(db.$client, 'SELECT role FROM memberships WHERE user_id = ? AND agency_id = ?').get(
    userId,
    agencyId,
  ) as { role: Role } | undefined;
  return row?.role ?? null;
}

export function agenciesOfUser(db: Read, userId: string) {
  return db
    .select({ agencyId: agencies.id, agencyName: agencies.name, role: memberships.role })
    .from(memberships)
    .innerJoin(agencies, eq(agencies.id, memberships.agencyId))
    .where(eq(memberships.userId, userId))
    .orderBy(agencies.name)
    .all();
}

export function membersOf(db: Read, agencyId: string) {
  return db
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
}

export function pendingInvitations(db: Read, agencyId: string) {
  return db
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
}

export function memberByEmail(db: Read, agencyId: string, email: string) {
  return db
    .select({ id: memberships.id })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.agencyId, agencyId), eq(users.email, email)))
    .get();
}

export function membership(db: Read, agencyId: string, userId: string) {
  return db
    .select()
    .from(memberships)
    .where(and(eq(memberships.agencyId, agencyId), eq(memberships.userId, userId)))
    .get();
}

export function adminCount(db: Read, agencyId: string) {
  return db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.agencyId, agencyId), eq(memberships.role, 'admin')))
    .all().length;
}

/** Whether the person is an admin of at least one agency. */
export function isAdminOfAny(db: Read, userId: string) {
  return !!db
    .select({ id: memberships.id })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.role, 'admin')))
    .get();
}

export function insertInvitation(tx: Pick<Db, 'insert'>, row: typeof invitations.$inferInsert) {
  tx.insert(invitations).values(row).run();
}

/** Marks a pending invitation withdrawn; the number of rows changed (0 when there is none). */
export function revokePending(tx: Pick<Db, 'update'>, agencyId: string, invitationId: string) {
  return tx
    .update(invitations)
    .set({ revokedAt: new Date().toISOString() })
    .where(and(eq(invitations.id, invitationId), eq(invitations.agencyId, agencyId), isNull(invitations.acceptedAt)))
    .run().changes;
}

export function setRole(tx: Pick<Db, 'update'>, membershipId: number, role: Role) {
  tx.update(memberships).set({ role }).where(eq(memberships.id, membershipId)).run();
}

export function deleteMembership(tx: Pick<Db, 'delete'>, membershipId: number) {
  tx.delete(memberships).where(eq(memberships.id, membershipId)).run();
}

export function caughtMailOf(db: Read, agencyId: string) {
  return db
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
}

export function upsertMembership(tx: Pick<Db, 'insert'>, agencyId: string, userId: string, role: Role) {
  tx.insert(memberships)
    .values({ agencyId, userId, role })
    .onConflictDoUpdate({ target: [memberships.agencyId, memberships.userId], set: { role } })
    .run();
}
