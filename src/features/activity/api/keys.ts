import type { AuditFilters } from './get-audit';

// Every activity (audit trail) query key, from general to specific.
export const activityKeys = {
  all: (agencyId: string) => ['audit', agencyId] as const,
  list: (agencyId: string, f: AuditFilters) => [...activityKeys.all(agencyId), f] as const,
};
