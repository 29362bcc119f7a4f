// Field messages for forms bound to the shared zod schemas. Issues come from
// the schema run in the browser (path as an array) or from the server's 400
// answer (`issues: [{ path: 'body.costItems.0.amount', message }]`); both end
// as one message per field, keyed by the field's path inside the form's value
// ('pricePerTon', 'costItems.0.amount').
import { useCallback, useState } from 'react';
import type { z } from 'zod';
import { ApiError } from './api-client';

export type FieldIssue = { path: string | readonly PropertyKey[]; message: string };
export type FieldErrors = Record<string, string>;

const REQUEST_PARTS = new Set(['body', 'query', 'params']);

/** `body.costItems.0.amount` or ['costItems', 0, 'amount'] → 'costItems.0.amount'. */
export function fieldKey(path: FieldIssue['path']): string {
  const parts = typeof path === 'string' ? path.split('.') : path.map(String);
  const kept = parts.filter((p) => p !== '');
  if (REQUEST_PARTS.has(kept[0])) kept.shift();
  return kept.join('.');
}

/** The issues an error carries: a zod error's, or the server's 400 answer's; none otherwise. */
export function issuesOf(err: unknown): FieldIssue[] {
  if (err instanceof ApiError) return err.issues ?? [];
  if (err && typeof err === 'object' && 'issues' in err && Array.isArray(err.issues)) return err.issues as FieldIssue[];
  return [];
}

const sentenceCase = (m: string) => (m ? m[0].toUpperCase() + m.slice(1) : m);

/** One message per field (its first issue), ready to show under the field. */
export function toFieldErrors(issues: readonly FieldIssue[]): FieldErrors {
  const out: FieldErrors = {};
  for (const i of issues) {
    const key = fieldKey(i.path);
    out[key] ??= sentenceCase(i.message.trim());
  }
  return out;
}

/** Text typed into a number field: blank or not a number becomes NaN, which the schema refuses in words. */
export function numberFrom(raw: string): number {
  const t = raw.trim().replace(/,/g, '');
  return t === '' ? Number.NaN : Number(t);
}

/**
 * A form's field messages. `check` runs the shared schema and returns the
 * parsed value (or undefined, with the messages set); `fromError` takes what a
 * save threw. `others(shown)` lists the messages of fields the form does not
 * show (a rule on several fields, or a field the form keeps as it was).
 */
export function useFormErrors() {
  const [errors, setErrors] = useState<FieldErrors>({});
  const check = useCallback(<S extends z.ZodType>(schema: S, value: unknown): z.output<S> | undefined => {
    const r = schema.safeParse(value);
    setErrors(r.success ? {} : toFieldErrors(r.error.issues));
    return r.success ? r.data : undefined;
  }, []);
  /** Takes what a save threw; true when its issues went to fields, false when the caller must say it another way. */
  const fromError = useCallback((err: unknown) => {
    const issues = issuesOf(err);
    setErrors(toFieldErrors(issues));
    return issues.length > 0;
  }, []);
  /** Forget one field's message (the user is changing it), or all of them. */
  const clear = useCallback((key?: string) => {
    setErrors((e) => {
      if (key === undefined) return {};
      if (!(key in e)) return e;
      const { [key]: _gone, ...rest } = e;
      return rest;
    });
  }, []);
  const others = (shown: readonly string[]) =>
    Object.entries(errors)
      .filter(([k]) => !shown.includes(k))
      .map(([, m]) => m);
  return { errors, error: (key: string) => errors[key], check, fromError, clear, others };
}
