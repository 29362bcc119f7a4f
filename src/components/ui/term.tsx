import { type ReactNode, useId, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { glossaryEntry } from '@/features/help/glossary';
import { useHelp } from '@/features/help/help-context';

/**
 * A trade term with its plain-words meaning on hover or focus, and a click that
 * opens the glossary at it. `<Term id="euac">EUAC</Term>`; the text defaults to
 * the glossary's own spelling. The tip is drawn in a portal so table headers and
 * scrolling panels never clip it.
 */
export function Term({ id, children, plain = false }: { id: string; children?: ReactNode; plain?: boolean }) {
  const entry = glossaryEntry(id);
  const help = useHelp();
  const tipId = useId();
  const ref = useRef<HTMLButtonElement>(null);
  const [at, setAt] = useState<{ left: number; top: number; above: boolean } | null>(null);
  if (!entry) return <>{children}</>;
  const show = () => {
    const r = ref.current?.getBoundingClientRect();
    if (!r) return;
    const above = r.bottom + 120 > window.innerHeight;
    setAt({
      left: Math.min(Math.max(8, r.left), window.innerWidth - 296),
      top: above ? r.top - 6 : r.bottom + 6,
      above,
    });
  };
  const hide = () => setAt(null);
  return (
    <>
      <button
        type="button"
        ref={ref}
        aria-describedby={at ? tipId : undefined}
        className={`inline cursor-help p-0 text-left align-baseline [font:inherit] [color:inherit] ${plain ? '' : 'underline decoration-asphalt-muted/60 decoration-dotted underline-offset-2'}`}
        onMouseEnter={show}
        onMouseLeave={hide}
        onFocus={show}
        onBlur={hide}
        onClick={(e) => {
          e.stopPropagation();
          hide();
          help?.show(id);
        }}
        onKeyDown={(e) => e.key === 'Escape' && hide()}
      >
        {children ?? entry.term}
      </button>
      {at &&
        createPortal(
          <div
            id={tipId}
            role="tooltip"
            className="pointer-events-none fixed z-[60] w-72 rounded border border-asphalt-line bg-white px-3 py-2 text-left text-xs font-normal normal-case tracking-normal text-asphalt shadow-lg"
            style={{ left: at.left, top: at.top, transform: at.above ? 'translateY(-100%)' : undefined }}
          >
            <span className="font-bold">{entry.term}</span>
            {entry.aka && <span className="text-asphalt-muted"> · {entry.aka}</span>}
            <span className="mt-0.5 block">{entry.short}</span>
            {help && <span className="mt-1 block text-asphalt-muted">Click for more in Help.</span>}
          </div>,
          document.body,
        )}
    </>
  );
}

/** A small "?" after a label that is itself a trade term (a table header, a field label). */
export function TermHint({ id }: { id: string }) {
  const entry = glossaryEntry(id);
  if (!entry) return null;
  return (
    <span className="ml-1 inline-flex">
      <Term id={id} plain>
        <span
          aria-hidden
          className="inline-flex h-3.5 w-3.5 items-center justify-center rounded-full border border-current text-[9px] font-bold no-underline"
        >
          ?
        </span>
        <span className="sr-only">What is {entry.term}?</span>
      </Term>
    </span>
  );
}
