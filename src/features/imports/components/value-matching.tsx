import { FUNCTIONAL_CLASSES, SURFACES } from '@shared/schemas/segments';
import type { ImportReport, ValueMap } from '@shared/schemas/imports';
import { Button } from '@/components/ui/button';
import { Select } from '@/components/ui/field';
import { CLASS_LABELS, fmtInt, SURFACE_LABELS } from '@/lib/format';

type Field = 'functional_class' | 'surface';
const FIELD_WORDS: Record<Field, string> = { functional_class: 'Functional class', surface: 'Surface' };
const OPTIONS: Record<Field, readonly string[]> = { functional_class: FUNCTIONAL_CLASSES, surface: SURFACES };
const LABELS: Record<Field, Record<string, string>> = { functional_class: CLASS_LABELS, surface: SURFACE_LABELS };

/**
 * The file's own words for classes and surfaces that Wearcourse does not know, each
 * matched to one of ours ("Arterial Road" → principal arterial). The matching is
 * remembered for the agency once a file is written with it.
 */
export function ValueMatching({
  report,
  values,
  onChange,
  busy,
  onCheckAgain,
}: {
  report: ImportReport;
  values: ValueMap;
  onChange: (v: ValueMap) => void;
  busy: boolean;
  onCheckAgain: () => void;
}) {
  const rows: { field: Field; value: string; rows: number | null }[] = [
    ...report.unknownValues.map((u) => ({ field: u.field, value: u.value, rows: u.rows })),
    ...(['functional_class', 'surface'] as const).flatMap((field) =>
      Object.keys(report.valueMap[field] ?? {})
        .filter((value) => !report.unknownValues.some((u) => u.field === field && u.value === value))
        .map((value) => ({ field, value, rows: null })),
    ),
  ];
  if (!rows.length) return null;
  const set = (field: Field, value: string, to: string) => {
    const next = { ...(values[field] ?? {}) } as Record<string, string>;
    if (to) next[value] = to;
    else delete next[value];
    onChange({ ...values, [field]: next });
  };
  return (
    <div className="mt-4" data-testid="value-matching">
      <h3 className="mb-1 text-xs font-bold uppercase text-asphalt-muted">Values to match</h3>
      <table className="text-sm">
        <thead className="text-left text-xs uppercase text-asphalt-muted">
          <tr>
            <th className="py-1 pr-3">Field</th>
            <th className="pr-3">In your file</th>
            <th className="pr-3">Rows</th>
            <th>In Wearcourse</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.field}|${r.value}`} className="border-t border-asphalt-line/60">
              <td className="py-1 pr-3">{FIELD_WORDS[r.field]}</td>
              <td className="pr-3 font-mono text-xs">{r.value}</td>
              <td className="num pr-3">{r.rows === null ? 'matched' : fmtInt(r.rows)}</td>
              <td>
                <Select
                  aria-label={`Wearcourse ${FIELD_WORDS[r.field].toLowerCase()} for ${r.value}`}
                  value={(values[r.field] as Record<string, string> | undefined)?.[r.value] ?? ''}
                  onChange={(e) => set(r.field, r.value, e.target.value)}
                >
                  <option value="">— not matched (the rows are rejected) —</option>
                  {OPTIONS[r.field].map((o) => (
                    <option key={o} value={o}>
                      {LABELS[r.field][o]}
                    </option>
                  ))}
                </Select>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <Button className="mt-2" variant="secondary" disabled={busy} onClick={onCheckAgain}>
        {busy ? 'Checking…' : 'Check again with these matches'}
      </Button>
    </div>
  );
}
