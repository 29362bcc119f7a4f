// Request validation with the routes' zod schemas: 400 with issues naming each field. Used on the request
// thread (server/http/api.ts) and in worker tasks that parse a large body themselves (RouteDef.bodyInWorker).
import type { z } from 'zod';
import { HttpError, zodIssues } from './errors';

export function parsePart<S extends z.ZodType>(schema: S, value: unknown, where: string): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) {
    const issues = zodIssues(result.error, where);
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: ${issues.map((i) => `${i.path} — ${i.message}`).join('; ')}`,
      issues,
    );
  }
  return result.data;
}

/** A JSON body given as bytes: parsed and checked as the request thread would have. */
export function parseJsonBody<S extends z.ZodType>(schema: S, bytes: Uint8Array): z.output<S> {
  let value: unknown;
  try {
    value = JSON.parse(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('utf8'));
  } catch {
    throw new HttpError(400, 'entity.parse.failed', 'The request body is not valid JSON');
  }
  return parsePart(schema, value, 'body');
}
