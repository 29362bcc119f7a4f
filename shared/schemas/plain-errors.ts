// Plain-language validation messages, for the API and the forms alike. Each is a
// phrase that follows the field's name ("Width (ft) must be more than 0"), so the
// server can answer `body.widthFt — must be more than 0` and a form can show
// "Must be more than 0" under the Width field. Messages written on a schema
// itself win over these.
import { z } from 'zod';

const num = (v: unknown) => (typeof v === 'number' ? v.toLocaleString('en-US') : String(v));

const FORMATS: Record<string, string> = {
  date: 'must be a date (YYYY-MM-DD)',
  datetime: 'must be a date and time',
  email: 'must be an e-mail address',
  url: 'must be a web address',
  uuid: 'is not a valid id',
};

type Issue = {
  code?: string;
  input?: unknown;
  expected?: string;
  origin?: string;
  minimum?: unknown;
  maximum?: unknown;
  inclusive?: boolean;
  format?: string;
  values?: unknown[];
  keys?: string[];
  divisor?: unknown;
  message?: string;
};

export function plainMessage(iss: Issue): string | undefined {
  switch (iss.code) {
    case 'invalid_type':
      if (iss.input === undefined || iss.input === null || iss.input === '') return 'is required';
      if (iss.expected === 'int') return 'must be a whole number';
      if (iss.expected === 'number') return 'must be a number';
      if (iss.expected === 'boolean') return 'must be yes or no';
      if (iss.expected === 'string') return 'must be text';
      if (iss.expected === 'array') return 'must be a list';
      if (iss.expected === 'object') return 'must be a group of fields';
      return `must be a ${iss.expected}`;
    case 'too_small':
      if (iss.origin === 'string')
        return Number(iss.minimum) <= 1 ? 'is required' : `must be at least ${num(iss.minimum)} characters`;
      if (iss.origin === 'array' || iss.origin === 'set')
        return Number(iss.minimum) <= 1 ? 'needs at least one entry' : `needs at least ${num(iss.minimum)} entries`;
      return iss.inclusive ? `must be at least ${num(iss.minimum)}` : `must be more than ${num(iss.minimum)}`;
    case 'too_big':
      if (iss.origin === 'string') return `must be at most ${num(iss.maximum)} characters`;
      if (iss.origin === 'array' || iss.origin === 'set') return `can have at most ${num(iss.maximum)} entries`;
      return iss.inclusive ? `must be ${num(iss.maximum)} or less` : `must be less than ${num(iss.maximum)}`;
    case 'invalid_format':
      return FORMATS[iss.format ?? ''] ?? 'is not in the expected form';
    case 'invalid_value':
      return `must be one of ${(iss.values ?? []).map((v) => `"${String(v)}"`).join(', ')}`;
    case 'not_multiple_of':
      return `must be a multiple of ${num(iss.divisor)}`;
    case 'unrecognized_keys':
      return `has ${iss.keys?.length === 1 ? 'a field' : 'fields'} that cannot be set here: ${(iss.keys ?? []).join(', ')}`;
    case 'invalid_union':
      return 'is not in any of the accepted forms';
    default:
      return undefined;
  }
}

/** Installs the plain messages as zod's global error map (server start-up and the client's entry). */
export function installPlainZodMessages() {
  z.config({ customError: (iss) => plainMessage(iss as Issue) });
}
