import { z } from 'zod';
import { CONDITION_BAND_IDS } from '../condition';

// FHWA functional classification, collapsed to the seven classes an agency
// inventory carries.
export const FUNCTIONAL_CLASSES = [
  'interstate',
  'freeway',
  'principal_arterial',
  'minor_arterial',
  'major_collector',
  'minor_collector',
  'local',
] as const;
export const FunctionalClassSchema = z.enum(FUNCTIONAL_CLASSES);
export type FunctionalClass = z.infer<typeof FunctionalClassSchema>;

export const SURFACES = ['asphalt', 'chip_seal', 'concrete', 'gravel', 'other'] as const;
export const SurfaceSchema = z.enum(SURFACES);
export type Surface = z.infer<typeof SurfaceSchema>;

export const SegmentSchema = z.object({
  id: z.number().int(),
  segmentId: z.string(),
  roadName: z.string(),
  fromDesc: z.string().nullable(),
  toDesc: z.string().nullable(),
  lengthMi: z.number(),
  widthFt: z.number(),
  lanes: z.number().int(),
  functionalClass: FunctionalClassSchema,
  surface: SurfaceSchema,
  adt: z.number().nullable(),
  truckPct: z.number().nullable(),
  district: z.string().nullable(),
  lastTreatment: z.string().nullable(),
  lastTreatmentYear: z.number().int().nullable(),
  pci: z.number().nullable(),
  pciDate: z.string().nullable(),
  laneMiles: z.number(),
  areaSy: z.number(),
});
export type Segment = z.infer<typeof SegmentSchema>;

const csvList = <T extends z.ZodTypeAny>(item: T) =>
  z.preprocess((v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v), z.array(item).max(20));

export const SegmentListQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(100),
  offset: z.coerce.number().int().min(0).default(0),
  q: z.string().trim().max(100).optional(),
  class: csvList(FunctionalClassSchema).optional(),
  surface: csvList(SurfaceSchema).optional(),
  band: csvList(z.enum([...CONDITION_BAND_IDS, 'none'])).optional(),
  district: z.string().trim().max(100).optional(),
  ids: z
    .preprocess(
      (v) => (typeof v === 'string' ? v.split(',').filter(Boolean) : v),
      z.array(z.coerce.number().int().positive()).max(5000),
    )
    .optional(),
  sort: z
    .enum([
      'segmentId',
      'roadName',
      'lengthMi',
      'widthFt',
      'lanes',
      'adt',
      'surface',
      'pci',
      'functionalClass',
      'district',
    ])
    .default('segmentId'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export type SegmentListQuery = z.infer<typeof SegmentListQuerySchema>;

export const SegmentTotalsSchema = z.object({
  count: z.number(),
  miles: z.number(),
  laneMiles: z.number(),
  areaSy: z.number(),
  weightedPci: z.number().nullable(),
});

export const SegmentListResponseSchema = z.object({
  total: z.number().int(),
  items: z.array(SegmentSchema),
  totals: SegmentTotalsSchema,
});
export type SegmentListResponse = z.infer<typeof SegmentListResponseSchema>;

/** The agency's districts for the filter's choice list (spellings that differ only in case count as one). */
export const DistrictListSchema = z.object({
  items: z.array(z.object({ name: z.string(), segments: z.number().int() })),
});
export type DistrictList = z.infer<typeof DistrictListSchema>;

export const NetworkSummarySchema = z.object({
  agencyName: z.string(),
  segments: z.number(),
  centrelineMiles: z.number(),
  laneMiles: z.number(),
  weightedPci: z.number().nullable(),
  laneMilesByBand: z.array(z.object({ band: z.string(), laneMiles: z.number() })),
  latestSurveyYear: z.number().nullable(),
});
export type NetworkSummary = z.infer<typeof NetworkSummarySchema>;

export const SegmentParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  id: z.coerce.number().int().positive(),
});

// Fields an engineer may edit in place. The agency's segment id is the key
// for re-imports, so it is not editable here.
export const SegmentUpdateSchema = z
  .object({
    roadName: z.string().trim().min(1).max(120),
    fromDesc: z.string().trim().max(200).nullable(),
    toDesc: z.string().trim().max(200).nullable(),
    lengthMi: z.number().positive().max(100),
    widthFt: z.number().positive().max(200),
    lanes: z.number().int().min(1).max(12),
    functionalClass: FunctionalClassSchema,
    surface: SurfaceSchema,
    adt: z.number().int().min(0).max(500000).nullable(),
    truckPct: z.number().min(0).max(100).nullable(),
    district: z.string().trim().max(60).nullable(),
    notes: z.string().max(2000).nullable(),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type SegmentUpdate = z.infer<typeof SegmentUpdateSchema>;

export const SegmentDetailSchema = SegmentSchema.extend({
  notes: z.string().nullable(),
  geometry: z.unknown().nullable(),
  surveys: z.array(z.object({ surveyDate: z.string(), pci: z.number(), source: z.string().nullable() })),
});
