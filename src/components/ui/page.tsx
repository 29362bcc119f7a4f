import type { ReactNode } from 'react';

export function PageHeader({ title, caption, actions }: { title: string; caption?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="mb-5 flex flex-wrap items-end justify-between gap-3 border-b border-asphalt-line pb-3">
      <div>
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        {caption && <p className="mt-1 max-w-3xl text-sm text-asphalt-muted">{caption}</p>}
      </div>
      {actions && <div className="flex gap-2">{actions}</div>}
    </header>
  );
}

export function Card({
  title,
  actions,
  children,
  className = '',
  testId,
}: {
  title?: string;
  /** Buttons at the right of the card's title. */
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  testId?: string;
}) {
  return (
    <section className={`rounded border border-asphalt-line bg-white p-4 ${className}`} data-testid={testId}>
      {(title || actions) && (
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          {title && <h2 className="text-sm font-bold uppercase tracking-wide text-asphalt-muted">{title}</h2>}
          {actions && <div className="flex gap-2">{actions}</div>}
        </div>
      )}
      {children}
    </section>
  );
}

export function Stat({ label, value, unit }: { label: string; value: string; unit?: string }) {
  return (
    <div>
      <div className="text-xs uppercase tracking-wide text-asphalt-muted">{label}</div>
      <div className="num text-2xl font-bold">
        {value}
        {unit && <span className="ml-1 text-sm font-normal text-asphalt-muted">{unit}</span>}
      </div>
    </div>
  );
}

export function EmptyState({ children }: { children: ReactNode }) {
  return (
    <div className="rounded border border-dashed border-asphalt-line bg-white/60 p-6 text-sm text-asphalt-muted">
      {children}
    </div>
  );
}

export function Caution({ children }: { children: ReactNode }) {
  return (
    <div role="note" className="rounded border border-caution/30 bg-caution-bg px-3 py-2 text-sm text-caution">
      {children}
    </div>
  );
}
