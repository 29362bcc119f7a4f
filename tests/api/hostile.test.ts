// Malformed and hostile input across the API: every case gets a 4xx with a
// clear message, none a 5xx, and nothing is written (every table counted before and after).
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_SHAPEFILE_EXPANDED_BYTES, MAX_WORKBOOK_EXPANDED_BYTES } from '../../server/imports/read-file';
import { editedArchive, editFeature, editJson, type ArchiveFiles, type ManifestLike } from '../helpers/archive';
import { lyingZip } from '../helpers/lying-zip';
import { APP_URL, createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let admin: Awaited<ReturnType<TestApp['as']>>;
let marlowAdmin: Awaited<ReturnType<TestApp['as']>>;
let viewer: Awaited<ReturnType<TestApp['as']>>;
let A: string;
let archive: Buffer;
const TABLES = [
  'agencies',
  'memberships',
  'segments',
  'surveys',
  'imports',
  'import_mappings',
  'mixes',
  'treatments',
  'plans',
  'analyses',
  'curve_overrides',
  'invitations',
  'users',
  'password_resets',
  'audit_log',
] as const;
const counts = () =>
  Object.fromEntries(
    TABLES.map((tb) => [tb, (t.sqlite.prepare(`SELECT count(*) AS n FROM ${tb}`).get() as { n: number }).n]),
  );
let before: Record<string, number>;
const MB = 1024 * 1024;

async function zipBomb() {
  const zip = new JSZip();
  zip.file('[Content_Types].xml', '<?xml version="1.0"?><Types/>');
  // 300 MB of one character compresses to a few hundred KB.
  zip.file('xl/worksheets/sheet1.xml', Buffer.alloc(300 * 1024 * 1024, 0x20));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 9 } });
}

beforeAll(async () => {
  t = await createTestApp({ signInRateLimit: 1000, restoreRateLimit: 1000 });
  eng = await t.as('engineer@brannock.example');
  admin = await t.as('admin@brannock.example');
  marlowAdmin = await t.as('admin@marlow.example');
  viewer = await t.as('viewer@brannock.example');
  A = t.ids.brannock;
  archive = (
    await marlowAdmin
      .get(`/api/agencies/${t.ids.marlow}/export`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      })
  ).body as Buffer;
  before = counts();
});
afterAll(() => t.close());

