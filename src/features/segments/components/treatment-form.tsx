import { type FormEvent, useState } from 'react';
import { toast } from 'sonner';
import { TREATMENT_KIND_LABELS, TREATMENT_KINDS } from '@shared/schemas/catalog';
import { TreatmentRecordInputSchema } from '@shared/schemas/segment-history';
import { Field, Select, TextArea, TextInput } from '@/components/ui/field';
import { numberOrNull, textOrNull, useFieldErrors } from '@/components/ui/form-errors';
import { Term } from '@/components/ui/term';
import { useCatalog } from '@/features/catalog/api/get-catalog';
import { useRecordTreatment } from '../api/segment-history';
import { FormFooter } from './form-footer';

const LABELS = {
  treatedOn: 'Date finished',
  treatmentId: 'From the catalog',
  kind: 'Kind of work',
  name: 'Description',
  mix: 'Mix',
  thicknessIn: 'Thickness (in)',
  costUsd: 'Cost ($)',
  pciAfter: 'PCI after the work',
  notes: 'Notes',
};
const today = () => new Date().toISOString().slice(0, 10);
const capital = (s: string) => s[0].toUpperCase() + s.slice(1);

type Draft = Record<keyof typeof LABELS, string>;

/** Records a job done on the segment; picking a catalog treatment fills in its kind, mix and lift. */
export function TreatmentForm({
  agencyId,
  segmentRef,
  segmentId,
  onDone,
}: {
  agencyId: string;
  segmentRef: number;
  segmentId: string;
  onDone: () => void;
}) {
  const record = useRecordTreatment(agencyId, segmentRef);
  const catalog = useCatalog(agencyId);
  const f = useFieldErrors(LABELS);
  const [d, setD] = useState<Draft>({
    treatedOn: today(),
    treatmentId: '',
    kind: 'crack_seal',
    name: '',
    mix: '',
    thicknessIn: '',
    costUsd: '',
    pciAfter: '',
    notes: '',
  });
  const set = (patch: Partial<Draft>) => {
    setD({ ...d, ...patch });
    for (const k of Object.keys(patch)) f.clear(k);
  };
  const mixName = (id: string | null) => catalog.data?.mixes.find((m) => m.id === id)?.name ?? '';

  const pickCatalog = (id: string) => {
    const t = catalog.data?.treatments.find((x) => x.id === id);
    if (!t) return set({ treatmentId: '' });
    set({
      treatmentId: id,
      kind: t.kind,
      name: t.name,
      mix: mixName(t.mixId),
      thicknessIn: t.defaultThicknessIn === null ? '' : String(t.defaultThicknessIn),
    });
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body = f.check(TreatmentRecordInputSchema, {
      treatedOn: d.treatedOn,
      kind: d.kind,
      name: d.name.trim(),
      treatmentId: d.treatmentId || null,
      mix: textOrNull(d.mix),
      thicknessIn: numberOrNull(d.thicknessIn),
      costUsd: numberOrNull(d.costUsd),
      pciAfter: numberOrNull(d.pciAfter),
      notes: textOrNull(d.notes),
    });
    if (!body) return;
    record.mutate(body, {
      onSuccess: () => {
        toast.success(`${segmentId}: ${body.name} on ${body.treatedOn} recorded`);
        onDone();
      },
      onError: f.fromError,
    });
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="space-y-3 rounded border border-accent/30 bg-accent-light/30 p-3"
      aria-label="Record a treatment"
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <Field
          label={LABELS.treatmentId}
          hint="Fills in the kind, mix and lift; change them if the job differed."
          error={f.error('treatmentId')}
        >
          <Select value={d.treatmentId} onChange={(e) => pickCatalog(e.target.value)}>
            <option value="">— not from the catalog —</option>
            {catalog.data?.treatments.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label={LABELS.treatedOn} error={f.error('treatedOn')}>
          <TextInput
            type="date"
            max={today()}
            value={d.treatedOn}
            onChange={(e) => set({ treatedOn: e.target.value })}
          />
        </Field>
        <Field label={LABELS.kind} error={f.error('kind')}>
          <Select value={d.kind} onChange={(e) => set({ kind: e.target.value })}>
            {TREATMENT_KINDS.map((k) => (
              <option key={k} value={k}>
                {capital(TREATMENT_KIND_LABELS[k])}
              </option>
            ))}
          </Select>
        </Field>
        <Field label={LABELS.name} hint="As the job is known: “Mill 2 in, overlay 2 in”." error={f.error('name')}>
          <TextInput value={d.name} onChange={(e) => set({ name: e.target.value })} />
        </Field>
        <Field label={LABELS.mix} error={f.error('mix')}>
          <TextInput list={`mixes-${segmentRef}`} value={d.mix} onChange={(e) => set({ mix: e.target.value })} />
        </Field>
        <datalist id={`mixes-${segmentRef}`}>
          {catalog.data?.mixes.map((m) => (
            <option key={m.id} value={m.name} />
          ))}
        </datalist>
        <Field label={LABELS.thicknessIn} hint="Compacted lift; blank for seals" error={f.error('thicknessIn')}>
          <TextInput inputMode="decimal" value={d.thicknessIn} onChange={(e) => set({ thicknessIn: e.target.value })} />
        </Field>
        <Field label={LABELS.costUsd} hint="What the job cost, all in (optional)" error={f.error('costUsd')}>
          <TextInput inputMode="decimal" value={d.costUsd} onChange={(e) => set({ costUsd: e.target.value })} />
        </Field>
        <Field
          label={
            <>
              <Term id="pci">PCI</Term> after the work
            </>
          }
          hint="If it was rated after the job; kept as a survey on that date. Otherwise plans still see the old PCI until the next survey."
          error={f.error('pciAfter')}
        >
          <TextInput inputMode="decimal" value={d.pciAfter} onChange={(e) => set({ pciAfter: e.target.value })} />
        </Field>
      </div>
      <Field label={LABELS.notes} error={f.error('notes')}>
        <TextArea rows={2} value={d.notes} onChange={(e) => set({ notes: e.target.value })} />
      </Field>
      <FormFooter
        messages={f.others}
        pending={record.isPending}
        label="Record the treatment"
        pendingLabel="Recording…"
        onCancel={onDone}
      />
    </form>
  );
}
