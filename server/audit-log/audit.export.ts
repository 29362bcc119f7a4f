// The audit trail as CSV: one row per entry, the change as JSON in the last column.
import { toCsv } from '../csv';

export type AuditCsvItem = {
  at: string;
  userEmail: string | null;
  action: string;
  entity: string;
  entityId: string | null;
  detail: unknown;
};

export function auditCsv(items: AuditCsvItem[]) {
  return toCsv(
    ['When (UTC)', 'User', 'Action', 'Record', 'Record ID', 'Change'],
    items.map((i) => [
      i.at,
      i.userEmail ?? '',
      i.action,
      i.entity,
      i.entityId ?? '',
      i.detail === null || i.detail === undefined ? '' : JSON.stringify(i.detail),
    ]),
  );
}
