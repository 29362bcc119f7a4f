// The import's check step: how numbers, dates and coordinate systems are read, the
// plausibility warnings, the field-by-field "would update", and what is (not) echoed back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { zippedShapefile } from '../helpers/shapefile';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let url: string;
const n = (sql: string, ...a: unknown[]) => (t.sqlite.prepare(sql).get(...a) as { n: number }).n;

beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  url = `/api/agencies/${t.ids.brannock}/imports`;
});
afterAll(() => t.close());

function upload(name: string, content: string | Buffer, fields: Record<string, string> = { dryRun: 'true' }) {
  let r = eng.post(url);
  for (const [k, v] of Object.entries(fields)) r = r.field(k, v);
  return r.attach('file', Buffer.from(content), name);
}
const HEAD = 'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface';
const line = (coords: number[][], props: Record<string, unknown>) => ({
  type: 'Feature',
  properties: { road_name: 'Line Rd', width_ft: 24, lanes: 2, functional_class: 'local', surface: 'asphalt', ...props },
  geometry: { type: 'LineString', coordinates: coords },
});
const geojson = (features: unknown[]) => JSON.stringify({ type: 'FeatureCollection', features });

describe('decimal commas', () => {
  it('"0,125" km is 0.125 km, with a warning, when the file writes decimals with commas', async () => {
    const csv =
      'segment_id;road_name;length_km;width_m;lanes;functional_class;surface\nDC-1;Komma Weg;0,125;7,5;2;local;asphalt\nDC-2;Komma Weg;1,250;7,5;2;local;asphalt\n';
    const res = await upload('comma.csv', csv);
    expect(res.status).toBe(200);
    expect(res.body.decimalComma).toBe(true);
    // 1 mi = 1.609344 km and 1 ft = 0.3048 m, exact by definition.
    expect(res.body.preview[0].lengthMi).toBeCloseTo(0.125 / 1.609344, 6);
    expect(res.body.preview[1].lengthMi).toBeCloseTo(1.25 / 1.609344, 6);
    expect(res.body.preview[0].widthFt).toBeCloseTo(7.5 / 0.3048, 2);
    expect(res.body.warnings[0]).toMatchObject({ row: 2, value: '0,125' });
    expect(res.body.warnings[0].message).toMatch(/decimal comma.*0\.125/);
  });

  it('a file with decimal points keeps commas as thousands separators', async () => {
    const res = await upload('dots.csv', `${HEAD},adt\nTS-1,Dot Rd,0.5,24,2,local,asphalt,"1,250"\n`);
    expect(res.body.decimalComma).toBe(false);
    expect(res.body.preview[0]).toMatchObject({ lengthMi: 0.5, adt: 1250 });
  });
});

describe('plausibility warnings in the check step', () => {
  it('names narrow and wide lanes, a very long local street and an early survey; refuses year 0001', async () => {
    const csv = `${HEAD},pci,pci_date
PL-1,Narrow Rd,1,7.3,2,local,asphalt,70,2025-05-01
PL-2,Wide Rd,1,190,1,local,asphalt,70,2025-05-01
PL-3,Long Rd,80,24,2,local,asphalt,70,2025-05-01
PL-4,Old Rd,1,24,2,local,asphalt,70,1962-05-01
PL-5,Year One Rd,1,24,2,local,asphalt,70,0001-05-01
PL-6,Fine Rd,1,24,2,local,asphalt,70,2025-05-01
`;
    const res = await upload('plausible.csv', csv, { dryRun: 'true', mode: 'skip-invalid' });
    expect(res.status).toBe(200);
    const w = (row: number) => res.body.warnings.filter((x: { row: number }) => x.row === row);
    expect(w(2)[0]).toMatchObject({
      column: 'width_ft',
      message: expect.stringMatching(/3\.6 ft per lane for 2 lanes/),
    });
    expect(w(3)[0]).toMatchObject({
      column: 'width_ft',
      message: expect.stringMatching(/190\.0 ft per lane for 1 lane/),
    });
    expect(w(4)[0]).toMatchObject({ column: 'length_mi', message: expect.stringMatching(/long segment for a local/) });
    expect(w(5)[0]).toMatchObject({ column: 'pci_date', message: expect.stringMatching(/early survey date/) });
    expect(w(7)).toEqual([]);
    expect(res.body.errors).toEqual([
      { row: 6, column: 'pci_date', value: '0001-05-01', message: 'is before 1900; check the date' },
    ]);
  });

  it('a zero-length line is refused when it is the only length, and questioned beside a stated one', async () => {
    const p = [-98.5, 38.8];
    const res = await upload(
      'zero.geojson',
      geojson([line([p, p], { segment_id: 'Z-1' }), line([p, p], { segment_id: 'Z-2', length_mi: 0.5 })]),
      { dryRun: 'true', mode: 'skip-invalid' },
    );
    expect(res.body.errors).toEqual([
      expect.objectContaining({ row: 1, message: expect.stringMatching(/zero length/) }),
    ]);
    expect(res.body.warnings).toEqual([
      expect.objectContaining({ row: 2, message: expect.stringMatching(/zero length/) }),
    ]);
  });
});

