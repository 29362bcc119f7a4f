import { useLayoutEffect, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { toast } from 'sonner';
import { type Segment, SegmentUpdateSchema } from '@shared/schemas/segments';
import { atField, describeError, issuesOf, numberOrNull, textOrNull } from '@/components/ui/form-errors';
import { useUpdateSegment } from '../api/update-segment';
import { SEGMENT_FIELD_LABELS } from '../segment-labels';

export type EditKind =
  | { type: 'text'; nullable?: boolean }
  | { type: 'number' }
  | { type: 'choice'; options: readonly string[]; labels: Record<string, string> };

type Props = { agencyId: string; segment: Segment; field: keyof Segment; kind: EditKind; onDone: () => void };

/**
 * Edits one cell in place. The value is checked with the same schema the server
 * uses before it is sent; a refusal (here or from the server) stays open at the
 * cell with the reason in plain words, until fixed or cancelled with Escape.
 */
export function SegmentCellEditor({ agencyId, segment, field, kind, onDone }: Props) {
  const update = useUpdateSegment(agencyId);
  const [error, setError] = useState<string | null>(null);
  const box = useRef<HTMLInputElement & HTMLSelectElement>(null);
  const label = SEGMENT_FIELD_LABELS[field] ?? String(field);

  const commit = (raw: string) => {
    if (update.isPending) return;
    const value =
      kind.type === 'number' ? numberOrNull(raw) : kind.type === 'text' && kind.nullable ? textOrNull(raw) : raw.trim();
    if (value === segment[field]) return onDone();
    const checked = SegmentUpdateSchema.safeParse({ [field]: value });
    if (!checked.success) {
      setError(atField(checked.error.issues[0].message));
      return;
    }
    update.mutate(
      { id: segment.id, patch: checked.data },
      {
        onSuccess: () => {
          toast.success(`${segment.segmentId}: ${label} saved`);
          onDone();
        },
        onError: (e) => {
          const first = issuesOf(e)[0];
          setError(first ? atField(first.message) : describeError(e, SEGMENT_FIELD_LABELS));
        },
      },
    );
  };

  const common = {
    ref: box,
    autoFocus: true,
    'aria-label': `${label} of ${segment.segmentId}`,
    'aria-invalid': error ? true : undefined,
    className: `w-full rounded border px-1 text-sm ${error ? 'border-band-failed ring-2 ring-band-failed/20' : 'border-accent'}`,
  } as const;

  return (
    <>
      {kind.type === 'choice' ? (
        <select
          {...common}
          defaultValue={String(segment[field])}
          onBlur={(e) => commit(e.target.value)}
          onChange={(e) => commit(e.target.value)}
          onKeyDown={(e) => e.key === 'Escape' && onDone()}
        >
          {kind.options.map((o) => (
            <option key={o} value={o}>
              {kind.labels[o]}
            </option>
          ))}
        </select>
      ) : (
        <input
          {...common}
          inputMode={kind.type === 'number' ? 'decimal' : undefined}
          defaultValue={segment[field] === null ? '' : String(segment[field])}
          onChange={() => error && setError(null)}
          onBlur={(e) => commit(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') commit((e.target as HTMLInputElement).value);
            if (e.key === 'Escape') onDone();
          }}
        />
      )}
      {error && <Bubble anchor={box.current} text={`${label}: ${error} (Esc to cancel)`} />}
    </>
  );
}

/** The reason, just under the cell, drawn above the table so the row's clipping cannot hide it. */
function Bubble({ anchor, text }: { anchor: HTMLElement | null; text: string }) {
  const [at, setAt] = useState<{ left: number; top: number } | null>(null);
  useLayoutEffect(() => {
    const r = anchor?.getBoundingClientRect();
    if (r) setAt({ left: r.left, top: r.bottom + 4 });
  }, [anchor]);
  if (!at) return null;
  return createPortal(
    <div
      role="alert"
      data-field-error
      className="fixed z-[60] max-w-xs rounded border border-band-failed/40 bg-white px-2 py-1 text-xs font-semibold text-band-failed shadow"
      style={at}
    >
      {text}
    </div>,
    document.body,
  );
}
