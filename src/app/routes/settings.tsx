import { NotBuiltYet } from '@/components/not-built-yet';

export function SettingsPage() {
  return (
    <NotBuiltYet
      title="Settings"
      what="Agency name, units and the economic defaults (discount rate with its source, analysis period, base year) become editable here with the catalog work."
    />
  );
}
