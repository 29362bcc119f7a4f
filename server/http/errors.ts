import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorBody } from '../../shared/schemas/common';

export class HttpError extends Error {
  constructor(
    public status: number,
    public code: string,
    message: string,
    public issues?: { path: string; message: string }[],
    /** Extra response headers, e.g. Retry-After on 429. */
    public headers?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'Not found') => new HttpError(404, 'not_found', what);
export const forbidden = (what = 'Your role does not allow this') => new HttpError(403, 'forbidden', what);
export const unauthorized = () => new HttpError(401, 'unauthorized', 'Sign in first');
/** 429 with a Retry-After header; the message says in plain words what to do. */
export const tooBusy = (message: string, retryAfterSeconds: number) =>
  new HttpError(429, 'too_busy', message, undefined, { 'Retry-After': String(retryAfterSeconds) });
export const badRequest = (message: string, issues?: { path: string; message: string }[]) =>
  new HttpError(400, 'bad_request', message, issues);

export function zodIssues(err: ZodError, prefix = '') {
  return err.issues.map((i) => ({
    path: [prefix, ...i.path.map(String)].filter(Boolean).join('.'),
    message: i.message,
  }));
}

// SQLite's own refusals that are the server's condition, not a bug: said in words, with
// the status a client can act on. Nothing was written (the statement's transaction rolled back).
const SQLITE_CONDITIONS: Record<string, { status: number; code: string; message: string }> = {
  SQLITE_FULL: {
    status: 507,
    code: 'storage_full',
    message:
      'The server’s disk is full, so nothing was saved. Tell whoever runs Wearcourse; try again once space is freed.',
  },
  SQLITE_BUSY: {
    status: 503,
    code: 'busy',
    message: 'The database is busy with other work; nothing was saved. Try again in a moment.',
  },
  SQLITE_READONLY: {
    status: 503,
    code: 'read_only',
    message: 'The database is read-only on this server, so nothing was saved. Tell whoever runs Wearcourse.',
  },
};

const sqliteCondition = (err: unknown) => {
  const code = err && typeof err === 'object' && 'code' in err ? String(err.code) : '';
  // better-sqlite3 names extended codes too (SQLITE_BUSY_SNAPSHOT, SQLITE_READONLY_DBMOVED…).
  return SQLITE_CONDITIONS[code] ?? SQLITE_CONDITIONS[code.split('_').slice(0, 2).join('_')] ?? null;
};

// The one error handler: stable JSON shape, never a stack trace to the client.
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  let status = 500;
  let body: ErrorBody = { error: { code: 'internal', message: 'Something went wrong on our side' } };
  if (err instanceof HttpError) {
    status = err.status;
    body = { error: { code: err.code, message: err.message, issues: err.issues } };
    if (err.headers) res.set(err.headers);
  } else if (err instanceof ZodError) {
    status = 400;
    const issues = zodIssues(err);
    body = {
      error: {
        code: 'invalid_request',
        message: `Invalid request: ${issues.map((i) => `${i.path || '(body)'} — ${i.message}`).join('; ')}`,
        issues,
      },
    };
  } else if (err && typeof err === 'object' && 'type' in err && typeof err.status === 'number' && err.status < 500) {
    // body-parser errors: malformed JSON, too large, wrong charset…
    status = err.status;
    const messages: Record<string, string> = {
      'entity.too.large': 'The request body is larger than allowed',
      'entity.parse.failed': 'The request body is not valid JSON',
      'charset.unsupported': 'Unsupported character set',
      'encoding.unsupported': 'Unsupported content encoding',
    };
    body = { error: { code: String(err.type), message: messages[String(err.type)] ?? 'Malformed request' } };
  } else if (sqliteCondition(err)) {
    const c = sqliteCondition(err)!;
    console.error(`${c.code}:`, (err as Error).message);
    status = c.status;
    body = { error: { code: c.code, message: c.message } };
  } else {
    console.error(err);
  }
  res.status(status).json(body);
};
