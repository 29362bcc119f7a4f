// Every screen at 1280 and 1920 px: a full-page screenshot under
// tests/e2e/__screens__/ (git-ignored, for people to look at), and the overlap
// check on its text. Screens this suite owns fail on any overlap; the others'
// overlaps are printed for their owners.
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';
import { describeOverlaps, textOverlaps } from './layout';
import { settledMap } from './map-probe';

const OUT = path.resolve('tests/e2e/__screens__');
const WIDTHS = [
  { width: 1280, height: 800 },
  { width: 1920, height: 1080 },
];
// Map controls and toasts float over content by design.
const IGNORE = '.maplibregl-ctrl, [data-sonner-toaster]';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
  fs.mkdirSync(OUT, { recursive: true });
});
afterAll(async () => {
  await h?.stop();
});

/** Waits for data, maps and fonts: never a fixed sleep. */
async function ready(page: Page) {
  await page.waitForLoadState('networkidle');
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  const maps = await page.locator('[data-testid=network-map] .maplibregl-map').count();
  if (maps > 0) await settledMap(page);
  await page.waitForFunction(() => !document.body.textContent?.includes('Loading'), null, { timeout: 30_000 });
}

type Screen = { name: string; path: string; mine: boolean; prepare?: (page: Page) => Promise<void> };

async function planId(page: Page, base: string) {
  const headers = { Origin: h.url };
  const api = `${h.url}/api${base.replace(h.url, '').replace(/^\/a\//, '/agencies/')}/plans`;
  const plan = await page.request.post(api, {
    headers,
    data: {
      name: 'Layout check',
      settings: { startYear: 2027, horizonYears: 6, budgetMode: 'flat', annualBudget: 2_400_000 },
    },
  });
  const id = (await plan.json()).id as string;
  const run = (await (await page.request.post(`${api}/${id}/run`, { headers })).json()).id as string;
  await expect
    .poll(async () => (await (await page.request.get(`${api.replace(/\/plans$/, '')}/runs/${run}`)).json()).status, {
      timeout: 120_000,
      interval: 1000,
    })
    .toBe('done');
  return id;
}

describe('every screen at 1280 and 1920 px', () => {
  it('is photographed, and no text on our screens draws over other text', async () => {
    const { page, context } = await newPage(h);
    const failures: string[] = [];
    const others: string[] = [];
    try {
      await signIn(page, h.url, 'admin@brannock.example');
      const base = page.url().replace(/\/network$/, '');
      const plan = await planId(page, base);
      // Something for Activity and the segment's history to show.
      const agencyApi = `${h.url}/api${base.replace(h.url, '').replace(/^\/a\//, '/agencies/')}`;
      await page.request.post(`${agencyApi}/segments/5/treatments`, {
        headers: { Origin: h.url },
        data: {
          treatedOn: '2024-06-10',
          kind: 'chip_seal',
          name: 'Chip seal',
          costUsd: 38_000,
          notes: 'Contract 24-11',
        },
      });
      await page.request.patch(`${agencyApi}/segments/5`, { headers: { Origin: h.url }, data: { adt: 275 } });

      const screens: Screen[] = [
        { name: 'network', path: 'network', mine: true },
        { name: 'roads', path: 'roads', mine: true },
        {
          name: 'roads-empty-filter',
          path: 'roads?q=no-such-road&district=Northwest',
          mine: true,
          prepare: async (p) => p.getByTestId('empty-filtered').waitFor(),
        },
        { name: 'segment', path: 'roads/5', mine: true },
        {
          name: 'segment-forms',
          path: 'roads/5',
          mine: true,
          prepare: async (p) => {
            await p.getByRole('button', { name: 'Record a treatment' }).click();
            await p.getByLabel('Thickness (in)').fill('thick');
            await p.getByRole('button', { name: 'Record the treatment' }).click();
            await p.getByRole('button', { name: 'Edit attributes' }).click();
            await p.getByLabel('Lanes').fill('2.5');
            await p.getByRole('button', { name: 'Save the attributes' }).click();
            await p.getByText('Must be a whole number').waitFor();
          },
        },
        {
          name: 'help',
          path: 'roads',
          mine: true,
          prepare: async (p) => {
            await p.getByRole('button', { name: 'Help & glossary' }).click();
            await p.getByTestId('help-panel').waitFor();
          },
        },
        { name: 'activity', path: 'activity', mine: true },
        { name: 'settings', path: 'settings', mine: true },
        { name: 'members', path: 'members', mine: true },
        { name: 'imports', path: 'imports', mine: false },
        { name: 'catalog', path: 'catalog', mine: false },
        { name: 'compare', path: 'compare', mine: false },
        { name: 'forecast', path: 'forecast', mine: false },
        { name: 'plans', path: 'plans', mine: false },
        { name: 'plan', path: `plans/${plan}`, mine: false },
        { name: 'brief', path: `plans/${plan}/brief`, mine: false },
        { name: 'sent-mail', path: 'sent-mail', mine: false },
      ];
      for (const size of WIDTHS) {
        await page.setViewportSize(size);
        for (const s of screens) {
          await page.goto(`${base}/${s.path}`);
          await ready(page);
          if (s.prepare) {
            await s.prepare(page);
            await ready(page);
          }
          await page.screenshot({ path: path.join(OUT, `${s.name}-${size.width}.png`), fullPage: true });
          const found = describeOverlaps(await textOverlaps(page, 'body', { ignore: IGNORE })).map(
            (o) => `${s.name} at ${size.width} px: ${o}`,
          );
          (s.mine ? failures : others).push(...found);
        }
      }
      if (others.length) console.log(`Overlapping text on screens owned elsewhere:\n${others.join('\n')}`);
      expect(failures).toEqual([]);
    } finally {
      await context.close();
    }
  }, 600_000);
});
