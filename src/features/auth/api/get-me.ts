import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '@shared/schemas/auth';
import { api, ApiError } from '@/lib/api-client';
import { authKeys } from './keys';

/** The signed-in user, or null when signed out. */
export async function getMe(): Promise<Me | null> {
  try {
    return await api<Me>('/api/me');
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000 });

export const useMe = () => useQuery(meQueryOptions());
