// The audit trail as CSV, in words: who, what happened, to what, the changes;
// the recorded detail last for whoever needs it. Written by the one CSV writer
// (formula-leading cells escaped).
import { toCsv } from '../csv';

export type AuditCsvItem = {
  at: string;
  userName: string | null;
  userEmail: string | null;
  actionText: string;
  what: string;
  change: string;
  detail: unknown;
};

export function auditCsvText(items: AuditCsvItem[]) {
  return toCsv(
    ['When (UTC)', 'Who', 'E-mail', 'What happened', 'To what', 'Changes', 'Recorded detail'],
    items.map((i) => [
      i.at.replace('T', ' ').slice(0, 19),
      i.userName ?? '',
      i.userEmail ?? '',
      i.actionText,
      i.what,
      i.change,
      i.detail === null || i.detail === undefined ? '' : JSON.stringify(i.detail),
    ]),
  );
}
