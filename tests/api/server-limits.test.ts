// Limits that protect the server: the origin check (no DNS rebinding), a full disk
// answered in words, the list cache bounded by bytes, the map's vertices per line.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allowedOrigins } from '../../server/http/security';
import { MAX_VERTICES_STORED } from '../../server/imports/geometry';
import type { TaskRef } from '../../server/pool/task';
import { ListCache } from '../../server/segments/list-cache';
import { APP_URL, createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
beforeAll(async () => {
  t = await createTestApp({ allowedOrigins: ['https://roads.example.gov'] });
  eng = await t.as('engineer@brannock.example');
});
afterAll(() => t.close());

describe('origin check', () => {
  const evaluate = (origin: string, host?: string) => {
    let r = eng.agent.post('/api/lcca/evaluate').set('Origin', origin);
    if (host) r = r.set('Host', host);
    return r.send({
      discountRate: 0.04,
      analysisPeriodYears: 10,
      alternatives: [{ name: 'A', activities: [{ year: 0, cost: 1, serviceLifeYears: 5 }] }],
    });
  };

  it('refuses an Origin that merely equals the Host it sent (DNS rebinding)', async () => {
    const res = await evaluate('http://rebound.example:3999', 'rebound.example:3999');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });

  it('accepts APP_URL, its loopback twins on the same port, and ALLOWED_ORIGINS; nothing else', async () => {
    expect((await evaluate(APP_URL)).status).toBe(200);
    expect((await evaluate('http://127.0.0.1:3999')).status).toBe(200);
    expect((await evaluate('https://roads.example.gov')).status).toBe(200);
    expect((await evaluate('http://127.0.0.1:4000')).status).toBe(403);
    expect((await evaluate('https://localhost:3999')).status).toBe(403);
    expect((await evaluate('http://localhost.attacker.example:3999')).status).toBe(403);
  });

  it('a public APP_URL gets no loopback twins', () => {
    expect([...allowedOrigins('https://wearcourse.example.gov', [])]).toEqual(['https://wearcourse.example.gov']);
  });
});

describe('a full disk', () => {
  const rows = Array.from({ length: 3000 }, (_, i) => `FULL-${i},Full Rd ${'x'.repeat(100)},1,24,2,local,asphalt`);
  const file = Buffer.from(
    `segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\n${rows.join('\n')}\n`,
  );
  const count = (db: TestApp['sqlite']) => (db.prepare('SELECT count(*) AS n FROM segments').get() as { n: number }).n;

  it('answers 507 with a message, and writes nothing (a write on the request thread)', async () => {
    const pages = t.sqlite.pragma('page_count', { simple: true }) as number;
    const before = count(t.sqlite);
    // SQLite's own limit on the file's size: writes past it fail with SQLITE_FULL, as on a full disk.
    t.sqlite.pragma(`max_page_count = ${pages}`);
    let refused = -1;
    try {
      // Segment edits with long notes, one at a time, until one needs a page the file may not grow by.
      const ids = (
        t.sqlite.prepare('SELECT id FROM segments WHERE agency_id = ? LIMIT 500').all(t.ids.brannock) as {
          id: number;
        }[]
      ).map((r) => r.id);
      let res: Awaited<ReturnType<typeof eng.patch>> | null = null;
      for (const [i, id] of ids.entries()) {
        res = await eng
          .patch(`/api/agencies/${t.ids.brannock}/segments/${id}`)
          .send({ notes: `full ${'x'.repeat(1990)}` });
        if (res.status !== 200) {
          refused = id;
          break;
        }
        if (i === ids.length - 1) throw new Error('the file never filled');
      }
      expect(res!.status).toBe(507);
      expect(res!.body.error).toMatchObject({ code: 'storage_full' });
      expect(res!.body.error.message).toMatch(/disk is full, so nothing was saved/);
    } finally {
      t.sqlite.pragma('max_page_count = 4294967294');
    }
    // The edits before the full one were saved one by one; the one refused was not.
    expect(count(t.sqlite)).toBe(before);
    const notes = t.sqlite.prepare('SELECT notes FROM segments WHERE id = ?').get(refused) as { notes: string | null };
    expect(notes.notes ?? '').not.toMatch(/^full /);
  });

  it('answers 507 when the write that finds the disk full runs in a worker (an import), and writes nothing', async () => {
    // One worker thread, so the cap set on its connection is the one the import writes with.
    const one = await createTestApp({ workers: { threads: 1, perAgency: 1, perUser: 1 } });
    try {
      const e = await one.as('engineer@brannock.example');
      const owner = { userId: 'test', agencyId: null };
      const limit = new URL('../helpers/page-limit.task.ts', import.meta.url);
      await one.deps.pool.run(
        { href: limit.href } as TaskRef<{ extraPages: number | null }, number>,
        { extraPages: 0 },
        owner,
      );
      const before = count(one.sqlite);
      const res = await e.post(`/api/agencies/${one.ids.brannock}/imports`).attach('file', file, 'full.csv');
      expect(res.status).toBe(507);
      expect(res.body.error).toMatchObject({ code: 'storage_full' });
      expect(res.body.error.message).toMatch(/disk is full, so nothing was saved/);
      expect(count(one.sqlite)).toBe(before);
      await one.deps.pool.run(
        { href: limit.href } as TaskRef<{ extraPages: number | null }, number>,
        { extraPages: null },
        owner,
      );
      const again = await e.post(`/api/agencies/${one.ids.brannock}/imports`).attach('file', file, 'full.csv');
      expect(again.status).toBe(200);
      expect(count(one.sqlite)).toBe(before + 3000);
    } finally {
      await one.close();
    }
  });
});

describe('the list cache', () => {
  it('is bounded by bytes: the oldest pages go first, an oversized page is never kept', () => {
    const c = new ListCache(100_000);
    const page = (n: number) => 'x'.repeat(n);
    for (let i = 0; i < 50; i++) c.set(c.key('A', { i }), page(4_000));
    expect(c.bytes).toBeLessThanOrEqual(100_000);
    expect(c.get(c.key('A', { i: 0 }))).toBeUndefined();
    expect(c.get(c.key('A', { i: 49 }))).toBeDefined();
    c.set(c.key('A', { big: true }), page(20_000));
    expect(c.get(c.key('A', { big: true }))).toBeUndefined();
    const held = c.size;
    c.bump('A');
    expect(c.size).toBe(0);
    expect(c.bytes).toBe(0);
    expect(held).toBeGreaterThan(0);
  });

  it('the list route keeps to the budget: pages past it push the oldest out, answers stay right', async () => {
    const original = t.deps.listCache;
    const small = new ListCache(800 * 1024);
    t.deps.listCache = small;
    try {
      const pages = [];
      for (let offset = 0; offset < 1300; offset += 100)
        pages.push((await eng.get(`/api/agencies/${t.ids.brannock}/segments?limit=100&offset=${offset}`)).body);
      expect(small.bytes).toBeLessThanOrEqual(800 * 1024);
      // Kept some, and let some go: 13 pages of about 70 KB each (as UTF-16) do not fit in 800 KB.
      expect(small.size).toBeGreaterThan(5);
      expect(small.size).toBeLessThan(pages.length);
      const again = await eng.get(`/api/agencies/${t.ids.brannock}/segments?limit=100&offset=0`);
      expect(again.body).toEqual(pages[0]);
    } finally {
      t.deps.listCache = original;
    }
  });
});

describe('vertices on the map', () => {
  it('a stored line of 5,000 positions reaches the map simplified to at most the limit', async () => {
    const coords = Array.from({ length: 5000 }, (_, i) => [-98.5 + i * 1e-5, 38.8 + (i % 2) * 1e-5]);
    t.sqlite
      .prepare(
        "INSERT INTO segments (agency_id, segment_id, road_name, length_mi, width_ft, lanes, functional_class, surface, geometry) VALUES (?, 'DENSE-1', 'Dense Rd', 4.4, 24, 2, 'local', 'asphalt', ?)",
      )
      .run(t.ids.brannock, JSON.stringify({ type: 'LineString', coordinates: coords }));
    t.deps.listCache?.bump(t.ids.brannock);
    const res = await eng.get(`/api/agencies/${t.ids.brannock}/segments.geojson?q=DENSE-1`);
    const f = JSON.parse(res.text).features[0];
    expect(f.properties.s).toBe('DENSE-1');
    expect(f.geometry.coordinates.length).toBeLessThanOrEqual(MAX_VERTICES_STORED);
    expect(f.geometry.coordinates[0]).toEqual(coords[0]);
  });
});

describe('health stays public', () => {
  it('answers without a session or an Origin', async () => {
    expect((await request(t.app).get('/api/health')).body).toEqual({ ok: true });
  });
});
