import { z } from 'zod';
import { FunctionalClassSchema, SurfaceSchema } from './segments';

export const MODIFIERS = ['none', 'polymer', 'crumb_rubber_dry', 'crumb_rubber_wet', 'other'] as const;
export const ModifierSchema = z.enum(MODIFIERS);
export const MODIFIER_LABELS: Record<(typeof MODIFIERS)[number], string> = {
  none: 'none',
  polymer: 'polymer',
  crumb_rubber_dry: 'crumb rubber, dry process',
  crumb_rubber_wet: 'crumb rubber, wet process',
  other: 'other',
};

const isoDate = z.iso.date();

export const MixInputSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    binderGrade: z.string().trim().min(1).max(40),
    modifier: ModifierSchema,
    pricePerTon: z.number().positive().max(10_000),
    spreadRateLbPerSyIn: z.number().positive().max(300).default(110),
    minLiftIn: z.number().positive().max(12),
    maxLiftIn: z.number().positive().max(12),
    refLiftIn: z.number().positive().max(12),
    refLifeYears: z.number().positive().max(60),
    coldWeatherNote: z.string().trim().max(500).nullable().default(null),
    priceEffectiveDate: isoDate,
  })
  .refine((m) => m.minLiftIn <= m.maxLiftIn, {
    message: 'the minimum lift is more than the maximum',
    path: ['minLiftIn'],
  })
  .refine((m) => m.refLiftIn >= m.minLiftIn && m.refLiftIn <= m.maxLiftIn, {
    message: 'the reference lift is outside the lift range',
    path: ['refLiftIn'],
  });
export type MixInput = z.infer<typeof MixInputSchema>;

// The stored shapes are bounded too: they come back inside saved comparisons'
// snapshots (and archives), and their names reach pages and the brief.
export const MixSchema = z.object({
  id: z.string().max(64),
  name: z.string().max(80),
  binderGrade: z.string().max(40),
  modifier: ModifierSchema,
  pricePerTon: z.number(),
  spreadRateLbPerSyIn: z.number(),
  minLiftIn: z.number(),
  maxLiftIn: z.number(),
  refLiftIn: z.number(),
  refLifeYears: z.number(),
  coldWeatherNote: z.string().max(500).nullable(),
  priceEffectiveDate: z.string().max(10),
  isDemo: z.boolean(),
});
export type Mix = z.infer<typeof MixSchema>;

export const TREATMENT_KINDS = [
  'crack_seal',
  'chip_seal',
  'micro_surfacing',
  'thin_overlay',
  'mill_and_overlay',
  'structural_overlay',
  'reconstruction',
  'custom',
] as const;
export const TreatmentKindSchema = z.enum(TREATMENT_KINDS);
export const TREATMENT_KIND_LABELS: Record<(typeof TREATMENT_KINDS)[number], string> = {
  crack_seal: 'crack seal',
  chip_seal: 'chip seal',
  micro_surfacing: 'micro-surfacing',
  thin_overlay: 'thin overlay',
  mill_and_overlay: 'mill and overlay',
  structural_overlay: 'structural overlay',
  reconstruction: 'reconstruction',
  custom: 'custom',
};
export const OVERLAY_KINDS = ['thin_overlay', 'mill_and_overlay', 'structural_overlay'] as const;

export const CostItemSchema = z.object({
  label: z.string().trim().min(1).max(80),
  basis: z.enum(['per_sy', 'per_lane_mile', 'per_job', 'percent']),
  /** Dollars per unit, or a fraction (0.08) for percent add-ons. */
  amount: z.number().min(0).max(1_000_000),
});
export type CostItem = z.infer<typeof CostItemSchema>;

export const EffectSchema = z.object({
  type: z.enum(['reset', 'gain']),
  /** Reset: the PCI after treatment. Gain: points added (capped at 100). */
  value: z.number().min(0).max(100),
  /** Whether the treatment restarts the age on its family's curve. */
  resetsAge: z.boolean(),
});

