// An audit entry in words: what happened, and each change as "field: before →
// after" with the field's label and the values formatted for people. Pure; the
// entity's name is looked up elsewhere and passed in.
import { fieldLabel, fieldWords } from '../../shared/field-labels';

export type Change = { field: string; before: string; after: string };
export type Fact = { field: string; value: string };
export type AuditWords = { action: string; changes: Change[]; facts: Fact[] };

const ACTIONS: Record<string, string> = {
  'segment.update': 'edited a segment',
  'segment.import.add': 'added a segment by import',
  'segment.import.update': 'changed a segment by import',
  'survey.add': 'added a survey',
  'treatment.record': 'recorded a treatment',
  'import.segments': 'imported segments',
  'import.surveys': 'imported surveys',
  'catalog.mix.create': 'added a mix',
  'catalog.mix.update': 'changed a mix',
  'catalog.mix.delete': 'removed a mix',
  'catalog.treatment.create': 'added a treatment to the catalog',
  'catalog.treatment.update': 'changed a catalog treatment',
  'catalog.treatment.delete': 'removed a catalog treatment',
  'catalog.economics.update': 'changed the economics',
  'agency.settings': 'changed the agency settings',
  'agency.export': 'downloaded the agency export',
  'agency.restore': 'restored an agency export',
  'plan.create': 'created a plan',
  'plan.update': 'changed a plan',
  'plan.delete': 'deleted a plan',
  'plan.run': 'ran a plan',
  'plan.publish': 'published a plan',
  'plan.version': 'opened a new draft version of a published plan',
  'plan.unpublish': 'withdrew a plan',
  'analysis.save': 'saved a comparison',
  'analysis.delete': 'deleted a comparison',
  'forecast.curve.edit': 'edited a deterioration curve',
  'forecast.curve.reset': 'reset a deterioration curve',
  'invitation.create': 'invited someone',
  'invitation.revoke': 'withdrew an invitation',
  'membership.join': 'joined the agency',
  'membership.role': 'changed a role',
  'membership.remove': 'removed a member',
  'password.reset': 'reset a password',
};

/** The action in words; an action this list does not know yet still reads as words. */
export const actionWords = (action: string) => ACTIONS[action] ?? fieldWords(action);

// Not worth a line on the Activity screen: ids, bookkeeping, large blobs.
const SKIP = new Set(['id', 'agencyId', 'createdAt', 'updatedAt', 'isDemo', 'importId', 'runId']);
const MONEY = /cost|price|budget|mobilization|trafficControl|spent|backlog/i;
const SHARE = /fraction|discountRate|escalation/i;

const isObject = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v);
const money = (n: number) => `$${n.toLocaleString('en-US', { maximumFractionDigits: Math.abs(n) >= 1000 ? 0 : 2 })}`;

/** A stored value as a person reads it. */
export function valueWords(key: string, v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'number') {
    if (key === 'escalationPct') return `${v} %`;
    if (/year/i.test(key) && Number.isInteger(v)) return String(v);
    if (SHARE.test(key)) return `${(v * 100).toLocaleString('en-US', { maximumFractionDigits: 2 })} %`;
    if (MONEY.test(key)) return money(v);
    return v.toLocaleString('en-US', { maximumFractionDigits: 3 });
  }
  if (typeof v === 'string') return /^[a-z0-9]+(_[a-z0-9]+)+$/.test(v) ? v.replace(/_/g, ' ') : v;
  if (Array.isArray(v)) {
    if (v.length === 0) return 'none';
    if (v.length <= 6 && v.every((x) => typeof x !== 'object')) return v.map((x) => valueWords(key, x)).join(', ');
    return `${v.length} items`;
  }
  if (isObject(v)) {
    const parts = Object.entries(v)
      .filter(([k]) => !SKIP.has(k))
      .map(([k, x]) => `${fieldLabel(k)} ${valueWords(k, x)}`);
    return parts.length <= 4 ? parts.join(', ') : `${parts.length} fields`;
  }
  return String(v);
}

const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/** Field-by-field differences; an update names its fields in `after`, nested groups go one level down. */
function diff(before: Record<string, unknown>, after: Record<string, unknown>, depth = 0): Change[] {
  const out: Change[] = [];
  for (const k of Object.keys(after)) {
    if (SKIP.has(k) || same(before[k], after[k])) continue;
    if (depth === 0 && isObject(before[k]) && isObject(after[k])) {
      out.push(...diff(before[k] as Record<string, unknown>, after[k] as Record<string, unknown>, 1));
      continue;
    }
    out.push({ field: fieldLabel(k), before: valueWords(k, before[k]), after: valueWords(k, after[k]) });
  }
  return out;
}

const facts = (o: Record<string, unknown>): Fact[] =>
  Object.entries(o)
    .filter(([k, v]) => !SKIP.has(k) && v !== undefined && v !== null && v !== '' && !isObject(v))
    .map(([k, v]) => ({ field: fieldLabel(k), value: valueWords(k, v) }));

/** A `{ field: { before, after } }` map, as segment edits and imports write them. */
const pairs = (o: Record<string, unknown>) =>
  Object.values(o).length > 0 && Object.values(o).every((v) => isObject(v) && 'before' in v && 'after' in v);

export function describeAudit(action: string, detail: unknown): AuditWords {
  const words = actionWords(action);
  if (!isObject(detail)) {
    if (detail === null || detail === undefined) return { action: words, changes: [], facts: [] };
    return { action: words, changes: [], facts: [{ field: 'Detail', value: valueWords('detail', detail) }] };
  }
  const d = detail;
  // { before, after } of a whole record (catalog, settings, plans, roles).
  if ('before' in d && 'after' in d) {
    if (isObject(d.after) && !isObject(d.before)) return { action: words, changes: [], facts: facts(d.after) };
    if (isObject(d.after))
      return { action: words, changes: diff(isObject(d.before) ? d.before : {}, d.after), facts: [] };
    return {
      action: words,
      changes: [
        {
          field: fieldLabel(action.split('.').pop() ?? ''),
          before: valueWords('', d.before),
          after: valueWords('', d.after),
        },
      ],
      facts: [],
    };
  }
  const changed = isObject(d.changed) ? d.changed : pairs(d) ? d : null;
  const changes: Change[] = [];
  if (changed)
    for (const [k, v] of Object.entries(changed))
      if (isObject(v))
        changes.push({ field: fieldLabel(k), before: valueWords(k, v.before), after: valueWords(k, v.after) });
  // Nested { before, after } pairs beside plain facts (a survey's new latest PCI, a job's last treatment).
  const rest = changed === d ? {} : Object.fromEntries(Object.entries(d).filter(([k]) => k !== 'changed'));
  for (const [k, v] of Object.entries(rest))
    if (isObject(v) && 'before' in v && 'after' in v && !same(v.before, v.after))
      changes.push({ field: fieldLabel(k), before: valueWords(k, v.before), after: valueWords(k, v.after) });
  const flat = Object.fromEntries(Object.entries(rest).filter(([, v]) => !isObject(v)));
  const nested = [isObject(d.after) && changed === null ? d.after : null, isObject(d.before) ? d.before : null].find(
    Boolean,
  );
  return {
    action: words,
    changes,
    facts: [...facts(flat), ...(nested ? facts(nested as Record<string, unknown>) : [])],
  };
}

/** One line for lists and the CSV: the changes, else the facts. */
export function changeLine(w: AuditWords) {
  if (w.changes.length) return w.changes.map((c) => `${c.field}: ${c.before} → ${c.after}`).join('; ');
  return w.facts.map((f) => `${f.field}: ${f.value}`).join('; ');
}
