import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { ROLE_RANK, type Role } from '../../shared/schemas/common';
import { membershipsOf } from '../agencies/agencies.repo';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import { agencies, invitations, memberships, passwordResets, users } from '../db/schema';
import type { SessionUser } from '../http/api';
import { HttpError } from '../http/errors';
import { hashPassword, verifyPassword } from './passwords';
import { hashToken, isoIn, newId, newToken } from './tokens';

export const RESET_TTL_MS = 60 * 60 * 1000; // one hour
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000; // one week

export function me(deps: Deps, user: SessionUser) {
  return { user, memberships: membershipsOf(deps.db, user.id), mailCatcher: deps.mailer.usesCatcher };
}

export async function requestPasswordReset(deps: Deps, email: string) {
  const user = deps.db.select().from(users).where(eq(users.email, email)).get();
  // Same answer whether or not the account exists.
  if (!user) return;
  const { token, hash } = newToken();
  deps.db
    .insert(passwordResets)
    .values({ id: newId(), userId: user.id, tokenHash: hash, expiresAt: isoIn(RESET_TTL_MS) })
    .run();
  const link = `${deps.config.appUrl}/reset-password/${token}`;
  await deps.mailer.send({
    to: user.email,
    subject: 'Reset your Wearcourse password',
    text: `Someone (we hope you) asked to reset the password for ${user.email}.\n\nSet a new password here within the next hour:\n${link}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.`,
  });
}

export async function resetPassword(deps: Deps, token: string, password: string) {
  const now = new Date().toISOString();
  const row = deps.db
    .select()
    .from(passwordResets)
    .where(
      and(
        eq(passwordResets.tokenHash, hashToken(token)),
        isNull(passwordResets.usedAt),
        gt(passwordResets.expiresAt, now),
      ),
    )
    .get();
  if (!row)
    throw new HttpError(400, 'invalid_token', 'This reset link is invalid, used or expired. Ask for a new one.');
  const passwordHash = await hashPassword(password);
  deps.db.transaction((tx) => {
    // Mark used first and check the count: two racing requests cannot both win.
    const used = tx
      .update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.id, row.id), isNull(passwordResets.usedAt)))
      .run();
    if (used.changes !== 1) throw new HttpError(400, 'invalid_token', 'This reset link has already been used.');
    // Any other link still out for this account stops working: only the newest use counts.
    tx.update(passwordResets)
      .set({ usedAt: now })
      .where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)))
      .run();
    tx.update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, row.userId))
      .run();
    recordAudit(tx, {
      agencyId: null,
      userId: row.userId,
      action: 'password.reset',
      entity: 'user',
      entityId: row.userId,
    });
  });
}

function openInvitation(deps: Deps, token: string) {
  const now = new Date().toISOString();
  const row = deps.db
    .select({ inv: invitations, agencyName: agencies.name })
    .from(invitations)
    .innerJoin(agencies, eq(agencies.id, invitations.agencyId))
    .where(
      and(
        eq(invitations.tokenHash, hashToken(token)),
        isNull(invitations.acceptedAt),
        isNull(invitations.revokedAt),
        gt(invitations.expiresAt, now),
      ),
    )
    .get();
  if (!row) throw new HttpError(404, 'invalid_token', 'This invitation is invalid, used, withdrawn or expired.');
  return row;
}

export function invitationInfo(deps: Deps, token: string) {
  const { inv, agencyName } = openInvitation(deps, token);
  const existing = deps.db.select({ id: users.id }).from(users).where(eq(users.email, inv.email)).get();
  return { agencyName, email: inv.email, role: inv.role as Role, hasAccount: !!existing, expiresAt: inv.expiresAt };
}

/** Accepts an invitation: creates the account (or checks the existing one's password) and joins. */
export async function acceptInvitation(
  deps: Deps,
  token: string,
  input: { name?: string; password: string },
): Promise<SessionUser> {
  const { inv } = openInvitation(deps, token);
  const existing = deps.db.select().from(users).where(eq(users.email, inv.email)).get();
  let userId: string;
  let newUser: { id: string; email: string; name: string; passwordHash: string } | null = null;
  if (existing) {
    if (!(await verifyPassword(input.password, existing.passwordHash))) {
      throw new HttpError(
        401,
        'invalid_credentials',
        'That is not the password of the existing account for this e-mail',
      );
    }
    userId = existing.id;
  } else {
    if (input.password.length < 10) {
      throw new HttpError(400, 'invalid_request', 'Invalid request: body.password — Use at least 10 characters', [
        { path: 'body.password', message: 'Use at least 10 characters' },
      ]);
    }
    if (!input.name) {
      throw new HttpError(400, 'invalid_request', 'Invalid request: body.name — Your name is required', [
        { path: 'body.name', message: 'Your name is required' },
      ]);
    }
    userId = newId();
    newUser = { id: userId, email: inv.email, name: input.name, passwordHash: await hashPassword(input.password) };
  }
  deps.db.transaction((tx) => {
    const taken = tx
      .update(invitations)
      .set({ acceptedAt: new Date().toISOString() })
      .where(and(eq(invitations.id, inv.id), isNull(invitations.acceptedAt)))
      .run();
    if (taken.changes !== 1) throw new HttpError(404, 'invalid_token', 'This invitation has already been used.');
    if (newUser) tx.insert(users).values(newUser).run();
    // An invitation grants access; it never lowers a role someone already has. A stale
    // viewer invitation accepted by the agency's only admin leaves them admin.
    const current = tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.agencyId, inv.agencyId), eq(memberships.userId, userId)))
      .get();
    const role = current && ROLE_RANK[current.role] >= ROLE_RANK[inv.role] ? current.role : inv.role;
    tx.insert(memberships)
      .values({ agencyId: inv.agencyId, userId, role })
      .onConflictDoUpdate({ target: [memberships.agencyId, memberships.userId], set: { role } })
      .run();
    recordAudit(tx, {
      agencyId: inv.agencyId,
      userId,
      action: 'membership.join',
      entity: 'membership',
      entityId: userId,
      detail: { role, invitedAs: inv.role, email: inv.email, before: current?.role ?? null },
    });
  });
  const u = deps.db.select().from(users).where(eq(users.id, userId)).get()!;
  return { id: u.id, email: u.email, name: u.name };
}
