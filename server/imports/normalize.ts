// One raw row → one clean segment (or survey), or the reasons it is refused.
// Units are converted here, at the edge; inside Wearcourse lengths are miles
// and widths feet.
import { z } from 'zod';
import { FUNCTIONAL_CLASSES, SURFACES, type FunctionalClass, type Surface } from '../../shared/schemas/segments';
import type { ImportIssue } from '../../shared/schemas/imports';
import type { Cell, RawRow } from './read-file';

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

const key = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');

const CLASS_ALIASES: Record<string, FunctionalClass> = {
  ...Object.fromEntries(FUNCTIONAL_CLASSES.map((c) => [key(c), c])),
  interstatehighway: 'interstate',
  otherfreewayorexpressway: 'freeway',
  otherfreewaysandexpressways: 'freeway',
  freewayexpressway: 'freeway',
  expressway: 'freeway',
  otherprincipalarterial: 'principal_arterial',
  principalarterialother: 'principal_arterial',
  arterial: 'minor_arterial',
  collector: 'major_collector',
  localroad: 'local',
  localstreet: 'local',
  // FHWA numeric codes 1–7
  '1': 'interstate',
  '2': 'freeway',
  '3': 'principal_arterial',
  '4': 'minor_arterial',
  '5': 'major_collector',
  '6': 'minor_collector',
  '7': 'local',
};

const SURFACE_ALIASES: Record<string, Surface> = {
  ...Object.fromEntries(SURFACES.map((s) => [key(s), s])),
  ac: 'asphalt',
  hma: 'asphalt',
  asphaltconcrete: 'asphalt',
  bituminous: 'asphalt',
  blacktop: 'asphalt',
  chipseal: 'chip_seal',
  sealcoat: 'chip_seal',
  bst: 'chip_seal',
  pcc: 'concrete',
  portlandcementconcrete: 'concrete',
  aggregate: 'gravel',
  unpaved: 'gravel',
};

type Ctx = { row: number; errors: ImportIssue[]; warnings: ImportIssue[]; mapping: Record<string, string> };

const show = (v: Cell) => (v === null ? '' : String(v));

function fail(ctx: Ctx, field: string, value: Cell, message: string) {
  ctx.errors.push({ row: ctx.row, column: ctx.mapping[field] ?? field, value: show(value), message });
}

/** The mapped cell of a field, or null when it is blank (noting "is required" if it must be there). */
function cell(values: Record<string, Cell>, ctx: Ctx, field: string, required: boolean): Cell {
  const col = ctx.mapping[field];
  const v = col ? values[col] : null;
  if (v === null || v === undefined || String(v).trim() === '') {
    if (required) fail(ctx, field, null, 'is required');
    return null;
  }
  return v;
}

function text(values: Record<string, Cell>, ctx: Ctx, field: string, max: number, required = false): string | null {
  const v = cell(values, ctx, field, required);
  if (v === null) return null;
  const s = String(v).trim();
  if (s.length > max) {
    fail(ctx, field, s.slice(0, 40), `is longer than ${max} characters`);
    return null;
  }
  return s;
}

function num(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  opts: { min?: number; max?: number; minExclusive?: boolean; integer?: boolean; required?: boolean },
): number | null {
  const raw = cell(values, ctx, field, !!opts.required);
  if (raw === null) return null;
  const cleaned =
    typeof raw === 'number'
      ? raw
      : String(raw)
          .trim()
          .replace(/,(?=\d{3}(\D|$))/g, '')
          .replace(/%$/, '');
  const n =
    typeof cleaned === 'number'
      ? cleaned
      : /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(cleaned)
        ? Number(cleaned)
        : Number.NaN;
  if (!Number.isFinite(n)) {
    fail(ctx, field, raw, 'is not a number');
    return null;
  }
  if (opts.integer && !Number.isInteger(n)) {
    fail(ctx, field, raw, 'must be a whole number');
    return null;
  }
  if (opts.min !== undefined && (opts.minExclusive ? n <= opts.min : n < opts.min)) {
    fail(ctx, field, raw, opts.minExclusive ? `must be greater than ${opts.min}` : `must be at least ${opts.min}`);
    return null;
  }
  if (opts.max !== undefined && n > opts.max) {
    fail(ctx, field, raw, `must be at most ${opts.max}`);
    return null;
  }
  return n;
}

