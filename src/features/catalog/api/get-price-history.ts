import { queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import type { PriceHistorySchema } from '@shared/schemas/catalog';
import { api } from '@/lib/api-client';

export const priceHistoryQueryOptions = (agencyId: string) =>
  queryOptions({
    queryKey: ['catalog', agencyId, 'history'],
    queryFn: () => api<z.infer<typeof PriceHistorySchema>>(`/api/agencies/${agencyId}/catalog/price-history`),
  });

export const usePriceHistory = (agencyId: string, enabled: boolean) =>
  useQuery({ ...priceHistoryQueryOptions(agencyId), enabled });
