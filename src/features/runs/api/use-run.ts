// The one client side of runs (plan runs, budget searches, comparisons): poll
// /api/agencies/{agencyId}/runs/{runId} while it runs, read its progress, result
// or error, and cancel it. Features wrap it with their result type.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { RunView } from '@shared/schemas/runs';
import { api } from '@/lib/api-client';
import { runKeys } from './keys';

export type Run<R = unknown> = RunView<R>;

const POLL_MS = 400;

export const runQueryOptions = <R>(agencyId: string, runId: string | null) =>
  queryOptions({
    queryKey: runKeys.one(agencyId, runId),
    queryFn: () => api<Run<R>>(`/api/agencies/${agencyId}/runs/${runId}`),
    enabled: !!runId,
    refetchInterval: (q) => (!q.state.data || q.state.data.status === 'running' ? POLL_MS : false),
  });

export const cancelRun = <R>(agencyId: string, runId: string) =>
  api<Run<R>>(`/api/agencies/${agencyId}/runs/${runId}/cancel`, { method: 'POST' });

/** data is the run as last polled (undefined before the first answer); cancel() stops it. */
export function useRun<R>(agencyId: string, runId: string | null) {
  const qc = useQueryClient();
  const query = useQuery(runQueryOptions<R>(agencyId, runId));
  const cancel = useMutation({
    mutationFn: (id: string) => cancelRun<R>(agencyId, id),
    onSuccess: (r) => qc.setQueryData(runQueryOptions<R>(agencyId, r.id).queryKey, r),
  });
  const data = query.data;
  return {
    data,
    /** The poll itself failed (not the run): e.g. signed out. */
    pollError: query.error,
    isRunning: data?.status === 'running',
    result: data?.status === 'done' ? data.result : null,
    cancel: () => runId && cancel.mutate(runId),
    isCancelling: cancel.isPending,
  };
}
