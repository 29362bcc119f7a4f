// Restore as a hostile or careless user would try it: who may restore, ids that
// name another agency's rows, what the report counts, the rate limit. (Malformed
// archives are cases in hostile.test.ts.)
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { editedArchive, editFeature, editJson } from '../helpers/archive';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { until } from '../helpers/until';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['as']>>;
let exported: Buffer;
const binary = (req: ReturnType<Awaited<ReturnType<TestApp['as']>>['get']>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
const n = (sql: string, ...a: unknown[]) => (t.sqlite.prepare(sql).get(...a) as { n: number }).n;

beforeAll(async () => {
  t = await createTestApp({ restoreRateLimit: 1000 });
  admin = await t.as('admin@marlow.example');
  await admin
    .put(`/api/agencies/${t.ids.marlow}/forecast/curves`)
    .send({ familyKey: 'asphalt|local|overlay', curve: { p0: 99, a: 0.6, b: 1.5 } });
  exported = (await binary(admin.get(`/api/agencies/${t.ids.marlow}/export`))).body as Buffer;
});
afterAll(() => t.close());

describe('restore', () => {
  it('is refused to signed-in users who administer no agency, before the upload is read', async () => {
    const agencies = n('SELECT count(*) AS n FROM agencies');
    for (const email of ['viewer@brannock.example', 'engineer@marlow.example']) {
      const u = await t.as(email);
      const res = await u.post('/api/agencies/restore').attach('file', exported, 'export.zip');
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/Only an admin of an agency may restore/);
    }
    expect((await t.anonymous().post('/api/agencies/restore').attach('file', exported, 'x.zip')).status).toBe(401);
    expect(n('SELECT count(*) AS n FROM agencies')).toBe(agencies);
  });

  it('rows that carry another agency’s id or a row id of its own never touch that agency', async () => {
    // Brannock is the target: its curves and mixes, named by id in the edited archive.
    const bMix = t.sqlite
      .prepare('SELECT id, price_per_ton AS p FROM mixes WHERE agency_id = ? LIMIT 1')
      .get(t.ids.brannock) as {
      id: string;
      p: number;
    };
    const bCurves = n('SELECT count(*) AS n FROM curve_overrides WHERE agency_id = ?', t.ids.brannock);
    const hostile = await editedArchive(exported, (files) => {
      editJson<{ familyKey: string; p0: number; a: number; b: number }[]>('curves.json', (c) =>
        c.map((x) => ({ ...x, agencyId: t.ids.brannock, a: 3 })),
      )(files);
      // The first mix takes the id of a Brannock mix (and the treatments follow it).
      editJson<{ mixes: { id: string }[]; treatments: { mixId: string | null }[] }>('catalog.json', (c) => {
        const old = c.mixes[0].id;
        c.mixes[0] = { ...c.mixes[0], id: bMix.id, pricePerTon: 9999, agencyId: t.ids.brannock } as never;
        for (const tr of c.treatments) if (tr.mixId === old) tr.mixId = bMix.id;
        return c;
      })(files);
    });
    const res = await admin.post('/api/agencies/restore').attach('file', hostile, 'export.zip');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const restored = res.body.agencyId;
    expect(n('SELECT count(*) AS n FROM curve_overrides WHERE agency_id = ?', t.ids.brannock)).toBe(bCurves);
    expect(n('SELECT count(*) AS n FROM curve_overrides WHERE agency_id = ? AND a = 3', restored)).toBe(1);
    const mix = t.sqlite.prepare('SELECT agency_id AS a, price_per_ton AS p FROM mixes WHERE id = ?').get(bMix.id) as {
      a: string;
      p: number;
    };
    expect(mix).toEqual({ a: t.ids.brannock, p: bMix.p });
    expect(n('SELECT count(*) AS n FROM mixes WHERE agency_id = ? AND price_per_ton = 9999', restored)).toBe(1);
    // Nothing about the restore landed in Brannock's audit trail either.
    expect(
      n("SELECT count(*) AS n FROM audit_log WHERE agency_id = ? AND action = 'agency.restore'", t.ids.brannock),
    ).toBe(0);
  });

  it('the report and the audit entry count what was written', async () => {
    const res = await admin
      .post('/api/agencies/restore')
      .field('name', 'Marlow copy')
      .attach('file', exported, 'e.zip');
    expect(res.status).toBe(201);
    const id = res.body.agencyId;
    const written = {
      segments: n('SELECT count(*) AS n FROM segments WHERE agency_id = ?', id),
      surveys: n('SELECT count(*) AS n FROM surveys WHERE agency_id = ?', id),
      treatmentRecords: n('SELECT count(*) AS n FROM treatment_records WHERE agency_id = ?', id),
      mixes: n('SELECT count(*) AS n FROM mixes WHERE agency_id = ?', id),
      treatments: n('SELECT count(*) AS n FROM treatments WHERE agency_id = ?', id),
      plans: n('SELECT count(*) AS n FROM plans WHERE agency_id = ?', id),
      analyses: n('SELECT count(*) AS n FROM analyses WHERE agency_id = ?', id),
      curves: n('SELECT count(*) AS n FROM curve_overrides WHERE agency_id = ?', id),
    };
    expect(written.segments).toBe(84);
    expect(res.body.counts).toEqual(written);
    const audit = t.sqlite
      .prepare("SELECT detail FROM audit_log WHERE agency_id = ? AND action = 'agency.restore'")
      .get(id) as { detail: string };
    expect(JSON.parse(audit.detail).counts).toEqual(written);
  });

  it('an operator setting lets every signed-in user restore; restores are rate-limited per user', async () => {
    const open = await createTestApp({ restoreByAnyUser: true, restoreRateLimit: 2 });
    try {
      const viewer = await open.as('viewer@brannock.example');
      const marlowAdmin = await open.as('admin@marlow.example');
      const archive = (await binary(marlowAdmin.get(`/api/agencies/${open.ids.marlow}/export`))).body as Buffer;
      expect((await viewer.post('/api/agencies/restore').attach('file', archive, 'a.zip')).status).toBe(201);
      expect((await viewer.post('/api/agencies/restore').attach('file', Buffer.from('x'), 'b.zip')).status).toBe(400);
      const third = await viewer.post('/api/agencies/restore').attach('file', archive, 'c.zip');
      expect(third.status).toBe(429);
      expect(third.body.error.message).toMatch(/At most 2 restores an hour/);
    } finally {
      await open.close();
    }
  });
});

