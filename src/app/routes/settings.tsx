import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { type FormEvent, useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { toast } from 'sonner';
import { AgencySettingsSchema } from '@shared/schemas/agency';
import { Button } from '@/components/ui/button';
import { Field, FilePicker, FormAlert, Select, TextInput } from '@/components/ui/field';
import { useFieldErrors } from '@/components/ui/form-errors';
import { Card, PageHeader } from '@/components/ui/page';
import { api } from '@/lib/api-client';
import { useAgency } from '../use-agency';

type AgencySettings = { id: string; name: string; kind: string; units: 'us' | 'metric' };
const LABELS = { name: 'Agency name', units: 'Units' };

export function SettingsPage() {
  const { agencyId } = useAgency();
  const qc = useQueryClient();
  const q = useQuery({
    queryKey: ['agency-settings', agencyId],
    queryFn: () => api<AgencySettings>(`/api/agencies/${agencyId}/settings`),
  });
  const [name, setName] = useState('');
  const [units, setUnits] = useState<'us' | 'metric'>('us');
  const f = useFieldErrors(LABELS);
  const [archive, setArchive] = useState<File | null>(null);
  const [restoring, setRestoring] = useState(false);
  useEffect(() => {
    if (q.data) {
      setName(q.data.name);
      setUnits(q.data.units);
    }
  }, [q.data]);
  const save = useMutation({
    mutationFn: (body: { name: string; units: 'us' | 'metric' }) =>
      api<AgencySettings>(`/api/agencies/${agencyId}/settings`, { method: 'PUT', json: body }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['agency-settings', agencyId] });
      qc.invalidateQueries({ queryKey: ['me'] });
      toast.success('Settings saved');
    },
    onError: f.fromError,
  });
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body = f.check(AgencySettingsSchema, { name, units });
    if (body) save.mutate(body);
  };
  return (
    <div className="space-y-4">
      <PageHeader
        title="Settings"
        caption="The agency’s name and display units. Economic defaults (discount rate and its source, analysis period, per-job costs) live with the prices in the Catalog."
      />
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
          Inside Wearcourse every quantity is kept in US customary units; imports in kilometres or metres are converted
          as they come in.{' '}
          <Link to="../catalog" className="text-accent underline">
            Economics and prices →
          </Link>
        </p>
      </Card>
      <Card title="Backup of this agency">
        <p className="text-sm">
          One zip with every segment (GeoJSON and CSV), survey, catalog item, plan, saved comparison and curve, with
          SHA-256 hashes in its manifest.{' '}
          <a className="font-semibold text-accent hover:underline" href={`/api/agencies/${agencyId}/export`}>
            Download the agency export
          </a>
        </p>
        <form
          className="mt-3 space-y-2 text-sm"
          onSubmit={async (e) => {
            e.preventDefault();
            if (!archive) return;
            const form = new FormData();
            form.set('file', archive);
            setRestoring(true);
            try {
              const res = await fetch('/api/agencies/restore', {
                method: 'POST',
                body: form,
                credentials: 'same-origin',
              });
              const body = await res.json();
              if (res.ok) {
                toast.success(
                  `Restored into a new agency (${body.counts.segments} segments); find it in the agency switcher${body.analysesToRerun ? `. Its ${body.analysesToRerun} saved comparison(s) come back with their inputs: run them again to see results` : ''}`,
                );
                qc.invalidateQueries({ queryKey: ['me'] });
              } else toast.error(body.error?.message ?? 'Restore failed');
            } finally {
              setRestoring(false);
            }
          }}
        >
          <p className="text-xs text-asphalt-muted">Restore an export into a new agency (you become its admin).</p>
          <div className="flex flex-wrap items-center gap-3">
            <FilePicker label="Agency export" accept=".zip" buttonText="Choose an export (.zip)…" onFile={setArchive} />
            <Button type="submit" variant="secondary" disabled={!archive || restoring}>
              {restoring ? 'Restoring…' : 'Restore'}
            </Button>
          </div>
        </form>
      </Card>
    </div>
  );
}
