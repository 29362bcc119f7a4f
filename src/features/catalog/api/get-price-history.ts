import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PriceHistory } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';
import { catalogKeys, catalogPath } from './keys';

export const getPriceHistory = (agencyId: string) => api<PriceHistory>(`${catalogPath(agencyId)}/price-history`);

export const priceHistoryQueryOptions = (agencyId: string) =>
  queryOptions({ queryKey: catalogKeys.priceHistory(agencyId), queryFn: () => getPriceHistory(agencyId) });

export const usePriceHistory = (agencyId: string, enabled: boolean) =>
  useQuery({ ...priceHistoryQueryOptions(agencyId), enabled });
