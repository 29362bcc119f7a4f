import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';

const styles: Record<Variant, string> = {
  primary: 'bg-accent text-white hover:bg-accent-dark disabled:bg-accent/50',
  secondary: 'bg-white text-asphalt border border-asphalt-line hover:border-asphalt-muted disabled:opacity-50',
  ghost: 'text-asphalt hover:bg-asphalt/5 disabled:opacity-50',
  danger: 'bg-white text-band-failed border border-band-failed/40 hover:bg-band-failed/5 disabled:opacity-50',
};

export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      className={`inline-flex items-center justify-center gap-2 rounded px-3 py-1.5 text-sm font-semibold transition-colors focus:outline-none focus-visible:ring-2 focus-visible:ring-accent/40 ${styles[variant]} ${className}`}
      {...props}
    />
  );
}
