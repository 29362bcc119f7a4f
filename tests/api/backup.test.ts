import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import crypto from 'node:crypto';
import Database from 'better-sqlite3';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['as']>>;
const binary = (req: ReturnType<Awaited<ReturnType<TestApp['as']>>['get']>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

beforeAll(async () => {
  t = await createTestApp();
  admin = await t.as('admin@brannock.example');
  // Give the agency a plan and a curve edit, so the archive carries more than the seed.
  await admin.post(`/api/agencies/${t.ids.brannock}/plans`).send({
    name: 'Archived plan',
    settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 1_000_000 },
  });
  // …and a recorded job, with a catalog treatment, so treatment records travel too.
  const catalog = await admin.get(`/api/agencies/${t.ids.brannock}/catalog`);
  await admin.post(`/api/agencies/${t.ids.brannock}/segments/1/treatments`).send({
    treatedOn: '2025-08-12',
    kind: 'chip_seal',
    name: 'Chip seal, single',
    treatmentId: catalog.body.treatments.find((x: { kind: string }) => x.kind === 'chip_seal').id,
    costUsd: 41_250,
    notes: 'Contract 25-07',
  });
  await admin
    .put(`/api/agencies/${t.ids.brannock}/forecast/curves`)
    .send({ familyKey: 'asphalt|local|overlay', curve: { p0: 99, a: 0.6, b: 1.5 } });
});
afterAll(() => t.close());

async function files(buf: Buffer) {
  const zip = await JSZip.loadAsync(buf);
  const out: Record<string, string> = {};
  for (const n of Object.keys(zip.files)) out[n] = await zip.file(n)!.async('string');
  return out;
}
const hash = (s: string) => crypto.createHash('sha256').update(s).digest('hex');

describe('agency export and restore', () => {
  it('round-trips: the restored agency equals the original (counts and content hashes)', async () => {
    const exp = await binary(admin.get(`/api/agencies/${t.ids.brannock}/export`));
    expect(exp.status).toBe(200);
    expect(exp.headers['content-type']).toBe('application/zip');
    const a = await files(exp.body as Buffer);
    const manifest = JSON.parse(a['manifest.json']);
    expect(manifest.counts).toMatchObject({
      segments: 1224,
      mixes: 4,
      treatments: 7,
      plans: 1,
      curves: 1,
      treatmentRecords: 1,
    });
    expect(manifest.counts.surveys).toBeGreaterThan(7000);

    const restored = await admin
      .post('/api/agencies/restore')
      .field('name', 'Brannock County (copy)')
      .attach('file', exp.body as Buffer, 'export.zip');
    expect(restored.status).toBe(201);
    expect(restored.body.counts).toEqual(manifest.counts);
    const me = await admin.get('/api/me');
    expect(me.body.memberships.map((m: { agencyName: string }) => m.agencyName)).toContain('Brannock County (copy)');

    const exp2 = await binary(admin.get(`/api/agencies/${restored.body.agencyId}/export`));
    const b = await files(exp2.body as Buffer);
    expect(JSON.parse(b['manifest.json']).counts).toEqual(manifest.counts);
    // Identical content wherever ids do not appear.
    for (const n of [
      'segments.csv',
      'segments.geojson',
      'surveys.csv',
      'treatment-records.csv',
      'curves.json',
      'import-mappings.json',
      'analyses.json',
    ])
      expect(hash(b[n]), n).toBe(hash(a[n]));
    // The catalog and plans carry new ids: equal once ids are mapped back to names.
    const strip = (txt: string) => {
      const c = JSON.parse(txt);
      const mixName = new Map(c.mixes.map((m: { id: string; name: string }) => [m.id, m.name]));
      return {
        mixes: c.mixes.map(({ id: _i, ...m }: { id: string }) => m),
        treatments: c.treatments.map(({ id: _i, mixId, ...t }: { id: string; mixId: string | null }) => ({
          ...t,
          mix: mixId ? mixName.get(mixId) : null,
        })),
      };
    };
    expect(strip(b['catalog.json'])).toEqual(strip(a['catalog.json']));
    const plansOf = (txt: string) => JSON.parse(txt).map(({ id: _i, ...p }: { id: string }) => p);
    expect(plansOf(b['plans.json'])).toEqual(plansOf(a['plans.json']));
    expect(a['treatment-records.csv']).toContain(
      'BC-E00-00,2025-08-12,chip_seal,"Chip seal, single",Chip seal,,,41250,Contract 25-07',
    );
  });

  it('refuses an edited archive, and another agency cannot export', async () => {
    const exp = await binary(admin.get(`/api/agencies/${t.ids.brannock}/export`));
    const zip = await JSZip.loadAsync(exp.body as Buffer);
    zip.file('surveys.csv', 'segment_id,survey_date,pci,source\nBC-E00-00,2026-01-01,100,edited\n');
    const tampered = await zip.generateAsync({ type: 'nodebuffer' });
    const res = await admin.post('/api/agencies/restore').attach('file', tampered, 'export.zip');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/does not match its hash/);
    const marlow = await t.as('admin@marlow.example');
    expect((await marlow.get(`/api/agencies/${t.ids.brannock}/export`)).status).toBe(404);
    const eng = await t.as('engineer@brannock.example');
    expect((await eng.get(`/api/agencies/${t.ids.brannock}/export`)).status).toBe(403);
  });

  it('the operator backup copies the live database with SQLite’s online backup API', async () => {
    const dest = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'wc-bk-')), 'copy.db');
    await t.sqlite.backup(dest);
    const copy = new Database(dest, { readonly: true });
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    const n = (db: Database.Database) => (db.prepare('SELECT count(*) AS n FROM segments').get() as { n: number }).n;
    expect(n(copy)).toBe(n(t.sqlite));
    copy.close();
  });
});
