import { z } from 'zod';
import { TreatmentKindSchema } from './catalog';

// A survey or a treatment cannot be dated after today. "Today" allows one day
// past UTC so that a user east of Greenwich, already in tomorrow, is not refused.
const notInFuture = (d: string) => d <= new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
const pastDate = z.iso.date().refine(notInFuture, 'cannot be in the future');
const optionalText = (max: number) => z.string().trim().max(max).nullable().default(null);

export const SurveyInputSchema = z
  .object({
    surveyDate: pastDate,
    pci: z.number().min(0).max(100),
    source: optionalText(120),
  })
  .strict();
export type SurveyInput = z.infer<typeof SurveyInputSchema>;
export type SurveyBody = z.input<typeof SurveyInputSchema>;

export const TreatmentRecordInputSchema = z
  .object({
    treatedOn: pastDate,
    kind: TreatmentKindSchema,
    name: z.string().trim().min(1).max(120),
    /** The catalog treatment this job was, if it was one. */
    treatmentId: z.string().min(1).max(64).nullable().default(null),
    mix: optionalText(80),
    thicknessIn: z.number().positive().max(24).nullable().default(null),
    costUsd: z.number().min(0).max(1_000_000_000).nullable().default(null),
    notes: optionalText(2000),
    /** A rating taken after the work; recorded as a survey on the same date. */
    pciAfter: z.number().min(0).max(100).nullable().default(null),
  })
  .strict();
export type TreatmentRecordInput = z.infer<typeof TreatmentRecordInputSchema>;
export type TreatmentRecordBody = z.input<typeof TreatmentRecordInputSchema>;

export const TreatmentRecordSchema = z.object({
  id: z.number().int(),
  treatedOn: z.string(),
  kind: TreatmentKindSchema,
  name: z.string(),
  mix: z.string().nullable(),
  thicknessIn: z.number().nullable(),
  costUsd: z.number().nullable(),
  notes: z.string().nullable(),
  recordedBy: z.string().nullable(),
  recordedAt: z.string(),
});
export type TreatmentRecord = z.infer<typeof TreatmentRecordSchema>;

export const TreatmentRecordListSchema = z.object({ items: z.array(TreatmentRecordSchema) });
export type TreatmentRecordList = z.infer<typeof TreatmentRecordListSchema>;
