import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syntheticCsv } from '../../bench/synthetic-network';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { until } from '../helpers/until';

const sample = (name: string) => path.resolve('data/samples', name);

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let url: string;
const count = (sql: string, ...args: unknown[]) => (t.sqlite.prepare(sql).get(...args) as { n: number }).n;
const segCount = () => count('SELECT count(*) AS n FROM segments WHERE agency_id = ?', t.ids.brannock);

beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  url = `/api/agencies/${t.ids.brannock}/imports`;
});
afterAll(() => t.close());

function upload(file: string | { name: string; content: string | Buffer }, fields: Record<string, string> = {}) {
  let req = eng.post(url);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return typeof file === 'string' ? req.attach('file', file) : req.attach('file', Buffer.from(file.content), file.name);
}

describe('CSV with our canonical headers', () => {
  it('a dry run reports what would happen and writes nothing', async () => {
    const before = segCount();
    const res = await upload(sample('brannock-prairie-view.csv'), { dryRun: 'true' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      dryRun: true,
      format: 'csv',
      added: 58,
      updated: 0,
      unchanged: 0,
      rejected: 0,
      errors: [],
    });
    expect(res.body.preview).toHaveLength(10);
    expect(res.body.mapping.segment_id).toBe('segment_id');
    expect(segCount()).toBe(before);
  });

  it('imports with no mapping, records the history and the surveys; a re-import is all unchanged', async () => {
    const before = segCount();
    const res = await upload(sample('brannock-prairie-view.csv'));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: false, added: 58, updated: 0, unchanged: 0, rejected: 0 });
    expect(segCount()).toBe(before + 58);
    const seg = t.sqlite
      .prepare("SELECT * FROM segments WHERE agency_id = ? AND segment_id = 'PV-S1-1'")
      .get(t.ids.brannock) as Record<string, unknown>;
    expect(seg).toMatchObject({
      road_name: 'Bluestem Dr',
      length_mi: 0.08,
      width_ft: 30,
      functional_class: 'local',
      surface: 'asphalt',
    });
    expect(count('SELECT count(*) AS n FROM surveys WHERE segment_ref = ?', seg.id)).toBe(1);
    const again = await upload(sample('brannock-prairie-view.csv'));
    expect(again.body).toMatchObject({ added: 0, updated: 0, unchanged: 58, rejected: 0 });
    const history = await eng.get(url);
    expect(history.body.items[0]).toMatchObject({
      fileName: 'brannock-prairie-view.csv',
      unchanged: 58,
      userName: 'Ruben Osei',
    });
    expect(history.body.items[1]).toMatchObject({ added: 58 });
  });

  it('re-import upserts by segment id: changed rows are updated, others unchanged', async () => {
    const text = fs
      .readFileSync(sample('brannock-prairie-view.csv'), 'utf8')
      .replace('PV-S1-1,Bluestem Dr', 'PV-S1-1,Bluestem Drive');
    const res = await upload({ name: 'edited.csv', content: text });
    expect(res.body).toMatchObject({ added: 0, updated: 1, unchanged: 57 });
  });
});

