import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

/** Segment ids the map has actually drawn (deduped: a feature comes back once per tile). */
async function renderedSegmentIds(page: Page) {
  await page.waitForFunction(
    () => {
      const el = document.querySelector('[data-testid=network-map] .maplibregl-map') as
        | (HTMLElement & { __map?: { loaded(): boolean; areTilesLoaded(): boolean } })
        | null;
      return !!el?.__map && el.__map.loaded() && el.__map.areTilesLoaded();
    },
    null,
    { timeout: 60_000 },
  );
  return page.evaluate(() => {
    const el = document.querySelector('[data-testid=network-map] .maplibregl-map') as HTMLElement & {
      __map: { queryRenderedFeatures(o: object): { properties: { s: string } }[] };
    };
    return [...new Set(el.__map.queryRenderedFeatures({ layers: ['segments-line'] }).map((f) => f.properties.s))];
  });
}

describe('inventory: import through the UI, then table and map', () => {
  it('walks choose → match → check → write with the sample CSV and shows the new segments', async () => {
    const { page, context, outside } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Imports' }).click();
      await page.getByLabel('File').setInputFiles(path.resolve('data/samples/brannock-prairie-view.csv'));
      await page.getByRole('button', { name: 'Read the file' }).click();
      await page.getByTestId('mapping-table').waitFor();
      // Canonical headers are matched without help.
      expect(await page.getByLabel('Column for Road name').inputValue()).toBe('road_name');
      await page.getByRole('button', { name: 'Check the file' }).click();
      await page.getByTestId('import-counts').waitFor();
      expect(await page.getByTestId('import-counts').textContent()).toContain('Would add58');
      await page.getByRole('button', { name: 'Write 58 rows' }).click();
      await page.getByTestId('import-result').waitFor();
      expect(await page.getByTestId('import-result').textContent()).toBe(
        'Added 58, updated 0, unchanged 0, rejected 0.',
      );
      expect(await page.getByTestId('import-history').textContent()).toContain('brannock-prairie-view.csv');

      await page.getByRole('link', { name: 'Roads' }).click();
      await page.getByLabel('Road name or segment id').fill('PV-');
      await page.waitForFunction(
        () => document.querySelector('[data-testid=segment-table]')?.getAttribute('data-total') === '58',
      );
      const firstRow = page.locator('[data-testid=segment-table] [role=row][data-segment]').first();
      expect(await firstRow.getAttribute('data-segment')).toMatch(/^PV-/);
      // The map draws the filtered set: the new segments and nothing else.
      await expect.poll(async () => (await renderedSegmentIds(page)).length, { timeout: 60_000 }).toBeGreaterThan(0);
      const drawn = await renderedSegmentIds(page);
      expect(drawn.every((s) => s.startsWith('PV-'))).toBe(true);
      expect(outside).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a viewer sees the roads read-only and cannot reach Imports', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'viewer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      await page.locator('[data-testid=segment-table] [role=row][data-segment]').first().waitFor();
      expect(await page.getByRole('button', { name: 'Compare alternatives for selection' }).count()).toBe(0);
      expect(await page.getByText('Double-click a cell to edit it').count()).toBe(0);
      await page.goto(page.url().replace(/\/roads.*$/, '/imports'));
      await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
    } finally {
      await context.close();
    }
  });

  it('a segment page shows the PCI history chart and its map inset', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      await page.getByLabel('Functional class').selectOption('principal_arterial');
      await page.waitForFunction(
        () => document.querySelector('[data-testid=segment-table]')?.getAttribute('data-total') === '24',
      );
      await page.locator('[data-testid=segment-table] [role=row][data-segment] a').first().click();
      await page.getByTestId('pci-chart').waitFor();
      expect(await page.getByTestId('pci-chart').locator('circle').count()).toBe(8);
      await page.getByTestId('network-map').waitFor();
    } finally {
      await context.close();
    }
  });
});
