import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CONDITION_BANDS } from '../../shared/condition';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let u: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  u = await t.as('viewer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}/segments`;
});
afterAll(() => t.close());

describe('segment list', () => {
  it('pages with limit and offset over the seeded county', async () => {
    const a = await u.get(`${base}?limit=10&offset=0`);
    const b = await u.get(`${base}?limit=10&offset=10`);
    expect(a.body.total).toBe(1224);
    expect(a.body.items).toHaveLength(10);
    expect(b.body.items).toHaveLength(10);
    const ids = new Set([...a.body.items, ...b.body.items].map((s: { id: number }) => s.id));
    expect(ids.size).toBe(20);
    for (const key of [
      'id',
      'segmentId',
      'roadName',
      'lengthMi',
      'widthFt',
      'lanes',
      'functionalClass',
      'surface',
      'pci',
    ]) {
      expect(a.body.items[0]).toHaveProperty(key);
    }
  });

  it('q matches road name or segment id', async () => {
    const byName = await u.get(`${base}?q=Tallow Creek Parkway&limit=1000`);
    expect(byName.body.total).toBe(20);
    expect(byName.body.items.every((s: { roadName: string }) => s.roadName === 'Tallow Creek Parkway')).toBe(true);
    const byId = await u.get(`${base}?q=TC-S06`);
    expect(byId.body.total).toBe(10);
  });

  it('a LIKE wildcard in q is taken literally', async () => {
    const res = await u.get(`${base}?q=%25`);
    expect(res.body.total).toBe(0);
  });

  it('class and band filters return only matching rows, and totals describe the filtered set', async () => {
    const res = await u.get(`${base}?class=principal_arterial&limit=1000`);
    expect(res.body.total).toBe(24);
    expect(res.body.items.every((s: { functionalClass: string }) => s.functionalClass === 'principal_arterial')).toBe(
      true,
    );
    const miles = res.body.items.reduce((s: number, x: { lengthMi: number }) => s + x.lengthMi, 0);
    expect(res.body.totals.miles).toBeCloseTo(miles, 6);
    const lm = res.body.items.reduce((s: number, x: { laneMiles: number }) => s + x.laneMiles, 0);
    expect(res.body.totals.laneMiles).toBeCloseTo(lm, 6);
    const fair = CONDITION_BANDS.find((b) => b.id === 'fair')!;
    const banded = await u.get(`${base}?band=fair&limit=1000`);
    expect(banded.body.total).toBeGreaterThan(0);
    expect(
      banded.body.items.every((s: { pci: number }) => Math.round(s.pci) >= fair.min && Math.round(s.pci) <= fair.max),
    ).toBe(true);
    const none = await u.get(`${base}?band=none&limit=1000`);
    expect(
      none.body.items.every((s: { pci: number | null; surface: string }) => s.pci === null && s.surface === 'gravel'),
    ).toBe(true);
  });

  it('sorts by PCI descending', async () => {
    const res = await u.get(`${base}?sort=pci&dir=desc&band=very-good,good&limit=50`);
    const pcis = res.body.items.map((s: { pci: number }) => s.pci);
    expect(pcis).toEqual([...pcis].sort((a, b) => b - a));
  });

  it('one segment carries its survey history, oldest first', async () => {
    const list = await u.get(`${base}?class=principal_arterial&limit=1`);
    const detail = await u.get(`${base}/${list.body.items[0].id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.surveys).toHaveLength(8);
    const dates = detail.body.surveys.map((s: { surveyDate: string }) => s.surveyDate);
    expect(dates).toEqual([...dates].sort());
    expect(detail.body.pci).toBe(detail.body.surveys.at(-1).pci);
    expect(detail.body.geometry.type).toBe('LineString');
  });
});

describe('network summary', () => {
  it('lane-miles by band add up to the network lane-miles', async () => {
    const res = await u.get(`/api/agencies/${t.ids.brannock}/network`);
    expect(res.status).toBe(200);
    const sum = res.body.laneMilesByBand.reduce((s: number, b: { laneMiles: number }) => s + b.laneMiles, 0);
    expect(sum).toBeCloseTo(res.body.laneMiles, 6);
    expect(res.body.weightedPci).toBeGreaterThan(0);
    expect(res.body.weightedPci).toBeLessThan(100);
  });
});

describe('map GeoJSON and exports', () => {
  it('GeoJSON carries only what the map needs, for the filtered set', async () => {
    const res = await u.get(`/api/agencies/${t.ids.brannock}/segments.geojson?class=principal_arterial`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/geo\+json/);
    const fc = JSON.parse(res.text);
    expect(fc.type).toBe('FeatureCollection');
    expect(fc.features).toHaveLength(24);
    expect(Object.keys(fc.features[0].properties).sort()).toEqual(['c', 'id', 'p', 'r', 's']);
    expect(fc.features[0].geometry.type).toBe('LineString');
  });

  it('CSV export has plain-word headers and re-imports as unchanged', async () => {
    const csv = await u.get(`/api/agencies/${t.ids.brannock}/segments/export?format=csv&class=minor_arterial`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-disposition']).toMatch(/brannock-county-segments\.csv/);
    const lines = csv.text.trim().split(/\r?\n/);
    expect(lines[0]).toBe(
      'Segment ID,Road name,From,To,Length (mi),Width (ft),Lanes,Functional class,Surface,ADT (vehicles per day),Trucks (% of ADT),PCI,Survey date,Last treatment,Last treatment year,District,Notes,"Geometry (WKT, WGS84)"',
    );
    expect(lines[1]).toMatch(/,"?LINESTRING ?\(-98\./);
    expect(lines).toHaveLength(1 + 20 + 20); // the parkway and the two Tallow Creek main streets
    const eng = await t.as('engineer@brannock.example');
    const re = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .field('dryRun', 'true')
      .attach('file', Buffer.from(csv.text), 'export.csv');
    expect(re.status).toBe(200);
    expect(re.body).toMatchObject({ added: 0, updated: 0, unchanged: 40, rejected: 0 });
  });

  it('XLSX export is a workbook that re-imports as unchanged', async () => {
    const x = await u
      .get(`/api/agencies/${t.ids.brannock}/segments/export?format=xlsx&district=Tallow Creek`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(x.status).toBe(200);
    const body = x.body as Buffer;
    expect(body.subarray(0, 2).toString('latin1')).toBe('PK');
    const eng = await t.as('engineer@brannock.example');
    const re = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .field('dryRun', 'true')
      .attach('file', body, 'export.xlsx');
    expect(re.status).toBe(200);
    expect(re.body).toMatchObject({ added: 0, updated: 0, unchanged: 220, rejected: 0 });
  });
});

describe('cached lists never go stale', () => {
  it('an edit and an import show in the very next list', async () => {
    const eng = await t.as('engineer@brannock.example');
    const url = `/api/agencies/${t.ids.brannock}/segments?q=BC-E00-01`;
    const first = await eng.get(url);
    const again = await eng.get(url);
    expect(again.body).toEqual(first.body);
    const id = first.body.items[0].id;
    await eng.patch(`/api/agencies/${t.ids.brannock}/segments/${id}`).send({ roadName: 'Renamed Road' });
    expect((await eng.get(url)).body.items[0].roadName).toBe('Renamed Road');
    const count = (await eng.get(`/api/agencies/${t.ids.brannock}/segments?limit=1`)).body.total;
    await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .attach(
        'file',
        Buffer.from(
          'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nNEW-1,New Rd,1,24,2,local,asphalt\n',
        ),
        'n.csv',
      );
    expect((await eng.get(`/api/agencies/${t.ids.brannock}/segments?limit=1`)).body.total).toBe(count + 1);
    // Another agency's cache is its own.
    const marlow = await t.as('engineer@marlow.example');
    expect((await marlow.get(`/api/agencies/${t.ids.marlow}/segments?limit=1`)).body.total).toBe(84);
  });
});