describe('XLSX with its own headers', () => {
  it('guesses the mapping from the header names and reads the same rows', async () => {
    const res = await upload(sample('brannock-prairie-view.xlsx'), { dryRun: 'true' });
    expect(res.status).toBe(200);
    expect(res.body.format).toBe('xlsx');
    expect(res.body.mapping).toMatchObject({
      segment_id: 'Segment ID',
      road_name: 'Road Name',
      length_mi: 'Length (mi)',
      surface: 'Surface Type',
      adt: 'AADT',
      pci_date: 'Survey Date',
    });
    expect(res.body.rejected).toBe(0);
    expect(res.body.unchanged + res.body.updated).toBe(58);
  });

  it('an explicit mapping naming a column that is not there answers 400 naming the field', async () => {
    const res = await upload(sample('brannock-prairie-view.xlsx'), {
      dryRun: 'true',
      mapping: JSON.stringify({ road_name: 'Street' }),
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('mapping.road_name');
  });
});

describe('GeoJSON', () => {
  it('lon/lat features import with lengths from the geometry', async () => {
    const fresh = await createTestApp();
    try {
      const u = await fresh.as('engineer@marlow.example');
      const res = await u
        .post(`/api/agencies/${fresh.ids.marlow}/imports`)
        .attach('file', sample('brannock-prairie-view.geojson'));
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ format: 'geojson', added: 58, rejected: 0 });
      const row = fresh.sqlite
        .prepare("SELECT length_mi, geometry FROM segments WHERE segment_id = 'PV-S1-1'")
        .get() as { length_mi: number; geometry: string };
      // 0.08 mi blocks laid out on the sample's grid; turf's geodesic length agrees within 0.5%.
      expect(row.length_mi).toBeGreaterThan(0.08 * 0.995);
      expect(row.length_mi).toBeLessThan(0.08 * 1.005);
      expect(JSON.parse(row.geometry).type).toBe('LineString');
    } finally {
      await fresh.close();
    }
  });

  it('the State Plane twin (EPSG:3419 named in the file) lands within 1 m of the lon/lat file', async () => {
    const a = await createTestApp();
    const b = await createTestApp();
    try {
      const ua = await a.as('engineer@marlow.example');
      const ub = await b.as('engineer@marlow.example');
      expect(
        (await ua.post(`/api/agencies/${a.ids.marlow}/imports`).attach('file', sample('brannock-prairie-view.geojson')))
          .status,
      ).toBe(200);
      const rb = await ub
        .post(`/api/agencies/${b.ids.marlow}/imports`)
        .attach('file', sample('brannock-prairie-view-stateplane.geojson'));
      expect(rb.status).toBe(200);
      expect(rb.body.crs).toBe('EPSG:3419');
      const geo = (app: TestApp) =>
        new Map(
          (
            app.sqlite.prepare("SELECT segment_id, geometry FROM segments WHERE segment_id LIKE 'PV-%'").all() as {
              segment_id: string;
              geometry: string;
            }[]
          ).map((r) => [r.segment_id, JSON.parse(r.geometry).coordinates as number[][]]),
        );
      const ga = geo(a);
      const gb = geo(b);
      expect(gb.size).toBe(58);
      let worst = 0;
      for (const [id, coords] of ga) {
        coords.forEach(([lon, lat], i) => {
          const [lon2, lat2] = gb.get(id)![i];
          const dy = (lat2 - lat) * 111_320;
          const dx = (lon2 - lon) * 111_320 * Math.cos((lat * Math.PI) / 180);
          worst = Math.max(worst, Math.hypot(dx, dy));
        });
      }
      expect(worst).toBeLessThan(1);
    } finally {
      await a.close();
      await b.close();
    }
  });

  it('projected coordinates without a CRS are refused with a clear message; naming the CRS fixes it', async () => {
    const doc = JSON.parse(fs.readFileSync(sample('brannock-prairie-view-stateplane.geojson'), 'utf8'));
    delete doc.crs;
    const bare = JSON.stringify(doc);
    const res = await upload({ name: 'no-crs.geojson', content: bare }, { dryRun: 'true' });
    expect(res.status).toBe(422);
    expect(res.body.errors[0]).toMatchObject({ column: 'geometry' });
    expect(res.body.errors[0].message).toMatch(/not longitude\/latitude/);
    const ok = await upload({ name: 'no-crs.geojson', content: bare }, { dryRun: 'true', crs: 'EPSG:3419' });
    expect(ok.status).toBe(200);
    expect(ok.body.rejected).toBe(0);
  });

  it('an unknown EPSG code answers 400 naming crs', async () => {
    const res = await upload(sample('brannock-prairie-view-stateplane.geojson'), {
      dryRun: 'true',
      crs: 'EPSG:999999',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('crs');
  });

  it('invalid and empty geometries are reported per feature', async () => {
    const doc = {
      type: 'FeatureCollection',
      features: [
        {
          type: 'Feature',
          properties: {
            segment_id: 'G-1',
            road_name: 'A',
            width_ft: 24,
            lanes: 2,
            functional_class: 'local',
            surface: 'asphalt',
          },
          geometry: { type: 'Point', coordinates: [-98.5, 38.8] },
        },
        {
          type: 'Feature',
          properties: {
            segment_id: 'G-2',
            road_name: 'B',
            width_ft: 24,
            lanes: 2,
            functional_class: 'local',
            surface: 'asphalt',
          },
          geometry: { type: 'LineString', coordinates: [[-98.5, 38.8]] },
        },
        {
          type: 'Feature',
          properties: {
            segment_id: 'G-3',
            road_name: 'C',
            width_ft: 24,
            lanes: 2,
            functional_class: 'local',
            surface: 'asphalt',
          },
          geometry: null,
        },
      ],
    };
    const res = await upload({ name: 'bad.geojson', content: JSON.stringify(doc) }, { dryRun: 'true' });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`)).toEqual([
      '1:geometry',
      '2:geometry',
      '3:geometry',
    ]);
  });
});

describe('WKT geometry in a spreadsheet column', () => {
  it('reads LINESTRING cells as geometry, leaves blank cells without, and names unreadable ones', async () => {
    const head = 'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface,geometry\n';
    const ok = await upload(
      {
        name: 'wkt.csv',
        content: `${head}W-1,Wkt Rd,,24,2,local,asphalt,"LINESTRING (-98.5 38.8, -98.5 38.81)"\nW-2,Wkt Rd,1,24,2,local,asphalt,\n`,
      },
      { dryRun: 'true' },
    );
    expect(ok.status).toBe(200);
    expect(ok.body.rejected).toBe(0);
    // 0.01° of latitude is about 0.69 mi (1° ≈ 69 mi, from memory); turf's value must be near it.
    expect(ok.body.preview[0].lengthMi).toBeGreaterThan(0.68);
    expect(ok.body.preview[0].lengthMi).toBeLessThan(0.7);
    expect(ok.body.preview[0].hasGeometry).toBe(true);
    expect(ok.body.preview[1].hasGeometry).toBe(false);
    const bad = await upload(
      { name: 'wkt.csv', content: `${head}W-3,Wkt Rd,1,24,2,local,asphalt,LINESTRING (oops)\n` },
      { dryRun: 'true' },
    );
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0]).toMatchObject({
      row: 2,
      column: 'geometry',
      message: expect.stringMatching(/not readable WKT/),
    });
  });
});

describe('the messy sample', () => {
  it('gives exactly the expected report', async () => {
    const res = await upload(sample('brannock-messy.csv'), { dryRun: 'true' });
    expect(res.status).toBe(422);
    // Row numbers are spreadsheet rows: the header is row 1.
    expect(res.body.errors).toEqual([
      { row: 3, column: 'Length (mi)', value: '1,000', message: 'must be at most 100' },
      { row: 4, column: 'Width (ft)', value: '-22', message: 'must be greater than 0' },
      { row: 5, column: 'Lanes', value: 'two', message: 'is not a number' },
      { row: 6, column: 'Road Name', value: '', message: 'is required' },
      {
        row: 7,
        column: 'Functional Class',
        value: 'Arterial Road',
        message:
          'is not a functional class Wearcourse knows (interstate, freeway, principal arterial, minor arterial, major collector, minor collector, local); match it to one in the check step',
      },
      {
        row: 8,
        column: 'Surface',
        value: 'Cobblestone',
        message:
          'is not a surface Wearcourse knows (asphalt, chip seal, concrete, gravel, other); match it to one in the check step',
      },
      { row: 9, column: 'PCI', value: '140', message: 'must be at most 100' },
      { row: 11, column: 'Segment ID', value: 'RD-101', message: 'repeats the segment id of row 2' },
      { row: 12, column: 'Length (mi)', value: '', message: 'is required when the row has no geometry' },
      { row: 13, column: 'ADT', value: 'abc', message: 'is not a number' },
    ]);
    // 06/04/2026 is read as a US date, with a warning saying so; all-or-nothing writes nothing,
    // and the counts for the good rows say what skipping the rejected ones would write.
    expect(res.body.warnings).toEqual([
      expect.objectContaining({ row: 10, column: 'Survey Date', value: '06/04/2026' }),
    ]);
    expect(res.body).toMatchObject({
      rejected: 10,
      totalRows: 12,
      added: 0,
      acceptedRows: { added: 2, updated: 0, unchanged: 0 },
      dateFormat: 'mdy',
      unknownValues: [
        { field: 'functional_class', value: 'Arterial Road', rows: 1 },
        { field: 'surface', value: 'Cobblestone', rows: 1 },
      ],
    });
  });

  it('the check and the write agree: "would add" for skip-invalid is what the write adds', async () => {
    const check = await upload(sample('brannock-messy.csv'), { dryRun: 'true', mode: 'skip-invalid' });
    expect(check.status).toBe(200);
    expect(check.body).toMatchObject({ added: 2, rejected: 10, acceptedRows: { added: 2 } });
  });

  it('all-or-nothing writes nothing; skip-invalid writes the good rows and keeps the rejects for download', async () => {
    const before = segCount();
    const refused = await upload(sample('brannock-messy.csv'));
    expect(refused.status).toBe(422);
    expect(segCount()).toBe(before);
    const skipped = await upload(sample('brannock-messy.csv'), { mode: 'skip-invalid' });
    expect(skipped.status).toBe(200);
    expect(skipped.body).toMatchObject({ added: 2, rejected: 10 });
    expect(segCount()).toBe(before + 2);
    const csv = await eng.get(`${url}/${skipped.body.importId}/rejected.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const lines = csv.text.trim().split(/\r?\n/);
    expect(lines[0]).toMatch(/^Row,Segment ID,.*,Reason$/);
    expect(lines).toHaveLength(11);
    expect(lines[1]).toMatch(/^3,RD-102,.*must be at most 100/);
  });

  it('day/month/year is a choice; a value matching turns "Arterial Road" into a principal arterial and is remembered', async () => {
    const dmy = await upload(sample('brannock-messy.csv'), { dryRun: 'true', dateFormat: 'dmy' });
    expect(dmy.body.dateFormat).toBe('dmy');
    expect(dmy.body.preview.find((p: { row: number }) => p.row === 10)?.pciDate).toBe('2026-04-06');
    const mdy = await upload(sample('brannock-messy.csv'), { dryRun: 'true', dateFormat: 'mdy' });
    expect(mdy.body.preview.find((p: { row: number }) => p.row === 10)?.pciDate).toBe('2026-06-04');

    const values = { functional_class: { 'Arterial Road': 'principal_arterial' }, surface: { Cobblestone: 'other' } };
    const matched = await upload(sample('brannock-messy.csv'), {
      dryRun: 'true',
      mode: 'skip-invalid',
      values: JSON.stringify(values),
    });
    expect(matched.status).toBe(200);
    expect(matched.body).toMatchObject({ rejected: 8, unknownValues: [], valueMap: values });
    const rd106 = matched.body.preview.find((p: { segmentId: string }) => p.segmentId === 'RD-106');
    expect(rd106.functionalClass).toBe('principal_arterial');
    // Written once, the matching is remembered for the agency's next file.
    const written = await upload(sample('brannock-messy.csv'), {
      mode: 'skip-invalid',
      values: JSON.stringify(values),
    });
    expect(written.status).toBe(200);
    const again = await upload(sample('brannock-messy.csv'), { dryRun: 'true', mode: 'skip-invalid' });
    expect(again.body.valueMap).toEqual(values);
    expect(again.body.unknownValues).toEqual([]);
    const bad = await upload(sample('brannock-messy.csv'), {
      dryRun: 'true',
      values: JSON.stringify({ functional_class: { 'Arterial Road': 'highway' } }),
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toMatch(/^body\.values\.functional_class/);
  });
});

describe('bad files get a clear 4xx, never a 500', () => {
  const good = 'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\n';
  const cases: { name: string; content: string | Buffer; status: number; match: RegExp }[] = [
    { name: 'empty.csv', content: '', status: 400, match: /empty/ },
    { name: 'header-only.csv', content: good, status: 400, match: /no data rows/ },
    { name: 'colon.csv', content: 'segment_id:road_name:length_mi\nA:B:1\n', status: 400, match: /Only one column/ },
    { name: 'dup-header.csv', content: 'segment_id,segment_id,road_name\nA,B,C\n', status: 400, match: /twice/ },
    {
      name: 'not-a-workbook.xlsx',
      content: 'this is plain text, not a zip',
      status: 400,
      match: /not an Excel workbook/,
    },
    {
      name: 'broken.xlsx',
      content: Buffer.from('PK\u0003\u0004garbage-garbage-garbage'),
      status: 400,
      match: /not a readable Excel workbook/,
    },
    {
      name: 'broken.geojson',
      content: '{"type": "FeatureCollection", "features": [',
      status: 400,
      match: /not valid JSON/,
    },
    { name: 'points.geojson', content: '{"type": "Point", "coordinates": [1, 2]}', status: 400, match: /not GeoJSON/ },
    {
      name: 'image.png',
      content: Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a]),
      status: 400,
      match: /Unsupported file type/,
    },
  ];
  it.each(cases)('$name → $status', async (c) => {
    const before = segCount();
    const res = await upload({ name: c.name, content: c.content });
    expect(res.status).toBe(c.status);
    expect(res.body.error.message).toMatch(c.match);
    expect(segCount()).toBe(before);
  });

  it('a BOM and semicolons are understood', async () => {
    const res = await upload(
      {
        name: 'bom.csv',
        content: `\ufeffsegment_id;road_name;length_mi;width_ft;lanes;functional_class;surface\nBOM-1;Test Rd;0.5;24;2;Local;Asphalt\n`,
      },
      { dryRun: 'true' },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ added: 1, rejected: 0 });
  });

  it('duplicate ids, negative widths and PCI out of range are row errors', async () => {
    const content = `${good.trim()},pci\nD-1,A,1,24,2,local,asphalt,50\nD-1,B,1,-3,2,local,asphalt,101\n`;
    const res = await upload({ name: 'dups.csv', content }, { dryRun: 'true' });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { column: string }) => e.column).sort()).toEqual(['pci', 'segment_id', 'width_ft']);
  });

  it('a file over the size limit answers 413', async () => {
    const res = await upload({ name: 'huge.csv', content: Buffer.alloc(26 * 1024 * 1024, 0x61) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
  });

  it('a missing required column is named once, not row by row', async () => {
    const res = await upload(
      {
        name: 'nowidth.csv',
        content: 'segment_id,road_name,length_mi,lanes,functional_class,surface\nX,Y,1,2,local,asphalt\n',
      },
      { dryRun: 'true' },
    );
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      { row: 1, column: 'width_ft', value: '', message: 'no column of the file is matched to this required field' },
    ]);
  });

  it('no file answers 400 naming the field; JSON instead of multipart answers 415', async () => {
    const none = await eng.post(url).field('dryRun', 'true');
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('file');
    const json = await eng.post(url).send({ file: 'x' });
    expect(json.status).toBe(415);
  });

  it('path tricks in the file name are reduced to a bare label', async () => {
    const res = await upload({
      name: '../../etc/passwd.csv',
      content:
        'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nP-1,Path Rd,1,24,2,local,asphalt\n',
    });
    expect(res.status).toBe(200);
    const history = await eng.get(url);
    expect(history.body.items[0].fileName).toBe('passwd.csv');
  });
});

