import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CurveOverrideBody } from '@shared/schemas/forecast';
import { api } from '@/lib/api-client';
import { forecastKeys, forecastPath } from './keys';

/** Sets a family's curve by hand, or with `curve: null` goes back to the fit or the default. */
export const setCurve = (agencyId: string, body: CurveOverrideBody) =>
  api<{ ok: true }>(`${forecastPath(agencyId)}/curves`, { method: 'PUT', json: body });

export function useSetCurve(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CurveOverrideBody) => setCurve(agencyId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: forecastKeys.all(agencyId) }),
  });
}