type Case = { name: string; run: () => Promise<{ status: number; body: unknown; text?: string }> };
const deep = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`;
const nested = (n: number) => `${'['.repeat(n)}1${']'.repeat(n)}`;
const imp =
  (name: string, content: string | Buffer, fields: Record<string, string> = {}) =>
  () => {
    let r = eng.post(`/api/agencies/${A}/imports`);
    for (const [k, v] of Object.entries(fields)) r = r.field(k, v);
    return r.attach('file', Buffer.from(content), name);
  };
const json =
  (path: string | (() => string), body: string, method: 'post' | 'patch' | 'put' = 'post') =>
  () =>
    eng[method](typeof path === 'string' ? path : path())
      .set('Content-Type', 'application/json')
      .send(body);
const evaluate = (body: unknown) => () => eng.post('/api/lcca/evaluate').send(body as object);
const ok = { name: 'A', activities: [{ year: 0, cost: 1, serviceLifeYears: 5 }] };
const segHead = 'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface';
const feature = (props: string, geometry = '{"type":"LineString","coordinates":[[-98.5,38.8],[-98.5,38.81]]}') =>
  `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"segment_id":"H-1","road_name":"Hostile Rd","width_ft":24,"lanes":2,"functional_class":"local","surface":"asphalt"${props}},"geometry":${geometry}}]}`;
/** A restore of the Marlow export after an edit (hashes recomputed, as a careful attacker would). */
const restore =
  (edit: (files: ArchiveFiles, manifest: ManifestLike) => void, opts: Parameters<typeof editedArchive>[2] = {}) =>
  async () =>
    marlowAdmin.post('/api/agencies/restore').attach('file', await editedArchive(archive, edit, opts), 'export.zip');
const restoreRaw = (buf: () => Promise<Buffer> | Buffer) => async () =>
  marlowAdmin.post('/api/agencies/restore').attach('file', await buf(), 'export.zip');
const long = 'x'.repeat(100_000);

const cases: Case[] = [
  // Broken files
  { name: 'empty CSV', run: imp('e.csv', '') },
  { name: 'CSV header only', run: imp('h.csv', 'segment_id,road_name\n') },
  { name: 'CSV with one column (unknown delimiter)', run: imp('d.csv', 'segment_id~road_name~width_ft\nA~B~1\n') },
  { name: 'CSV with NUL bytes', run: imp('n.csv', 'segment_id,road_name\n\u0000\u0000,x\n') },
  { name: 'CSV with a duplicated header', run: imp('dup.csv', 'a,a,b\n1,2,3\n') },
  {
    name: 'CSV with NaN and Infinity for numbers',
    run: imp(
      'nan.csv',
      'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nX,Y,NaN,Infinity,2,local,asphalt\n',
    ),
  },
  {
    name: 'CSV with a huge number',
    run: imp(
      'big.csv',
      `segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nX,Y,1e308,24,2,local,asphalt\n`,
    ),
  },
  {
    name: 'CSV with strings for numbers',
    run: imp(
      's.csv',
      'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nX,Y,one,wide,two,local,asphalt\n',
    ),
  },
  {
    name: 'CSV with a script in an enum column',
    run: imp(
      'x.csv',
      'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nX,Y,1,24,2,<script>alert(1)</script>,asphalt\n',
    ),
  },
  {
    name: 'CSV with SQL in an enum column',
    run: imp(
      'q.csv',
      "segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nX,Y,1,24,2,local'; DROP TABLE segments;--,asphalt\n",
    ),
  },
  { name: 'text that is not a workbook, named .xlsx', run: imp('w.xlsx', 'not a zip at all') },
  {
    name: 'a zip that is not a workbook, named .xlsx',
    run: async () => imp('z.xlsx', await new JSZip().file('readme.txt', 'hi').generateAsync({ type: 'nodebuffer' }))(),
  },
  { name: 'a zip-bomb workbook', run: async () => imp('bomb.xlsx', await zipBomb())() },
  { name: 'truncated GeoJSON', run: imp('t.geojson', '{"type":"FeatureCollection","features":[{') },
  { name: 'GeoJSON of the wrong type', run: imp('p.geojson', '{"type":"GeometryCollection","geometries":[]}') },
  {
    name: 'GeoJSON with NaN coordinates',
    run: imp(
      'c.geojson',
      '{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"segment_id":"G","road_name":"R","width_ft":24,"lanes":2,"functional_class":"local","surface":"asphalt"},"geometry":{"type":"LineString","coordinates":[["NaN",1],[2,3]]}}]}',
      { dryRun: 'false' },
    ),
  },
  { name: 'GeoJSON with empty features', run: imp('e.geojson', '{"type":"FeatureCollection","features":[]}') },
  {
    name: 'a shapefile zip with no shapefile',
    run: async () => imp('s.zip', await new JSZip().file('a.txt', 'x').generateAsync({ type: 'nodebuffer' }))(),
  },
  { name: 'an executable pretending to be CSV', run: imp('evil.exe', 'MZ\u0090\u0000') },
  { name: 'an unknown CRS', run: imp('c.geojson', '{"type":"FeatureCollection","features":[]}', { crs: 'EPSG:abc' }) },
  { name: 'a mapping that is not JSON', run: imp('m.csv', 'a,b\n1,2\n', { mapping: '{not json' }) },
  { name: 'an unknown import mode', run: imp('m.csv', 'a,b\n1,2\n', { mode: 'yolo' }) },
  { name: 'a file over the size limit', run: imp('huge.csv', Buffer.alloc(26 * 1024 * 1024, 0x41)) },
  {
    name: 'two files in one upload',
    run: () =>
      eng
        .post(`/api/agencies/${A}/imports`)
        .attach('file', Buffer.from('a,b\n'), 'a.csv')
        .attach('file', Buffer.from('a,b\n'), 'b.csv'),
  },
  // Malformed JSON bodies
  { name: 'deeply nested JSON object', run: json('/api/lcca/evaluate', deep(20000)) },
  { name: 'deeply nested JSON array', run: json('/api/lcca/evaluate', nested(20000)) },
  { name: 'truncated JSON', run: json('/api/lcca/evaluate', '{"discountRate": 0.04,') },
  { name: 'JSON body over 1 MB', run: () => eng.post('/api/lcca/evaluate').send({ pad: 'x'.repeat(1_200_000) }) },
  { name: 'XML body', run: () => eng.post('/api/lcca/evaluate').set('Content-Type', 'application/xml').send('<a/>') },
  {
    name: 'form-encoded body',
    run: () =>
      eng.post('/api/lcca/evaluate').set('Content-Type', 'application/x-www-form-urlencoded').send('discountRate=0.04'),
  },
  {
    name: 'a rate of 1e400 (Infinity)',
    run: json(
      '/api/lcca/evaluate',
      `{"discountRate": 1e400, "analysisPeriodYears": 35, "alternatives": [${JSON.stringify(ok)}]}`,
    ),
  },
  {
    name: 'a rate given as "NaN"',
    run: evaluate({ discountRate: 'NaN', analysisPeriodYears: 35, alternatives: [ok] }),
  },
  {
    name: 'a cost of 1e300',
    run: evaluate({
      discountRate: 0.04,
      analysisPeriodYears: 35,
      alternatives: [{ name: 'A', activities: [{ year: 0, cost: 1e300, serviceLifeYears: 5 }] }],
    }),
  },
  {
    name: '10,000 activities',
    run: evaluate({
      discountRate: 0.04,
      analysisPeriodYears: 35,
      alternatives: [
        { name: 'A', activities: Array.from({ length: 10000 }, () => ({ year: 0, cost: 1, serviceLifeYears: 5 })) },
      ],
    }),
  },
  {
    name: 'a prototype-polluting segment patch',
    run: json(
      () => `/api/agencies/${A}/segments/1`,
      '{"__proto__": {"admin": true}, "constructor": {"prototype": {}}}',
      'patch',
    ),
  },
  {
    name: 'a patch of the agency id',
    run: () => eng.patch(`/api/agencies/${A}/segments/1`).send({ agencyId: 'other' }),
  },
  {
    name: 'HTML in a mix name longer than allowed',
    run: () =>
      admin.post(`/api/agencies/${A}/catalog/mixes`).send({
        name: `<img src=x onerror=alert(1)>${'x'.repeat(100)}`,
        binderGrade: 'PG 64-22',
        modifier: 'none',
        pricePerTon: 70,
        minLiftIn: 1,
        maxLiftIn: 2,
        refLiftIn: 1.5,
        refLifeYears: 10,
        priceEffectiveDate: '2026-12-01',
      }),
  },
  {
    name: 'Monte Carlo iterations over the limit',
    run: () =>
      eng.post(`/api/agencies/${A}/analyses/runs`).send({
        group: { label: 'x', areaSy: 1, laneMiles: 1, centrelineMiles: 1, segments: [] },
        alternatives: [],
        risk: { iterations: 10_000_000 },
      }),
  },
  {
    name: 'a plan horizon of 500 years',
    run: () =>
      eng
        .post(`/api/agencies/${A}/plans`)
        .send({ name: 'x', settings: { startYear: 2027, horizonYears: 500, budgetMode: 'flat', annualBudget: 1 } }),
  },
  {
    name: 'negative budgets for the optimiser',
    run: () => eng.post('/api/plan/optimize').send({ budgets: [-5], segments: [] }),
  },
  {
    name: 'an optimiser instance over the segment limit',
    run: () =>
      eng
        .post('/api/plan/optimize')
        .send({ budgets: [1], segments: Array.from({ length: 100_001 }, (_, i) => ({ id: String(i), options: [] })) }),
  },
  // Query strings and paths
  { name: 'SQL in a list filter', run: () => eng.get(`/api/agencies/${A}/segments?class=local'%20OR%201=1--`) },
  { name: 'a script in a sort key', run: () => eng.get(`/api/agencies/${A}/segments?sort=<script>`) },
  { name: 'a page size of 10 million', run: () => eng.get(`/api/agencies/${A}/segments?limit=10000000`) },
  { name: 'a repeated query parameter', run: () => eng.get(`/api/agencies/${A}/segments?limit=1&limit=2`) },
  { name: 'a negative offset', run: () => eng.get(`/api/agencies/${A}/segments?offset=-1`) },
  { name: 'path traversal in the agency id', run: () => eng.get('/api/agencies/..%2F..%2Fetc%2Fpasswd/segments') },
  { name: 'SQL in the agency id', run: () => eng.get(`/api/agencies/${encodeURIComponent("x' OR '1'='1")}/segments`) },
  { name: 'a segment id that is not a number', run: () => eng.get(`/api/agencies/${A}/segments/1;DROP`) },
  { name: 'an invitation token of the wrong shape', run: () => t.anonymous().get('/api/invitations/short') },
  { name: 'a cross-site POST without Origin', run: () => eng.agent.post('/api/lcca/evaluate').send({}) },
  {
    name: 'a cross-site POST from another origin',
    run: () => eng.agent.post('/api/lcca/evaluate').set('Origin', 'http://attacker.example').send({}),
  },
  {
    name: 'DNS rebinding: an Origin equal to the Host it names, which is not this server',
    run: () =>
      eng.agent
        .post('/api/lcca/evaluate')
        .set('Host', 'rebound.attacker.example:3999')
        .set('Origin', 'http://rebound.attacker.example:3999')
        .send({}),
  },
  // Inflation, nesting and size in imports
  {
    name: 'a workbook whose zip declares 1 KB and inflates past the cap',
    run: async () =>
      imp(
        'lying.xlsx',
        await lyingZip([
          { name: '[Content_Types].xml', data: Buffer.from('<Types/>') },
          {
            name: 'xl/worksheets/sheet1.xml',
            realBytes: MAX_WORKBOOK_EXPANDED_BYTES + 4 * MB,
            fill: 0x20,
            declaredSize: 1024,
          },
        ]),
      )(),
  },
  {
    name: 'a zipped shapefile whose zip declares 1 KB and inflates past the cap',
    run: async () =>
      imp(
        'lying.zip',
        await lyingZip([
          { name: 'r.shp', realBytes: MAX_SHAPEFILE_EXPANDED_BYTES + 4 * MB, fill: 0, declaredSize: 1024 },
        ]),
      )(),
  },
  {
    name: 'a GeoJSON property nested 200,000 deep in a used column',
    run: imp('deep.geojson', feature(`,"notes":${'['.repeat(200_000)}1${']'.repeat(200_000)}`), { dryRun: 'false' }),
  },
  {
    name: 'a 20 MB cell',
    run: imp('cell.csv', `${segHead}\nC-1,${'x'.repeat(20 * MB)},1,24,2,local,asphalt\n`, { mode: 'skip-invalid' }),
  },
  {
    name: 'a line of 100,001 positions',
    run: imp(
      'long.geojson',
      feature(
        '',
        JSON.stringify({
          type: 'LineString',
          coordinates: Array.from({ length: 100_001 }, (_, i) => [-98.5 + i * 1e-6, 38.8]),
        }),
      ),
    ),
  },
  {
    name: 'a value matching to a class that does not exist',
    run: imp('v.csv', `${segHead}\nV-1,Val Rd,1,24,2,Arterial Road,asphalt\n`, {
      values: JSON.stringify({ functional_class: { 'Arterial Road': 'autobahn' } }),
    }),
  },
  {
    name: 'an unknown date format',
    run: imp('d.csv', `${segHead}\nD-1,Date Rd,1,24,2,local,asphalt\n`, { dateFormat: 'ddmmyy' }),
  },
  {
    name: 'survey year 0001',
    run: imp('y.csv', `${segHead},pci,pci_date\nY-1,Year Rd,1,24,2,local,asphalt,70,0001-06-04\n`, { dryRun: 'false' }),
  },
  // Restores: access, then broken and edited archives
  {
    name: 'a restore by someone who administers no agency',
    run: () => viewer.post('/api/agencies/restore').attach('file', archive, 'export.zip'),
  },
  { name: 'a restore of a file that is not a zip', run: restoreRaw(() => Buffer.from('not a zip at all')) },
  { name: 'a restore of a zip without a manifest', run: restore(() => {}, { manifestText: null }) },
  { name: 'a restore whose manifest is not JSON', run: restore(() => {}, { manifestText: '{oops' }) },
  {
    name: 'a restore of another format',
    run: restore((_f, m) => {
      m.format = 'other-program-export';
    }),
  },
  {
    name: 'a restore whose manifest lacks a file',
    run: restore((_f, m) => void delete m.files['curves.json']),
  },
  {
    name: 'a restore whose file does not match its hash',
    run: restore(
      (f) => {
        f['catalog.json'] = '{"mixes":[],"treatments":[]}';
      },
      { keepHashes: true },
    ),
  },
  {
    name: 'a restore whose manifest declares 1 KB and inflates to 2 MB',
    run: restoreRaw(async () => {
      const files = await (await import('../helpers/archive')).archiveFiles(archive);
      return lyingZip([
        { name: 'manifest.json', realBytes: 2 * MB, fill: 0x20, declaredSize: 1024 },
        ...Object.entries(files)
          .filter(([n]) => n !== 'manifest.json')
          .map(([name, text]) => ({ name, data: Buffer.from(text) })),
      ]);
    }),
  },
  {
    name: 'a restore whose segments are not JSON',
    run: restore((f) => {
      f['segments.geojson'] = '{"type":';
    }),
  },
  { name: 'a restore with surface "lava"', run: restore(editFeature(0, { surface: 'lava' })) },
  { name: 'a restore with PCI 500', run: restore(editFeature(1, { pci: 500 })) },
  { name: 'a restore with the date 2026-02-30', run: restore(editFeature(2, { pci_date: '2026-02-30' })) },
  { name: 'a restore with 0 lanes', run: restore(editFeature(3, { lanes: 0 })) },
  { name: 'a restore with a negative length', run: restore(editFeature(4, { length_mi: -1 })) },
  {
    name: 'a restore with a repeated segment id',
    run: restore((f) => {
      const geo = JSON.parse(f['segments.geojson']);
      geo.features[5].properties.segment_id = geo.features[0].properties.segment_id;
      f['segments.geojson'] = JSON.stringify(geo);
    }),
  },
  {
    name: 'a restore with State Plane coordinates',
    run: restore(
      editFeature(
        6,
        {},
        {
          type: 'LineString',
          coordinates: [
            [1189834.9, 181180.4],
            [1190258.5, 181178.4],
          ],
        },
      ),
    ),
  },
  {
    name: 'a restore with a discount rate of −99 %',
    run: restore((_f, m) => {
      m.agency.economics.discountRate = -0.99;
    }),
  },
  {
    name: 'a restore with an analysis period of 100,000 years',
    run: restore((_f, m) => {
      m.agency.economics.analysisPeriodYears = 100_000;
    }),
  },
  {
    name: 'a restore with a 100,000-character agency name',
    run: restore((_f, m) => {
      m.agency.name = long;
    }),
  },
  {
    name: 'a restore with a 100,000-character plan name',
    run: restore(
      editJson<{ name: string }[]>('plans.json', (p) => [
        {
          name: long,
          status: 'draft',
          publishedAt: null,
          settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 1 },
        },
        ...p,
      ]),
    ),
  },
  {
    name: 'a restore whose plan names a treatment the archive does not have',
    run: restore(
      editJson<unknown[]>('plans.json', () => [
        {
          name: 'P',
          status: 'draft',
          publishedAt: null,
          settings: {
            startYear: 2027,
            horizonYears: 5,
            budgetMode: 'flat',
            annualBudget: 1,
            treatmentIds: ['not-here'],
          },
        },
      ]),
    ),
  },
  {
    name: 'a restore whose treatment names a mix the archive does not have',
    run: restore(
      editJson<{ treatments: { mixId: string | null }[] }>('catalog.json', (c) => {
        c.treatments.find((x) => x.mixId)!.mixId = 'some-other-agency-mix';
        return c;
      }),
    ),
  },
  {
    name: 'a restore with a mix whose lift range is reversed',
    run: restore(
      editJson<{ mixes: { minLiftIn: number; maxLiftIn: number }[] }>('catalog.json', (c) => {
        c.mixes[0].minLiftIn = 4;
        c.mixes[0].maxLiftIn = 1;
        return c;
      }),
    ),
  },
  {
    name: 'a restore with a survey of a segment it does not have',
    run: restore((f) => {
      f['surveys.csv'] += 'NO-SUCH-SEGMENT,2024-05-01,70,\r\n';
    }),
  },
  {
    name: 'a restore with a survey repeated',
    run: restore((f) => {
      const lines = f['surveys.csv'].trim().split('\r\n');
      f['surveys.csv'] = `${[...lines, lines[1]].join('\r\n')}\r\n`;
    }),
  },
  {
    name: 'a restore with a curve exponent of 7 and an unknown family',
    run: restore(editJson('curves.json', () => [{ familyKey: 'lava|local|overlay', p0: 100, a: 1, b: 7 }])),
  },
  {
    name: 'a restore with an import mapping of an unknown kind',
    run: restore(editJson('import-mappings.json', () => [{ kind: 'passwords', mapping: {} }])),
  },
  {
    name: 'a restore with a survey row of extra values',
    run: restore((f) => {
      f['surveys.csv'] += 'MW-A01-01,2024-05-01,70,x,extra\r\n';
    }),
  },
  {
    name: 'a restore with a comparison whose input is broken',
    run: restore(
      editJson('analyses.json', () => [{ name: 'C', input: { economics: {} }, result: { presentValue: 1 } }]),
    ),
  },
];