describe('survey import', () => {
  it('adds history rows and lifts the latest PCI only when newer', async () => {
    const res = await upload(sample('brannock-prairie-view-surveys.csv'), { kind: 'surveys' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ kind: 'surveys', added: 58, rejected: 0 });
    const seg = t.sqlite
      .prepare("SELECT id, pci, pci_date FROM segments WHERE agency_id = ? AND segment_id = 'PV-S1-2'")
      .get(t.ids.brannock) as { id: number; pci: number; pci_date: string };
    // The 2025 survey is older than the 2026 one from the segment file: the latest stays.
    expect(seg.pci_date.startsWith('2026')).toBe(true);
    expect(count('SELECT count(*) AS n FROM surveys WHERE segment_ref = ?', seg.id)).toBe(2);
  });

  it('several surveys of one segment in one file, out of date order: the latest becomes the PCI, an older one never does', async () => {
    const seg = (id: string) =>
      t.sqlite
        .prepare('SELECT id, pci, pci_date FROM segments WHERE agency_id = ? AND segment_id = ?')
        .get(t.ids.brannock, id) as { id: number; pci: number; pci_date: string };
    const four = seg('PV-S1-4');
    const surveysOf = (id: number) => count('SELECT count(*) AS n FROM surveys WHERE segment_ref = ?', id);
    const [three0, four0] = [surveysOf(seg('PV-S1-3').id), surveysOf(four.id)];
    const res = await upload(
      {
        name: 'several.csv',
        content:
          'segment_id,survey_date,pci\nPV-S1-3,2026-07-01,61\nPV-S1-3,2026-11-01,55\nPV-S1-3,2026-09-01,58\nPV-S1-4,2020-01-01,90\n',
      },
      { kind: 'surveys' },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ added: 4, rejected: 0 });
    expect(seg('PV-S1-3')).toMatchObject({ pci: 55, pci_date: '2026-11-01' });
    expect(seg('PV-S1-4')).toEqual(four);
    expect([surveysOf(seg('PV-S1-3').id), surveysOf(four.id)]).toEqual([three0 + 3, four0 + 1]);
  });

  it('an unknown segment id is a row error', async () => {
    const res = await upload(
      { name: 's.csv', content: 'segment_id,survey_date,pci\nNOPE-1,2025-05-01,70\n' },
      { kind: 'surveys', dryRun: 'true' },
    );
    expect(res.status).toBe(422);
    expect(res.body.errors[0]).toMatchObject({ row: 2, column: 'segment_id', value: 'NOPE-1' });
  });
});

