import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Catalog } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';

export const getCatalog = (agencyId: string) => api<Catalog>(`/api/agencies/${agencyId}/catalog`);

export const catalogQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: ['catalog', agencyId], queryFn: () => getCatalog(agencyId) });

export const useCatalog = (agencyId: string) => useQuery(catalogQueryOptions(agencyId));
