import { z } from 'zod';
import { RoleSchema } from './common';

export const EmailSchema = z.string().trim().toLowerCase().email().max(254);
// Long passphrases are welcome; the floor keeps out the trivially guessable.
export const NewPasswordSchema = z.string().min(10, 'Use at least 10 characters').max(200);

export const SignInBodySchema = z.object({
  email: EmailSchema,
  password: z.string().min(1).max(200),
});
export type SignInBody = z.infer<typeof SignInBodySchema>;

export const MembershipSchema = z.object({
  agencyId: z.string(),
  agencyName: z.string(),
  role: RoleSchema,
});
export type Membership = z.infer<typeof MembershipSchema>;

export const MeSchema = z.object({
  user: z.object({ id: z.string(), email: z.string(), name: z.string() }),
  memberships: z.array(MembershipSchema),
  mailCatcher: z.boolean(),
});
export type Me = z.infer<typeof MeSchema>;

export const ForgotPasswordBodySchema = z.object({ email: EmailSchema });
export const ResetPasswordBodySchema = z.object({
  token: z.string().min(20).max(200),
  password: NewPasswordSchema,
});

export const TokenParamsSchema = z.object({ token: z.string().min(20).max(200) });

export const InvitationInfoSchema = z.object({
  agencyName: z.string(),
  email: z.string(),
  role: RoleSchema,
  hasAccount: z.boolean(),
  expiresAt: z.string(),
});
export type InvitationInfo = z.infer<typeof InvitationInfoSchema>;

export const AcceptInvitationBodySchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  password: z.string().min(1).max(200),
});
