// A run's query key (polled while it runs).
export const runKeys = {
  all: (agencyId: string) => ['runs', agencyId] as const,
  one: (agencyId: string, runId: string | null) => [...runKeys.all(agencyId), runId] as const,
};
