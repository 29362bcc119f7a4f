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

const isoDate = z.iso.date('must be a date (YYYY-MM-DD)');
/** A number typed into a form: text that is not a number gets these words, not zod's. */
const num = () => z.number('must be a number');
const liftIn = () => num().positive('must be more than 0 in').max(12, 'must be 12 in or less');

export const MixInputSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    binderGrade: z.string().trim().min(1).max(40),
    modifier: ModifierSchema,
    pricePerTon: num().positive('must be more than $0').max(10_000, 'must be $10,000 a ton or less'),
    spreadRateLbPerSyIn: num()
      .positive('must be more than 0 lb/SY-in')
      .max(300, 'must be 300 lb/SY-in or less')
      .default(110),
    minLiftIn: liftIn(),
    maxLiftIn: liftIn(),
    refLiftIn: liftIn(),
    refLifeYears: num().positive('must be more than 0 years').max(60, 'must be 60 years or less'),
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

export const TREATMENT_CATEGORIES = ['preservation', 'rehabilitation', 'reconstruction'] as const;
export const TreatmentCategorySchema = z.enum(TREATMENT_CATEGORIES);

export const COST_BASES = ['per_sy', 'per_lane_mile', 'per_job', 'percent'] as const;
/** How an amount on each basis reads: "$0.40 per SY", "8 % of the job". */
export const COST_BASIS_LABELS: Record<(typeof COST_BASES)[number], string> = {
  per_sy: 'per SY',
  per_lane_mile: 'per lane-mile',
  per_job: 'per job',
  percent: '% of the job',
};

export const CostItemSchema = z.object({
  label: z.string().trim().min(1).max(80),
  basis: z.enum(COST_BASES),
  /** Dollars per unit, or a fraction (0.08) for percent add-ons. */
  amount: num().min(0, 'cannot be negative').max(1_000_000, 'must be $1,000,000 or less'),
});
export type CostItem = z.infer<typeof CostItemSchema>;

export const EffectSchema = z.object({
  type: z.enum(['reset', 'gain']),
  /** Reset: the PCI after treatment. Gain: points added (capped at 100). */
  value: z.number().min(0).max(100),
  /** Whether the treatment restarts the age on its family's curve. */
  resetsAge: z.boolean(),
});
export type Effect = z.infer<typeof EffectSchema>;

export const ApplicabilitySchema = z.object({
  pciMin: z.number().min(0).max(100),
  pciMax: z.number().min(0).max(100),
  surfaces: z.array(SurfaceSchema).min(1),
  classes: z.array(FunctionalClassSchema).min(1),
  minYearsSinceLast: z.number().int().min(0).max(50),
});
export type Applicability = z.infer<typeof ApplicabilitySchema>;

export const TreatmentInputSchema = z
  .object({
    name: z.string().trim().min(1).max(80),
    category: TreatmentCategorySchema,
    kind: TreatmentKindSchema,
    mixId: z.string().max(64).nullable().default(null),
    defaultThicknessIn: z.number().positive().max(12).nullable().default(null),
    millDepthIn: z.number().min(0).max(12).default(0),
    /** Null: life follows the mix and lift. */
    lifeYears: num().positive('must be more than 0 years').max(60, 'must be 60 years or less').nullable(),
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
  category: TreatmentCategorySchema,
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
  // A fraction (0.02 is 2 %). Real rates as published (OMB Circular A-94's real rates have run from
  // slightly below zero to a few per cent); −99 % or 90 % is a typing slip that would wreck every present value.
  discountRate: num().min(-0.05, 'must be at least −5 % (a real rate)').max(0.2, 'must be at most 20 % (a real rate)'),
  discountRateSource: z.string().trim().max(300, 'must be at most 300 characters').nullable(),
  analysisPeriodYears: num()
    .int('must be a whole number of years')
    .min(1, 'must be 1 to 100 years')
    .max(100, 'must be 1 to 100 years'),
  baseYear: num().int('must be a year').min(1990, 'must be 1990 to 2100').max(2100, 'must be 1990 to 2100'),
  mobilizationPerJob: num().min(0, 'cannot be negative').max(1_000_000, 'must be $1,000,000 or less'),
  trafficControlPerDay: num().min(0, 'cannot be negative').max(1_000_000, 'must be $1,000,000 or less'),
  engineeringFraction: num().min(0, 'cannot be negative').max(1, 'must be 100 % or less'),
  contingencyFraction: num().min(0, 'cannot be negative').max(1, 'must be 100 % or less'),
});
export type Economics = z.infer<typeof EconomicsSchema>;

export const CatalogSchema = z.object({
  mixes: z.array(MixSchema),
  treatments: z.array(TreatmentSchema),
  economics: EconomicsSchema,
  demoValues: z.boolean(),
});
export type Catalog = z.infer<typeof CatalogSchema>;

// The fields whose change is a change of price or life, kept in the price history.
export const MIX_PRICE_FIELDS = ['pricePerTon', 'spreadRateLbPerSyIn', 'refLifeYears'] as const;
export const TREATMENT_PRICE_FIELDS = ['costItems', 'lifeYears'] as const;
export const PRICE_FIELDS = [...MIX_PRICE_FIELDS, ...TREATMENT_PRICE_FIELDS] as const;
export type PriceField = (typeof PRICE_FIELDS)[number];
export const PRICE_FIELD_LABELS: Record<PriceField, string> = {
  pricePerTon: 'Price ($/ton)',
  spreadRateLbPerSyIn: 'Spread rate (lb/SY-in)',
  refLifeYears: 'Life at the reference lift (yr)',
  costItems: 'Cost items',
  lifeYears: 'Life (yr)',
};
export const PRICE_ENTITIES = ['mix', 'treatment'] as const;

/** A price field's value: a number, the cost items, or null (no value before, or life by mix and lift). */
export const PriceValueSchema = z.union([z.number(), z.array(CostItemSchema)]).nullable();
export type PriceValue = z.infer<typeof PriceValueSchema>;

export const PriceChangeSchema = z.object({
  entity: z.enum(PRICE_ENTITIES),
  entityId: z.string(),
  name: z.string(),
  field: z.enum(PRICE_FIELDS),
  before: PriceValueSchema,
  after: PriceValueSchema,
  effectiveDate: z.string(),
  /** When the change was saved (UTC). */
  at: z.string(),
  userName: z.string().nullable(),
});
export type PriceChange = z.infer<typeof PriceChangeSchema>;

export const PriceHistorySchema = z.object({ items: z.array(PriceChangeSchema) });
export type PriceHistory = z.infer<typeof PriceHistorySchema>;

export const CatalogItemParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  itemId: z.string().min(1).max(64),
});
