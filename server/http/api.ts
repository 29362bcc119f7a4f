// One way to declare an API route: its access rule, its zod schemas and its
// handler together. The same list drives Express, the OpenAPI document and the
// authorization-matrix test, so a route without a rule cannot exist.
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import { ROLE_RANK, type Role } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import { forbidden, HttpError, notFound, unauthorized, zodIssues } from './errors';

export type Access = { kind: 'public' } | { kind: 'signed-in' } | { kind: 'agency'; role: Role };

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export type SessionUser = { id: string; email: string; name: string };

/** The caller's role in an agency, or null when not a member: handed in by the app, so http/ imports no module. */
export type MembershipLookup = (userId: string, agencyId: string) => Role | null;

export type Ctx<P, Q, B> = {
  params: P;
  query: Q;
  body: B;
  user: SessionUser | null;
  /** Set for agency routes: the caller's membership in :agencyId. */
  agency: { id: string; role: Role } | null;
  deps: Deps;
  req: Request;
  res: Response;
  /** Aborted when the client goes away before the answer: pass it to awaited heavy tasks. */
  signal: AbortSignal;
};

type AnyZod = z.ZodType;
type Out<S> = S extends AnyZod ? z.output<S> : undefined;

export type RouteDef<
  PS extends AnyZod | undefined = AnyZod | undefined,
  QS extends AnyZod | undefined = AnyZod | undefined,
  BS extends AnyZod | undefined = AnyZod | undefined,
> = {
  method: Method;
  path: string;
  summary: string;
  tag: string;
  access: Access;
  params?: PS;
  query?: QS;
  body?: BS;
  /** JSON response schema for the docs; omit for files and streams. */
  response?: AnyZod;
  responseDescription?: string;
  status?: number;
  /** Runs heavy work in the worker pool: may answer 429 with Retry-After (documented). */
  heavy?: boolean;
  /** Extra middleware run before validation (uploads, rate limits). */
  before?: RequestHandler[];
  /** Return a value to send it as JSON; return undefined when the handler answered itself. */
  handler: (ctx: Ctx<Out<PS>, Out<QS>, Out<BS>>) => unknown | Promise<unknown>;
};

export type ApiRoutes = {
  list: RouteDef[];
  add: <PS extends AnyZod | undefined, QS extends AnyZod | undefined, BS extends AnyZod | undefined>(
    def: RouteDef<PS, QS, BS>,
  ) => void;
};

export function createApiRoutes(): ApiRoutes {
  const list: RouteDef[] = [];
  return {
    list,
    add(def) {
      if (def.access.kind === 'agency' && !def.path.includes(':agencyId')) {
        throw new Error(`Agency route ${def.path} has no :agencyId`);
      }
      list.push(def as unknown as RouteDef);
    },
  };
}

function parsePart(schema: AnyZod | undefined, value: unknown, where: string) {
  if (!schema) return undefined;
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

function authorize(def: RouteDef, req: Request, roleIn: MembershipLookup) {
  const user = (req.user as SessionUser | undefined) ?? null;
  let agency: Ctx<unknown, unknown, unknown>['agency'] = null;
  if (def.access.kind !== 'public' && !user) throw unauthorized();
  if (def.access.kind === 'agency' && user) {
    const agencyId = String(req.params.agencyId);
    const role = roleIn(user.id, agencyId);
    // Not a member: answer as if the agency did not exist.
    if (!role) throw notFound('No such agency');
    if (ROLE_RANK[role] < ROLE_RANK[def.access.role]) throw forbidden();
    agency = { id: agencyId, role };
  }
  return { user, agency };
}

export function mountApiRoutes(router: Router, routes: ApiRoutes, deps: Deps, roleIn: MembershipLookup) {
  // Literal path parts win over parameters (…/segments/export before …/segments/:id).
  const paramCount = (p: string) => (p.match(/:/g) ?? []).length;
  const ordered = [...routes.list].sort((a, b) => paramCount(a.path) - paramCount(b.path));
  for (const def of ordered) {
    const run = async (req: Request, res: Response, next: NextFunction) => {
      const gone = new AbortController();
      res.once('close', () => {
        if (!res.writableFinished) gone.abort();
      });
      try {
        const { user, agency } = authorize(def, req, roleIn);
        const params = parsePart(def.params, req.params, 'params');
        const query = parsePart(def.query, req.query, 'query');
        if (def.body && !req.is('application/json') && !req.is('multipart/form-data')) {
          throw new HttpError(415, 'unsupported_media_type', 'Send the request body as application/json');
        }
        const body = parsePart(def.body, req.body, 'body');
        const signal = gone.signal;
        const result = await def.handler({ params, query, body, user, agency, deps, req, res, signal } as Ctx<
          never,
          never,
          never
        >);
        if (result !== undefined && !res.headersSent) res.status(def.status ?? 200).json(result);
      } catch (err) {
        // The client went away (its heavy task was stopped for that): nobody is left to answer.
        if (gone.signal.aborted) return;
        next(err);
      }
    };
    // Access is checked before any upload middleware touches the body.
    const guard: RequestHandler = (req, _res, next) => {
      try {
        authorize(def, req, roleIn);
        next();
      } catch (err) {
        next(err);
      }
    };
    const chain: RequestHandler[] = def.before?.length ? [guard, ...def.before] : [];
    router[def.method](def.path, ...chain, run);
  }
}
