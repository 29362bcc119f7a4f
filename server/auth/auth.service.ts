import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import { agenciesOfUser, joinByInvitation } from '../members/members.service';
import type { SessionUser } from '../http/api';
import { HttpError } from '../http/errors';
import * as repo from './auth.repo';
import { hashPassword, verifyPassword } from './passwords';
import { hashToken, isoIn, newId, newToken } from '../ids';

export const RESET_TTL_MS = 60 * 60 * 1000; // one hour

export function me(deps: Deps, user: SessionUser) {
  return { user, memberships: agenciesOfUser(deps, user.id), mailCatcher: deps.mailer.usesCatcher };
}

export async function requestPasswordReset(deps: Deps, email: string) {
  const user = repo.userByEmail(deps.db, email);
  // Same answer whether or not the account exists.
  if (!user) return;
  const { token, hash } = newToken();
  repo.insertPasswordReset(deps.db, { id: newId(), userId: user.id, tokenHash: hash, expiresAt: isoIn(RESET_TTL_MS) });
  const link = `${deps.config.appUrl}/reset-password/${token}`;
  await deps.mailer.send({
    to: user.email,
    subject: 'Reset your Wearcourse password',
    text: `Someone (we hope you) asked to reset the password for ${user.email}.\n\nSet a new password here within the next hour:\n${link}\n\nThe link works once. If you did not ask for this, ignore this message; your password stays as it is.`,
  });
}

export async function resetPassword(deps: Deps, token: string, password: string) {
  const now = new Date().toISOString();
  const row = repo.openPasswordReset(deps.db, hashToken(token), now);
  if (!row)
    throw new HttpError(400, 'invalid_token', 'This reset link is invalid, used or expired. Ask for a new one.');
  const passwordHash = await hashPassword(password);
  deps.db.transaction((tx) => {
    // Mark used first and check the count: two racing requests cannot both win.
    if (repo.usePasswordReset(tx, row.id, now) !== 1)
      throw new HttpError(400, 'invalid_token', 'This reset link has already been used.');
    // Any other link still out for this account stops working: only the newest use counts.
    repo.useAllPasswordResets(tx, row.userId, now);
    repo.setPassword(tx, row.userId, passwordHash);
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
  const row = repo.openInvitation(deps.db, hashToken(token), now);
  if (!row) throw new HttpError(404, 'invalid_token', 'This invitation is invalid, used, withdrawn or expired.');
  return row;
}

export function invitationInfo(deps: Deps, token: string) {
  const { inv, agencyName } = openInvitation(deps, token);
  const existing = repo.userByEmail(deps.db, inv.email);
  return { agencyName, email: inv.email, role: inv.role, hasAccount: !!existing, expiresAt: inv.expiresAt };
}

/** Accepts an invitation: creates the account (or checks the existing one's password) and joins. */
export async function acceptInvitation(
  deps: Deps,
  token: string,
  input: { name?: string; password: string },
): Promise<SessionUser> {
  const { inv } = openInvitation(deps, token);
  const existing = repo.userByEmail(deps.db, inv.email);
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
    if (repo.acceptInvitationRow(tx, inv.id) !== 1)
      throw new HttpError(404, 'invalid_token', 'This invitation has already been used.');
    if (newUser) repo.insertUser(tx, newUser);
    const { role, before } = joinByInvitation(tx, inv.agencyId, userId, inv.role);
    recordAudit(tx, {
      agencyId: inv.agencyId,
      userId,
      action: 'membership.join',
      entity: 'membership',
      entityId: userId,
      detail: { role, invitedAs: inv.role, email: inv.email, before },
    });
  });
  const u = repo.userById(deps.db, userId)!;
  return { id: u.id, email: u.email, name: u.name };
}