describe('permissions', () => {
  it('viewers cannot import; another agency cannot be imported into', async () => {
    const viewer = await t.as('viewer@brannock.example');
    const v = await viewer.post(url).attach('file', sample('brannock-prairie-view.csv'));
    expect(v.status).toBe(403);
    const marlowEng = await t.as('engineer@marlow.example');
    const m = await marlowEng.post(url).attach('file', sample('brannock-prairie-view.csv'));
    expect(m.status).toBe(404);
  });

  it('the remembered mapping is per agency', async () => {
    const b = await eng.get(`${url}/mapping?kind=segments`);
    expect(b.body.mapping).not.toBeNull();
    const marlowEng = await t.as('engineer@marlow.example');
    const m = await marlowEng.get(`/api/agencies/${t.ids.marlow}/imports/mapping?kind=segments`);
    expect(m.body.mapping).toBeNull();
  });
});

describe('zipped shapefile', () => {
  it('reads a State Plane shapefile through its .prj, guesses the 10-character dBase column names, and measures the reprojected line', async () => {
    const { default: proj4 } = await import('proj4');
    const epsg = (await import('epsg-index/all.json', { with: { type: 'json' } })).default as Record<
      string,
      { proj4: string; wkt: string }
    >;
    // NAD83 / Kansas North (ftUS), EPSG:3419: definition and WKT from the epsg-index package.
    const toSp = proj4('WGS84', epsg['3419'].proj4);
    const lonlat = [
      [-98.43, 38.83],
      [-98.428513, 38.83],
    ];
    const zip = await (await import('../helpers/shapefile')).zippedShapefile(
      [
        {
          props: {
            segment_id: 'SHP-1',
            road_name: 'Shape Rd',
            width_ft: '24',
            lanes: '2',
            functional: 'local',
            surface: 'asphalt',
          },
          lines: [lonlat.map((p) => toSp.forward(p))],
        },
      ],
      epsg['3419'].wkt,
    );
    const res = await upload({ name: 'roads.zip', content: zip }, { dryRun: 'true' });
    expect(res.body.mapping.functional_class).toBe('functional');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ format: 'shapefile', added: 1, rejected: 0 });
    // Length from the reprojected geometry: the same 0.08 mi block as the lon/lat sample.
    expect(res.body.preview[0].lengthMi).toBeGreaterThan(0.0796);
    expect(res.body.preview[0].lengthMi).toBeLessThan(0.0804);
  });
});

