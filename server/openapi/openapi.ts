import { OpenAPIRegistry, OpenApiGeneratorV31 } from '@asteasolutions/zod-to-openapi';
import type { z } from 'zod';
import { ErrorBodySchema } from '../../shared/schemas/common';
import type { RouteDef } from '../http/api';

// The OpenAPI document is generated from the same route list and zod schemas
// the server validates with, so it cannot drift from what the API accepts.
export function buildOpenApiDocument(routes: RouteDef[]) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'session', {
    type: 'apiKey',
    in: 'cookie',
    name: 'wearcourse.sid',
    description: 'Session cookie set by POST /api/auth/sign-in/email',
  });
  const error = { content: { 'application/json': { schema: ErrorBodySchema } } };
  for (const r of routes) {
    const path = r.path.replace(/:([A-Za-z]+)/g, '{$1}');
    const accessNote =
      r.access.kind === 'public'
        ? 'No sign-in needed.'
        : r.access.kind === 'signed-in'
          ? 'Any signed-in user.'
          : `Members of the agency with role ${r.access.role} or higher.`;
    registry.registerPath({
      method: r.method,
      path,
      tags: [r.tag],
      summary: r.summary,
      description: accessNote,
      security: r.access.kind === 'public' ? [] : [{ session: [] }],
      request: {
        params: r.params as z.ZodObject | undefined,
        query: r.query as z.ZodObject | undefined,
        body: r.body ? { content: { 'application/json': { schema: r.body } } } : undefined,
      },
      responses: {
        [String(r.status ?? 200)]: r.response
          ? { description: r.responseDescription ?? 'OK', content: { 'application/json': { schema: r.response } } }
          : { description: r.responseDescription ?? 'OK' },
        400: { description: 'Invalid request; issues name each field', ...error },
        ...(r.access.kind === 'public' ? {} : { 401: { description: 'Not signed in', ...error } }),
        ...(r.heavy
          ? {
              429: {
                description:
                  'Too many heavy tasks at once (for you, your agency or the whole server); the message says which. Try again after Retry-After seconds.',
                headers: {
                  'Retry-After': { description: 'Seconds to wait before trying again', schema: { type: 'integer' } },
                },
                ...error,
              },
            }
          : {}),
        ...(r.access.kind === 'agency'
          ? {
              403: { description: 'Role too low', ...error },
              404: { description: 'No such agency (or not a member)', ...error },
            }
          : {}),
      },
    });
  }
  const generator = new OpenApiGeneratorV31(registry.definitions);
  return generator.generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Wearcourse API',
      version: '0.1.0',
      description:
        'Road inventory, life-cycle cost comparison and paving budget plans. Agency data lives under /api/agencies/{agencyId}. ' +
        'State-changing requests must carry an Origin header matching the server (CSRF defence for cookie sessions).',
    },
    servers: [{ url: '/' }],
  });
}