export const ApplicabilitySchema = z.object({
  pciMin: z.number().min(0).max(100),
  pciMax: z.number().min(0).max(100),
  surfaces: z.array(SurfaceSchema).min(1),
  classes: z.array(FunctionalClassSchema).min(1),
  minYearsSinceLast: z.number().int().min(0).max(50),
});

export const TreatmentInputSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    category: z.enum(['preservation', 'rehabilitation', 'reconstruction']),
    kind: TreatmentKindSchema,
    mixId: z.string().max(64).nullable().default(null),
    defaultThicknessIn: z.number().positive().max(12).nullable().default(null),
    millDepthIn: z.number().min(0).max(12).default(0),
    /** Null: life follows the mix and lift. */
    lifeYears: z.number().positive().max(60).nullable(),
    /** Square yards one crew does in a day, for traffic-control days. */
    productionSyPerDay: z.number().positive().max(200_000),
    costItems: z.array(CostItemSchema).max(20),
    effect: EffectSchema,
    applicability: ApplicabilitySchema,
    priceEffectiveDate: isoDate,
  })
  .refine((t) => !(OVERLAY_KINDS as readonly string[]).includes(t.kind) || (t.mixId && t.defaultThicknessIn), {
    message: 'an overlay needs a mix and a default thickness',
    path: ['mixId'],
  })
  .refine((t) => t.lifeYears !== null || t.mixId !== null, {
    message: 'give a life, or a mix whose life it follows',
    path: ['lifeYears'],
  })
  .refine((t) => t.applicability.pciMin <= t.applicability.pciMax, {
    message: 'the PCI range is reversed',
    path: ['applicability', 'pciMin'],
  });
export type TreatmentInput = z.infer<typeof TreatmentInputSchema>;

export const TreatmentSchema = z.object({
  id: z.string().max(64),
  name: z.string().max(80),
  category: z.enum(['preservation', 'rehabilitation', 'reconstruction']),
  kind: TreatmentKindSchema,
  mixId: z.string().max(64).nullable(),
  defaultThicknessIn: z.number().nullable(),
  millDepthIn: z.number(),
  lifeYears: z.number().nullable(),
  productionSyPerDay: z.number(),
  costItems: z.array(CostItemSchema),
  effect: EffectSchema,
  applicability: ApplicabilitySchema,
  priceEffectiveDate: z.string().max(10),
  isDemo: z.boolean(),
});
export type Treatment = z.infer<typeof TreatmentSchema>;

export const EconomicsSchema = z.object({
  // Real rates as published (OMB Circular A-94's real rates have run from slightly below zero
  // to a few per cent); −99 % or 90 % is a typing slip that would wreck every present value.
  discountRate: z
    .number()
    .min(-0.05, 'is below −5 %; give a real discount rate as a fraction (0.02 for 2 %)')
    .max(0.2, 'is above 20 %; give a real discount rate as a fraction (0.02 for 2 %)'),
  discountRateSource: z.string().trim().max(300).nullable(),
  analysisPeriodYears: z.number().int().min(1).max(100),
  baseYear: z.number().int().min(1990).max(2100),
  mobilizationPerJob: z.number().min(0).max(1_000_000),
  trafficControlPerDay: z.number().min(0).max(1_000_000),
  engineeringFraction: z.number().min(0).max(1),
  contingencyFraction: z.number().min(0).max(1),
});
export type Economics = z.infer<typeof EconomicsSchema>;

export const CatalogSchema = z.object({
  mixes: z.array(MixSchema),
  treatments: z.array(TreatmentSchema),
  economics: EconomicsSchema,
  demoValues: z.boolean(),
});
export type Catalog = z.infer<typeof CatalogSchema>;

export const PriceHistorySchema = z.object({
  items: z.array(
    z.object({
      entity: z.string(),
      entityId: z.string(),
      name: z.string(),
      field: z.string(),
      before: z.unknown(),
      after: z.unknown(),
      effectiveDate: z.string(),
      at: z.string(),
      userName: z.string().nullable(),
    }),
  ),
});

export const CatalogItemParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  itemId: z.string().min(1).max(64),
});
