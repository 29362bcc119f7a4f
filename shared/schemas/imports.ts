import { z } from 'zod';
import { FunctionalClassSchema, SurfaceSchema } from './segments';

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

/**
 * Headers of the segment export, in plain words. The importer knows them, so an
 * exported file re-imports with no matching at all.
 */
export const EXPORT_HEADERS: Record<SegmentField, string> = {
  segment_id: 'Segment ID',
  road_name: 'Road name',
  from_desc: 'From',
  to_desc: 'To',
  length_mi: 'Length (mi)',
  width_ft: 'Width (ft)',
  lanes: 'Lanes',
  functional_class: 'Functional class',
  surface: 'Surface',
  adt: 'ADT (vehicles per day)',
  truck_pct: 'Trucks (% of ADT)',
  pci: 'PCI',
  pci_date: 'Survey date',
  last_treatment: 'Last treatment',
  last_treatment_year: 'Last treatment year',
  district: 'District',
  notes: 'Notes',
  geometry: 'Geometry (WKT, WGS84)',
};

export const LengthUnitSchema = z.enum(['mi', 'km', 'ft', 'm']);
export const WidthUnitSchema = z.enum(['ft', 'm']);

export const ImportModeSchema = z.enum(['all-or-nothing', 'skip-invalid']);
export type ImportMode = z.infer<typeof ImportModeSchema>;

const jsonField = <T extends z.ZodTypeAny>(inner: T) =>
  z.preprocess((v) => {
    if (typeof v !== 'string' || v.trim() === '') return v === '' ? undefined : v;
    try {
      return JSON.parse(v);
    } catch {
      return v; // left as a string: the inner schema reports it
    }
  }, inner);

/** How day-month-year dates with slashes are read; ISO dates (2026-06-04) are always understood. */
export const DateFormatSchema = z.enum(['auto', 'ymd', 'mdy', 'dmy']);
export type DateFormat = z.infer<typeof DateFormatSchema>;
export const DATE_FORMAT_LABELS: Record<DateFormat, string> = {
  auto: 'detect from the file',
  ymd: '2026-06-04 (year-month-day)',
  mdy: '06/04/2026 (month/day/year, US)',
  dmy: '04/06/2026 (day/month/year)',
};

const MAX_VALUE_MAP_ENTRIES = 200;
const valueMapOf = <T extends z.ZodTypeAny>(target: T) =>
  z
    .record(z.string().min(1).max(200), target)
    .refine((m) => Object.keys(m).length <= MAX_VALUE_MAP_ENTRIES, `at most ${MAX_VALUE_MAP_ENTRIES} values`);

/** The file's own words for classes and surfaces → ours ("Arterial Road" → principal_arterial). */
export const ValueMapSchema = z
  .object({ functional_class: valueMapOf(FunctionalClassSchema), surface: valueMapOf(SurfaceSchema) })
  .partial()
  .strict();
export type ValueMap = z.infer<typeof ValueMapSchema>;

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
  dateFormat: DateFormatSchema.default('auto'),
  values: jsonField(ValueMapSchema.optional()),
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

const CountsSchema = z.object({ added: z.number().int(), updated: z.number().int(), unchanged: z.number().int() });

/** One segment the import would change, field by field (values as the user reads them). */
export const SegmentChangeSchema = z.object({
  row: z.number().int(),
  segmentId: z.string(),
  fields: z.array(z.object({ field: z.string(), label: z.string(), before: z.string(), after: z.string() })),
});
export type SegmentChange = z.infer<typeof SegmentChangeSchema>;

/** Issues listed in one answer; the rest are counted (moreErrors, moreWarnings). */
export const MAX_LISTED_ISSUES = 1000;
/** "Would update" rows listed field by field in one answer. */
export const MAX_LISTED_CHANGES = 200;

export const ImportReportSchema = z.object({
  dryRun: z.boolean(),
  kind: z.enum(['segments', 'surveys']),
  format: z.enum(['csv', 'xlsx', 'geojson', 'shapefile']),
  /** What this answer wrote, or would write with the chosen mode (0 when the file is refused). */
  added: z.number().int(),
  updated: z.number().int(),
  unchanged: z.number().int(),
  rejected: z.number().int(),
  totalRows: z.number().int(),
  /** What the rows without problems do: what "skip the rejected rows" writes. */
  acceptedRows: CountsSchema,
  errors: z.array(ImportIssueSchema),
  warnings: z.array(ImportIssueSchema),
  moreErrors: z.number().int(),
  moreWarnings: z.number().int(),
  columns: z.array(z.object({ name: z.string(), samples: z.array(z.string()) })),
  mapping: z.record(z.string(), z.string()),
  units: z.object({ length: LengthUnitSchema, width: WidthUnitSchema }),
  /** How slash dates were read (null when the file has none). */
  dateFormat: z.enum(['ymd', 'mdy', 'dmy']).nullable(),
  decimalComma: z.boolean(),
  crs: z.string().nullable(),
  /** Where the coordinate system came from, in words ("the shapefile's .prj: NAD83 / Kansas South"). */
  crsNote: z.string().nullable(),
  /** The value matching used (saved and chosen), and the values still unknown. */
  valueMap: ValueMapSchema,
  unknownValues: z.array(
    z.object({ field: z.enum(['functional_class', 'surface']), value: z.string(), rows: z.number().int() }),
  ),
  changes: z.array(SegmentChangeSchema),
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
