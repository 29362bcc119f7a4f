import { PageHeader } from '@/components/ui/page';
import { BackupCard } from '@/features/settings/components/backup-card';
import { SettingsForm } from '@/features/settings/components/settings-form';
import { useAgency } from '../use-agency';

export function SettingsPage() {
  const { agencyId } = useAgency();
  return (
    <div className="space-y-4">
      <PageHeader
        title="Settings"
        caption="The agency’s name and display units. Economic defaults (discount rate and its source, analysis period, per-job costs) live with the prices in the Catalog."
      />
      <SettingsForm agencyId={agencyId} />
      <BackupCard agencyId={agencyId} />
    </div>
  );
}