describe('"would update" field by field', () => {
  it('lists each changed field with its value before and after, in plain words', async () => {
    const seg = t.sqlite
      .prepare('SELECT * FROM segments WHERE agency_id = ? AND geometry IS NULL ORDER BY id LIMIT 1')
      .get(t.ids.brannock) as Record<string, string | number | null> | undefined;
    const row =
      seg ??
      (t.sqlite.prepare('SELECT * FROM segments WHERE agency_id = ? ORDER BY id LIMIT 1').get(t.ids.brannock) as Record<
        string,
        string | number | null
      >);
    const csv = `${HEAD}\n${row.segment_id},Renamed Road,${row.length_mi},${Number(row.width_ft) + 2},${row.lanes},principal arterial,${row.surface}\n`;
    const res = await upload('diff.csv', csv);
    expect(res.status).toBe(200);
    expect(res.body.updated).toBe(1);
    const fields = Object.fromEntries(
      res.body.changes[0].fields.map((f: { label: string; before: string; after: string }) => [f.label, f]),
    );
    expect(res.body.changes[0].segmentId).toBe(row.segment_id);
    expect(fields['Road name']).toMatchObject({ before: row.road_name, after: 'Renamed Road' });
    expect(fields.Width).toMatchObject({ before: String(row.width_ft), after: String(Number(row.width_ft) + 2) });
    expect(fields['Functional class']).toMatchObject({
      before: String(row.functional_class).replace(/_/g, ' '),
      after: 'principal arterial',
    });
    expect(Object.keys(fields)).toHaveLength(3);
  });
});

describe('what is echoed and kept', () => {
  it('a 20 MB cell is cut in the answer, and nothing is stored when nothing is written', async () => {
    const huge = 'x'.repeat(20 * 1024 * 1024);
    const before = n('SELECT count(*) AS n FROM imports');
    const res = await upload('huge-cell.csv', `${HEAD}\nH-1,${huge},1,24,2,local,asphalt\n`, {
      dryRun: 'false',
      mode: 'skip-invalid',
    });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].message).toBe('is longer than 120 characters');
    expect(res.body.errors[0].value.length).toBeLessThan(120);
    expect(JSON.stringify(res.body).length).toBeLessThan(10_000);
    expect(n('SELECT count(*) AS n FROM imports')).toBe(before);
  });

  it('when good rows are written, the kept rejected row is cut to 100,000 characters a cell', async () => {
    const big = 'y'.repeat(2_000_000);
    const res = await upload(
      'big-cell.csv',
      `${HEAD}\nK-1,${big},1,24,2,local,asphalt\nK-2,Kept Rd,1,24,2,local,asphalt\n`,
      {
        dryRun: 'false',
        mode: 'skip-invalid',
      },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ added: 1, rejected: 1 });
    const kept = n('SELECT length(rejected_csv) AS n FROM imports WHERE id = ?', res.body.importId);
    expect(kept).toBeGreaterThan(100_000);
    expect(kept).toBeLessThan(101_000);
  });

  it('a nested GeoJSON property 200,000 levels deep is a row error in a used column, and ignored elsewhere', async () => {
    const deep = `${'['.repeat(200_000)}1${']'.repeat(200_000)}`;
    const feature = (extra: string) =>
      `{"type":"Feature","properties":{"segment_id":"N-1","road_name":"Nest Rd","width_ft":24,"lanes":2,"functional_class":"local","surface":"asphalt"${extra}},"geometry":{"type":"LineString","coordinates":[[-98.5,38.8],[-98.5,38.81]]}}`;
    const used = await upload(
      'nested.geojson',
      `{"type":"FeatureCollection","features":[${feature(`,"notes":${deep}`)}]}`,
    );
    expect(used.status).toBe(422);
    expect(used.body.errors[0]).toMatchObject({ row: 1, column: 'notes', message: expect.stringMatching(/nested/) });
    const unused = await upload(
      'nested.geojson',
      `{"type":"FeatureCollection","features":[${feature(`,"extra":${deep}`)}]}`,
    );
    expect(unused.status).toBe(200);
  });
});

