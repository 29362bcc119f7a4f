// A hard byte cap while inflating, whatever a zip declares: workbooks, zipped shapefiles
// and agency archives built here with headers that say 1 KB while the data inflates to more
// than the cap. Each is refused with a 400 and the process keeps its memory.
import fs from 'node:fs';
import path from 'node:path';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_WORKBOOK_EXPANDED_BYTES, MAX_SHAPEFILE_EXPANDED_BYTES } from '../../server/imports/read-file';
import { lyingZip } from '../helpers/lying-zip';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
});
afterAll(() => t.close());

const MB = 1024 * 1024;
const upload = (name: string, buf: Buffer) =>
  eng.post(`/api/agencies/${t.ids.brannock}/imports`).field('dryRun', 'true').attach('file', buf, name);

describe('inflation is capped whatever the zip headers say', () => {
  it('a workbook declaring 1 KB that inflates past the 200 MB cap is refused', async () => {
    const zip = await lyingZip([
      { name: '[Content_Types].xml', data: Buffer.from('<?xml version="1.0"?><Types/>') },
      {
        name: 'xl/worksheets/sheet1.xml',
        realBytes: MAX_WORKBOOK_EXPANDED_BYTES + 8 * MB,
        fill: 0x20,
        declaredSize: 1024,
      },
    ]);
    expect(zip.length).toBeLessThan(1 * MB);
    const res = await upload('bomb.xlsx', zip);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/This workbook expands to more than 200 MB when unzipped/);
  });

  it('a zipped shapefile declaring 1 KB that inflates past its cap is refused', async () => {
    const zip = await lyingZip([
      { name: 'roads.shp', realBytes: MAX_SHAPEFILE_EXPANDED_BYTES + 8 * MB, fill: 0, declaredSize: 1024 },
      { name: 'roads.dbf', data: Buffer.alloc(100) },
    ]);
    const res = await upload('roads.zip', zip);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/This zipped shapefile expands to more than 200 MB/);
  });

  it('the same zip layout with honest parts is read: the sample workbook re-zipped here imports its 58 rows', async () => {
    const sample = await JSZip.loadAsync(fs.readFileSync(path.resolve('data/samples/brannock-prairie-view.xlsx')));
    const parts = await Promise.all(
      Object.values(sample.files)
        .filter((f) => !f.dir)
        .map(async (f) => ({ name: f.name, data: await f.async('nodebuffer') })),
    );
    const res = await upload('rezipped.xlsx', await lyingZip(parts));
    expect(res.status).toBe(200);
    expect(res.body.totalRows).toBe(58);
  });
});
