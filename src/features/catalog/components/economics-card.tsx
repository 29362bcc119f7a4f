import { useId, useState } from 'react';
import { toast } from 'sonner';
import { type Economics, EconomicsSchema } from '@shared/schemas/catalog';
import { Button } from '@/components/ui/button';
import { describedBy, FieldMessage } from '@/components/ui/field-message';
import { TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { issuesOf, numberFrom, useFormErrors } from '@/lib/form-errors';
import { useUpdateEconomics } from '../api/update-economics';

type NumberKey = Exclude<keyof Economics, 'discountRateSource'>;

// Fractions are typed in percent.
const FIELDS: { key: NumberKey; label: string; percent?: boolean }[] = [
  { key: 'discountRate', label: 'Discount rate, real (%)', percent: true },
  { key: 'analysisPeriodYears', label: 'Analysis period (yr)' },
  { key: 'baseYear', label: 'Base year (constant dollars)' },
  { key: 'mobilizationPerJob', label: 'Mobilisation ($ per job)' },
  { key: 'trafficControlPerDay', label: 'Traffic control ($ per day)' },
  { key: 'engineeringFraction', label: 'Engineering (% of the job)', percent: true },
  { key: 'contingencyFraction', label: 'Contingency (% of the job)', percent: true },
];

const toText = (e: Economics) =>
  Object.fromEntries(FIELDS.map((f) => [f.key, String(f.percent ? +(e[f.key] * 100).toFixed(6) : e[f.key])])) as Record<
    NumberKey,
    string
  >;

export function EconomicsCard({ e, canEdit, agencyId }: { e: Economics; canEdit: boolean; agencyId: string }) {
  const id = useId();
  const [text, setText] = useState(() => toText(e));
  const [source, setSource] = useState(e.discountRateSource ?? '');
  const save = useUpdateEconomics(agencyId);
  const form = useFormErrors();
  const submit = () => {
    const value = Object.fromEntries(
      FIELDS.map((f) => [f.key, f.percent ? numberFrom(text[f.key]) / 100 : numberFrom(text[f.key])]),
    );
    const input = form.check(EconomicsSchema, { ...value, discountRateSource: source.trim() || null });
    if (!input) return;
    save.mutate(input, {
      // The form shows what the server kept (it stays mounted while the catalog is read again).
      onSuccess: (saved) => {
        setText(toText(saved));
        setSource(saved.discountRateSource ?? '');
        toast.success('Economics saved');
      },
      onError: (err) => {
        form.fromError(err);
        if (!issuesOf(err).length) toast.error(err.message);
      },
    });
  };
  return (
    <Card title="Economics">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        {FIELDS.map((f) => (
          <label key={f.key} className="text-sm">
            <span className="block text-xs text-asphalt-muted">{f.label}</span>
            <TextInput
              aria-label={f.label}
              inputMode="decimal"
              disabled={!canEdit}
              value={text[f.key]}
              onChange={(ev) => {
                setText({ ...text, [f.key]: ev.target.value });
                form.clear(f.key);
              }}
              {...describedBy(`${id}-${f.key}`, form.error(f.key))}
            />
            <FieldMessage id={`${id}-${f.key}`} message={form.error(f.key)} />
          </label>
        ))}
      </div>
      <label className="mt-3 block text-sm">
        <span className="block text-xs text-asphalt-muted">Source of the discount rate</span>
        <TextInput
          aria-label="Source of the discount rate"
          disabled={!canEdit}
          value={source}
          onChange={(ev) => {
            setSource(ev.target.value);
            form.clear('discountRateSource');
          }}
          placeholder="e.g. OMB Circular A-94, Appendix C (real rate, year)"
          {...describedBy(`${id}-source`, form.error('discountRateSource'))}
        />
        <FieldMessage id={`${id}-source`} message={form.error('discountRateSource')} />
      </label>
      {canEdit && (
        <Button className="mt-3" onClick={submit} disabled={save.isPending}>
          Save economics
        </Button>
      )}
    </Card>
  );
}
