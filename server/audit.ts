import type { Db } from './db/client';
import { auditLog } from './db/schema';

export type AuditEntry = {
  agencyId: string | null;
  userId: string | null;
  action: string;
  entity: string;
  entityId?: string;
  detail?: unknown;
};

// Written inside the caller's transaction so a change and its record land together.
export function recordAudit(db: Pick<Db, 'insert'>, entry: AuditEntry) {
  db.insert(auditLog)
    .values({
      agencyId: entry.agencyId,
      userId: entry.userId,
      action: entry.action,
      entity: entry.entity,
      entityId: entry.entityId ?? null,
      detail: entry.detail === undefined ? null : JSON.stringify(entry.detail),
    })
    .run();
}
