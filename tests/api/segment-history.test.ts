// A segment's history through the API: surveys added by hand, treatments
// recorded, what each changes on the segment, in lists and the network
// summary, the audit trail, validation at the field, and who may do it.
import { and, desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, segments } from '../../server/db/schema';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let viewer: Awaited<ReturnType<TestApp['as']>>;
let base: string;
let seg: { id: number; segmentId: string; pci: number; pciDate: string; lastTreatmentYear: number | null };
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  viewer = await t.as('viewer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}`;
  // A surveyed asphalt segment of the demo county.
  seg = (await eng.get(`${base}/segments?q=BC-E10-03&limit=1`)).body.items[0];
});
afterAll(() => t.close());

const lastAudit = () =>
  t.db
    .select()
    .from(auditLog)
    .where(and(eq(auditLog.agencyId, t.ids.brannock), eq(auditLog.entityId, seg.segmentId)))
    .orderBy(desc(auditLog.id))
    .get()!;

describe('adding a survey', () => {
  it('a newer survey becomes the latest PCI, in the detail, the list and the network summary', async () => {
    const netBefore = (await eng.get(`${base}/network`)).body;
    const listBefore = (await eng.get(`${base}/segments?q=${seg.segmentId}&limit=1`)).body.items[0];
    expect(listBefore.pci).toBe(seg.pci);
    const res = await eng
      .post(`${base}/segments/${seg.id}/surveys`)
      .send({ surveyDate: '2026-09-15', pci: 12, source: 'windshield survey' });
    expect(res.status).toBe(201);
    expect(res.body.pci).toBe(12);
    expect(res.body.pciDate).toBe('2026-09-15');
    expect(res.body.surveys.at(-1)).toEqual({ surveyDate: '2026-09-15', pci: 12, source: 'windshield survey' });
    // The paged list is cached per agency; the write bumped it.
    const listAfter = (await eng.get(`${base}/segments?q=${seg.segmentId}&limit=1`)).body.items[0];
    expect(listAfter.pci).toBe(12);
    const netAfter = (await eng.get(`${base}/network`)).body;
    expect(netAfter.weightedPci).toBeLessThan(netBefore.weightedPci);
    const a = lastAudit();
    expect(a.action).toBe('survey.add');
    expect(JSON.parse(a.detail!)).toMatchObject({ pci: 12, latestPci: { before: seg.pci, after: 12 } });
  });

  it('an older survey joins the history and leaves the latest PCI alone', async () => {
    const res = await eng.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2018-06-01', pci: 77 });
    expect(res.status).toBe(201);
    expect(res.body.pci).toBe(12);
    expect(res.body.surveys[0]).toEqual({ surveyDate: '2018-06-01', pci: 77, source: null });
  });

  it('a second survey on the same date is refused at the date field, and nothing is written', async () => {
    const res = await eng.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2026-09-15', pci: 50 });
    expect(res.status).toBe(409);
    expect(res.body.error.issues).toEqual([
      { path: 'body.surveyDate', message: `${seg.segmentId} already has a survey on 2026-09-15` },
    ]);
    const after = await eng.get(`${base}/segments/${seg.id}`);
    expect(after.body.pci).toBe(12);
  });

  it('validation names the field in plain words', async () => {
    const high = await eng.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2026-01-10', pci: 120 });
    expect(high.status).toBe(400);
    expect(high.body.error.issues).toEqual([{ path: 'body.pci', message: 'must be 100 or less' }]);
    const future = await eng.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2999-01-01', pci: 50 });
    expect(future.body.error.issues).toEqual([{ path: 'body.surveyDate', message: 'cannot be in the future' }]);
    const missing = await eng.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '06/04/2026' });
    expect(missing.body.error.issues).toEqual([
      { path: 'body.surveyDate', message: 'must be a date (YYYY-MM-DD)' },
      { path: 'body.pci', message: 'is required' },
    ]);
  });
});

