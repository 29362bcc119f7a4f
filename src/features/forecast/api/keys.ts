// Every forecast query key, from general to specific.
export const forecastKeys = {
  all: (agencyId: string) => ['forecast', agencyId] as const,
  families: (agencyId: string) => [...forecastKeys.all(agencyId), 'families'] as const,
};

export const forecastPath = (agencyId: string) => `/api/agencies/${agencyId}/forecast`;
