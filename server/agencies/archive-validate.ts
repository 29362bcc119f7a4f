// Every file of an agency archive parsed and checked before anything is written:
// segments and surveys by the importer's own row rules, the catalog, plans,
// comparisons, curves and mappings by the API's schemas. All problems are
// collected and answered at once, each naming its file, row and field.
import Papa from 'papaparse';
import type { z } from 'zod';
import { runComparison, ComparisonInputError } from '../../shared/engine/lcca/comparison';
import { type MixInput, MixInputSchema, type TreatmentInput, TreatmentInputSchema } from '../../shared/schemas/catalog';
import { SEGMENT_FIELDS, SURVEY_FIELDS } from '../../shared/schemas/imports';
import { type ComparisonInput, ComparisonInputSchema } from '../../shared/schemas/comparisons';
import { unescapeFormula } from '../csv';
import { fitVertices, geometryProblem, type LineGeometry, looksLonLat, to2d } from '../imports/geometry';
import { normalizeSegmentRow, normalizeSurveyRow, type ReadOptions, type SegmentInput } from '../imports/normalize';
import { MAX_ROWS, type RawRow, tableFromFeatures } from '../imports/read-file';
import { type ArchivedTreatmentRecord, parseTreatmentRecords } from '../segment-history/segment-history.archive';
import type { ArchiveIssue, ArchiveText } from './archive-read';
import {
  ArchiveAnalysisSchema,
  ArchiveCurveSchema,
  ArchiveMappingSchema,
  ArchivePlanSchema,
  ArchiveRefSchema,
  type ArchiveFile,
} from './archive-schemas';

export type RestoreData = {
  segments: { seg: SegmentInput; geometry: LineGeometry | null }[];
  surveys: { segmentId: string; surveyDate: string; pci: number; source: string | null }[];
  mixes: { oldId: string; isDemo: boolean; input: MixInput }[];
  treatments: { oldId: string; isDemo: boolean; input: TreatmentInput }[];
  plans: z.infer<typeof ArchivePlanSchema>[];
  analyses: { name: string; input: ComparisonInput }[];
  curves: z.infer<typeof ArchiveCurveSchema>[];
  mappings: z.infer<typeof ArchiveMappingSchema>[];
  treatmentRecords: ArchivedTreatmentRecord[];
};

const READ: ReadOptions = {
  units: { length: 'mi', width: 'ft' },
  formats: { decimalComma: false, dateFormat: 'ymd' },
  values: {},
};
const identity = (fields: readonly string[]) => Object.fromEntries(fields.map((f) => [f, f]));
const MAX_ITEMS = 10_000;

/** zod's path → "row 3, settings.budgets" (rows counted from 1, as a person counts them). */
const where = (path: PropertyKey[]) =>
  path.map((p) => (typeof p === 'number' ? `row ${p + 1}` : String(p))).join(', ') || '(the whole file)';