describe('recording a treatment', () => {
  it('the newest job becomes the last treatment; a PCI after the work becomes a survey', async () => {
    const res = await eng.post(`${base}/segments/${seg.id}/treatments`).send({
      treatedOn: '2026-10-02',
      kind: 'mill_and_overlay',
      name: 'Mill 2 in, overlay 2 in',
      mix: 'Dense-graded 12.5 mm',
      thicknessIn: 2,
      costUsd: 184_500,
      notes: 'Night work',
      pciAfter: 98,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      treatedOn: '2026-10-02',
      kind: 'mill_and_overlay',
      name: 'Mill 2 in, overlay 2 in',
      thicknessIn: 2,
      costUsd: 184_500,
      recordedBy: expect.any(String),
    });
    const detail = (await eng.get(`${base}/segments/${seg.id}`)).body;
    expect(detail.lastTreatment).toBe('mill and overlay');
    expect(detail.lastTreatmentYear).toBe(2026);
    expect(detail.pci).toBe(98);
    expect(detail.surveys.at(-1)).toEqual({
      surveyDate: '2026-10-02',
      pci: 98,
      source: 'after Mill 2 in, overlay 2 in',
    });
    const list = (await eng.get(`${base}/segments?q=${seg.segmentId}&limit=1`)).body.items[0];
    expect(list).toMatchObject({ lastTreatment: 'mill and overlay', lastTreatmentYear: 2026, pci: 98 });
    const a = lastAudit();
    expect(a.action).toBe('treatment.record');
    expect(JSON.parse(a.detail!)).toMatchObject({ kind: 'mill_and_overlay', costUsd: 184_500, pciAfter: 98 });
  });

  it('an older job joins the history, newest first, without changing the last treatment', async () => {
    const res = await eng
      .post(`${base}/segments/${seg.id}/treatments`)
      .send({ treatedOn: '2011-07-20', kind: 'crack_seal', name: 'Crack seal' });
    expect(res.status).toBe(201);
    const history = (await viewer.get(`${base}/segments/${seg.id}/treatments`)).body.items;
    expect(history.map((h: { treatedOn: string }) => h.treatedOn)).toEqual(['2026-10-02', '2011-07-20']);
    const row = t.db.select().from(segments).where(eq(segments.id, seg.id)).get()!;
    expect(row.lastTreatment).toBe('mill and overlay');
  });

  it('validation names the field; a treatment from another agency’s catalog is refused', async () => {
    const thin = await eng
      .post(`${base}/segments/${seg.id}/treatments`)
      .send({ treatedOn: '2026-05-01', kind: 'thin_overlay', name: 'Thin lift', thicknessIn: 0 });
    expect(thin.status).toBe(400);
    expect(thin.body.error.issues).toEqual([{ path: 'body.thicknessIn', message: 'must be more than 0' }]);
    expect(thin.body.error.message).toBe('Invalid request: body.thicknessIn — must be more than 0');
    const kind = await eng
      .post(`${base}/segments/${seg.id}/treatments`)
      .send({ treatedOn: '2026-05-01', name: 'x', kind: 'paint' });
    expect(kind.body.error.issues[0].path).toBe('body.kind');
    const marlowCatalog = await (await t.as('admin@marlow.example')).get(`/api/agencies/${t.ids.marlow}/catalog`);
    const foreign = marlowCatalog.body.treatments[0].id;
    const res = await eng
      .post(`${base}/segments/${seg.id}/treatments`)
      .send({ treatedOn: '2026-05-01', kind: 'chip_seal', name: 'Chip seal', treatmentId: foreign });
    expect(res.status).toBe(400);
    expect(res.body.error.issues).toEqual([{ path: 'body.treatmentId', message: 'is not in this agency’s catalog' }]);
    expect((await eng.get(`${base}/segments/${seg.id}/treatments`)).body.items).toHaveLength(2);
  });
});

describe('who may write history', () => {
  it('a viewer reads the history but may not add to it (403)', async () => {
    expect((await viewer.get(`${base}/segments/${seg.id}/treatments`)).status).toBe(200);
    const s = await viewer.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2026-01-02', pci: 60 });
    const tr = await viewer
      .post(`${base}/segments/${seg.id}/treatments`)
      .send({ treatedOn: '2026-01-02', kind: 'crack_seal', name: 'Crack seal' });
    expect([s.status, tr.status]).toEqual([403, 403]);
  });

  it('another agency is 404, and so is its segment under our agency', async () => {
    const marlowSeg = (await (await t.as('admin@marlow.example')).get(`/api/agencies/${t.ids.marlow}/segments?limit=1`))
      .body.items[0];
    const foreignAgency = await eng
      .post(`/api/agencies/${t.ids.marlow}/segments/${marlowSeg.id}/surveys`)
      .send({ surveyDate: '2026-01-02', pci: 60 });
    expect(foreignAgency.status).toBe(404);
    const foreignSegment = await eng
      .post(`${base}/segments/${marlowSeg.id}/treatments`)
      .send({ treatedOn: '2026-01-02', kind: 'crack_seal', name: 'Crack seal' });
    expect(foreignSegment.status).toBe(404);
    expect((await eng.get(`${base}/segments/${marlowSeg.id}/treatments`)).status).toBe(404);
  });
});

describe('plain messages on other forms', () => {
  it('a segment edit with a zero width says so in words', async () => {
    const res = await eng.patch(`${base}/segments/${seg.id}`).send({ widthFt: 0, lanes: 2.5 });
    expect(res.status).toBe(400);
    expect(res.body.error.issues).toEqual([
      { path: 'body.widthFt', message: 'must be more than 0' },
      { path: 'body.lanes', message: 'must be a whole number' },
    ]);
  });
});
