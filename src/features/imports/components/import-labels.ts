// Words for what the import report names in code: field keys of the preview rows,
// units, date formats.
import { FIELD_LABELS } from '@shared/schemas/imports';

export const PREVIEW_LABELS: Record<string, string> = {
  row: 'Row',
  segmentId: FIELD_LABELS.segment_id,
  roadName: FIELD_LABELS.road_name,
  fromDesc: FIELD_LABELS.from_desc,
  toDesc: FIELD_LABELS.to_desc,
  lengthMi: 'Length (mi)',
  widthFt: 'Width (ft)',
  lanes: FIELD_LABELS.lanes,
  functionalClass: FIELD_LABELS.functional_class,
  surface: FIELD_LABELS.surface,
  adt: FIELD_LABELS.adt,
  truckPct: FIELD_LABELS.truck_pct,
  pci: FIELD_LABELS.pci,
  pciDate: FIELD_LABELS.pci_date,
  lastTreatment: FIELD_LABELS.last_treatment,
  lastTreatmentYear: FIELD_LABELS.last_treatment_year,
  district: FIELD_LABELS.district,
  notes: FIELD_LABELS.notes,
  hasGeometry: 'Line',
  surveyDate: FIELD_LABELS.survey_date,
  source: FIELD_LABELS.source,
};

export const LENGTH_UNIT_WORDS: Record<string, string> = { mi: 'miles', km: 'kilometres', ft: 'feet', m: 'metres' };
export const WIDTH_UNIT_WORDS: Record<string, string> = { ft: 'feet', m: 'metres' };
export const READ_DATE_WORDS: Record<string, string> = {
  ymd: 'year-month-day',
  mdy: 'month/day/year (US)',
  dmy: 'day/month/year',
};

/** A preview cell as the user reads it. */
export function previewValue(key: string, v: unknown) {
  if (v === null || v === undefined || v === '') return '—';
  if (key === 'hasGeometry') return v ? 'yes' : 'none';
  if (key === 'functionalClass' || key === 'surface') return String(v).replace(/_/g, ' ');
  return String(v);
}
