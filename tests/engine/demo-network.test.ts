import { describe, expect, it } from 'vitest';
import { brannockCounty, cityOfMarlow } from '../../server/seed/demo-network';

describe('demo network (fictional scenario)', () => {
  it('is the same on every run', () => {
    expect(brannockCounty()).toEqual(brannockCounty());
  });

  it('has about 1,200 county segments with unique ids and valid PCI histories', () => {
    const county = brannockCounty();
    expect(county.length).toBe(1224);
    expect(new Set(county.map((s) => s.segmentId)).size).toBe(county.length);
    for (const s of county) {
      expect(s.geometry.coordinates).toHaveLength(2);
      if (s.surface === 'gravel') expect(s.surveys).toHaveLength(0);
      else expect(s.surveys).toHaveLength(8);
      for (const v of s.surveys) {
        expect(v.pci).toBeGreaterThanOrEqual(0);
        expect(v.pci).toBeLessThanOrEqual(100);
      }
    }
    expect(cityOfMarlow().length).toBe(84);
  });
});
