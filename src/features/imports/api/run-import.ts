import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DateFormat, ImportReport, ValueMap } from '@shared/schemas/imports';
import { ApiError } from '@/lib/api-client';
import { importHistoryQueryOptions } from './get-import-history';

export type ImportRequest = {
  file: File;
  kind: 'segments' | 'surveys';
  mapping?: Record<string, string>;
  crs?: string;
  mode: 'all-or-nothing' | 'skip-invalid';
  dryRun: boolean;
  lengthUnit?: string;
  widthUnit?: string;
  dateFormat?: DateFormat;
  values?: ValueMap;
};

/** Uploads the file; a 422 is not a failure here but the report of a refused file. */
export async function runImport(agencyId: string, r: ImportRequest): Promise<{ status: number; report: ImportReport }> {
  const form = new FormData();
  form.set('kind', r.kind);
  form.set('mode', r.mode);
  form.set('dryRun', String(r.dryRun));
  if (r.mapping) form.set('mapping', JSON.stringify(r.mapping));
  if (r.crs) form.set('crs', r.crs);
  if (r.lengthUnit) form.set('lengthUnit', r.lengthUnit);
  if (r.widthUnit) form.set('widthUnit', r.widthUnit);
  if (r.dateFormat) form.set('dateFormat', r.dateFormat);
  if (r.values && Object.keys(r.values).length) form.set('values', JSON.stringify(r.values));
  form.set('file', r.file);
  const res = await fetch(`/api/agencies/${agencyId}/imports`, {
    method: 'POST',
    body: form,
    credentials: 'same-origin',
  });
  const body = await res.json().catch(() => ({}));
  if (res.status === 200 || res.status === 422) return { status: res.status, report: body as ImportReport };
  throw new ApiError(
    res.status,
    body?.error?.code ?? 'http_error',
    body?.error?.message ?? `Upload failed (${res.status})`,
    body?.error?.issues,
  );
}

export function useRunImport(agencyId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (r: ImportRequest) => runImport(agencyId, r),
    onSuccess: (res, r) => {
      if (!r.dryRun && res.status === 200) {
        qc.invalidateQueries({ queryKey: importHistoryQueryOptions(agencyId).queryKey });
        qc.invalidateQueries({ queryKey: ['segments', agencyId] });
        qc.invalidateQueries({ queryKey: ['network', agencyId] });
      }
    },
  });
}
