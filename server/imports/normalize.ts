// One raw row → one clean segment (or survey), or the reasons it is refused.
// Units are converted here, at the edge; inside Wearcourse lengths are miles
// and widths feet.
import { z } from 'zod';
import { FUNCTIONAL_CLASSES, SURFACES, type FunctionalClass, type Surface } from '../../shared/schemas/segments';
import type { ImportIssue, ValueMap } from '../../shared/schemas/imports';
import { type CellFormats, parseNumber, SLASH_DATE } from './cell-formats';
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

export const valueKey = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');
const key = valueKey;

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

/** Everything a row is read with: units, the file's number and date formats, the value matching. */
export type ReadOptions = {
  units: Units;
  formats: Pick<CellFormats, 'decimalComma' | 'dateFormat'>;
  values: ValueMap;
};

type Ctx = {
  row: number;
  errors: ImportIssue[];
  warnings: ImportIssue[];
  mapping: Record<string, string>;
  unreadable?: Record<string, string>;
};

/** Values echoed back in an answer are cut: a 20 MB cell must not travel back to the browser. */
export const MAX_ECHO_CHARS = 80;
export const echo = (v: Cell | undefined) => {
  const s = v === null || v === undefined ? '' : String(v);
  return s.length > MAX_ECHO_CHARS
    ? `${s.slice(0, MAX_ECHO_CHARS)}… (${s.length.toLocaleString('en-US')} characters)`
    : s;
};

function fail(ctx: Ctx, field: string, value: Cell, message: string) {
  ctx.errors.push({ row: ctx.row, column: ctx.mapping[field] ?? field, value: echo(value), message });
}

/** The mapped cell of a field, or null when it is blank (noting "is required" if it must be there). */
function cell(values: Record<string, Cell>, ctx: Ctx, field: string, required: boolean): Cell {
  const col = ctx.mapping[field];
  if (col && ctx.unreadable?.[col]) {
    fail(ctx, field, null, ctx.unreadable[col]);
    return null;
  }
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
    fail(ctx, field, s, `is longer than ${max} characters`);
    return null;
  }
  return s;
}

function num(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  opts: {
    min?: number;
    max?: number;
    minExclusive?: boolean;
    integer?: boolean;
    required?: boolean;
    decimalComma: boolean;
  },
): number | null {
  const raw = cell(values, ctx, field, !!opts.required);
  if (raw === null) return null;
  const n = typeof raw === 'number' ? raw : parseNumber(String(raw), opts.decimalComma);
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
const FORMAT_WORDS = { ymd: 'year-month-day', mdy: 'month/day/year', dmy: 'day/month/year' } as const;

/** A date cell → YYYY-MM-DD, or the reason it is not one. */
export function readDate(s: string, format: ReadOptions['formats']['dateFormat']): string | { problem: string } {
  let iso = s;
  const slash = s.match(SLASH_DATE);
  if (slash) {
    if (format === 'ymd' || format === null)
      return { problem: 'is not a date in YYYY-MM-DD form (choose how the file writes its dates)' };
    const [a, b] = [slash[1].padStart(2, '0'), slash[2].padStart(2, '0')];
    iso = format === 'mdy' ? `${slash[3]}-${a}-${b}` : `${slash[3]}-${b}-${a}`;
    if (!IsoDate.safeParse(iso).success) return { problem: `is not a real date read as ${FORMAT_WORDS[format]}` };
  } else if (/^\d{1,2}[/.-]\d{1,2}[/.-]\d{2}$/.test(s)) {
    return { problem: 'has a two-digit year; write the year in full' };
  } else if (!IsoDate.safeParse(s).success) {
    return { problem: 'is not a date (YYYY-MM-DD, or month/day/year or day/month/year with the format chosen)' };
  }
  if (iso < '1900-01-01') return { problem: 'is before 1900; check the date' };
  if (iso > new Date().toISOString().slice(0, 10)) return { problem: 'is in the future' };
  return iso;
}

function date(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  format: ReadOptions['formats']['dateFormat'],
  required = false,
): string | null {
  const v = cell(values, ctx, field, required);
  if (v === null) return null;
  const s = String(v).trim();
  const d = readDate(s, format);
  if (typeof d !== 'string') {
    fail(ctx, field, s, d.problem);
    return null;
  }
  // PCI surveys as a method date from the late 1970s (from memory); earlier dates are kept but questioned.
  if (d < '1975-01-01')
    ctx.warnings.push({
      row: ctx.row,
      column: ctx.mapping[field] ?? field,
      value: s,
      message: 'is an unusually early survey date; check the year',
    });
  return d;
}

const words = (v: string) => v.replace(/_/g, ' ');

/** Unknown class and surface values, counted per field and value (shown for matching in the check step). */
export type UnknownValues = Map<string, { field: 'functional_class' | 'surface'; value: string; rows: number }>;

function choice<T extends string>(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: 'functional_class' | 'surface',
  aliases: Record<string, T>,
  allowed: readonly string[],
  chosen: Record<string, T> | undefined,
  unknown: UnknownValues | undefined,
): T | null {
  const v = cell(values, ctx, field, true);
  if (v === null) return null;
  const k = key(String(v));
  // The user's own matching wins over the built-in aliases.
  const mine = chosen && Object.entries(chosen).find(([from]) => key(from) === k)?.[1];
  const hit = mine ?? aliases[k];
  if (!hit) {
    const what = field === 'functional_class' ? 'functional class' : 'surface';
    fail(
      ctx,
      field,
      v,
      `is not a ${what} Wearcourse knows (${allowed.map(words).join(', ')}); match it to one in the check step`,
    );
    const id = `${field}|${k}`;
    const seen = unknown?.get(id);
    if (seen) seen.rows++;
    else unknown?.set(id, { field, value: echo(v), rows: 1 });
    return null;
  }
  return hit;
}

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
