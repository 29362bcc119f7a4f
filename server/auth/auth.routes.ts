import rateLimit, { ipKeyGenerator } from 'express-rate-limit';
import type { PassportStatic } from 'passport';
import {
  AcceptInvitationBodySchema,
  ForgotPasswordBodySchema,
  InvitationInfoSchema,
  MeSchema,
  ResetPasswordBodySchema,
  SignInBodySchema,
  TokenParamsSchema,
} from '../../shared/schemas/auth';
import { OkSchema } from '../../shared/schemas/common';
import type { ApiRoutes } from '../http/api';
import type { Deps } from '../deps';
import * as service from './auth.service';
import { normalizeEmail } from './emails';
import { authenticateLocal, logIn, logOut } from './passport';

export function authRoutes(api: ApiRoutes, deps: Deps, pp: PassportStatic) {
  const limiter = (
    limit: number,
    keyOf: (body: Record<string, unknown>) => string,
    opts: { skipSuccessfulRequests?: boolean } = {},
  ) =>
    rateLimit({
      windowMs: 15 * 60 * 1000,
      limit,
      // draft-7 headers: draft-8's policy header carries a hash of the key (the e-mail).
      standardHeaders: 'draft-7',
      legacyHeaders: false,
      ...opts,
      // Keyed by address and account, so one office behind one address is not locked out together.
      keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${keyOf((req.body ?? {}) as Record<string, unknown>)}`,
      handler: (_req, res) =>
        res
          .status(429)
          .json({ error: { code: 'rate_limited', message: 'Too many attempts. Wait 15 minutes and try again.' } }),
    });
  // The same normalisation as the account look-up (EmailSchema: trim, lower case), so
  // " User@x" does not get a fresh budget of its own.
  const byEmail = (b: Record<string, unknown>) => normalizeEmail(b.email);
  // Only failed sign-ins count: someone who signs in and out all day is never locked out.
  const signInLimit = limiter(deps.config.signInRateLimit, byEmail, { skipSuccessfulRequests: true });
  const resetLimit = limiter(deps.config.signInRateLimit, byEmail);

  api.typed({
    method: 'post',
    path: '/api/auth/sign-in/email',
    tag: 'Auth',
    summary: 'Sign in with e-mail and password; sets the session cookie',
    access: { kind: 'public' },
    body: SignInBodySchema,
    response: MeSchema,
    before: [signInLimit],
    handler: async ({ req }) => {
      const user = await authenticateLocal(pp, req);
      await logIn(req, user);
      return service.me(deps, user);
    },
  });

  api.typed({
    method: 'post',
    path: '/api/auth/sign-out',
    tag: 'Auth',
    summary: 'Sign out and end the session on the server',
    access: { kind: 'public' },
    response: OkSchema,
    handler: async ({ req, res }) => {
      if (req.session) await logOut(req);
      res.clearCookie('wearcourse.sid', { path: '/' });
      return { ok: true as const };
    },
  });

  api.typed({
    method: 'get',
    path: '/api/me',
    tag: 'Auth',
    summary: 'The signed-in user and their agency memberships',
    access: { kind: 'signed-in' },
    response: MeSchema,
    handler: ({ user }) => service.me(deps, user!),
  });

  api.typed({
    method: 'post',
    path: '/api/auth/forgot-password',
    tag: 'Auth',
    summary: 'E-mail a single-use password reset link (same answer whether or not the account exists)',
    access: { kind: 'public' },
    body: ForgotPasswordBodySchema,
    response: OkSchema,
    before: [resetLimit],
    handler: ({ body }) => {
      // Answered before the account is even looked up: the answer takes the same time and
      // says the same thing whether or not the account exists. The mail goes out after.
      setImmediate(() => {
        service.requestPasswordReset(deps, body.email).catch((err) => console.error('password reset mail:', err));
      });
      return { ok: true as const };
    },
  });

  api.typed({
    method: 'post',
    path: '/api/auth/reset-password',
    tag: 'Auth',
    summary: 'Set a new password with a reset token; ends every other session of the account',
    access: { kind: 'public' },
    body: ResetPasswordBodySchema,
    response: OkSchema,
    before: [limiter(deps.config.signInRateLimit, () => 'reset')],
    handler: async ({ body }) => {
      await service.resetPassword(deps, body.token, body.password);
      return { ok: true as const };
    },
  });

  api.typed({
    method: 'get',
    path: '/api/invitations/:token',
    tag: 'Auth',
    summary: 'What an invitation offers (agency, role) before it is accepted',
    access: { kind: 'public' },
    params: TokenParamsSchema,
    response: InvitationInfoSchema,
    handler: ({ params }) => service.invitationInfo(deps, params.token),
  });

  api.typed({
    method: 'post',
    path: '/api/invitations/:token/accept',
    tag: 'Auth',
    summary: 'Accept an invitation: create the account (or confirm the existing one) and sign in',
    access: { kind: 'public' },
    params: TokenParamsSchema,
    body: AcceptInvitationBodySchema,
    response: MeSchema,
    before: [limiter(deps.config.signInRateLimit, () => 'invite')],
    handler: async ({ params, body, req }) => {
      const user = await service.acceptInvitation(deps, params.token, body);
      await logIn(req, user);
      return service.me(deps, user);
    },
  });
}
