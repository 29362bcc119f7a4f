import { useMutation } from '@tanstack/react-query';
import type { StudyResult } from '@shared/engine/lcca/study';
import type { StudyRequest } from '@shared/schemas/lcca';
import { api } from '@/lib/api-client';
import { type Run, useRun } from '@/features/runs/api/use-run';

export type ComparisonRun = Run<StudyResult>;

export const startComparison = (agencyId: string, req: StudyRequest) =>
  api<ComparisonRun>(`/api/agencies/${agencyId}/analyses/runs`, { method: 'POST', json: req });

/** A comparison run: polled, with progress, result and cancel (the runs hook, typed). */
export const useComparisonRun = (agencyId: string, runId: string | null) => useRun<StudyResult>(agencyId, runId);

export const useStartComparison = (agencyId: string) =>
  useMutation({ mutationFn: (req: StudyRequest) => startComparison(agencyId, req) });
