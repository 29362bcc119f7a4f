import { type FormEvent, useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { AgencySettingsSchema } from '@shared/schemas/agency';
import { Button } from '@/components/ui/button';
import { Field, FormAlert, Select, TextInput } from '@/components/ui/field';
import { useFieldErrors } from '@/components/ui/form-errors';
import { Card } from '@/components/ui/page';
import { useAgencySettings } from '../api/get-settings';
import { useUpdateSettings } from '../api/update-settings';

const LABELS = { name: 'Agency name', units: 'Units' };

export function SettingsForm({ agencyId }: { agencyId: string }) {
  const q = useAgencySettings(agencyId);
  const [name, setName] = useState('');
  const [units, setUnits] = useState<'us' | 'metric'>('us');
  const f = useFieldErrors(LABELS);
  useEffect(() => {
    if (q.data) {
      setName(q.data.name);
      setUnits(q.data.units);
    }
  }, [q.data]);
  const save = useUpdateSettings(agencyId, f.fromError);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body = f.check(AgencySettingsSchema, { name, units });
    if (body) save.mutate(body);
  };
  return (
    <Card>
      <form
        onSubmit={submit}
        noValidate
        className="flex flex-wrap items-start gap-3 text-sm"
        aria-label="Agency settings"
      >
        <Field label={LABELS.name} error={f.error('name')} className="w-72">
          <TextInput
            value={name}
            onChange={(e) => {
              setName(e.target.value);
              f.clear('name');
            }}
          />
        </Field>
        <Field label={LABELS.units} error={f.error('units')} className="w-64">
          <Select value={units} onChange={(e) => setUnits(e.target.value as 'us' | 'metric')}>
            <option value="us">US customary (mi, ft, SY, tons)</option>
            <option value="metric">Metric (imports in km / m)</option>
          </Select>
        </Field>
        <Button type="submit" className="mt-6" disabled={save.isPending}>
          Save
        </Button>
      </form>
      <FormAlert messages={f.others} />
      <p className="mt-3 text-xs text-asphalt-muted" data-testid="units-note">
        Inside Wearcourse every quantity is kept in US customary units; imports in kilometres or metres are converted as
        they come in.{' '}
        <Link to="../catalog" className="text-accent underline">
          Economics and prices →
        </Link>
      </p>
    </Card>
  );
}
