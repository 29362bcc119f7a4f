import { auditCsvText } from './audit.export';
import { fieldWords } from '../../shared/field-labels';
import type { AuditItem, AuditQuery } from '../../shared/schemas/audit';
import type { Deps } from '../deps';
import { changeLine, describeAudit } from './audit-describe';
import { auditPage, entityNames } from './audit.repo';

type Row = ReturnType<typeof auditPage>['items'][number];
type Detail = Record<string, unknown> | null;

const quoted = (s: unknown) => (typeof s === 'string' && s ? `“${s}”` : null);
/** Random ids (our 20+ character keys) mean nothing to a reader. */
const readableId = (id: string | null) => (id && id.length < 20 ? id : null);

/** The name the entry recorded for itself, for entities deleted since. */
function recordedName(d: Detail): string | null {
  if (!d) return null;
  for (const v of [d.name, (d.after as Detail)?.name, (d.before as Detail)?.name, d.fileName, d.email])
    if (typeof v === 'string' && v) return v;
  return null;
}

function what(row: Row, d: Detail, names: Map<string, Map<string, string>>): string {
  const found = row.entityId ? names.get(row.entity)?.get(row.entityId) : undefined;
  const name = found || recordedName(d);
  switch (row.entity) {
    case 'segment':
      return `segment ${row.entityId}${found ? ` (${found})` : ''}`;
    case 'plan':
      return `plan ${quoted(name) ?? '(deleted)'}`;
    case 'analysis':
      return `comparison ${quoted(name) ?? '(deleted)'}`;
    case 'mix':
      return `mix ${quoted(name) ?? '(deleted)'}`;
    case 'treatment':
      return `catalog treatment ${quoted(name) ?? '(deleted)'}`;
    case 'import':
      return `file ${quoted(name) ?? ''}`.trim();
    case 'invitation':
      return `invitation for ${name ?? 'someone'}`;
    case 'membership':
    case 'user':
      return name ?? 'a former member';
    case 'agency':
      return name ?? 'the agency';
    case 'curve':
      return `curve for ${(row.entityId ?? '').split('|').map(fieldWords).join(' · ')}`;
    default:
      return [fieldWords(row.entity), readableId(row.entityId)].filter(Boolean).join(' ');
  }
}

function view(deps: Deps, agencyId: string, rows: Row[]): AuditItem[] {
  const wanted = new Map<string, Set<string>>();
  for (const r of rows)
    if (r.entityId) (wanted.get(r.entity) ?? wanted.set(r.entity, new Set()).get(r.entity)!).add(r.entityId);
  const names = entityNames(deps.db, agencyId, wanted);
  return rows.map((r) => {
    const detail = r.detail ? (JSON.parse(r.detail) as unknown) : null;
    const words = describeAudit(r.action, detail);
    const d =
      detail && typeof detail === 'object' && !Array.isArray(detail) ? (detail as Record<string, unknown>) : null;
    return {
      id: r.id,
      at: r.at,
      action: r.action,
      entity: r.entity,
      entityId: r.entityId,
      userName: r.userName,
      userEmail: r.userEmail,
      what: what(r, d, names),
      actionText: words.action,
      changes: words.changes,
      facts: words.facts,
      detail,
    };
  });
}

export function auditList(deps: Deps, agencyId: string, q: AuditQuery) {
  const { total, items } = auditPage(deps.db, agencyId, q);
  return { total, items: view(deps, agencyId, items) };
}

/** The filtered trail as CSV, with headers and changes in words (the stored record last, for auditors). */
export function auditCsv(deps: Deps, agencyId: string, q: AuditQuery) {
  const { items } = auditPage(deps.db, agencyId, q, true);
  return auditCsvText(view(deps, agencyId, items).map((i) => ({ ...i, change: changeLine(i) })));
}
