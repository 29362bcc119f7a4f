import { z } from 'zod';

export const AUDIT_ENTITIES = [
  'segment',
  'import',
  'mix',
  'treatment',
  'agency',
  'plan',
  'analysis',
  'membership',
  'invitation',
  'curve',
  'user',
] as const;

export const AuditQuerySchema = z.object({
  action: z.string().trim().max(60).optional(),
  entity: z.enum(AUDIT_ENTITIES).optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  offset: z.coerce.number().int().min(0).default(0),
});
export type AuditQuery = z.infer<typeof AuditQuerySchema>;

export const AuditItemSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  action: z.string(),
  entity: z.string(),
  entityId: z.string().nullable(),
  userName: z.string().nullable(),
  userEmail: z.string().nullable(),
  /** What it was done to, in words: "segment BC-E10-05 (County Highway 14)", "plan “Council ask”". */
  what: z.string(),
  /** The action in words: "edited a segment". */
  actionText: z.string(),
  changes: z.array(z.object({ field: z.string(), before: z.string(), after: z.string() })),
  facts: z.array(z.object({ field: z.string(), value: z.string() })),
  /** The stored record, for scripts; the screen shows `changes` and `facts`. */
  detail: z.unknown(),
});
export type AuditItem = z.infer<typeof AuditItemSchema>;

export const AuditListSchema = z.object({ total: z.number().int(), items: z.array(AuditItemSchema) });
export type AuditList = z.infer<typeof AuditListSchema>;
