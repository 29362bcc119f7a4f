import { useId, useState } from 'react';
import { toast } from 'sonner';
import { type Economics, EconomicsSchema } from '@shared/schemas/catalog';
import { Button } from '@/components/ui/button';
import { CheckedInput } from '@/components/ui/field-message';
import { Card } from '@/components/ui/page';
import { numberFrom, useFieldErrors } from '@/components/ui/form-errors';
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
  const form = useFieldErrors(undefined, [], { general: false });
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
      onError: (err) => form.fromError(err) || toast.error(err.message),
    });
  };
  return (
    <Card title="Economics">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-4">
        {FIELDS.map((f) => (
          <CheckedInput
            key={f.key}
            id={`${id}-${f.key}`}
            label={f.label}
            inputMode="decimal"
            disabled={!canEdit}
            value={text[f.key]}
            onChange={(v) => {
              setText({ ...text, [f.key]: v });
              form.clear(f.key);
            }}
            error={form.error(f.key)}
          />
        ))}
      </div>
      <CheckedInput
        id={`${id}-source`}
        label="Source of the discount rate"
        labelClassName="mt-3 block text-sm"
        disabled={!canEdit}
        value={source}
        onChange={(v) => {
          setSource(v);
          form.clear('discountRateSource');
        }}
        placeholder="e.g. OMB Circular A-94, Appendix C (real rate, year)"
        error={form.error('discountRateSource')}
      />
      {canEdit && (
        <Button className="mt-3" onClick={submit} disabled={save.isPending}>
          Save economics
        </Button>
      )}
    </Card>
  );
}
