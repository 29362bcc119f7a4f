import {
  cloneElement,
  type InputHTMLAttributes,
  isValidElement,
  type ReactElement,
  type ReactNode,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
  useId,
  useState,
} from 'react';

/**
 * A labelled control with its hint or its error underneath. The label points at
 * the control by id (so a Term inside the label stays a button of its own), and
 * the control is marked invalid and described by the message.
 */
export function Field({
  label,
  hint,
  error,
  children,
  className = '',
}: {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
  className?: string;
}) {
  const auto = useId();
  const child = isValidElement<{ id?: string }>(children) ? children : null;
  const id = child?.props.id ?? auto;
  const noteId = `${id}-note`;
  const control = child
    ? cloneElement(child as ReactElement<Record<string, unknown>>, {
        id,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': error || hint ? noteId : undefined,
      })
    : children;
  return (
    <div className={`block text-sm ${className}`}>
      <label htmlFor={id} className="mb-1 block font-semibold text-asphalt">
        {label}
      </label>
      {control}
      {hint && !error && (
        <span id={noteId} className="mt-1 block text-xs text-asphalt-muted">
          {hint}
        </span>
      )}
      {error && (
        <span id={noteId} className="mt-1 block text-xs font-semibold text-band-failed" data-field-error>
          {error}
        </span>
      )}
    </div>
  );
}

// Disabled controls read as unavailable: a flat grey fill, muted text, a dashed
// edge and the not-allowed cursor, not just a lighter copy of the live one.
const inputClass =
  'w-full rounded border border-asphalt-line bg-white px-2.5 py-1.5 text-sm text-asphalt placeholder:text-asphalt-muted/70 focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/20 disabled:cursor-not-allowed disabled:border-dashed disabled:bg-asphalt/[0.06] disabled:text-asphalt-muted aria-[invalid=true]:border-band-failed aria-[invalid=true]:ring-2 aria-[invalid=true]:ring-band-failed/15';

type Invalid = { invalid?: boolean };

export function TextInput({ invalid, ...props }: InputHTMLAttributes<HTMLInputElement> & Invalid) {
  return (
    <input
      {...props}
      aria-invalid={invalid || props['aria-invalid'] || undefined}
      className={`${inputClass} ${props.className ?? ''}`}
    />
  );
}

export function Select({ invalid, ...props }: SelectHTMLAttributes<HTMLSelectElement> & Invalid) {
  return (
    <select
      {...props}
      aria-invalid={invalid || props['aria-invalid'] || undefined}
      className={`${inputClass} ${props.className ?? ''}`}
    />
  );
}

export function TextArea({ invalid, ...props }: TextareaHTMLAttributes<HTMLTextAreaElement> & Invalid) {
  return (
    <textarea
      {...props}
      aria-invalid={invalid || props['aria-invalid'] || undefined}
      className={`${inputClass} ${props.className ?? ''}`}
    />
  );
}

/** Issues that no field on the form shows (a rule across fields, a conflict, a server refusal). */
export function FormAlert({ messages }: { messages: string[] }) {
  if (!messages.length) return null;
  return (
    <div
      role="alert"
      className="rounded border border-band-failed/30 bg-band-failed/5 px-3 py-2 text-sm text-band-failed"
    >
      {messages.length === 1 ? (
        messages[0]
      ) : (
        <ul className="list-disc pl-4">
          {messages.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      )}
    </div>
  );
}

/**
 * A file input that looks like the rest of the app: a button-styled label over
 * the (visually hidden, still focusable) native input, and the chosen file's
 * name beside it.
 */
export function FilePicker({
  label,
  buttonText = 'Choose a file…',
  onFile,
  disabled,
  ...props
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'onChange'> & {
  label: string;
  buttonText?: string;
  onFile?: (file: File | null) => void;
}) {
  const id = useId();
  const [name, setName] = useState<string | null>(null);
  return (
    <div className="flex min-w-0 items-center gap-2 text-sm">
      <label
        htmlFor={id}
        className={`inline-flex shrink-0 items-center rounded border px-3 py-1.5 font-semibold focus-within:ring-2 focus-within:ring-accent/40 ${disabled ? 'cursor-not-allowed border-dashed border-asphalt-line bg-asphalt/[0.06] text-asphalt-muted' : 'cursor-pointer border-asphalt-line bg-white text-asphalt hover:border-asphalt-muted'}`}
      >
        {buttonText}
        <input
          {...props}
          id={id}
          type="file"
          aria-label={label}
          disabled={disabled}
          className="sr-only"
          onChange={(e) => {
            const f = e.target.files?.[0] ?? null;
            setName(f?.name ?? null);
            onFile?.(f);
          }}
        />
      </label>
      <span className={`truncate ${name ? 'text-asphalt' : 'text-asphalt-muted'}`} data-testid="file-name">
        {name ?? 'No file chosen'}
      </span>
    </div>
  );
}
