// One way for every form to show what is wrong, at the field, in plain words.
// Issues come from the shared zod schemas run in the browser, or from the
// server's 400 answer (`issues: [{ path: 'body.widthFt', message }]`); both
// carry the same plain phrases (shared/schemas/plain-errors.ts). Fields are
// keyed by their path inside the form's value: `widthFt`, `alternatives.1.life`.
import { useCallback, useState } from 'react';
import type { z } from 'zod';
import { ApiError } from '@/lib/api-client';

export type Issue = { path: string | readonly PropertyKey[]; message: string };
export type FieldErrors = Record<string, string>;
/** Field key → the words a user reads for it ("Width (ft)"). */
export type FieldLabels = Record<string, string>;

const REQUEST_PARTS = new Set(['body', 'query', 'params']);

/** A path as the form's field key: `body.widthFt` → `widthFt`. */
export function fieldKey(path: Issue['path']): string {
  const parts = (typeof path === 'string' ? path.split('.') : path.map(String)).filter((p) => p !== '');
  if (parts.length > 0 && REQUEST_PARTS.has(parts[0])) parts.shift();
  return parts.join('.');
}

/** Issues carried by anything a form may catch: a ZodError, the API's error, or nothing usable. */
export function issuesOf(err: unknown): Issue[] {
  if (err instanceof ApiError) return err.issues ?? [];
  if (err && typeof err === 'object' && 'issues' in err && Array.isArray((err as { issues: unknown }).issues))
    return (err as { issues: Issue[] }).issues;
  return [];
}

const capital = (s: string) => (s ? s[0].toUpperCase() + s.slice(1) : s);

/** The message under a field: "Must be more than 0". */
export const atField = (message: string) => capital(message.trim());

/** The message away from its field (a toast, a summary): "Width (ft) must be more than 0". */
export function sentence(key: string, message: string, labels: FieldLabels = {}): string {
  const label = labels[key] ?? labels[key.split('.')[0]];
  if (!label) return atField(message);
  return `${label} ${message.trim()}`;
}

/** Issues → one message per field (the first for each), keyed as the form keys its fields. */
export function toFieldErrors(issues: Issue[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    const k = fieldKey(i.path);
    if (!(k in out)) out[k] = i.message;
  }
  return out;
}

/** What to say about an error as a whole, naming fields in plain words; falls back to its message. */
export function describeError(err: unknown, labels: FieldLabels = {}): string {
  const issues = issuesOf(err);
  if (issues.length) return issues.map((i) => sentence(fieldKey(i.path), i.message, labels)).join('; ');
  return err instanceof Error ? err.message : 'Something went wrong';
}

export type FieldErrorOptions = {
  /** A failure with no field issues goes to `others` in words (default); false leaves it to the caller (a toast). */
  general?: boolean;
};

const NO_LABELS: FieldLabels = {};

/**
 * Per-form error state. `check(schema, value)` validates in the browser and
 * returns the parsed value or undefined; `fromError(err)` takes a server answer
 * and says whether its issues went to fields. `error(key)` is the message to
 * show under that field; `others` lists issues no field on the form shows (pass
 * the keys the form has), `othersExcept(keys)` the same for keys known later.
 */
export function useFieldErrors(
  labels: FieldLabels = NO_LABELS,
  shownKeys: readonly string[] = Object.keys(labels),
  opts: FieldErrorOptions = {},
) {
  const [errors, setErrors] = useState<FieldErrors>({});
  const [general, setGeneral] = useState<string | null>(null);
  const keepGeneral = opts.general ?? true;

  const check = useCallback(<S extends z.ZodType>(schema: S, value: unknown): z.output<S> | undefined => {
    const r = schema.safeParse(value);
    if (r.success) {
      setErrors({});
      setGeneral(null);
      return r.data;
    }
    setErrors(toFieldErrors(r.error.issues));
    setGeneral(null);
    return undefined;
  }, []);

  const fromError = useCallback(
    (err: unknown) => {
      const issues = issuesOf(err);
      setErrors(toFieldErrors(issues));
      setGeneral(issues.length || !keepGeneral ? null : describeError(err, labels));
      return issues.length > 0;
    },
    [labels, keepGeneral],
  );

  const clear = useCallback((key?: string) => {
    setGeneral(null);
    setErrors((e) => {
      if (!key) return {};
      if (!(key in e)) return e;
      const { [key]: _gone, ...rest } = e;
      return rest;
    });
  }, []);

  const error = (key: string) => (errors[key] ? atField(errors[key]) : undefined);
  const othersExcept = (shown: readonly string[]) => [
    ...(general ? [general] : []),
    ...Object.entries(errors)
      .filter(([k]) => !shown.includes(k))
      .map(([k, m]) => sentence(k, m, labels)),
  ];
  const others = othersExcept(shownKeys);
  return {
    errors,
    error,
    others,
    othersExcept,
    check,
    fromError,
    clear,
    hasErrors: Object.keys(errors).length > 0 || !!general,
  };
}

/** Text typed into a number field that must hold one: blank or not a number is NaN, which the schema refuses in words. */
export function numberFrom(raw: string): number {
  const t = raw.trim().replace(/,/g, '');
  return t === '' ? Number.NaN : Number(t);
}

/** Form text → number for a schema: blank is null (let the schema say whether that is allowed). */
export function numberOrNull(raw: string): number | null {
  const t = raw.trim().replace(/,/g, '');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** Form text → string or null when blank. */
export const textOrNull = (raw: string) => (raw.trim() === '' ? null : raw.trim());
