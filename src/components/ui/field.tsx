import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';

export function Field({
  label,
  hint,
  error,
  children,
}: {
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}) {
  return (
    <label className="block text-sm">
      <span className="mb-1 block font-semibold text-asphalt">{label}</span>
      {children}
      {hint && !error && <span className="mt-1 block text-xs text-asphalt-muted">{hint}</span>}
      {error && <span className="mt-1 block text-xs text-band-failed">{error}</span>}
    </label>
  );
}

const inputClass =
  'w-full rounded border border-asphalt-line bg-white px-2.5 py-1.5 text-sm text-asphalt placeholder:text-asphalt-muted/70 focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/20';

export function TextInput(props: InputHTMLAttributes<HTMLInputElement>) {
  return <input {...props} className={`${inputClass} ${props.className ?? ''}`} />;
}

export function Select(props: SelectHTMLAttributes<HTMLSelectElement>) {
  return <select {...props} className={`${inputClass} ${props.className ?? ''}`} />;
}
