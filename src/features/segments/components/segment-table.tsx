// biome-ignore-all lint/a11y/useSemanticElements: a virtualised table positions rows absolutely, so rows and cells are divs with ARIA roles
// biome-ignore-all lint/a11y/useFocusableInteractive: the cells are read-only text or hold their own focusable controls
import { type ColumnDef, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import { useEffect, useMemo, useRef, useState } from 'react';
import { toast } from 'sonner';
import { conditionBand, NO_DATA_COLOR } from '@shared/condition';
import { FUNCTIONAL_CLASSES, type Segment, SURFACES, type SegmentUpdate } from '@shared/schemas/segments';
import { CLASS_LABELS, fmt2, fmtInt, SURFACE_LABELS } from '@/lib/format';
import type { SegmentFilters } from '../api/get-segments';
import { useSegmentPages } from '../api/get-segment-pages';
import { useUpdateSegment } from '../api/update-segment';

type EditKind =
  | { type: 'text' }
  | { type: 'number'; integer?: boolean }
  | { type: 'choice'; options: readonly string[]; labels: Record<string, string> };

// Columns an engineer may change in place (double-click a cell).
const EDITABLE: Partial<Record<keyof Segment, EditKind>> = {
  roadName: { type: 'text' },
  widthFt: { type: 'number' },
  lanes: { type: 'number', integer: true },
  functionalClass: { type: 'choice', options: FUNCTIONAL_CLASSES, labels: CLASS_LABELS },
  surface: { type: 'choice', options: SURFACES, labels: SURFACE_LABELS },
  adt: { type: 'number', integer: true },
  district: { type: 'text' },
};

const ROW_H = 32;

type Props = {
  agencyId: string;
  filters: SegmentFilters;
  sort: { id: string; desc: boolean };
  onSort: (s: { id: string; desc: boolean }) => void;
  canEdit: boolean;
  selected: Set<number>;
  onToggle: (id: number) => void;
  onOpen: (id: number) => void;
};

export function SegmentTable({ agencyId, filters, sort, onSort, canEdit, selected, onToggle, onOpen }: Props) {
  const pages = useSegmentPages(agencyId, { ...filters, sort: sort.id, dir: sort.desc ? 'desc' : 'asc' });
  const rows = useMemo(() => pages.data?.pages.flatMap((p) => p.items) ?? [], [pages.data]);
  const total = pages.data?.pages[0]?.total ?? 0;
  const update = useUpdateSegment(agencyId);
  const [editing, setEditing] = useState<{ id: number; key: keyof Segment } | null>(null);

  const columns = useMemo<ColumnDef<Segment>[]>(
    () => [
      { id: 'select', header: '', size: 34, enableSorting: false },
      { accessorKey: 'segmentId', header: 'Segment', size: 110 },
      { accessorKey: 'roadName', header: 'Road', size: 180 },
      {
        id: 'fromTo',
        header: 'From – to',
        size: 190,
        enableSorting: false,
        accessorFn: (s) => `${s.fromDesc ?? ''} – ${s.toDesc ?? ''}`,
      },
      { accessorKey: 'lengthMi', header: 'Length (mi)', size: 90, meta: { num: true } },
      { accessorKey: 'widthFt', header: 'Width (ft)', size: 80, enableSorting: false, meta: { num: true } },
      { accessorKey: 'lanes', header: 'Lanes', size: 60, enableSorting: false, meta: { num: true } },
      { accessorKey: 'functionalClass', header: 'Class', size: 140 },
      { accessorKey: 'surface', header: 'Surface', size: 90, enableSorting: false },
      { accessorKey: 'adt', header: 'ADT', size: 70, enableSorting: false, meta: { num: true } },
      { accessorKey: 'district', header: 'District', size: 110 },
      { accessorKey: 'pci', header: 'PCI', size: 70, meta: { num: true } },
    ],
    [],
  );
  const table = useReactTable({
    data: rows,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    state: { sorting: [sort] },
    onSortingChange: (updater) => {
      const next = typeof updater === 'function' ? updater([sort]) : updater;
      if (next[0]) onSort(next[0]);
    },
  });

  const scroller = useRef<HTMLDivElement>(null);
  const virtual = useVirtualizer({
    count: total,
    getScrollElement: () => scroller.current,
    estimateSize: () => ROW_H,
    overscan: 20,
  });
  const items = virtual.getVirtualItems();
  const last = items.at(-1);
  // Fetch the next page as the scroll nears the end of what is loaded.
  useEffect(() => {
    if (last && last.index >= rows.length - 50 && pages.hasNextPage && !pages.isFetchingNextPage)
      void pages.fetchNextPage();
  }, [last, rows.length, pages]);

  const gridTemplate = table
    .getVisibleLeafColumns()
    .map((c) => `${c.getSize()}px`)
    .join(' ');

  const save = (s: Segment, key: keyof Segment, raw: string) => {
    setEditing(null);
    const kind = EDITABLE[key]!;
    let value: unknown = raw.trim();
    if (kind.type === 'number') value = raw.trim() === '' ? null : Number(raw);
    if (value === s[key] || (kind.type === 'number' && Number.isNaN(value))) return;
    update.mutate(
      { id: s.id, patch: { [key]: value } as SegmentUpdate },
      {
        onSuccess: () => toast.success(`${s.segmentId}: ${String(key)} saved`),
        onError: (e) => toast.error(e.message),
      },
    );
  };

  const cell = (s: Segment, key: string) => {
    const k = key as keyof Segment;
    if (editing && editing.id === s.id && editing.key === k) {
      const kind = EDITABLE[k]!;
      if (kind.type === 'choice')
        return (
          <select
            autoFocus
            aria-label={`Edit ${key}`}
            className="w-full rounded border border-accent px-1 text-sm"
            defaultValue={String(s[k])}
            onBlur={(e) => save(s, k, e.target.value)}
            onChange={(e) => save(s, k, e.target.value)}
          >
            {kind.options.map((o) => (
              <option key={o} value={o}>
                {kind.labels[o]}
              </option>
            ))}
          </select>
        );
      return (
        <input
          autoFocus
          aria-label={`Edit ${key}`}
          className="w-full rounded border border-accent px-1 text-sm"
          defaultValue={s[k] === null ? '' : String(s[k])}
          onBlur={(e) => save(s, k, e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') save(s, k, (e.target as HTMLInputElement).value);
            if (e.key === 'Escape') setEditing(null);
          }}
        />
      );
    }
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
          <button type="button" className="font-semibold text-accent hover:underline" onClick={() => onOpen(s.id)}>
            {s.segmentId}
          </button>
        );
      case 'fromTo':
        return (
          <span className="text-asphalt-muted">
            {s.fromDesc} – {s.toDesc}
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
          <span className="inline-flex items-center gap-1.5">
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
      <div className="overflow-x-auto">
        <div style={{ minWidth: table.getTotalSize() }}>
          <div
            className="grid border-b border-asphalt-line bg-paper text-xs font-bold uppercase tracking-wide text-asphalt-muted"
            style={{ gridTemplateColumns: gridTemplate }}
            role="row"
          >
            {table.getHeaderGroups()[0].headers.map((h) => {
              const num = (h.column.columnDef.meta as { num?: boolean } | undefined)?.num;
              const sorted = h.column.getIsSorted();
              return (
                <div key={h.id} role="columnheader" className={`truncate px-2 py-2 ${num ? 'text-right' : ''}`}>
                  {h.column.getCanSort() ? (
                    <button
                      type="button"
                      className="uppercase hover:text-asphalt"
                      onClick={h.column.getToggleSortingHandler()}
                    >
                      {flexRender(h.column.columnDef.header, h.getContext())}
                      {sorted ? (sorted === 'desc' ? ' ↓' : ' ↑') : ''}
                    </button>
                  ) : (
                    flexRender(h.column.columnDef.header, h.getContext())
                  )}
                </div>
              );
            })}
          </div>
          <div ref={scroller} className="overflow-y-auto" style={{ height: 520 }} data-testid="segment-scroller">
            <div style={{ height: virtual.getTotalSize(), position: 'relative' }}>
              {items.map((vi) => {
                const s = rows[vi.index];
                return (
                  <div
                    key={vi.key}
                    role="row"
                    data-segment={s?.segmentId}
                    className={`absolute left-0 grid w-full items-center border-b border-asphalt-line/50 ${s && selected.has(s.id) ? 'bg-accent-light' : vi.index % 2 ? 'bg-paper/40' : ''}`}
                    style={{ top: vi.start, height: ROW_H, gridTemplateColumns: gridTemplate }}
                  >
                    {s ? (
                      table.getVisibleLeafColumns().map((c) => {
                        const num = (c.columnDef.meta as { num?: boolean } | undefined)?.num;
                        const editable = canEdit && EDITABLE[c.id as keyof Segment];
                        return (
                          <div
                            key={c.id}
                            role="cell"
                            className={`truncate px-2 ${num ? 'text-right' : ''} ${editable ? 'cursor-text' : ''}`}
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
          </div>
        </div>
      </div>
    </div>
  );
}