const IsoDate = z.iso.date();

function date(values: Record<string, Cell>, ctx: Ctx, field: string, required = false): string | null {
  const v = cell(values, ctx, field, required);
  if (v === null) return null;
  const s = String(v).trim();
  if (!IsoDate.safeParse(s).success) {
    fail(ctx, field, s, 'is not a date in YYYY-MM-DD form');
    return null;
  }
  if (s > new Date().toISOString().slice(0, 10)) {
    fail(ctx, field, s, 'is in the future');
    return null;
  }
  return s;
}

function choice<T extends string>(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  aliases: Record<string, T>,
  allowed: readonly string[],
): T | null {
  const v = cell(values, ctx, field, true);
  if (v === null) return null;
  const hit = aliases[key(String(v))];
  if (!hit) {
    fail(ctx, field, v, `is not one of ${allowed.join(', ')}`);
    return null;
  }
  return hit;
}

export type Units = { length: 'mi' | 'km' | 'ft' | 'm'; width: 'ft' | 'm' };

const toMiles = (v: number, u: Units['length']) =>
  u === 'mi' ? v : u === 'km' ? v / KM_PER_MILE : u === 'ft' ? v / FT_PER_MILE : v / M_PER_FT / FT_PER_MILE;
const toFeet = (v: number, u: Units['width']) => (u === 'ft' ? v : v / M_PER_FT);

export function normalizeSegmentRow(r: RawRow, mapping: Record<string, string>, units: Units) {
  const ctx: Ctx = { row: r.row, errors: [], warnings: [], mapping };
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
  });
  const widthRaw = num(v, ctx, 'width_ft', {
    min: 0,
    minExclusive: true,
    max: units.width === 'm' ? 60 : 200,
    required: true,
  });
  const seg: SegmentInput = {
    segmentId: text(v, ctx, 'segment_id', 60, true) ?? '',
    roadName: text(v, ctx, 'road_name', 120, true) ?? '',
    fromDesc: text(v, ctx, 'from_desc', 200),
    toDesc: text(v, ctx, 'to_desc', 200),
    lengthMi: lengthRaw === null ? null : Math.round(toMiles(lengthRaw, units.length) * 1e6) / 1e6,
    widthFt: widthRaw === null ? 0 : Math.round(toFeet(widthRaw, units.width) * 100) / 100,
    lanes: num(v, ctx, 'lanes', { min: 1, max: 12, integer: true, required: true }) ?? 0,
    functionalClass: choice(v, ctx, 'functional_class', CLASS_ALIASES, FUNCTIONAL_CLASSES) ?? 'local',
    surface: choice(v, ctx, 'surface', SURFACE_ALIASES, SURFACES) ?? 'other',
    adt: num(v, ctx, 'adt', { min: 0, max: 500_000, integer: true }),
    truckPct: num(v, ctx, 'truck_pct', { min: 0, max: 100 }),
    pci: num(v, ctx, 'pci', { min: 0, max: 100 }),
    pciDate: date(v, ctx, 'pci_date'),
    lastTreatment: text(v, ctx, 'last_treatment', 80),
    lastTreatmentYear: num(v, ctx, 'last_treatment_year', { min: 1900, max: new Date().getFullYear(), integer: true }),
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

export function normalizeSurveyRow(r: RawRow, mapping: Record<string, string>) {
  const ctx: Ctx = { row: r.row, errors: [], warnings: [], mapping };
  const v = r.values;
  const survey = {
    segmentId: text(v, ctx, 'segment_id', 60, true) ?? '',
    surveyDate: date(v, ctx, 'survey_date', true) ?? '',
    pci: num(v, ctx, 'pci', { min: 0, max: 100, required: true }) ?? 0,
    source: text(v, ctx, 'source', 120),
  };
  return { survey, errors: ctx.errors, warnings: ctx.warnings };
}