// Restore in the worker pool, by ordering (never by timing): while a restore cannot finish (this test holds
// SQLite's write lock on a connection of its own) its slot is taken, /api/health answers and the restorer's
// next heavy task answers 429; a refusal from the worker names the file, row and field; a write that fails
// part-way leaves no agency and no stray rows.
describe('restore in the worker pool', () => {
  let p: TestApp;
  let pAdmin: Awaited<ReturnType<TestApp['as']>>;
  let archive: Buffer;
  const m = (sql: string, ...a: unknown[]) => (p.sqlite.prepare(sql).get(...a) as { n: number }).n;
  const everything = () => ({
    agencies: m('SELECT count(*) AS n FROM agencies'),
    memberships: m('SELECT count(*) AS n FROM memberships'),
    segments: m('SELECT count(*) AS n FROM segments'),
    surveys: m('SELECT count(*) AS n FROM surveys'),
    mixes: m('SELECT count(*) AS n FROM mixes'),
    audit: m('SELECT count(*) AS n FROM audit_log'),
  });
  beforeAll(async () => {
    p = await createTestApp({ restoreRateLimit: 1000, workers: { threads: 2, perAgency: 1, perUser: 1 } });
    pAdmin = await p.as('admin@marlow.example');
    // The export also starts a worker thread, so the locked test below does not wait for a cold one.
    archive = (await binary(pAdmin.get(`/api/agencies/${p.ids.marlow}/export`))).body as Buffer;
  }, 60_000);
  afterAll(() => p.close());

  it('while a restore cannot finish, its slot is taken, /api/health answers and the restorer gets 429', {
    timeout: 60_000,
  }, async () => {
    const before = everything();
    const lock = new Database(p.deps.config.databasePath);
    lock.exec('BEGIN IMMEDIATE');
    let answered = false;
    const pending = pAdmin
      .post('/api/agencies/restore')
      .field('name', 'Held copy')
      .attach('file', archive, 'held.zip')
      .then((r) => {
        answered = true;
        return r;
      });
    try {
      await until(() => p.deps.pool.busy === 1, 'the restore takes its slot');
      const health = await p.anonymous().get('/api/health');
      expect(health.status).toBe(200);
      const refused = await pAdmin.get(`/api/agencies/${p.ids.marlow}/export`);
      expect(refused.status).toBe(429);
      expect(refused.headers['retry-after']).toBe('10');
      expect(refused.body.error.message).toMatch(/^You already have 1 heavy task going/);
      expect(answered).toBe(false);
      expect(everything()).toEqual(before);
    } finally {
      lock.exec('ROLLBACK');
      lock.close();
    }
    const res = await pending;
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.counts.segments).toBe(84);
    expect(p.deps.pool.busy).toBe(0);
    // The new agency's list is read fresh (the route bumped its cache entry on the request thread).
    const list = await pAdmin.get(`/api/agencies/${res.body.agencyId}/segments?limit=1`);
    expect(list.body.total).toBe(84);
  });

  it('a refusal from inside the worker names the file, the row and the field; nothing is written', async () => {
    const before = everything();
    const bad = await editedArchive(archive, editFeature(1, { pci: 500 }));
    const res = await pAdmin.post('/api/agencies/restore').attach('file', bad, 'bad.zip');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_archive');
    expect(res.body.error.issues).toEqual([
      { path: expect.stringMatching(/^segments\.geojson\b.*\b2\b.*pci/), message: expect.stringMatching(/100/) },
    ]);
    expect(everything()).toEqual(before);
  });

  it('a write that fails after 20 segments leaves no agency, no membership and no stray rows', async () => {
    const before = everything();
    // A real SQLite refusal in the middle of the worker's transaction: the 21st segment of a new agency.
    p.sqlite.exec(`CREATE TRIGGER refuse_restore BEFORE INSERT ON segments
      WHEN NEW.agency_id NOT IN ('${p.ids.brannock}', '${p.ids.marlow}')
       AND (SELECT count(*) FROM segments WHERE agency_id = NEW.agency_id) >= 20
      BEGIN SELECT RAISE(ABORT, 'refused by the test'); END`);
    try {
      const res = await pAdmin.post('/api/agencies/restore').attach('file', archive, 'half.zip');
      expect(res.status).toBe(500);
      expect(res.body.error).toEqual({ code: 'internal', message: 'Something went wrong on our side' });
    } finally {
      p.sqlite.exec('DROP TRIGGER refuse_restore');
    }
    expect(everything()).toEqual(before);
    expect(
      m('SELECT count(*) AS n FROM segments WHERE agency_id NOT IN (SELECT id FROM agencies)') +
        m('SELECT count(*) AS n FROM mixes WHERE agency_id NOT IN (SELECT id FROM agencies)'),
    ).toBe(0);
    expect(p.deps.pool.busy).toBe(0);
  });
});
