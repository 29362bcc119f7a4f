import { z } from 'zod';
import { EmailSchema } from './auth';
import { RoleSchema } from './common';

export const MemberSchema = z.object({
  userId: z.string(),
  email: z.string(),
  name: z.string(),
  role: RoleSchema,
  since: z.string(),
});

export const PendingInvitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: RoleSchema,
  expiresAt: z.string(),
  createdAt: z.string(),
});

export const MembersResponseSchema = z.object({
  members: z.array(MemberSchema),
  invitations: z.array(PendingInvitationSchema),
});
export type MembersResponse = z.infer<typeof MembersResponseSchema>;

export const InviteBodySchema = z.object({ email: EmailSchema, role: RoleSchema });
export type InviteBody = z.infer<typeof InviteBodySchema>;
/** The invitation just sent (the link goes by e-mail only). */
export const InvitationSentSchema = z.object({ id: z.string(), email: z.string(), role: RoleSchema });
export type InvitationSent = z.infer<typeof InvitationSentSchema>;

export const ChangeRoleBodySchema = z.object({ role: RoleSchema });
export const MemberParamsSchema = z.object({ agencyId: z.string().min(1).max(64), userId: z.string().min(1).max(64) });
export const InvitationParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  invitationId: z.string().min(1).max(64),
});

export const CaughtMailSchema = z.object({
  id: z.number(),
  fromAddress: z.string(),
  toAddress: z.string(),
  subject: z.string(),
  textBody: z.string(),
  receivedAt: z.string(),
});
export const CaughtMailListSchema = z.object({ enabled: z.boolean(), items: z.array(CaughtMailSchema) });
export type CaughtMailList = z.infer<typeof CaughtMailListSchema>;
