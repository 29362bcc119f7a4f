// Every unit spelling the importer claims to read from a header (server/imports/mapping.ts),
// each checked end to end: the header is matched to the field, the unit is recognised, and
// the value is converted. Conversion factors are exact by definition (international yard and
// pound agreement, 1959: 1 ft = 0.3048 m, 1 mi = 5,280 ft = 1.609344 km).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LENGTH_UNIT_WORDS, WIDTH_UNIT_WORDS } from '../../server/imports/mapping';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
});
afterAll(() => t.close());

// One mile, and 24 ft, written in each unit.
const ONE_MILE = { mi: '1', km: '1.609344', ft: '5280', m: '1609.344' } as const;
const WIDTH_24FT = { ft: '24', m: '7.3152' } as const;

async function check(lengthHeader: string, lengthValue: string, widthHeader: string, widthValue: string) {
  const csv = `segment_id,road_name,${lengthHeader},${widthHeader},lanes,functional_class,surface\nU-1,Unit Rd,${lengthValue},${widthValue},2,local,asphalt\n`;
  const res = await eng
    .post(`/api/agencies/${t.ids.brannock}/imports`)
    .field('dryRun', 'true')
    .attach('file', Buffer.from(csv), 'units.csv');
  expect(res.status, JSON.stringify(res.body.errors)).toBe(200);
  return res.body;
}

const lengthHeaders = LENGTH_UNIT_WORDS.flatMap(([word, unit]) =>
  [`length_${word}`, `Length (${word})`, `len_${word}`, `Length in ${word}`].map((h) => [h, unit] as const),
);
const widthHeaders = WIDTH_UNIT_WORDS.flatMap(([word, unit]) =>
  [`width_${word}`, `Width (${word})`, `Pavement width ${word}`].map((h) => [h, unit] as const),
);

describe('unit spellings in headers', () => {
  it(`knows ${LENGTH_UNIT_WORDS.length} length and ${WIDTH_UNIT_WORDS.length} width spellings`, () => {
    expect(LENGTH_UNIT_WORDS.map(([w]) => w).sort()).toEqual(
      [
        'kilometres',
        'kilometers',
        'kilometre',
        'kilometer',
        'kms',
        'km',
        'miles',
        'mile',
        'mi',
        'metres',
        'meters',
        'metre',
        'meter',
        'm',
        'feet',
        'foot',
        'ft',
      ].sort(),
    );
  });

  it.each(lengthHeaders)('length header "%s" is read in %s', async (header, unit) => {
    const body = await check(header, ONE_MILE[unit], 'width_ft', '24');
    expect(body.mapping.length_mi).toBe(header);
    expect(body.units.length).toBe(unit);
    expect(body.preview[0].lengthMi).toBeCloseTo(1, 6);
  });

  it.each(widthHeaders)('width header "%s" is read in %s', async (header, unit) => {
    const body = await check('length_mi', '1', header, WIDTH_24FT[unit]);
    expect(body.mapping.width_ft).toBe(header);
    expect(body.units.width).toBe(unit);
    expect(body.preview[0].widthFt).toBeCloseTo(24, 2);
  });

  it('"meter" inside "kilometer" is not metres: length_kilometer 1.609344 is one mile', async () => {
    const body = await check('length_kilometer', '1.609344', 'width_ft', '24');
    expect(body.units.length).toBe('km');
    expect(body.preview[0].lengthMi).toBeCloseTo(1, 6);
  });

  it('a bare unit header ("Miles", "km") is a length; a header with no unit is miles and feet', async () => {
    expect((await check('Miles', '1', 'width_ft', '24')).units.length).toBe('mi');
    expect((await check('km', '1.609344', 'width_ft', '24')).preview[0].lengthMi).toBeCloseTo(1, 6);
    const plain = await check('Length', '1', 'Width', '24');
    expect(plain.units).toEqual({ length: 'mi', width: 'ft' });
  });

  it('a unit chosen in the request wins over the header', async () => {
    const csv =
      'segment_id,road_name,length_km,width_ft,lanes,functional_class,surface\nU-1,Unit Rd,1,24,2,local,asphalt\n';
    const res = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .field('dryRun', 'true')
      .field('lengthUnit', 'mi')
      .attach('file', Buffer.from(csv), 'units.csv');
    expect(res.body.units.length).toBe('mi');
    expect(res.body.preview[0].lengthMi).toBe(1);
  });
});
