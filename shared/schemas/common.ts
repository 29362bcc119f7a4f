import { z } from 'zod';

export const ROLES = ['admin', 'engineer', 'viewer'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

// Rank used for "at least this role" checks.
export const ROLE_RANK: Record<Role, number> = { viewer: 1, engineer: 2, admin: 3 };

export const ErrorIssueSchema = z.object({
  path: z.string(),
  message: z.string(),
});

export const ErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    issues: z.array(ErrorIssueSchema).optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;

export const OkSchema = z.object({ ok: z.literal(true) });

export const AgencyParamsSchema = z.object({ agencyId: z.string().min(1).max(64) });
