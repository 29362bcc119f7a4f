import { useMutation } from '@tanstack/react-query';
import type { ComparisonResult } from '@shared/engine/lcca/comparison';
import type { ComparisonRequest } from '@shared/schemas/comparisons';
import { api } from '@/lib/api-client';
import { type Run, useRun } from '@/features/runs/api/use-run';

export type ComparisonRun = Run<ComparisonResult>;

export const startComparison = (agencyId: string, req: ComparisonRequest) =>
  api<ComparisonRun>(`/api/agencies/${agencyId}/analyses/runs`, { method: 'POST', json: req });

/** A comparison run: polled, with progress, result and cancel (the runs hook, typed). */
export const useComparisonRun = (agencyId: string, runId: string | null) => useRun<ComparisonResult>(agencyId, runId);

export const useStartComparison = (agencyId: string) =>
  useMutation({ mutationFn: (req: ComparisonRequest) => startComparison(agencyId, req) });
