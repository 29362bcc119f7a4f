import { z } from 'zod';

export const AgencySettingsSchema = z.object({
  name: z.string().trim().min(2, 'needs at least 2 characters').max(120),
  units: z.enum(['us', 'metric']),
});
export type AgencySettings = z.infer<typeof AgencySettingsSchema>;

/** The agency as its settings screen reads it. */
export const AgencyViewSchema = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(['county', 'city', 'other']),
  units: z.enum(['us', 'metric']),
});
export type AgencyView = z.infer<typeof AgencyViewSchema>;

/** What a restore wrote into the new agency. */
export const RestoreReportSchema = z.object({
  agencyId: z.string(),
  counts: z.object({
    segments: z.number().int(),
    surveys: z.number().int(),
    treatmentRecords: z.number().int(),
    mixes: z.number().int(),
    treatments: z.number().int(),
    plans: z.number().int(),
    analyses: z.number().int(),
    curves: z.number().int(),
  }),
  analysesToRerun: z
    .number()
    .int()
    .describe('Saved comparisons come back with their inputs; their results are computed again when re-run'),
});
export type RestoreReport = z.infer<typeof RestoreReportSchema>;
