// biome-ignore-all lint/a11y/useSemanticElements: a virtualised table positions rows absolutely, so rows and cells are divs with ARIA roles
// biome-ignore-all lint/a11y/useFocusableInteractive: the cells are read-only text or hold their own focusable controls
import { useVirtualizer } from '@tanstack/react-virtual';
import { type ReactNode, useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { conditionBand, NO_DATA_COLOR } from '@shared/condition';
import type { Segment } from '@shared/schemas/segments';
import { Button } from '@/components/ui/button';
import { TermHint } from '@/components/ui/term';
import { CLASS_LABELS, fmt2, fmtInt, SURFACE_LABELS } from '@/lib/format';
import { useSegmentPages } from '../api/get-segment-pages';
import type { SegmentFilters } from '../api/get-segments';
import { COLUMNS, EDITABLE, STICKY_LEFT } from './segment-columns';
import { SegmentCellEditor } from './segment-cell-editor';

const ROW_H = 32;
const HEADER_H = 34;

type Props = {
  agencyId: string;
  filters: SegmentFilters;
  sort: { id: string; desc: boolean };
  onSort: (s: { id: string; desc: boolean }) => void;
  canEdit: boolean;
  selected: Set<number>;
  onToggle: (id: number) => void;
  /** Said when the filters leave nothing, with a way out. */
  emptyFiltered?: { text: ReactNode; onClear: () => void };
  height?: number;
};

export function SegmentTable({
  agencyId,
  filters,
  sort,
  onSort,
  canEdit,
  selected,
  onToggle,
  emptyFiltered,
  height = 555,
}: Props) {
  const pages = useSegmentPages(agencyId, { ...filters, sort: sort.id, dir: sort.desc ? 'desc' : 'asc' });
  const rows = useMemo(() => pages.data?.pages.flatMap((p) => p.items) ?? [], [pages.data]);
  const total = pages.data?.pages[0]?.total ?? 0;
  const [editing, setEditing] = useState<{ id: number; key: keyof Segment } | null>(null);

  // One scroller both ways: the header sticks to the top, the first columns to the left.
  const scroller = useRef<HTMLDivElement>(null);
  const virtual = useVirtualizer({
    count: total,
    getScrollElement: () => scroller.current,
    estimateSize: () => ROW_H,
    overscan: 20,
    scrollMargin: HEADER_H,
  });
  const items = virtual.getVirtualItems();
  const last = items.at(-1);
  // Fetch the next page as the scroll nears the end of what is loaded.
  useEffect(() => {
    if (last && last.index >= rows.length - 50 && pages.hasNextPage && !pages.isFetchingNextPage)
      void pages.fetchNextPage();
  }, [last, rows.length, pages]);

  const gridTemplate = COLUMNS.map((c) => `${c.width}px`).join(' ');
  const width = COLUMNS.reduce((s, c) => s + c.width, 0);
  const stick = (id: string) =>
    STICKY_LEFT[id] !== undefined ? { position: 'sticky' as const, left: STICKY_LEFT[id], zIndex: 1 } : undefined;

  const cell = (s: Segment, key: string) => {
    const k = key as keyof Segment;
    if (editing && editing.id === s.id && editing.key === k)
      return (
        <SegmentCellEditor
          agencyId={agencyId}
          segment={s}
          field={k}
          kind={EDITABLE[k]!}
          onDone={() => setEditing(null)}
        />
      );
    switch (key) {
      case 'select':
        return (
          <input
            type="checkbox"
            aria-label={`Select ${s.segmentId}`}
            checked={selected.has(s.id)}
            onChange={() => onToggle(s.id)}
            onClick={(e) => e.stopPropagation()}
          />
        );
      case 'segmentId':
        return (
          <Link to={String(s.id)} className="font-semibold text-accent hover:underline">
            {s.segmentId}
          </Link>
        );
      case 'fromTo':
        return (
          <span className="text-asphalt-muted">
            {s.fromDesc ?? '—'} – {s.toDesc ?? '—'}
          </span>
        );
      case 'lengthMi':
        return fmt2(s.lengthMi);
      case 'widthFt':
        return fmtInt(s.widthFt);
      case 'adt':
        return fmtInt(s.adt);
      case 'functionalClass':
        return CLASS_LABELS[s.functionalClass];
      case 'surface':
        return SURFACE_LABELS[s.surface];
      case 'pci': {
        const b = conditionBand(s.pci);
        return (
          <span
            className="inline-flex items-center gap-1.5"
            title={b ? `${b.label} (PCI ${b.min}–${b.max})` : 'No PCI'}
          >
            <span className="inline-block h-2.5 w-2.5 rounded-full" style={{ background: b?.color ?? NO_DATA_COLOR }} />
            {s.pci === null ? '—' : fmtInt(s.pci)}
          </span>
        );
      }
      default:
        return String(s[k] ?? '—');
    }
  };

  return (
    <div
      className="num overflow-hidden rounded border border-asphalt-line bg-white text-sm"
      data-testid="segment-table"
      data-total={total}
    >
      <div ref={scroller} className="relative overflow-auto" style={{ height }} data-testid="segment-scroller">
        <div style={{ width, minWidth: '100%' }}>
          <div
            className="sticky top-0 z-10 grid border-b border-asphalt-line bg-paper text-xs font-bold text-asphalt-muted"
            style={{ gridTemplateColumns: gridTemplate, height: HEADER_H }}
            role="row"
          >
            {COLUMNS.map((c) => {
              const sorted = sort.id === c.id ? (sort.desc ? 'desc' : 'asc') : null;
              return (
                <div
                  key={c.id}
                  role="columnheader"
                  aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                  className={`flex items-center bg-paper px-2 ${c.num ? 'justify-end' : ''}`}
                  style={stick(c.id)}
                >
                  {c.sortable ? (
                    <button
                      type="button"
                      className="whitespace-nowrap hover:text-asphalt"
                      onClick={() => onSort({ id: c.id, desc: sort.id === c.id ? !sort.desc : false })}
                    >
                      {c.header}
                      {sorted ? (sorted === 'desc' ? ' ↓' : ' ↑') : ''}
                    </button>
                  ) : (
                    c.header
                  )}
                  {c.term && <TermHint id={c.term} />}
                </div>
              );
            })}
          </div>
          <div style={{ height: virtual.getTotalSize(), position: 'relative' }}>
            {items.map((vi) => {
              const s = rows[vi.index];
              const bg = s && selected.has(s.id) ? 'bg-accent-light' : vi.index % 2 ? 'bg-[#fbfaf7]' : 'bg-white';
              return (
                <div
                  key={vi.key}
                  role="row"
                  data-segment={s?.segmentId}
                  className={`absolute left-0 grid w-full items-center border-b border-asphalt-line/50 ${bg}`}
                  style={{ top: vi.start - HEADER_H, height: ROW_H, gridTemplateColumns: gridTemplate }}
                >
                  {s ? (
                    COLUMNS.map((c) => {
                      const editable = canEdit && EDITABLE[c.id as keyof Segment];
                      return (
                        <div
                          key={c.id}
                          role="cell"
                          className={`flex h-full items-center truncate px-2 ${c.num ? 'justify-end' : ''} ${editable ? 'cursor-text' : ''} ${c.sticky ? bg : ''}`}
                          style={stick(c.id)}
                          onDoubleClick={() => editable && setEditing({ id: s.id, key: c.id as keyof Segment })}
                          title={editable ? 'Double-click to edit' : undefined}
                        >
                          {cell(s, c.id)}
                        </div>
                      );
                    })
                  ) : (
                    <div className="px-2 text-asphalt-muted">Loading…</div>
                  )}
                </div>
              );
            })}
          </div>
          {!pages.isLoading && total === 0 && emptyFiltered && (
            <div className="sticky left-0 max-w-md p-6 text-sm" data-testid="empty-filtered" role="status">
              <p className="font-semibold">No segments match these filters.</p>
              <p className="mt-1 text-asphalt-muted">{emptyFiltered.text}</p>
              <Button variant="secondary" className="mt-3" onClick={emptyFiltered.onClear}>
                Clear the filters
              </Button>
            </div>
          )}
        </div>
      </div>
    </div>
  );
}
