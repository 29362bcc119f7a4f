// The authorization matrix, generated from the router's own route list: every
// declared route × signed out × each role × own/foreign agency. A route added
// without an access rule cannot exist (api.typed and api.file require one), and a route
// mounted outside the list fails the completeness check below.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLE_RANK } from '../../shared/schemas/common';
import type { RouteDef } from '../../server/http/api';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
const users: Record<string, Awaited<ReturnType<TestApp['as']>>> = {};
beforeAll(async () => {
  t = await createTestApp({ signInRateLimit: 1000 });
  users.admin = await t.as('admin@brannock.example');
  users.engineer = await t.as('engineer@brannock.example');
  users.viewer = await t.as('viewer@brannock.example');
});
afterAll(() => t.close());

const fill = (r: RouteDef, agencyId: string) =>
  r.path
    .replace(':agencyId', agencyId)
    .replace(/:([A-Za-z]+)/g, (_m, name: string) => (name === 'id' ? '999999' : `no-such-${name}`));

function send(client: ReturnType<TestApp['anonymous']>, r: RouteDef, url: string) {
  const req = client[r.method](url);
  return r.method === 'get' || r.method === 'delete' ? req : req.send({});
}

const isAgencyNotFound = (res: { status: number; body: { error?: { message?: string } } }) =>
  res.status === 404 && res.body?.error?.message === 'No such agency';

describe('authorization matrix over every declared route', () => {
  it('covers every /api route Express serves', () => {
    const declared = new Set(t.routes.map((r) => `${r.method} ${r.path}`));
    type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };
    const served: string[] = [];
    const walk = (stack: Layer[]) => {
      for (const layer of stack) {
        if (layer.route) for (const m of Object.keys(layer.route.methods)) served.push(`${m} ${layer.route.path}`);
        else if (layer.handle?.stack) walk(layer.handle.stack);
      }
    };
    walk((t.app as unknown as { router: { stack: Layer[] } }).router.stack);
    const undeclared = served.filter(
      (s) => s.includes(' /api/') && !declared.has(s) && !['get /api/health', 'get /api/openapi.json'].includes(s),
    );
    expect(served.length).toBeGreaterThan(50);
    expect(undeclared).toEqual([]);
    expect(t.routes.length).toBeGreaterThan(50);
  });

  it('signed out: every non-public route answers 401', async () => {
    const failures: string[] = [];
    for (const r of t.routes.filter((x) => x.access.kind !== 'public')) {
      const res = await send(t.anonymous(), r, fill(r, t.ids.brannock));
      if (res.status !== 401) failures.push(`${r.method} ${r.path} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  for (const role of ['admin', 'engineer', 'viewer'] as const) {
    it(`${role}: own agency passes or is refused by role; a foreign agency is always 404`, async () => {
      const failures: string[] = [];
      for (const r of t.routes.filter((x) => x.access.kind === 'agency')) {
        if (r.access.kind !== 'agency') continue;
        const own = await send(users[role], r, fill(r, t.ids.brannock));
        const allowed = ROLE_RANK[role] >= ROLE_RANK[r.access.role];
        if (allowed && (own.status === 401 || own.status === 403 || isAgencyNotFound(own)))
          failures.push(`own ${r.method} ${r.path} → ${own.status} (should pass the access check)`);
        if (!allowed && own.status !== 403) failures.push(`own ${r.method} ${r.path} → ${own.status} (should be 403)`);
        if (own.status >= 500) failures.push(`own ${r.method} ${r.path} → ${own.status}`);
        const foreign = await send(users[role], r, fill(r, t.ids.marlow));
        if (!isAgencyNotFound(foreign))
          failures.push(
            `foreign ${r.method} ${r.path} → ${foreign.status} ${JSON.stringify(foreign.body).slice(0, 80)}`,
          );
      }
      expect(failures).toEqual([]);
    });
  }

  // Restoring creates an agency: only someone who administers one already may (server/agencies/agencies.routes.ts).
  const ADMIN_OF_SOME_AGENCY = new Set(['post /api/agencies/restore']);

  it('signed-in routes outside agencies accept any member, whatever the role (restore: admins only)', async () => {
    for (const r of t.routes.filter((x) => x.access.kind === 'signed-in')) {
      for (const role of ['admin', 'engineer', 'viewer'] as const) {
        const res = await send(users[role], r, fill(r, t.ids.brannock));
        const adminsOnly = ADMIN_OF_SOME_AGENCY.has(`${r.method} ${r.path}`);
        const expected = adminsOnly && role !== 'admin' ? [403] : [200, 400, 415];
        expect(expected, `${role} ${r.method} ${r.path}`).toContain(res.status);
      }
    }
  });
});
