import { useId } from 'react';
import type { Curve } from '@shared/engine/forecast/curve';
import { Button } from '@/components/ui/button';
import { CheckedInput } from '@/components/ui/field-message';

export type CurveDraft = Record<keyof Curve, string>;

const FIELDS: { key: keyof Curve; label: string; hint: string }[] = [
  { key: 'p0', label: 'Starting PCI (P0)', hint: 'just after the treatment, 0 to 100' },
  { key: 'a', label: 'Rate (a), PCI points', hint: 'lost in the first year' },
  { key: 'b', label: 'Shape (b)', hint: '1 is a straight line; up to 3 bends later' },
];

/** The three numbers of PCI = P0 − a·age^b, each with its message. */
export function CurveEditor({
  draft,
  onChange,
  error,
  saving,
  onSave,
  onCancel,
}: {
  draft: CurveDraft;
  onChange: (d: CurveDraft, changed: keyof Curve) => void;
  error: (key: string) => string | undefined;
  saving: boolean;
  onSave: () => void;
  onCancel: () => void;
}) {
  const id = useId();
  return (
    <div className="flex flex-wrap items-start gap-3 text-sm">
      {FIELDS.map((f) => (
        <CheckedInput
          key={f.key}
          id={`${id}-${f.key}`}
          label={f.label}
          hint={f.hint}
          labelClassName="w-44"
          inputMode="decimal"
          value={draft[f.key]}
          onChange={(v) => onChange({ ...draft, [f.key]: v }, f.key)}
          error={error(f.key)}
        />
      ))}
      <span className="flex gap-2 pt-4">
        <Button onClick={onSave} disabled={saving}>
          {saving ? 'Saving…' : 'Save curve'}
        </Button>
        <Button variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </span>
    </div>
  );
}
