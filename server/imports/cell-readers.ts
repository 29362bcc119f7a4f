// Reading one cell as text, a number, a date or one of our values, noting why a
// cell is refused (by the column the user knows). Echoed values are cut short.
import { z } from 'zod';
import type { ImportIssue } from '../../shared/schemas/imports';
import { parseNumber, SLASH_DATE } from './cell-formats';
import type { Cell } from './read-file';
import { valueKey as key } from './value-aliases';

export type DateRead = 'ymd' | 'mdy' | 'dmy' | null;

export type Ctx = {
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

export function fail(ctx: Ctx, field: string, value: Cell, message: string) {
  ctx.errors.push({ row: ctx.row, column: ctx.mapping[field] ?? field, value: echo(value), message });
}

/** The mapped cell of a field, or null when it is blank (noting "is required" if it must be there). */
export function cell(values: Record<string, Cell>, ctx: Ctx, field: string, required: boolean): Cell {
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

export function text(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  max: number,
  required = false,
): string | null {
  const v = cell(values, ctx, field, required);
  if (v === null) return null;
  const s = String(v).trim();
  if (s.length > max) {
    fail(ctx, field, s, `is longer than ${max} characters`);
    return null;
  }
  return s;
}

export function num(
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
export function readDate(s: string, format: DateRead): string | { problem: string } {
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

export function date(
  values: Record<string, Cell>,
  ctx: Ctx,
  field: string,
  format: DateRead,
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

export function choice<T extends string>(
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
