import { useId } from 'react';
import type { Curve } from '@shared/engine/forecast/curve';
import { Button } from '@/components/ui/button';
import { describedBy, FieldMessage } from '@/components/ui/field-message';
import { TextInput } from '@/components/ui/field';

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
        <label key={f.key} className="w-44">
          <span className="block text-xs font-semibold text-asphalt">{f.label}</span>
          <TextInput
            aria-label={f.label}
            inputMode="decimal"
            value={draft[f.key]}
            onChange={(e) => onChange({ ...draft, [f.key]: e.target.value }, f.key)}
            {...describedBy(`${id}-${f.key}`, error(f.key))}
          />
          <span className="block text-xs text-asphalt-muted">{f.hint}</span>
          <FieldMessage id={`${id}-${f.key}`} message={error(f.key)} />
        </label>
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
