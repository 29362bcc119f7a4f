import { and, desc, eq, gte, inArray, like, lte, sql, type SQL } from 'drizzle-orm';
import type { AuditQuery } from '../../shared/schemas/audit';
import type { Db } from '../db/client';
import {
  agencies,
  analyses,
  auditLog,
  imports,
  invitations,
  mixes,
  plans,
  segments,
  treatments,
  users,
} from '../db/schema';

export function auditPage(db: Db, agencyId: string, q: AuditQuery, all = false) {
  const parts: SQL[] = [eq(auditLog.agencyId, agencyId)];
  if (q.action) parts.push(like(auditLog.action, `${q.action.replace(/[%_]/g, '')}%`));
  if (q.entity) parts.push(eq(auditLog.entity, q.entity));
  if (q.from) parts.push(gte(auditLog.at, q.from));
  if (q.to) parts.push(lte(auditLog.at, `${q.to}T23:59:59.999Z`));
  const where = and(...parts);
  const base = db
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
  const total = db.select({ n: sql<number>`count(*)` }).from(auditLog).where(where).get()!.n;
  return { total, items };
}

const byId = (rows: { id: string; label: string | null }[]) => new Map(rows.map((r) => [r.id, r.label ?? '']));

/**
 * Names for the entities on one page, looked up in batches and only within the
 * agency: entity → id → label. An entity deleted since has no name here; the
 * caller falls back to what the entry itself recorded.
 */
export function entityNames(db: Db, agencyId: string, wanted: Map<string, Set<string>>) {
  const ids = (e: string) => [...(wanted.get(e) ?? [])];
  const out = new Map<string, Map<string, string>>();
  const some = (e: string) => ids(e).length > 0;
  if (some('segment'))
    out.set(
      'segment',
      byId(
        db
          .select({ id: segments.segmentId, label: segments.roadName })
          .from(segments)
          .where(and(eq(segments.agencyId, agencyId), inArray(segments.segmentId, ids('segment'))))
          .all(),
      ),
    );
  const simple = [
    ['plan', plans, plans.id, plans.name, plans.agencyId],
    ['analysis', analyses, analyses.id, analyses.name, analyses.agencyId],
    ['mix', mixes, mixes.id, mixes.name, mixes.agencyId],
    ['treatment', treatments, treatments.id, treatments.name, treatments.agencyId],
    ['import', imports, imports.id, imports.fileName, imports.agencyId],
    ['invitation', invitations, invitations.id, invitations.email, invitations.agencyId],
    ['agency', agencies, agencies.id, agencies.name, agencies.id],
  ] as const;
  for (const [entity, table, id, label, owner] of simple)
    if (some(entity))
      out.set(
        entity,
        byId(
          db
            .select({ id, label })
            .from(table)
            .where(and(eq(owner, agencyId), inArray(id, ids(entity))))
            .all(),
        ),
      );
  // Members and users: a person's name (users belong to no one agency; the entry's agency scoping is above).
  const people = [...ids('membership'), ...ids('user')];
  if (people.length) {
    const names = byId(
      db.select({ id: users.id, label: users.name }).from(users).where(inArray(users.id, people)).all(),
    );
    out.set('membership', names);
    out.set('user', names);
  }
  return out;
}
