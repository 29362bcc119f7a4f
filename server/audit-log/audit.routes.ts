import { and, desc, eq, gte, like, lte, sql, type SQL } from 'drizzle-orm';
import { z } from 'zod';
import { AgencyParamsSchema } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import { auditLog, users } from '../db/schema';
import type { ApiRoutes } from '../http/api';
import { auditCsv } from './audit.export';

const AuditQuerySchema = z.object({
  action: z.string().trim().max(60).optional(),
  entity: z.string().trim().max(40).optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  offset: z.coerce.number().int().min(0).default(0),
});
type AuditQuery = z.infer<typeof AuditQuerySchema>;

function query(deps: Deps, agencyId: string, q: AuditQuery, all = false) {
  const parts: SQL[] = [eq(auditLog.agencyId, agencyId)];
  if (q.action) parts.push(like(auditLog.action, `${q.action.replace(/[%_]/g, '')}%`));
  if (q.entity) parts.push(eq(auditLog.entity, q.entity));
  if (q.from) parts.push(gte(auditLog.at, q.from));
  if (q.to) parts.push(lte(auditLog.at, `${q.to}T23:59:59.999Z`));
  const where = and(...parts);
  const base = deps.db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      action: auditLog.action,
      entity: auditLog.entity,
      entityId: auditLog.entityId,
      detail: auditLog.detail,
      userName: users.name,
      userEmail: users.email,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(where)
    .orderBy(desc(auditLog.id));
  const items = (all ? base.limit(100_000) : base.limit(q.limit).offset(q.offset)).all();
  const total = deps.db.select({ n: sql<number>`count(*)` }).from(auditLog).where(where).get()!.n;
  return { total, items: items.map((i) => ({ ...i, detail: i.detail ? JSON.parse(i.detail) : null })) };
}

export function auditRoutes(api: ApiRoutes, deps: Deps) {
  const admin = { kind: 'agency', role: 'admin' } as const;
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/audit',
    tag: 'Activity',
    summary: 'The audit trail: who changed what and when (before/after of the changed fields)',
    access: admin,
    params: AgencyParamsSchema,
    query: AuditQuerySchema,
    handler: ({ agency, query: q }) => query(deps, agency!.id, q),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/audit.csv',
    tag: 'Activity',
    summary: 'The filtered audit trail as CSV',
    access: admin,
    params: AgencyParamsSchema,
    query: AuditQuerySchema,
    responseDescription: 'text/csv',
    handler: ({ agency, query: q, res }) => {
      const { items } = query(deps, agency!.id, q, true);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', 'attachment; filename="activity.csv"');
      res.send(auditCsv(items));
    },
  });
}