export function validateArchive(a: ArchiveText): { data: RestoreData; issues: ArchiveIssue[] } {
  const issues: ArchiveIssue[] = [];
  const add = (file: string, at: string, message: string) => issues.push({ path: `${file}, ${at}`, message });
  const zodIssues = (file: string, prefix: PropertyKey[], err: z.ZodError) =>
    err.issues.forEach((i) => add(file, where([...prefix, ...i.path]), i.message));
  const json = (file: ArchiveFile): unknown => {
    try {
      return JSON.parse(a.files[file]);
    } catch {
      add(file, '(the whole file)', 'is not valid JSON');
      return null;
    }
  };
  const list = (file: keyof ArchiveText['files'], v: unknown): unknown[] => {
    if (Array.isArray(v) && v.length <= MAX_ITEMS) return v;
    if (v !== null)
      add(file, '(the whole file)', `must be a list of at most ${MAX_ITEMS.toLocaleString('en-US')} items`);
    return [];
  };

  // Segments: the importer's rules, feature by feature.
  const segmentsOut: RestoreData['segments'] = [];
  const before = issues.length;
  const geo = json('segments.geojson') as { type?: unknown; features?: unknown } | null;
  const features = geo && geo.type === 'FeatureCollection' && Array.isArray(geo.features) ? geo.features : null;
  if (geo && !features) add('segments.geojson', '(the whole file)', 'is not a GeoJSON FeatureCollection');
  else if (features && features.length > MAX_ROWS)
    add('segments.geojson', '(the whole file)', `has more than ${MAX_ROWS.toLocaleString('en-US')} features`);
  else if (features?.length) {
    const table = tableFromFeatures(features as never[], 'geojson', null);
    const mapping = identity(SEGMENT_FIELDS.filter((f) => f !== 'geometry'));
    const seen = new Set<string>();
    for (const r of table.rows) {
      const { seg, errors } = normalizeSegmentRow(r, mapping, READ);
      for (const e of errors) add('segments.geojson', `feature ${r.row}, ${e.column}`, e.message);
      if (seg.lengthMi === null && !errors.some((e) => e.column === 'length_mi'))
        add('segments.geojson', `feature ${r.row}, length_mi`, 'is required');
      if (seen.has(seg.segmentId)) add('segments.geojson', `feature ${r.row}, segment_id`, 'repeats a segment id');
      seen.add(seg.segmentId);
      let geometry: LineGeometry | null = null;
      if (r.geometry) {
        const problem = geometryProblem(r.geometry);
        if (problem) add('segments.geojson', `feature ${r.row}, geometry`, problem);
        else if (!looksLonLat(r.geometry as LineGeometry))
          add('segments.geojson', `feature ${r.row}, geometry`, 'is not in longitude/latitude (WGS84)');
        else geometry = fitVertices(to2d(r.geometry as LineGeometry)).geometry;
      }
      segmentsOut.push({ seg, geometry });
    }
  }

  // Surveys: the importer's rules, row by row, each naming a segment of the archive
  // (not checked against segments that could not be read at all: that would only repeat it).
  const segmentsRead = !issues.slice(before).some((i) => i.path.endsWith('(the whole file)'));
  const surveysOut: RestoreData['surveys'] = [];
  const parsed = Papa.parse<string[]>(a.files['surveys.csv'].trim(), { skipEmptyLines: true }).data;
  if (parsed[0]?.join(',') !== SURVEY_FIELDS.join(','))
    add('surveys.csv', 'row 1', `the header must be ${SURVEY_FIELDS.join(',')}`);
  else if (parsed.length - 1 > MAX_ROWS * 50) add('surveys.csv', '(the whole file)', 'has too many rows');
  else {
    const ids = new Set(segmentsOut.map((s) => s.seg.segmentId));
    const seen = new Set<string>();
    parsed.slice(1).forEach((cells, i) => {
      const row = i + 2;
      if (cells.length !== SURVEY_FIELDS.length)
        return add('surveys.csv', `row ${row}`, `has ${cells.length} values for ${SURVEY_FIELDS.length} columns`);
      const values = Object.fromEntries(
        SURVEY_FIELDS.map((f, j) => [f, cells[j] === undefined || cells[j] === '' ? null : unescapeFormula(cells[j])]),
      );
      const { survey, errors } = normalizeSurveyRow({ row, values } as RawRow, identity(SURVEY_FIELDS), READ);
      for (const e of errors) add('surveys.csv', `row ${row}, ${e.column}`, e.message);
      if (errors.length) return;
      if (segmentsRead && !ids.has(survey.segmentId))
        add('surveys.csv', `row ${row}, segment_id`, 'names a segment that segments.geojson does not have');
      const key = `${survey.segmentId}|${survey.surveyDate}`;
      if (seen.has(key)) add('surveys.csv', `row ${row}, survey_date`, 'repeats a survey of the same segment and date');
      seen.add(key);
      surveysOut.push(survey);
    });
  }

  // Catalog: the API's mix and treatment schemas; references only to mixes of the archive.
  const catalog = json('catalog.json') as { mixes?: unknown; treatments?: unknown } | null;
  const mixesOut: RestoreData['mixes'] = [];
  const treatmentsOut: RestoreData['treatments'] = [];
  const items = <T>(
    kind: 'mixes' | 'treatments',
    schema: z.ZodType<T>,
    out: { oldId: string; isDemo: boolean; input: T }[],
  ) =>
    list('catalog.json', catalog?.[kind] ?? null).forEach((item, i) => {
      const ref = ArchiveRefSchema.safeParse(item);
      const input = schema.safeParse(item);
      if (!ref.success) zodIssues('catalog.json', [kind, i], ref.error);
      if (!input.success) zodIssues('catalog.json', [kind, i], input.error);
      if (ref.success && out.some((o) => o.oldId === ref.data.id))
        add('catalog.json', where([kind, i, 'id']), 'repeats an id');
      if (ref.success && input.success) out.push({ oldId: ref.data.id, isDemo: ref.data.isDemo, input: input.data });
    });
  items('mixes', MixInputSchema, mixesOut);
  items('treatments', TreatmentInputSchema, treatmentsOut);
  const mixIds = new Set(mixesOut.map((m) => m.oldId));
  treatmentsOut.forEach((t, i) => {
    if (t.input.mixId && !mixIds.has(t.input.mixId))
      add('catalog.json', where(['treatments', i, 'mixId']), 'names a mix the archive does not have');
  });

  // Plans, comparisons, curves, mappings: the API's schemas.
  const treatmentIds = new Set(treatmentsOut.map((t) => t.oldId));
  const plansOut: RestoreData['plans'] = [];
  list('plans.json', json('plans.json')).forEach((p, i) => {
    const r = ArchivePlanSchema.safeParse(p);
    if (!r.success) return zodIssues('plans.json', [i], r.error);
    r.data.settings.treatmentIds.forEach((id, j) => {
      if (!treatmentIds.has(id))
        add('plans.json', where([i, 'settings', 'treatmentIds', j]), 'names a treatment the archive does not have');
    });
    plansOut.push(r.data);
  });
  const analysesOut: RestoreData['analyses'] = [];
  list('analyses.json', json('analyses.json')).forEach((an, i) => {
    const r = ArchiveAnalysisSchema.safeParse(an);
    if (!r.success) return zodIssues('analyses.json', [i], r.error);
    const input = ComparisonInputSchema.safeParse(r.data.input);
    if (!input.success) return zodIssues('analyses.json', [i, 'input'], input.error);
    try {
      // The deterministic part runs as the API runs it before starting a comparison.
      runComparison({ ...input.data, risk: { ...input.data.risk, iterations: 100 } }, { monteCarlo: false });
    } catch (err) {
      if (!(err instanceof ComparisonInputError)) throw err;
      add('analyses.json', where([i, 'input', err.path]), err.message);
      return;
    }
    analysesOut.push({ name: r.data.name, input: input.data });
  });
  const curvesOut: RestoreData['curves'] = [];
  list('curves.json', json('curves.json')).forEach((c, i) => {
    const r = ArchiveCurveSchema.safeParse(c);
    if (!r.success) return zodIssues('curves.json', [i], r.error);
    if (curvesOut.some((o) => o.familyKey === r.data.familyKey))
      add('curves.json', where([i, 'familyKey']), 'repeats a family');
    curvesOut.push(r.data);
  });
  const mappingsOut: RestoreData['mappings'] = [];
  list('import-mappings.json', json('import-mappings.json')).forEach((m, i) => {
    const r = ArchiveMappingSchema.safeParse(m);
    if (!r.success) return zodIssues('import-mappings.json', [i], r.error);
    if (mappingsOut.some((o) => o.kind === r.data.kind))
      add('import-mappings.json', where([i, 'kind']), 'repeats a kind');
    mappingsOut.push(r.data);
  });

  // Treatment records (archives made before they existed have none): the API's schema, row by row.
  const recordsOut: RestoreData['treatmentRecords'] = [];
  const recordsCsv = a.files['treatment-records.csv'];
  if (recordsCsv !== undefined) {
    const segIds = new Set(segmentsOut.map((s) => s.seg.segmentId));
    const names = new Set(treatmentsOut.map((t) => t.input.name));
    parseTreatmentRecords(recordsCsv, (at, m) => add('treatment-records.csv', at, m)).forEach((r, i) => {
      if (segmentsRead && !segIds.has(r.segmentId))
        add('treatment-records.csv', `row ${i + 2}, segment_id`, 'names a segment that segments.geojson does not have');
      else if (r.catalogTreatment && !names.has(r.catalogTreatment))
        add('treatment-records.csv', `row ${i + 2}, catalog_treatment`, 'names a treatment the archive does not have');
      else recordsOut.push(r);
    });
  }

  return {
    data: {
      segments: segmentsOut,
      surveys: surveysOut,
      mixes: mixesOut,
      treatments: treatmentsOut,
      plans: plansOut,
      analyses: analysesOut,
      curves: curvesOut,
      mappings: mappingsOut,
      treatmentRecords: recordsOut,
    },
    issues,
  };
}
