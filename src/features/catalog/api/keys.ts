// Every catalog query key, from general to specific: invalidating `all` refreshes the catalog and its history.
export const catalogKeys = {
  all: (agencyId: string) => ['catalog', agencyId] as const,
  items: (agencyId: string) => [...catalogKeys.all(agencyId), 'items'] as const,
  priceHistory: (agencyId: string) => [...catalogKeys.all(agencyId), 'price-history'] as const,
};

export const catalogPath = (agencyId: string) => `/api/agencies/${agencyId}/catalog`;