describe('audit of imports', () => {
  it('records each added and changed segment with before and after, in the same transaction', async () => {
    const text = fs
      .readFileSync(sample('brannock-prairie-view.csv'), 'utf8')
      .replace('PV-S1-2,Bluestem Dr', 'PV-S1-2,Bluestem Boulevard');
    const res = await upload({ name: 'audit.csv', content: text });
    expect(res.status).toBe(200);
    const row = t.sqlite
      .prepare(
        "SELECT detail FROM audit_log WHERE action = 'segment.import.update' AND entity_id = 'PV-S1-2' ORDER BY id DESC LIMIT 1",
      )
      .get() as { detail: string };
    expect(JSON.parse(row.detail).changed.roadName).toEqual({ before: 'Bluestem Dr', after: 'Bluestem Boulevard' });
    const adds = (
      t.sqlite.prepare("SELECT count(*) AS n FROM audit_log WHERE action = 'segment.import.add'").get() as { n: number }
    ).n;
    expect(adds).toBeGreaterThanOrEqual(58);
  });
});

// Imports in the worker pool, proved by ordering (never by timing): while an import cannot finish (this
// test holds SQLite's write lock on a connection of its own), its slot is taken, /api/health answers and
// the caps answer 429; what the worker refuses still names the row, column and reason; a worker that
// fails or is stopped part-way leaves nothing half-written; no agency's rows reach another.
describe('imports in the worker pool', () => {
  let p: TestApp;
  let pEng: Awaited<ReturnType<TestApp['as']>>;
  let pUrl: string;
  const n = (sql: string, ...args: unknown[]) => (p.sqlite.prepare(sql).get(...args) as { n: number }).n;
  /** Everything an import writes, counted: it must move all together or not at all. */
  const written = () => ({
    segments: n('SELECT count(*) AS n FROM segments WHERE agency_id = ?', p.ids.brannock),
    surveys: n('SELECT count(*) AS n FROM surveys WHERE agency_id = ?', p.ids.brannock),
    imports: n('SELECT count(*) AS n FROM imports WHERE agency_id = ?', p.ids.brannock),
    audit: n('SELECT count(*) AS n FROM audit_log WHERE agency_id = ?', p.ids.brannock),
  });
  const csv = (count: number, prefix: string) => Buffer.from(syntheticCsv(count).replace(/^SYN-/gm, `${prefix}-`));
  beforeAll(async () => {
    p = await createTestApp({ signInRateLimit: 1000, workers: { threads: 2, perAgency: 1, perUser: 1 } });
    pEng = await p.as('engineer@brannock.example');
    pUrl = `/api/agencies/${p.ids.brannock}/imports`;
    // Both worker threads started (a cold one loads its modules for seconds), so the test that holds the
    // write lock holds it only as long as its own steps take, well inside SQLite's 5 s busy timeout.
    const marlow = await p.as('engineer@marlow.example');
    const warm = await Promise.all([
      pEng.post(pUrl).field('dryRun', 'true').attach('file', csv(5, 'WARM'), 'warm.csv'),
      marlow
        .post(`/api/agencies/${p.ids.marlow}/imports`)
        .field('dryRun', 'true')
        .attach('file', csv(5, 'WARM'), 'warm.csv'),
    ]);
    expect(warm.map((r) => r.status)).toEqual([200, 200]);
  }, 60_000);
  afterAll(() => p.close());

  it('while an import cannot finish, its slot is taken, /api/health answers and the caps answer 429', {
    timeout: 60_000,
  }, async () => {
    const admin = await p.as('admin@brannock.example');
    const marlow = await p.as('engineer@marlow.example');
    const before = written();
    const listBefore = (await pEng.get(`/api/agencies/${p.ids.brannock}/segments?limit=1`)).body.total as number;
    // Each session's first request touches its row in the session store (a write on the request thread,
    // once a minute), and a write waits for the lock: done here, before the lock is taken.
    for (const c of [admin, marlow]) expect((await c.get('/api/me')).status).toBe(200);
    const lock = new Database(p.deps.config.databasePath);
    lock.exec('BEGIN IMMEDIATE');
    let answered = false;
    const pending = pEng
      .post(pUrl)
      .attach('file', csv(2000, 'POOL'), 'pool.csv')
      .then((r) => {
        answered = true;
        return r;
      });
    try {
      await until(() => p.deps.pool.busy === 1, 'the import takes its slot');
      const health = await p.anonymous().get('/api/health');
      expect(health.status).toBe(200);
      expect(health.body).toEqual({ ok: true });

      const mine = await pEng.post(pUrl).attach('file', csv(10, 'POOL'), 'again.csv');
      expect(mine.status).toBe(429);
      expect(mine.headers['retry-after']).toBe('10');
      expect(mine.body.error.message).toMatch(/^You already have 1 heavy task going/);
      const agency = await admin.post(pUrl).attach('file', csv(10, 'POOL'), 'admin.csv');
      expect(agency.status).toBe(429);
      expect(agency.body.error.message).toMatch(/^This agency already has 1 heavy task going/);
      // Another agency's dry run goes on in the other worker (it only reads).
      const other = await marlow
        .post(`/api/agencies/${p.ids.marlow}/imports`)
        .field('dryRun', 'true')
        .attach('file', csv(10, 'POOL'), 'marlow.csv');
      expect(other.status).toBe(200);
      expect(other.body).toMatchObject({ dryRun: true, added: 10 });
      expect(answered).toBe(false);
      expect(written()).toEqual(before);
    } finally {
      lock.exec('ROLLBACK');
      lock.close();
    }
    const res = await pending;
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ dryRun: false, added: 2000, rejected: 0, importId: expect.any(String) });
    expect(p.deps.pool.busy).toBe(0);
    expect(written()).toMatchObject({ segments: before.segments + 2000, imports: before.imports + 1 });
    // The route bumped the list cache on the request thread: the paged list counts the new rows.
    expect((await pEng.get(`/api/agencies/${p.ids.brannock}/segments?limit=1`)).body.total).toBe(listBefore + 2000);
    expect(n("SELECT count(*) AS n FROM segments WHERE agency_id = ? AND segment_id LIKE 'POOL-%'", p.ids.marlow)).toBe(
      0,
    );
  });

  it('what the worker refuses still names the row, the column and the reason', async () => {
    const before = written();
    const rows = syntheticCsv(5).split('\n');
    rows[3] = rows[3].replace(/,local,asphalt,(\d+),5,\d+,/, ',local,asphalt,$1,5,500,');
    const report = await pEng.post(pUrl).attach('file', Buffer.from(rows.join('\n')), 'pci.csv');
    expect(report.status).toBe(422);
    expect(report.body.errors).toEqual([
      expect.objectContaining({ row: 4, column: 'pci', value: '500', message: expect.stringMatching(/100/) }),
    ]);
    const twice = await pEng
      .post(pUrl)
      .attach('file', Buffer.from('segment_id,road_name,Road_Name\nA,B,C\n'), 'twice.csv');
    expect(twice.status).toBe(400);
    expect(twice.body.error).toMatchObject({
      code: 'bad_file',
      message: 'The header row names the column "Road_Name" twice.',
    });
    const mapping = await pEng
      .post(pUrl)
      .field('mapping', JSON.stringify({ road_name: 'Street' }))
      .attach('file', csv(3, 'MAP'), 'map.csv');
    expect(mapping.status).toBe(400);
    expect(mapping.body.error.issues).toEqual([
      { path: 'mapping.road_name', message: 'column "Street" is not in the file' },
    ]);
    expect(written()).toEqual(before);
  });

  it('a write that fails after 700 rows leaves nothing: no rows, no history, no audit', {
    timeout: 60_000,
  }, async () => {
    const before = written();
    // A real SQLite refusal in the middle of the worker's transaction: a trigger on the 701st row.
    p.sqlite.exec(
      "CREATE TRIGGER refuse_row BEFORE INSERT ON segments WHEN NEW.segment_id = 'HALF-700' BEGIN SELECT RAISE(ABORT, 'refused by the test'); END",
    );
    try {
      const res = await pEng.post(pUrl).attach('file', csv(1500, 'HALF'), 'half.csv');
      expect(res.status).toBe(500);
      expect(res.body.error).toEqual({ code: 'internal', message: 'Something went wrong on our side' });
    } finally {
      p.sqlite.exec('DROP TRIGGER refuse_row');
    }
    expect(written()).toEqual(before);
    expect(p.deps.pool.busy).toBe(0);
    const again = await pEng.post(pUrl).attach('file', csv(1500, 'HALF'), 'half.csv');
    expect(again.body).toMatchObject({ added: 1500 });
    expect(written()).toMatchObject({ segments: before.segments + 1500, imports: before.imports + 1 });
  });

  it('an import whose worker is stopped (the client went away) is all written or not at all', {
    timeout: 120_000,
  }, async () => {
    const before = written();
    const req = pEng.post(pUrl).attach('file', csv(20_000, 'GONE'), 'gone.csv');
    const settled = req.then(
      () => 'answered',
      () => 'aborted',
    );
    await until(() => p.deps.pool.busy === 1, 'the import takes its slot');
    req.abort();
    expect(await settled).toBe('aborted');
    await until(() => p.deps.pool.busy === 0, 'the stopped import frees its slot');
    const gone = n(
      "SELECT count(*) AS n FROM segments WHERE agency_id = ? AND segment_id LIKE 'GONE-%'",
      p.ids.brannock,
    );
    const after = written();
    if (gone === 0) expect(after).toEqual(before);
    else {
      expect(gone).toBe(20_000);
      expect(after.imports).toBe(before.imports + 1);
    }
    expect(p.sqlite.pragma('integrity_check', { simple: true })).toBe('ok');
    // The pool replaced the stopped worker: the next import runs.
    expect((await pEng.post(pUrl).field('dryRun', 'true').attach('file', csv(5, 'NEXT'), 'next.csv')).status).toBe(200);
  });

  it('an import writes only its own agency: a segment id Marlow also has is added to Brannock, Marlow untouched', async () => {
    const marlowRow = p.sqlite
      .prepare('SELECT * FROM segments WHERE agency_id = ? ORDER BY id LIMIT 1')
      .get(p.ids.marlow) as Record<string, unknown>;
    const marlowCount = n('SELECT count(*) AS n FROM segments WHERE agency_id = ?', p.ids.marlow);
    const text = `segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface,pci\n${marlowRow.segment_id},Taken Over Rd,0.5,22,2,local,asphalt,12\n`;
    const res = await pEng.post(pUrl).attach('file', Buffer.from(text), 'same-id.csv');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ added: 1, updated: 0 });
    expect(p.sqlite.prepare('SELECT * FROM segments WHERE id = ?').get(marlowRow.id)).toEqual(marlowRow);
    expect(n('SELECT count(*) AS n FROM segments WHERE agency_id = ?', p.ids.marlow)).toBe(marlowCount);
    expect(
      n("SELECT count(*) AS n FROM segments WHERE agency_id = ? AND road_name = 'Taken Over Rd'", p.ids.brannock),
    ).toBe(1);
  });
});
