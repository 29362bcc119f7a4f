import { useMutation, useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { authKeys } from '@/features/auth/api/keys';
import { api } from '@/lib/api-client';
import type { AgencySettings } from './get-settings';
import { settingsKeys, settingsPath } from './keys';

export type SettingsBody = { name: string; units: 'us' | 'metric' };

export const updateSettings = (agencyId: string, body: SettingsBody) =>
  api<AgencySettings>(settingsPath(agencyId), { method: 'PUT', json: body });

/** Saves the settings; the agency's name also shows in the switcher, so `me` is read again. */
export function useUpdateSettings(agencyId: string, onError: (err: Error) => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SettingsBody) => updateSettings(agencyId, body),
    onSuccess: () => {
      qc.invalidateQueries({ queryKey: settingsKeys.agency(agencyId) });
      qc.invalidateQueries({ queryKey: authKeys.me() });
      toast.success('Settings saved');
    },
    onError,
  });
}
