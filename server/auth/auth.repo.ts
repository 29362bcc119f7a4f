// Accounts, password reset links and the invitation an account is opened with.
import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import type { SessionUser } from '../http/api';
import type { Db } from '../db/client';
import { statement } from '../db/statements';
import { agencies, invitations, passwordResets, users } from '../db/schema';

type Read = Pick<Db, 'select'>;

export const userByEmail = (db: Read, email: string) => db.select().from(users).where(eq(users.email, email)).get();

export const userById = (db: Read, id: string) => db.select().from(users).where(eq(users.id, id)).get();

export function insertUser(tx: Pick<Db, 'insert'>, row: typeof users.$inferInsert) {
  tx.insert(users).values(row).run();
}

/** A new password; every session from before it ends (the session version moves on). */
export function setPassword(tx: Pick<Db, 'update'>, userId: string, passwordHash: string) {
  tx.update(users)
    .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId))
    .run();
}

export function insertPasswordReset(db: Pick<Db, 'insert'>, row: typeof passwordResets.$inferInsert) {
  db.insert(passwordResets).values(row).run();
}

/** The unused, unexpired reset link with this token hash. */
export function openPasswordReset(db: Read, tokenHash: string, now: string) {
  return db
    .select()
    .from(passwordResets)
    .where(
      and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, now)),
    )
    .get();
}

/** Marks one link used; 1 when this call did it, 0 when another had already. */
export function usePasswordReset(tx: Pick<Db, 'update'>, id: string, now: string) {
  return tx
    .update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.id, id), isNull(passwordResets.usedAt)))
    .run().changes;
}

/** Every other link still out for the account stops working. */
export function useAllPasswordResets(tx: Pick<Db, 'update'>, userId: string, now: string) {
  tx.update(passwordResets)
    .set({ usedAt: now })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)))
    .run();
}

/** The invitation with this token hash that is still open (not accepted, withdrawn or expired), with its agency's name. */
export function openInvitation(db: Read, tokenHash: string, now: string) {
  return db
    .select({ inv: invitations, agencyName: agencies.name })
    .from(invitations)
    .innerJoin(agencies, eq(agencies.id, invitations.agencyId))
    .where(
      and(
        eq(invitations.tokenHash, tokenHash),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, now),
      ),
    )
    .get();
}

/** Marks an invitation accepted; 1 when this call did it, 0 when it had already been used. */
export function acceptInvitationRow(tx: Pick<Db, 'update'>, id: string) {
  return tx
    .update(invitations)
    .set({ acceptedAt: new Date().toISOString() })
    .where(and(eq(invitations.id, id), isNull(invitations.acceptedAt)))
    .run().changes;
}

export const sessionVersionOf = (db: Read, userId: string) =>
  db.select({ v: users.sessionVersion }).from(users).where(eq(users.id, userId)).get()?.v;

/** The account a session names, with its session version. Read on every request: a cached prepared statement. */
export const sessionUserOf = (db: Db, userId: string) =>
  statement(db.$client, 'SELECT id, email, name, session_version AS v FROM users WHERE id = ?').get(userId) as
    | (SessionUser & { v: number })
    | undefined;
