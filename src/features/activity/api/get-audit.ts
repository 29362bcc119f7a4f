import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditList } from '@shared/schemas/audit';
import { api } from '@/lib/api-client';
import { activityKeys } from './keys';

export type AuditFilters = { entity?: string; from?: string; to?: string; limit?: number };

export const auditParams = (f: AuditFilters) => {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== '') p.set(k, String(v));
  return p;
};

export const auditQueryOptions = (agencyId: string, f: AuditFilters) =>
  queryOptions({
    queryKey: activityKeys.list(agencyId, f),
    queryFn: () => api<AuditList>(`/api/agencies/${agencyId}/audit?${auditParams(f)}`),
    placeholderData: keepPreviousData,
  });

export const useAudit = (agencyId: string, f: AuditFilters) => useQuery(auditQueryOptions(agencyId, f));