describe('vertices per feature', () => {
  const zigzag = (count: number) => Array.from({ length: count }, (_, i) => [-98.5 + i * 1e-5, 38.8 + (i % 2) * 1e-5]);

  it('a line of 5,000 positions is simplified to at most 1,000, with a warning; its length comes from the full line', async () => {
    const res = await upload('dense.geojson', geojson([line(zigzag(5000), { segment_id: 'V-1' })]), {
      dryRun: 'false',
    });
    expect(res.status).toBe(200);
    expect(res.body.warnings[0]).toMatchObject({ row: 1, value: '5,000 positions' });
    const stored = t.sqlite.prepare("SELECT geometry, length_mi FROM segments WHERE segment_id = 'V-1'").get() as {
      geometry: string;
      length_mi: number;
    };
    const coords = JSON.parse(stored.geometry).coordinates as number[][];
    expect(coords.length).toBeLessThanOrEqual(1000);
    expect(coords[0]).toEqual(zigzag(5000)[0]);
    expect(coords.at(-1)).toEqual(zigzag(5000).at(-1));
    // Each zigzag step is about 1.4 m; 4,999 of them ≈ 4.4 mi measured on the full line, far more than the simplified one.
    expect(stored.length_mi).toBeGreaterThan(4);
  });

  it('a line of more than 100,000 positions is refused', async () => {
    const res = await upload('huge-line.geojson', geojson([line(zigzag(100_001), { segment_id: 'V-2' })]));
    expect(res.status).toBe(422);
    expect(res.body.errors[0].message).toMatch(/more than 100,000; simplify or split/);
  });
});

describe('one coordinate system wins', () => {
  async function stateplaneShapefile() {
    const { default: proj4 } = await import('proj4');
    const epsg = (await import('epsg-index/all.json', { with: { type: 'json' } })).default as Record<
      string,
      { proj4: string; wkt: string }
    >;
    // NAD83 / Kansas North (ftUS), EPSG:3419, from the epsg-index package.
    const toSp = proj4('WGS84', epsg['3419'].proj4);
    const props = {
      segment_id: 'SP-1',
      road_name: 'Prj Rd',
      width_ft: '24',
      lanes: '2',
      functional: 'local',
      surface: 'asphalt',
    };
    return zippedShapefile(
      [
        {
          props,
          lines: [
            [
              [-98.43, 38.83],
              [-98.428513, 38.83],
            ].map((p) => toSp.forward(p)),
          ],
        },
      ],
      epsg['3419'].wkt,
    );
  }

  it('a .prj and the same EPSG code chosen: reprojected once, no warning, the true length', async () => {
    const res = await upload('roads.zip', await stateplaneShapefile(), { dryRun: 'true', crs: 'EPSG:3419' });
    expect(res.status).toBe(200);
    expect(res.body.warnings).toEqual([]);
    // The same 0.08 mi block as the lon/lat sample (the length of 0.001487° of longitude at 38.83° N).
    expect(res.body.preview[0].lengthMi).toBeGreaterThan(0.0796);
    expect(res.body.preview[0].lengthMi).toBeLessThan(0.0804);
  });

  it('without a choice the .prj is used and named', async () => {
    const res = await upload('roads.zip', await stateplaneShapefile());
    expect(res.body.crsNote).toMatch(/\.prj \(NAD83 \/ Kansas North/);
    expect(res.body.preview[0].lengthMi).toBeGreaterThan(0.0796);
  });

  it('a choice that disagrees with the .prj is used, with a warning saying how far apart they put the line', async () => {
    const res = await upload('roads.zip', await stateplaneShapefile(), { dryRun: 'true', crs: 'EPSG:3420' });
    expect(res.body.crs).toBe('EPSG:3420');
    expect(res.body.warnings[0].message).toMatch(
      /EPSG:3420 as chosen and the shapefile's \.prj .* disagree: the first point lands \d+ km apart/,
    );
  });
});
