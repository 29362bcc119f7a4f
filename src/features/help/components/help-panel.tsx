import { useEffect, useMemo, useRef, useState } from 'react';
import { TextInput } from '@/components/ui/field';
import { GLOSSARY } from '../glossary';
import { useHelp } from '../help-context';

/** The glossary as a panel at the right edge, opened from the rail or from any Term. */
export function HelpPanel() {
  const help = useHelp();
  const [q, setQ] = useState('');
  const list = useRef<HTMLDivElement>(null);
  const open = help?.open ?? false;
  const termId = help?.termId ?? null;

  useEffect(() => {
    if (!open) return;
    setQ('');
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && help?.close();
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [open, help]);

  useEffect(() => {
    if (!open || !termId) return;
    list.current?.querySelector(`[data-term="${termId}"]`)?.scrollIntoView({ block: 'start' });
  }, [open, termId]);

  const shown = useMemo(() => {
    const needle = q.trim().toLowerCase();
    if (!needle) return GLOSSARY;
    return GLOSSARY.filter((g) => `${g.term} ${g.aka ?? ''} ${g.short} ${g.more ?? ''}`.toLowerCase().includes(needle));
  }, [q]);

  if (!open || !help) return null;
  return (
    <aside
      className="no-print fixed inset-y-0 right-0 z-50 flex w-[26rem] max-w-full flex-col border-l border-asphalt-line bg-white shadow-xl"
      aria-label="Help and glossary"
      data-testid="help-panel"
    >
      <div className="flex items-center justify-between border-b border-asphalt-line px-4 py-3">
        <h2 className="text-base font-bold">Help: words and numbers</h2>
        <button
          type="button"
          className="rounded px-2 py-1 text-sm font-semibold text-asphalt-muted hover:bg-asphalt/5 hover:text-asphalt"
          onClick={help.close}
        >
          Close
        </button>
      </div>
      <div className="border-b border-asphalt-line px-4 py-2">
        <TextInput
          aria-label="Find a term"
          placeholder="Find a term (PCI, EUAC, backlog…)"
          value={q}
          onChange={(e) => setQ(e.target.value)}
          autoFocus
        />
      </div>
      <div ref={list} className="flex-1 overflow-y-auto px-4 py-2">
        {shown.length === 0 && <p className="py-4 text-sm text-asphalt-muted">No term matches “{q}”.</p>}
        <dl>
          {shown.map((g) => (
            <div
              key={g.id}
              data-term={g.id}
              className={`border-b border-asphalt-line/60 py-2.5 ${g.id === termId ? 'bg-accent-light/50 -mx-2 px-2' : ''}`}
            >
              <dt className="text-sm font-bold">
                {g.term}
                {g.aka && <span className="font-normal text-asphalt-muted"> · {g.aka}</span>}
              </dt>
              <dd className="mt-0.5 text-sm">{g.short}</dd>
              {g.more && <dd className="mt-1 text-xs leading-relaxed text-asphalt-muted">{g.more}</dd>}
            </div>
          ))}
        </dl>
        <p className="py-3 text-xs text-asphalt-muted">
          Wearcourse gives planning estimates. Pavement design, work-zone safety and cold-weather paving follow local
          codes, agency specifications and a licensed engineer’s judgement.
        </p>
      </div>
    </aside>
  );
}
