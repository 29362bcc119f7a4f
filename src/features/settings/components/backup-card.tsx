import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { FilePicker } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { authKeys } from '@/features/auth/api/keys';
import { exportPath, restoreAgency } from '../api/restore-agency';

export function BackupCard({ agencyId }: { agencyId: string }) {
  const qc = useQueryClient();
  const [archive, setArchive] = useState<File | null>(null);
  const [restoring, setRestoring] = useState(false);
  return (
    <Card title="Backup of this agency">
      <p className="text-sm">
        One zip with every segment (GeoJSON and CSV), survey, catalog item, plan, saved comparison and curve, with
        SHA-256 hashes in its manifest.{' '}
        <a className="font-semibold text-accent hover:underline" href={exportPath(agencyId)}>
          Download the agency export
        </a>
      </p>
      <form
        className="mt-3 space-y-2 text-sm"
        onSubmit={async (e) => {
          e.preventDefault();
          if (!archive) return;
          setRestoring(true);
          try {
            const { ok, body } = await restoreAgency(archive);
            if (ok) {
              toast.success(
                `Restored into a new agency (${body.counts?.segments} segments); find it in the agency switcher${body.analysesToRerun ? `. Its ${body.analysesToRerun} saved comparison(s) come back with their inputs: run them again to see results` : ''}`,
              );
              qc.invalidateQueries({ queryKey: authKeys.me() });
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
  );
}
