import { type FormEvent, useState } from 'react';
import { toast } from 'sonner';
import { FUNCTIONAL_CLASSES, SURFACES, SegmentUpdateSchema } from '@shared/schemas/segments';
import { Field, Select, TextArea, TextInput } from '@/components/ui/field';
import { numberOrNull, textOrNull, useFieldErrors } from '@/components/ui/form-errors';
import { CLASS_LABELS, SURFACE_LABELS } from '@/lib/format';
import { useDistricts } from '../api/get-districts';
import type { SegmentDetail } from '../api/get-segment';
import { useUpdateSegment } from '../api/update-segment';
import { SEGMENT_FIELD_LABELS } from '../segment-labels';
import { FormFooter } from './form-footer';

const TEXT = ['roadName', 'fromDesc', 'toDesc', 'district', 'notes'] as const;
const NUMBERS = ['lengthMi', 'widthFt', 'lanes', 'adt', 'truckPct'] as const;
type Key = (typeof TEXT)[number] | (typeof NUMBERS)[number] | 'functionalClass' | 'surface';
type Draft = Record<Key, string>;

const draftOf = (s: SegmentDetail): Draft => {
  const out = {} as Draft;
  for (const k of [...TEXT, ...NUMBERS, 'functionalClass', 'surface'] as Key[])
    out[k] = s[k] === null || s[k] === undefined ? '' : String(s[k]);
  return out;
};

/** Edits a segment's attributes; only the fields that changed are sent, checked first with the server's schema. */
export function SegmentEditForm({
  agencyId,
  segment,
  onDone,
}: {
  agencyId: string;
  segment: SegmentDetail;
  onDone: () => void;
}) {
  const update = useUpdateSegment(agencyId);
  const districts = useDistricts(agencyId);
  const f = useFieldErrors(SEGMENT_FIELD_LABELS);
  const [d, setD] = useState<Draft>(() => draftOf(segment));
  const set = (k: Key, v: string) => {
    setD({ ...d, [k]: v });
    f.clear(k);
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const value: Record<string, unknown> = {};
    for (const k of NUMBERS) value[k] = numberOrNull(d[k]);
    value.roadName = d.roadName.trim();
    for (const k of ['fromDesc', 'toDesc', 'district', 'notes'] as const) value[k] = textOrNull(d[k]);
    value.functionalClass = d.functionalClass;
    value.surface = d.surface;
    // Send what changed; a blank required number stays in, so the schema can say it is required.
    const patch = Object.fromEntries(Object.entries(value).filter(([k, v]) => v !== segment[k as Key]));
    if (Object.keys(patch).length === 0) {
      toast('Nothing changed');
      onDone();
      return;
    }
    const checked = f.check(SegmentUpdateSchema, patch);
    if (!checked) return;
    update.mutate(
      { id: segment.id, patch: checked },
      {
        onSuccess: () => {
          toast.success(`${segment.segmentId}: ${Object.keys(checked).length} change(s) saved`);
          onDone();
        },
        onError: f.fromError,
      },
    );
  };

  const text = (k: Key, hint?: string) => (
    <Field label={SEGMENT_FIELD_LABELS[k]} hint={hint} error={f.error(k)}>
      <TextInput
        value={d[k]}
        inputMode={(NUMBERS as readonly string[]).includes(k) ? 'decimal' : undefined}
        onChange={(e) => set(k, e.target.value)}
      />
    </Field>
  );

  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label="Edit attributes">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <div className="sm:col-span-2">{text('roadName')}</div>
        {text('fromDesc')}
        {text('toDesc')}
        {text('lengthMi')}
        {text('widthFt', 'Edge to edge of pavement')}
        {text('lanes')}
        <Field label={SEGMENT_FIELD_LABELS.functionalClass} error={f.error('functionalClass')}>
          <Select value={d.functionalClass} onChange={(e) => set('functionalClass', e.target.value)}>
            {FUNCTIONAL_CLASSES.map((c) => (
              <option key={c} value={c}>
                {CLASS_LABELS[c]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label={SEGMENT_FIELD_LABELS.surface} error={f.error('surface')}>
          <Select value={d.surface} onChange={(e) => set('surface', e.target.value)}>
            {SURFACES.map((c) => (
              <option key={c} value={c}>
                {SURFACE_LABELS[c]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label={SEGMENT_FIELD_LABELS.district} error={f.error('district')}>
          <TextInput
            list={`districts-${segment.id}`}
            value={d.district}
            onChange={(e) => set('district', e.target.value)}
          />
        </Field>
        <datalist id={`districts-${segment.id}`}>
          {districts.data?.items.map((x) => (
            <option key={x.name} value={x.name} />
          ))}
        </datalist>
        {text('adt')}
        {text('truckPct')}
      </div>
      <Field label={SEGMENT_FIELD_LABELS.notes} error={f.error('notes')}>
        <TextArea rows={3} value={d.notes} onChange={(e) => set('notes', e.target.value)} />
      </Field>
      <p className="text-xs text-asphalt-muted">
        The segment id ({segment.segmentId}) is the key for re-imports and is not edited here. Length, width and lanes
        change every quantity and cost worked from this segment.
      </p>
      <FormFooter
        messages={f.others}
        pending={update.isPending}
        label="Save the attributes"
        pendingLabel="Saving…"
        onCancel={onDone}
      />
    </form>
  );
}
