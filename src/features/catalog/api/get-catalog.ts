import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Catalog } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogKeys, catalogPath } from './keys';

export const getCatalog = (agencyId: string) => api<Catalog>(catalogPath(agencyId));

export const catalogQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: catalogKeys.items(agencyId), queryFn: () => getCatalog(agencyId) });

export const useCatalog = (agencyId: string) => useQuery(catalogQueryOptions(agencyId));
