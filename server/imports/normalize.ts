// One raw row → one clean segment (or survey), or the reasons it is refused.
// Units are converted here, at the edge; inside Wearcourse lengths are miles
// and widths feet.
import { FUNCTIONAL_CLASSES, SURFACES, type FunctionalClass, type Surface } from '../../shared/schemas/segments';
import type { ValueMap } from '../../shared/schemas/imports';
import type { CellFormats } from './cell-formats';
import { type Ctx, choice, date, num, text, type UnknownValues } from './cell-readers';
import type { RawRow } from './read-file';
import { CLASS_ALIASES, SURFACE_ALIASES } from './value-aliases';

export { echo, MAX_ECHO_CHARS, readDate, type UnknownValues } from './cell-readers';
export { valueKey } from './value-aliases';

export const KM_PER_MILE = 1.609344; // exact, by definition of the international mile
export const FT_PER_MILE = 5280;
export const M_PER_FT = 0.3048; // exact, by definition of the international foot

export type SegmentInput = {
  segmentId: string;
  roadName: string;
  fromDesc: string | null;
  toDesc: string | null;
  lengthMi: number | null;
  widthFt: number;
  lanes: number;
  functionalClass: FunctionalClass;
  surface: Surface;
  adt: number | null;
  truckPct: number | null;
  pci: number | null;
  pciDate: string | null;
  lastTreatment: string | null;
  lastTreatmentYear: number | null;
  district: string | null;
  notes: string | null;
};

/** Everything a row is read with: units, the file's number and date formats, the value matching. */
export type ReadOptions = {
  units: Units;
  formats: Pick<CellFormats, 'decimalComma' | 'dateFormat'>;
  values: ValueMap;
};

export type Units = { length: 'mi' | 'km' | 'ft' | 'm'; width: 'ft' | 'm' };

const toMiles = (v: number, u: Units['length']) =>
  u === 'mi' ? v : u === 'km' ? v / KM_PER_MILE : u === 'ft' ? v / FT_PER_MILE : v / M_PER_FT / FT_PER_MILE;
const toFeet = (v: number, u: Units['width']) => (u === 'ft' ? v : v / M_PER_FT);

export function normalizeSegmentRow(
  r: RawRow,
  mapping: Record<string, string>,
  o: ReadOptions,
  unknown?: UnknownValues,
) {
  const { units } = o;
  const dc = o.formats.decimalComma;
  const ctx: Ctx = { row: r.row, errors: [], warnings: [], mapping, unreadable: r.unreadable };
  const v = r.values;
  if (typeof v.__extra === 'string')
    ctx.errors.push({
      row: r.row,
      column: '(row)',
      value: '',
      message: `has ${v.__extra}; check the separators and quotes`,
    });
  const lengthRaw = num(v, ctx, 'length_mi', {
    min: 0,
    minExclusive: true,
    max: units.length === 'ft' ? 528_000 : units.length === 'm' ? 160_000 : units.length === 'km' ? 160 : 100,
    decimalComma: dc,
  });
  const widthRaw = num(v, ctx, 'width_ft', {
    min: 0,
    minExclusive: true,
    max: units.width === 'm' ? 60 : 200,
    required: true,
    decimalComma: dc,
  });
  const seg: SegmentInput = {
    segmentId: text(v, ctx, 'segment_id', 60, true) ?? '',
    roadName: text(v, ctx, 'road_name', 120, true) ?? '',
    fromDesc: text(v, ctx, 'from_desc', 200),
    toDesc: text(v, ctx, 'to_desc', 200),
    lengthMi: lengthRaw === null ? null : Math.round(toMiles(lengthRaw, units.length) * 1e6) / 1e6,
    widthFt: widthRaw === null ? 0 : Math.round(toFeet(widthRaw, units.width) * 100) / 100,
    lanes: num(v, ctx, 'lanes', { min: 1, max: 12, integer: true, required: true, decimalComma: dc }) ?? 0,
    functionalClass:
      choice(v, ctx, 'functional_class', CLASS_ALIASES, FUNCTIONAL_CLASSES, o.values.functional_class, unknown) ??
      'local',
    surface: choice(v, ctx, 'surface', SURFACE_ALIASES, SURFACES, o.values.surface, unknown) ?? 'other',
    adt: num(v, ctx, 'adt', { min: 0, max: 500_000, integer: true, decimalComma: dc }),
    truckPct: num(v, ctx, 'truck_pct', { min: 0, max: 100, decimalComma: dc }),
    pci: num(v, ctx, 'pci', { min: 0, max: 100, decimalComma: dc }),
    pciDate: date(v, ctx, 'pci_date', o.formats.dateFormat),
    lastTreatment: text(v, ctx, 'last_treatment', 80),
    lastTreatmentYear: num(v, ctx, 'last_treatment_year', {
      min: 1900,
      max: new Date().getFullYear(),
      integer: true,
      decimalComma: dc,
    }),
    district: text(v, ctx, 'district', 60),
    notes: text(v, ctx, 'notes', 2000),
  };
  if (
    seg.pci !== null &&
    seg.pciDate === null &&
    !ctx.errors.some((e) => e.column === (mapping.pci_date ?? 'pci_date'))
  ) {
    ctx.warnings.push({
      row: r.row,
      column: mapping.pci ?? 'pci',
      value: String(seg.pci),
      message: 'has no survey date; it updates the latest PCI but is not added to the survey history',
    });
  }
  if (seg.surface === 'gravel' && seg.pci !== null) {
    ctx.warnings.push({
      row: r.row,
      column: mapping.pci ?? 'pci',
      value: String(seg.pci),
      message: 'PCI on a gravel road is unusual (PCI rates paved surfaces)',
    });
  }
  return { seg, errors: ctx.errors, warnings: ctx.warnings };
}

export type SurveyInput = { segmentId: string; surveyDate: string; pci: number; source: string | null };

export function normalizeSurveyRow(r: RawRow, mapping: Record<string, string>, o: Pick<ReadOptions, 'formats'>) {
  const ctx: Ctx = { row: r.row, errors: [], warnings: [], mapping, unreadable: r.unreadable };
  const v = r.values;
  const survey = {
    segmentId: text(v, ctx, 'segment_id', 60, true) ?? '',
    surveyDate: date(v, ctx, 'survey_date', o.formats.dateFormat, true) ?? '',
    pci: num(v, ctx, 'pci', { min: 0, max: 100, required: true, decimalComma: o.formats.decimalComma }) ?? 0,
    source: text(v, ctx, 'source', 120),
  };
  return { survey, errors: ctx.errors, warnings: ctx.warnings };
}
