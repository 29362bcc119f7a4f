// The Roads list: the district filter ignores case and surrounding spaces, the
// district choice list comes from the agency's own segments, and the new sort
// columns (width, lanes, ADT, surface) sort.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let u: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  u = await t.as('viewer@brannock.example');
  base = `/api/agencies/${t.ids.brannock}`;
});
afterAll(() => t.close());

describe('district filter and choice list', () => {
  it('matches a district whatever its case', async () => {
    const exact = await u.get(`${base}/segments?district=Northwest&limit=1`);
    const lower = await u.get(`${base}/segments?district=northwest&limit=1`);
    const spaced = await u.get(`${base}/segments?district=${encodeURIComponent('  NORTHWEST ')}&limit=1`);
    expect(exact.body.total).toBeGreaterThan(100);
    expect(lower.body.total).toBe(exact.body.total);
    expect(spaced.body.total).toBe(exact.body.total);
    expect(lower.body.items[0].district).toBe('Northwest');
  });

  it('lists the districts with segment counts that add up to the inventory, and none of another agency', async () => {
    const res = await u.get(`${base}/districts`);
    expect(res.status).toBe(200);
    const names = res.body.items.map((d: { name: string }) => d.name);
    expect(names).toEqual(['Northeast', 'Northwest', 'Southeast', 'Southwest', 'Tallow Creek']);
    const sum = res.body.items.reduce((s: number, d: { segments: number }) => s + d.segments, 0);
    const all = await u.get(`${base}/segments?limit=1`);
    expect(sum).toBe(all.body.total);
    for (const d of res.body.items) {
      const one = await u.get(`${base}/segments?district=${encodeURIComponent(d.name)}&limit=1`);
      expect(one.body.total).toBe(d.segments);
    }
    expect(names).not.toContain('Marlow');
    expect((await u.get(`/api/agencies/${t.ids.marlow}/districts`)).status).toBe(404);
  });

  it('counts spellings that differ only in case as one district', async () => {
    const eng = await t.as('engineer@brannock.example');
    const first = (await eng.get(`${base}/segments?district=Tallow Creek&limit=1`)).body.items[0];
    const res = await eng.patch(`${base}/segments/${first.id}`).send({ district: 'tallow creek' });
    expect(res.status).toBe(200);
    const list = (await u.get(`${base}/districts`)).body.items;
    expect(list.filter((d: { name: string }) => d.name.toLowerCase() === 'tallow creek')).toHaveLength(1);
    const filtered = await u.get(`${base}/segments?district=Tallow Creek&limit=1`);
    expect(filtered.body.total).toBe(list.find((d: { name: string }) => /tallow/i.test(d.name)).segments);
  });
});

describe('sorting the new columns', () => {
  for (const [sort, key] of [
    ['adt', 'adt'],
    ['widthFt', 'widthFt'],
    ['lanes', 'lanes'],
    ['surface', 'surface'],
  ] as const) {
    it(`sorts by ${sort} both ways`, async () => {
      const firsts: unknown[] = [];
      for (const dir of ['asc', 'desc'] as const) {
        const res = await u.get(`${base}/segments?sort=${sort}&dir=${dir}&limit=300`);
        expect(res.status).toBe(200);
        const values = res.body.items
          .map((s: Record<string, number | string | null>) => s[key])
          .filter((v: unknown) => v !== null);
        const sorted = [...values].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
        expect(values).toEqual(dir === 'asc' ? sorted : sorted.reverse());
        firsts.push(values[0]);
      }
      // The two directions start at opposite ends.
      expect(firsts[0]).not.toEqual(firsts[1]);
    });
  }
});
