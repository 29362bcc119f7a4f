import { type FormEvent, useState } from 'react';
import { toast } from 'sonner';
import { SurveyInputSchema } from '@shared/schemas/segment-history';
import { Field, TextInput } from '@/components/ui/field';
import { numberOrNull, textOrNull, useFieldErrors } from '@/components/ui/form-errors';
import { Term } from '@/components/ui/term';
import { useAddSurvey } from '../api/segment-history';
import { FormFooter } from './form-footer';

const LABELS = { surveyDate: 'Survey date', pci: 'PCI', source: 'Source' };
const today = () => new Date().toISOString().slice(0, 10);

/** Adds one condition survey by hand; the newest survey becomes the segment's PCI. */
export function SurveyForm({
  agencyId,
  segmentRef,
  segmentId,
  latestDate,
  onDone,
}: {
  agencyId: string;
  segmentRef: number;
  segmentId: string;
  latestDate: string | null;
  onDone: () => void;
}) {
  const add = useAddSurvey(agencyId, segmentRef);
  const f = useFieldErrors(LABELS);
  const [date, setDate] = useState(today());
  const [pci, setPci] = useState('');
  const [source, setSource] = useState('');

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body = f.check(SurveyInputSchema, {
      surveyDate: date,
      pci: numberOrNull(pci) ?? undefined,
      source: textOrNull(source),
    });
    if (!body) return;
    add.mutate(body, {
      onSuccess: () => {
        toast.success(`${segmentId}: survey of ${date} added`);
        onDone();
      },
      onError: f.fromError,
    });
  };
  const olderThanLatest = latestDate !== null && date !== '' && date < latestDate;

  return (
    <form
      onSubmit={submit}
      noValidate
      className="space-y-3 rounded border border-accent/30 bg-accent-light/30 p-3"
      aria-label="Add a survey"
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[10rem_7rem_minmax(0,1fr)]">
        <Field label={LABELS.surveyDate} error={f.error('surveyDate')}>
          <TextInput
            type="date"
            value={date}
            max={today()}
            onChange={(e) => {
              setDate(e.target.value);
              f.clear('surveyDate');
            }}
          />
        </Field>
        <Field label={<Term id="pci">PCI</Term>} hint="0–100" error={f.error('pci')}>
          <TextInput
            inputMode="decimal"
            aria-label="PCI"
            value={pci}
            onChange={(e) => {
              setPci(e.target.value);
              f.clear('pci');
            }}
          />
        </Field>
        <Field label={LABELS.source} hint="Who rated it, or how (optional)" error={f.error('source')}>
          <TextInput value={source} onChange={(e) => setSource(e.target.value)} />
        </Field>
      </div>
      {olderThanLatest && (
        <p className="text-xs text-asphalt-muted">
          Older than the latest survey ({latestDate}): it joins the history; the segment keeps its latest PCI.
        </p>
      )}
      <FormFooter
        messages={f.others}
        pending={add.isPending}
        label="Add the survey"
        pendingLabel="Adding…"
        onCancel={onDone}
      />
    </form>
  );
}
