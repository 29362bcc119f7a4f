import { z } from 'zod';

// Pavement families: surface × functional-class group × treatment group.
export const CLASS_GROUPS = ['arterial', 'collector', 'local'] as const;
export type ClassGroup = (typeof CLASS_GROUPS)[number];
export const CLASS_GROUP_LABELS: Record<ClassGroup, string> = {
  arterial: 'arterials',
  collector: 'collectors',
  local: 'local roads',
};

export const TREATMENT_GROUPS = ['reconstruction', 'overlay', 'preservation', 'unknown'] as const;
export type TreatmentGroup = (typeof TREATMENT_GROUPS)[number];
/** Phrases that follow "last treatment:". */
export const TREATMENT_GROUP_LABELS: Record<TreatmentGroup, string> = {
  reconstruction: 'rebuilt',
  overlay: 'overlay or mill and overlay',
  preservation: 'seal or micro-surfacing',
  unknown: 'none on record',
};

/** Where a family's curve comes from. */
export const CURVE_SOURCES = ['fitted', 'default', 'edited'] as const;
export const CURVE_SOURCE_LABELS: Record<(typeof CURVE_SOURCES)[number], string> = {
  fitted: 'fitted to surveys',
  default: 'default curve',
  edited: 'set by hand',
};

/** PCI = P0 − a·age^b (shared/engine/forecast/curve.ts). */
export const CurveSchema = z.object({
  p0: z.number('must be a number').min(0, 'must be 0 to 100').max(100, 'must be 0 to 100'),
  a: z.number('must be a number').positive('must be more than 0').max(100, 'must be 100 or less'),
  b: z.number('must be a number').min(1, 'must be 1 to 3').max(3, 'must be 1 to 3'),
});
export type Curve = z.infer<typeof CurveSchema>;

export const CurveOverrideBodySchema = z.object({
  familyKey: z.string().min(3).max(80),
  curve: CurveSchema.nullable(),
});
export type CurveOverrideBody = z.infer<typeof CurveOverrideBodySchema>;

export const FitPointSchema = z.object({
  /** Years since the last treatment. */
  age: z.number(),
  pci: z.number(),
});

export const FamilySchema = z.object({
  key: z.string(),
  surface: z.string(),
  classGroup: z.enum(CLASS_GROUPS),
  treatmentGroup: z.enum(TREATMENT_GROUPS),
  segments: z.number().int(),
  /** Survey points since the last treatment. */
  n: z.number().int(),
  /** The curve plans use. */
  curve: CurveSchema,
  source: z.enum(CURVE_SOURCES),
  /** RMSE of the fit in PCI points, when the fit is the curve used. */
  rmse: z.number().nullable(),
  /** The least-squares fit, whenever there are points enough to compute one. */
  fitted: z.object({ curve: CurveSchema, rmse: z.number() }).nullable(),
  points: z.array(FitPointSchema),
});
export type Family = z.infer<typeof FamilySchema>;

export const FamilyListSchema = z.object({ families: z.array(FamilySchema) });
export type FamilyList = z.infer<typeof FamilyListSchema>;

export const FamilyListQuerySchema = z.object({ points: z.enum(['true', 'false']).default('true') });
