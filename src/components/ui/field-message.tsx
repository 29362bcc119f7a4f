import type { InputHTMLAttributes } from 'react';
import { TextInput } from './field';

/** The message under one field; the input names it with aria-describedby. */
export function FieldMessage({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <span id={id} role="alert" className="mt-0.5 block text-xs font-normal whitespace-normal text-band-failed">
      {message}
    </span>
  );
}

/** Props that tie an input to its message. */
export const describedBy = (id: string, message: string | undefined) => ({
  'aria-invalid': message ? true : undefined,
  'aria-describedby': message ? id : undefined,
});

/**
 * A labelled text input with its hint and its message under it. `name` is what a
 * screen reader hears when the visible label needs the item's name beside it.
 */
export function CheckedInput({
  id,
  label,
  name = label,
  hint,
  error,
  value,
  onChange,
  className = '',
  labelClassName = 'text-sm',
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'onChange' | 'value' | 'name'> & {
  id: string;
  label: string;
  name?: string;
  hint?: string;
  error: string | undefined;
  value: string;
  onChange: (v: string) => void;
  labelClassName?: string;
}) {
  const msgId = `${id}-error`;
  return (
    <label className={labelClassName}>
      <span className="block text-xs font-semibold text-asphalt">{label}</span>
      <TextInput
        {...rest}
        aria-label={name}
        className={className}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        {...describedBy(msgId, error)}
      />
      {hint && <span className="block text-xs text-asphalt-muted">{hint}</span>}
      <FieldMessage id={msgId} message={error} />
    </label>
  );
}
