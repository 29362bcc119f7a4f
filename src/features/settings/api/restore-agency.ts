// An agency export restored into a new agency: a multipart upload, so fetch rather than api().
import type { RestoreReport } from '@shared/schemas/agency';
import type { ErrorBody } from '@shared/schemas/common';
/** The restore's report when it worked (RestoreReportSchema), the error body when not. */
export type RestoreAnswer = Partial<RestoreReport> & Partial<ErrorBody>;

export async function restoreAgency(archive: File): Promise<{ ok: boolean; body: RestoreAnswer }> {
  const form = new FormData();
  form.set('file', archive);
  const res = await fetch('/api/agencies/restore', { method: 'POST', body: form, credentials: 'same-origin' });
  return { ok: res.ok, body: (await res.json()) as RestoreAnswer };
}

export const exportPath = (agencyId: string) => `/api/agencies/${agencyId}/export`;
