import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportHistory } from '@shared/schemas/imports';
import { api } from '@/lib/api-client';

export const getImportHistory = (agencyId: string) => api<ImportHistory>(`/api/agencies/${agencyId}/imports`);

export const importHistoryQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: ['imports', agencyId], queryFn: () => getImportHistory(agencyId) });

export const useImportHistory = (agencyId: string) => useQuery(importHistoryQueryOptions(agencyId));
