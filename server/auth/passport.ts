import { eq } from 'drizzle-orm';
import type { Request } from 'express';
import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Deps } from '../deps';
import { users } from '../db/schema';
import type { SessionUser } from '../http/api';
import { HttpError } from '../http/errors';
import { sessionUserOf, sessionVersionOf } from './auth.repo';
import { normalizeEmail } from './emails';
import { hashPassword, verifyPassword } from './passwords';

let dummyHash: Promise<string> | null = null;

type SessionRecord = { id: string; v: number };

// A passport instance per app, so tests can build several apps in one process.
export function createPassport(deps: Deps): PassportStatic {
  const pp = new passport.Passport() as unknown as PassportStatic;
  pp.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      const row = deps.db
        .select()
        .from(users)
        .where(eq(users.email, normalizeEmail(email)))
        .get();
      const fail = () => done(null, false, { message: 'Wrong e-mail or password' });
      if (!row) {
        // Spend comparable time so a missing account is not revealed by timing.
        dummyHash ??= hashPassword('no-such-account-placeholder');
        void dummyHash.then((h) => verifyPassword(password, h)).then(fail, fail);
        return;
      }
      if (row.isDemo && deps.config.env === 'production') {
        return done(null, false, { message: 'Demo accounts are disabled in production' });
      }
      verifyPassword(password, row.passwordHash).then(
        (ok) => (ok ? done(null, { id: row.id, email: row.email, name: row.name }) : fail()),
        (err) => done(err),
      );
    }),
  );
  pp.serializeUser((user, done) => {
    const u = user as SessionUser;
    done(null, { id: u.id, v: sessionVersionOf(deps.db, u.id) ?? 1 } satisfies SessionRecord);
  });
  pp.deserializeUser((record: SessionRecord, done) => {
    const row = sessionUserOf(deps.db, record.id);
    // A password change bumps the version: sessions from before it end here.
    if (!row || row.v !== record.v) return done(null, false);
    done(null, { id: row.id, email: row.email, name: row.name } satisfies SessionUser);
  });
  return pp;
}

export function authenticateLocal(pp: PassportStatic, req: Request): Promise<SessionUser> {
  return new Promise((resolve, reject) => {
    pp.authenticate('local', (err: unknown, user: SessionUser | false, info?: { message?: string }) => {
      if (err) return reject(err);
      if (!user) return reject(new HttpError(401, 'invalid_credentials', info?.message ?? 'Wrong e-mail or password'));
      resolve(user);
    })(req);
  });
}

/** Logs in with a fresh session id (passport regenerates it: no session fixation). */
export function logIn(req: Request, user: SessionUser): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
}

export function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.logout((err) => {
      if (err) return reject(err);
      req.session.destroy((e) => (e ? reject(e) : resolve()));
    }),
  );
}
