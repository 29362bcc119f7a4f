// What an agency archive may contain, file by file, in the same schemas the API
// and the importer use: a restore accepts nothing an engineer could not have
// typed in or imported. Rows from the archive never carry their own ids into the
// database; the restore assigns new ones and maps references through them.
import { z } from 'zod';
import { EconomicsSchema } from '../../shared/schemas/catalog';
import { ValueMapSchema, SEGMENT_FIELDS, SURVEY_FIELDS } from '../../shared/schemas/imports';
import { CurveSchema, PlanBodySchema } from '../../shared/schemas/plans';
import { SURFACES } from '../../shared/schemas/segments';

export const ARCHIVE_FORMAT = 'wearcourse-agency-export';

export const ARCHIVE_FILES = [
  'segments.csv',
  'segments.geojson',
  'surveys.csv',
  'catalog.json',
  'plans.json',
  'analyses.json',
  'curves.json',
  'import-mappings.json',
] as const;
export type ArchiveFile = (typeof ARCHIVE_FILES)[number];
/** Files added after the first archives were made: checked when the manifest lists them. */
export const OPTIONAL_ARCHIVE_FILES = ['treatment-records.csv'] as const;
export type OptionalArchiveFile = (typeof OPTIONAL_ARCHIVE_FILES)[number];

/** The most each file may inflate to (the whole archive: 500 MB), whatever the zip declares. */
export const ARCHIVE_ENTRY_BYTES: Record<ArchiveFile | OptionalArchiveFile | 'manifest.json', number> = {
  'manifest.json': 1024 * 1024,
  'segments.csv': 200 * 1024 * 1024,
  'segments.geojson': 250 * 1024 * 1024,
  'surveys.csv': 100 * 1024 * 1024,
  'treatment-records.csv': 50 * 1024 * 1024,
  'catalog.json': 5 * 1024 * 1024,
  'plans.json': 20 * 1024 * 1024,
  'analyses.json': 100 * 1024 * 1024,
  'curves.json': 1024 * 1024,
  'import-mappings.json': 1024 * 1024,
};
export const MAX_ARCHIVE_EXPANDED_BYTES = 500 * 1024 * 1024;

export const AgencyNameSchema = z.string().trim().min(2).max(120);
const sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'is not a SHA-256 hash');

export const ManifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT, 'is not a Wearcourse agency export'),
  version: z.literal(1, 'is not version 1'),
  exportedAt: z.string().max(40),
  agency: z.object({
    name: AgencyNameSchema,
    kind: z.enum(['county', 'city', 'other']),
    state: z.string().trim().max(40).nullable(),
    units: z.enum(['us', 'metric']),
    economics: EconomicsSchema,
  }),
  counts: z.record(z.string().max(40), z.number().int().min(0)),
  files: z
    .object(Object.fromEntries(ARCHIVE_FILES.map((f) => [f, sha256])) as Record<ArchiveFile, typeof sha256>)
    .extend({ 'treatment-records.csv': sha256.optional() })
    .strict(),
});
export type Manifest = z.infer<typeof ManifestSchema>;

/** An id as the archive names it: only a key for references inside the archive. */
const ArchiveId = z.string().min(1).max(64);
export const ArchiveRefSchema = z.object({ id: ArchiveId, isDemo: z.boolean().default(false) });

export const ArchivePlanSchema = PlanBodySchema.extend({
  status: z.enum(['draft', 'published']),
  publishedAt: z.iso.datetime().nullable(),
});

export const ArchiveAnalysisSchema = z.object({
  name: z.string().trim().min(1).max(120),
  input: z.unknown(),
  result: z.unknown(),
});

const FAMILY_KEY = new RegExp(
  `^(${SURFACES.join('|')})\\|(arterial|collector|local)\\|(reconstruction|overlay|preservation|unknown)$`,
);
export const ArchiveCurveSchema = CurveSchema.extend({
  familyKey: z.string().regex(FAMILY_KEY, 'is not a pavement family (surface|class group|treatment group)'),
});

const columnMapping = (fields: readonly string[]) =>
  z.record(z.enum(fields as [string, ...string[]]), z.string().min(1).max(200));
export const ArchiveMappingSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('segments'), mapping: columnMapping(SEGMENT_FIELDS) }),
  z.object({ kind: z.literal('surveys'), mapping: columnMapping(SURVEY_FIELDS) }),
  z.object({ kind: z.literal('segments-values'), mapping: ValueMapSchema }),
]);
