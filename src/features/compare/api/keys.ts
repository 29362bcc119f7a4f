// Every saved-comparison query key, from general to specific.
export const comparisonKeys = {
  all: (agencyId: string) => ['comparisons', agencyId] as const,
  list: (agencyId: string) => [...comparisonKeys.all(agencyId), 'list'] as const,
  detail: (agencyId: string, id: string | null) => [...comparisonKeys.all(agencyId), 'detail', id] as const,
};
