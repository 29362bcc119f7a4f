import { z } from 'zod';

// A run is heavy work that outlives its request: a plan run, a budget search or
// a comparison. It is kept in the runs table with the snapshot of its input, and
// polled and cancelled at one place: /api/agencies/{agencyId}/runs/{runId}.
export const RUN_KINDS = ['plan', 'budget-search', 'comparison'] as const;
export const RunKindSchema = z.enum(RUN_KINDS);
export type RunKind = z.infer<typeof RunKindSchema>;

export const RUN_STATUSES = ['running', 'done', 'failed', 'cancelled'] as const;
export const RunStatusSchema = z.enum(RUN_STATUSES);
export type RunStatus = z.infer<typeof RunStatusSchema>;

/** Why a run failed, in the user's words; path names the input field when one is to blame. */
export const RunErrorSchema = z.object({ message: z.string(), path: z.string().optional() });
export type RunError = z.infer<typeof RunErrorSchema>;

export const RunParamsSchema = z.object({ agencyId: z.string().min(1).max(64), runId: z.string().min(1).max(64) });

export const RunViewSchema = z.object({
  id: z.string(),
  kind: RunKindSchema,
  subjectId: z.string().nullable().describe('The plan (plan, budget-search) or saved comparison it belongs to'),
  status: RunStatusSchema,
  progress: z.number().min(0).max(1).describe('0 to 1'),
  error: RunErrorSchema.nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  endedAt: z.string().nullable(),
  result: z
    .unknown()
    .describe(
      'null until done. plan: the plan result (years, work list, summary); budget-search: { targetPci, budget, reachable, points }; comparison: the comparison result',
    ),
});

/** A run as the API answers it; R is the result type of its kind. */
export type RunView<R = unknown> = Omit<z.infer<typeof RunViewSchema>, 'result'> & { result: R | null };