describe(`${cases.length} hostile inputs, each answered 4xx with a message, nothing written`, () => {
  it('has at least 90 cases', () => {
    expect(cases.length).toBeGreaterThanOrEqual(90);
  });

  it.each(cases.map((c) => [c.name, c] as const))(
    '%s → 4xx with a message',
    async (_n, c) => {
      const res = await c.run();
      expect(res.status, JSON.stringify(res.body).slice(0, 200)).toBeGreaterThanOrEqual(400);
      expect(res.status).toBeLessThan(500);
      // Either the one error shape, or an import report (422) whose rows carry the reasons.
      const body = res.body as { error?: { message?: string }; errors?: { message: string }[] };
      const message = body.error?.message ?? body.errors?.[0]?.message;
      if (process.env.SHOW_HOSTILE) console.log(`${_n} → ${res.status}: ${String(message).slice(0, 220)}`);
      expect(typeof message).toBe('string');
      expect(message!.length).toBeGreaterThan(5);
      expect(JSON.stringify(res.body)).not.toMatch(/node_modules|at [A-Za-z]+ \(/);
    },
    60_000,
  );

  it('wrote nothing', () => {
    expect(counts()).toEqual(before);
  });

  it('text payloads in free-text fields are stored literally and harmlessly', async () => {
    const name = "'; DROP TABLE segments; -- <script>alert(1)</script>";
    const res = await eng.patch(`/api/agencies/${A}/segments/1`).send({ roadName: name });
    expect(res.status).toBe(200);
    expect(res.body.roadName).toBe(name);
    expect(counts().segments).toBe(before.segments);
    const page = await t.anonymous().get('/').set('Origin', APP_URL);
    expect(page.status).toBeLessThan(500);
  });
});
