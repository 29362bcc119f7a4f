// One way to declare an API route: its access rule, its zod schemas and its
// handler together. The same list drives Express, the OpenAPI document and the
// authorization-matrix test, so a route without a rule cannot exist.
import express, { type NextFunction, type Request, type RequestHandler, type Response, type Router } from 'express';
import type { z } from 'zod';
import { ROLE_RANK, type Role } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import { forbidden, HttpError, notFound, unauthorized } from './errors';
import { parsePart } from './validate';

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
  /** Set for bodyInWorker routes: the JSON body's bytes, unparsed (body is then undefined). */
  rawBody: Buffer | null;
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
  /**
   * The JSON body can be large (up to the 1 MB limit): the request thread only reads its bytes (ctx.rawBody)
   * and the route's task parses and checks them against `body` (parseJsonBody), off the request thread.
   */
  bodyInWorker?: boolean;
  /** Extra middleware run before validation (uploads, rate limits). */
  before?: RequestHandler[];
  /** Return a value to send it as JSON; return undefined when the handler answered itself. */
  handler: (ctx: Ctx<Out<PS>, Out<QS>, Out<BS>>) => unknown | Promise<unknown>;
};

declare const answered: unique symbol;
/** What a typed handler returns when it wrote the answer itself (`sendJsonText`). */
export type Answered = { readonly [answered]: true };

/**
 * Sends JSON text the caller already holds (a cached page, stored result bytes) as the answer of a
 * typed route; the text must be what the route's response schema describes.
 */
export function sendJsonText(res: Response, json: string | Buffer): Answered {
  res.type('application/json').send(json);
  return undefined as unknown as Answered;
}

/**
 * A JSON route: `response` is required and the compiler checks that the handler returns what it
 * describes (or `sendJsonText(...)` for JSON text it already holds).
 */
export type TypedRouteDef<
  PS extends AnyZod | undefined,
  QS extends AnyZod | undefined,
  BS extends AnyZod | undefined,
  RS extends AnyZod,
> = Omit<RouteDef<PS, QS, BS>, 'response' | 'handler'> & {
  response: RS;
  handler: (
    ctx: Ctx<Out<PS>, Out<QS>, Out<BS>>,
  ) => NoInfer<z.output<RS>> | Answered | Promise<NoInfer<z.output<RS>> | Answered>;
};

/** A route that answers with a file or a stream itself: it says what it sends, and returns nothing. */
export type FileRouteDef<
  PS extends AnyZod | undefined,
  QS extends AnyZod | undefined,
  BS extends AnyZod | undefined,
> = Omit<RouteDef<PS, QS, BS>, 'response' | 'handler' | 'responseDescription'> & {
  responseDescription: string;
  handler: (ctx: Ctx<Out<PS>, Out<QS>, Out<BS>>) => void | Promise<void>;
};

export type ApiRoutes = {
  list: RouteDef[];
  /** A JSON route, its handler's return checked against `response` at compile time. */
  typed: <
    PS extends AnyZod | undefined,
    QS extends AnyZod | undefined,
    BS extends AnyZod | undefined,
    RS extends AnyZod,
  >(
    def: TypedRouteDef<PS, QS, BS, RS>,
  ) => void;
  /** A file or stream route: no JSON answer, `responseDescription` says what is sent. */
  file: <PS extends AnyZod | undefined, QS extends AnyZod | undefined, BS extends AnyZod | undefined>(
    def: FileRouteDef<PS, QS, BS>,
  ) => void;
};

export function createApiRoutes(): ApiRoutes {
  const list: RouteDef[] = [];
  const add = (def: { access: Access; path: string }) => {
    if (def.access.kind === 'agency' && !def.path.includes(':agencyId')) {
      throw new Error(`Agency route ${def.path} has no :agencyId`);
    }
    list.push(def as unknown as RouteDef);
  };
  return { list, typed: add, file: add };
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

const pathPattern = (p: string) =>
  new RegExp(`^${p.replace(/[.+*?^$()[\]{}|\\]/g, '\\$&').replace(/:[A-Za-z]+/g, '[^/]+')}$`);

/** For the JSON parser in front of the routes: true for requests to bodyInWorker routes, which read bytes. */
export function readsRawBody(routes: ApiRoutes) {
  let raw: { method: string; pattern: RegExp }[] | null = null;
  return (req: Request) => {
    raw ??= routes.list
      .filter((r) => r.bodyInWorker)
      .map((r) => ({ method: r.method.toUpperCase(), pattern: pathPattern(r.path) }));
    const p = req.originalUrl.split('?')[0];
    return raw.some((r) => r.method === req.method && r.pattern.test(p));
  };
}

export function mountApiRoutes(
  router: Router,
  routes: ApiRoutes,
  deps: Deps,
  opts: { roleIn: MembershipLookup; jsonLimit: string },
) {
  const { roleIn } = opts;
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
        const params = def.params ? parsePart(def.params, req.params, 'params') : undefined;
        const query = def.query ? parsePart(def.query, req.query, 'query') : undefined;
        if (def.body && !req.is('application/json') && !req.is('multipart/form-data')) {
          throw new HttpError(415, 'unsupported_media_type', 'Send the request body as application/json');
        }
        // No body reads as {}, as the JSON parser would give it.
        const rawBody = !def.bodyInWorker
          ? null
          : Buffer.isBuffer(req.body) && req.body.length
            ? req.body
            : Buffer.from('{}');
        const body = def.body && !def.bodyInWorker ? parsePart(def.body, req.body, 'body') : undefined;
        const signal = gone.signal;
        const result = await def.handler({ params, query, body, user, agency, deps, req, res, signal, rawBody } as Ctx<
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
    const before = [
      ...(def.bodyInWorker ? [express.raw({ type: 'application/json', limit: opts.jsonLimit })] : []),
      ...(def.before ?? []),
    ];
    const chain: RequestHandler[] = before.length ? [guard, ...before] : [];
    router[def.method](def.path, ...chain, run);
  }
}
