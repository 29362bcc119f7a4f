import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { Card, PageHeader } from '@/components/ui/page';
import { api } from '@/lib/api-client';
import { useAgency } from '../use-agency';

type AgencySettings = { id: string; name: string; kind: string; units: 'us' | 'metric' };

export function SettingsPage() {
  const { agencyId } = useAgency();
  const qc = useQueryClient();
  const q = useQuery({
    queryKey: ['agency-settings', agencyId],
    queryFn: () => api<AgencySettings>(`/api/agencies/${agencyId}/settings`),
  });
  const [name, setName] = useState('');
  const [units, setUnits] = useState<'us' | 'metric'>('us');
  useEffect(() => {
    if (q.data) {
      setName(q.data.name);
      setUnits(q.data.units);
    }
  }, [q.data]);
  const save = useMutation({
    mutationFn: () =>
      api<AgencySettings>(`/api/agencies/${agencyId}/settings`, { method: 'PUT', json: { name, units } }),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: ['agency-settings', agencyId] });
      qc.invalidateQueries({ queryKey: ['me'] });
      toast.success('Settings saved');
    },
    onError: (e) => toast.error(e.message),
  });
  return (
    <div className="space-y-4">
      <PageHeader
        title="Settings"
        caption="The agency’s name and display units. Economic defaults (discount rate and its source, analysis period, per-job costs) live with the prices in the Catalog."
      />
      <Card>
        <div className="flex flex-wrap items-end gap-3 text-sm">
          <label>
            <span className="block text-xs text-asphalt-muted">Agency name</span>
            <TextInput
              aria-label="Agency name"
              className="w-72"
              value={name}
              onChange={(e) => setName(e.target.value)}
            />
          </label>
          <label>
            <span className="block text-xs text-asphalt-muted">Units</span>
            <Select
              aria-label="Units"
              className="w-48"
              value={units}
              onChange={(e) => setUnits(e.target.value as 'us' | 'metric')}
            >
              <option value="us">US customary (mi, ft, SY, tons)</option>
              <option value="metric">metric (imports in km / m)</option>
            </Select>
          </label>
          <Button onClick={() => save.mutate()} disabled={save.isPending}>
            Save
          </Button>
        </div>
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
          className="mt-3 flex flex-wrap items-end gap-2 text-sm"
          onSubmit={async (e) => {
            e.preventDefault();
            const input = (e.currentTarget.elements.namedItem('archive') as HTMLInputElement).files?.[0];
            if (!input) return;
            const form = new FormData();
            form.set('file', input);
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
          }}
        >
          <label>
            <span className="block text-xs text-asphalt-muted">
              Restore an export into a new agency (you become its admin)
            </span>
            <input name="archive" aria-label="Agency export" type="file" accept=".zip" />
          </label>
          <Button type="submit" variant="secondary">
            Restore
          </Button>
        </form>
      </Card>
    </div>
  );
}
