import { z } from 'zod';

// Our canonical import columns. A file whose headers are exactly these imports
// with no mapping at all.
export const SEGMENT_FIELDS = [
  'segment_id',
  'road_name',
  'from_desc',
  'to_desc',
  'length_mi',
  'width_ft',
  'lanes',
  'functional_class',
  'surface',
  'adt',
  'truck_pct',
  'pci',
  'pci_date',
  'last_treatment',
  'last_treatment_year',
  'district',
  'notes',
  'geometry',
] as const;
export type SegmentField = (typeof SEGMENT_FIELDS)[number];

export const REQUIRED_SEGMENT_FIELDS: SegmentField[] = [
  'segment_id',
  'road_name',
  'width_ft',
  'lanes',
  'functional_class',
  'surface',
];

export const SURVEY_FIELDS = ['segment_id', 'survey_date', 'pci', 'source'] as const;
export type SurveyField = (typeof SURVEY_FIELDS)[number];

export const FIELD_LABELS: Record<SegmentField | SurveyField, string> = {
  segment_id: 'Segment id (agency’s own)',
  road_name: 'Road name',
  from_desc: 'From',
  to_desc: 'To',
  length_mi: 'Length',
  width_ft: 'Width',
  lanes: 'Lanes',
  functional_class: 'Functional class',
  surface: 'Surface',
  adt: 'ADT (vehicles/day)',
  truck_pct: 'Trucks (% of ADT)',
  pci: 'PCI (0–100)',
  pci_date: 'Survey date',
  last_treatment: 'Last treatment',
  last_treatment_year: 'Last treatment year',
  district: 'District / zone',
  notes: 'Notes',
  geometry: 'Geometry (WKT line, WGS84 or the chosen CRS)',
  survey_date: 'Survey date',
  source: 'Survey source',
};

export const LengthUnitSchema = z.enum(['mi', 'km', 'ft', 'm']);
export const WidthUnitSchema = z.enum(['ft', 'm']);

export const ImportModeSchema = z.enum(['all-or-nothing', 'skip-invalid']);

const jsonField = <T extends z.ZodTypeAny>(inner: T) =>
  z.preprocess((v) => {
    if (typeof v !== 'string' || v.trim() === '') return v === '' ? undefined : v;
    try {
      return JSON.parse(v);
    } catch {
      return v; // left as a string: the inner schema reports it
    }
  }, inner);

const boolField = z.preprocess((v) => (v === 'true' ? true : v === 'false' ? false : v), z.boolean());

/** Multipart fields beside `file`. */
export const ImportOptionsSchema = z.object({
  kind: z.enum(['segments', 'surveys']).default('segments'),
  mapping: jsonField(z.record(z.string(), z.string().max(200)).optional()),
  crs: z
    .string()
    .trim()
    .regex(/^(EPSG:\d{4,6})$/i, 'Give the coordinate system as EPSG:<code>, e.g. EPSG:3419')
    .optional(),
  mode: ImportModeSchema.default('all-or-nothing'),
  dryRun: boolField.default(false),
  lengthUnit: LengthUnitSchema.optional(),
  widthUnit: WidthUnitSchema.optional(),
  saveMapping: boolField.default(true),
});
export type ImportOptions = z.infer<typeof ImportOptionsSchema>;

export const ImportIssueSchema = z.object({
  row: z.number().int(),
  column: z.string(),
  value: z.string(),
  message: z.string(),
});
export type ImportIssue = z.infer<typeof ImportIssueSchema>;

export const ImportReportSchema = z.object({
  dryRun: z.boolean(),
  kind: z.enum(['segments', 'surveys']),
  format: z.enum(['csv', 'xlsx', 'geojson', 'shapefile']),
  added: z.number().int(),
  updated: z.number().int(),
  unchanged: z.number().int(),
  rejected: z.number().int(),
  totalRows: z.number().int(),
  errors: z.array(ImportIssueSchema),
  warnings: z.array(ImportIssueSchema),
  columns: z.array(z.object({ name: z.string(), samples: z.array(z.string()) })),
  mapping: z.record(z.string(), z.string()),
  units: z.object({ length: LengthUnitSchema, width: WidthUnitSchema }),
  crs: z.string().nullable(),
  preview: z.array(z.record(z.string(), z.unknown())),
  importId: z.string().nullable(),
});
export type ImportReport = z.infer<typeof ImportReportSchema>;

export const ImportHistoryItemSchema = z.object({
  id: z.string(),
  fileName: z.string(),
  kind: z.string(),
  format: z.string(),
  mode: z.string(),
  added: z.number(),
  updated: z.number(),
  unchanged: z.number(),
  rejected: z.number(),
  userName: z.string().nullable(),
  createdAt: z.string(),
});
export const ImportHistorySchema = z.object({ items: z.array(ImportHistoryItemSchema) });
export type ImportHistory = z.infer<typeof ImportHistorySchema>;

export const SavedMappingSchema = z.object({ mapping: z.record(z.string(), z.string()).nullable() });

export const ImportParamsSchema = z.object({
  agencyId: z.string().min(1).max(64),
  importId: z.string().min(1).max(64),
});
