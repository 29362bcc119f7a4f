import { useEffect, useState } from 'react';
import { parseDollars } from '@shared/schemas/plans';
import { TextInput } from '@/components/ui/field';
import { fmtMoney } from '@/lib/format';

/**
 * A dollar amount as people type it — "$250,000", "250k", "1.85M", "$1,850,000" — shown back
 * formatted when the box is left. Calls onChange with the amount, or null while it is not one.
 */
export function BudgetInput({
  value,
  onChange,
  label,
  className = '',
  id,
}: {
  value: number | undefined;
  onChange: (v: number | null) => void;
  label: string;
  className?: string;
  id?: string;
}) {
  const [text, setText] = useState(value === undefined ? '' : fmtMoney(value));
  const [focused, setFocused] = useState(false);
  useEffect(() => {
    if (!focused) setText(value === undefined ? '' : fmtMoney(value));
  }, [value, focused]);
  const bad = text.trim() !== '' && parseDollars(text) === null;
  return (
    <>
      <TextInput
        id={id}
        aria-label={label}
        inputMode="decimal"
        className={`text-right ${className}`}
        value={text}
        aria-invalid={bad || undefined}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          const v = parseDollars(text);
          if (v !== null) setText(fmtMoney(v));
        }}
        onChange={(e) => {
          setText(e.target.value);
          onChange(parseDollars(e.target.value));
        }}
      />
      {bad && (
        <span className="mt-1 block text-xs font-semibold text-band-failed" data-field-error>
          must be a dollar amount, like $250,000, 250k or 1.85M
        </span>
      )}
    </>
  );
}
