// The map keeps every road on screen while the user works with it: click a road,
// draw a selection box, tick a table row, change the plan's work-list year, and
// after each the map still draws every feature it was given.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';
import { idsInBox, mapBox, pointOnSegment, rendered } from './map-probe';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

/** Every feature drawn: as many distinct rendered ids as features handed to the map, and more than none. */
async function expectAllDrawn(page: Page, scope?: string) {
  const r = await rendered(page, scope);
  expect(r.total).toBeGreaterThan(1000);
  expect(r.ids.length).toBe(r.total);
  return r;
}

describe('the map stays drawn while the user selects', () => {
  it('Roads: click a road, select by box, tick a row — every road still drawn after each', async () => {
    const { page, context, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      await page.locator('[data-testid=segment-table] [role=row][data-segment]').first().waitFor();
      const before = await expectAllDrawn(page);
      expect(before.selected).toEqual([]);

      // 1. Click a road: its popup opens, it is selected, and nothing disappears.
      const p = await pointOnSegment(page);
      expect(p).not.toBeNull();
      await page.mouse.click(p!.x, p!.y);
      await page.getByTestId('map-popup').waitFor();
      expect(await page.getByTestId('selection-count').textContent()).toBe('1 selected');
      const afterClick = await expectAllDrawn(page);
      expect(afterClick.selected).toEqual([p!.id]);
      expect(
        await page.getByTestId('map-popup').getByRole('link', { name: 'Open segment' }).getAttribute('href'),
      ).toMatch(new RegExp(`/roads/${p!.id}$`));

      // 2. Select by box over the middle of the map.
      const m = await mapBox(page);
      const box = {
        x0: Math.round(m.x + m.width * 0.3),
        y0: Math.round(m.y + m.height * 0.3),
        x1: Math.round(m.x + m.width * 0.6),
        y1: Math.round(m.y + m.height * 0.6),
      };
      const expected = await idsInBox(page, box);
      expect(expected.length).toBeGreaterThan(10);
      await page.getByRole('button', { name: 'Select by box' }).click();
      await page.mouse.move(box.x0, box.y0);
      await page.mouse.down();
      await page.mouse.move((box.x0 + box.x1) / 2, (box.y0 + box.y1) / 2, { steps: 4 });
      await page.mouse.move(box.x1, box.y1, { steps: 4 });
      await page.mouse.up();

      await page.getByTestId('selection-count').getByText(`${expected.length} selected`).waitFor();
      const afterBox = await expectAllDrawn(page);
      expect(afterBox.selected).toEqual(expected);

      // 3. Tick a table row: one more selected, drawn with the selection casing.
      const row = page.locator('[data-testid=segment-table] [role=row][data-segment]').first();
      const boxIn = row.locator('input[type=checkbox]');
      const wasChecked = await boxIn.isChecked();
      await boxIn.click();
      const n = expected.length + (wasChecked ? -1 : 1);
      await page.getByTestId('selection-count').getByText(`${n} selected`).waitFor();
      const afterTick = await expectAllDrawn(page);
      expect(afterTick.selected.length).toBe(n);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('Network home: clicking a road opens its popup and the map keeps every road', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'viewer@brannock.example');
      await expectAllDrawn(page);
      for (const nth of [0, 3]) {
        const p = await pointOnSegment(page, 'body', nth);
        expect(p).not.toBeNull();
        await page.mouse.click(p!.x, p!.y);
        await page.getByTestId('map-popup').waitFor();
        await expectAllDrawn(page);
      }
    } finally {
      await context.close();
    }
  });

  it("a plan's map keeps every road and its planned years when the work-list year changes", async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      const agencyId = page.url().match(/\/a\/([^/]+)\//)![1];
      const headers = { Origin: h.url };
      const base = `${h.url}/api/agencies/${agencyId}/plans`;
      const plan = await page.request.post(base, {
        headers,
        data: {
          name: 'Map check',
          settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 2_400_000 },
        },
      });
      expect(plan.status()).toBe(201);
      const planId = (await plan.json()).id as string;
      const run = await page.request.post(`${base}/${planId}/run`, { headers });
      expect(run.status()).toBe(202);
      const runId = (await run.json()).id as string;
      await expect
        .poll(
          async () => (await (await page.request.get(`${h.url}/api/agencies/${agencyId}/runs/${runId}`)).json()).status,
          {
            timeout: 120_000,
            interval: 1000,
          },
        )
        .toBe('done');

      await page.goto(`${h.url}/a/${agencyId}/plans/${planId}`);
      await page.getByTestId('plan-results').waitFor({ timeout: 60_000 });
      const scope = '[data-testid=plan-results]';
      const first = await expectAllDrawn(page, scope);
      expect(first.planned.length).toBeGreaterThan(10);
      const year = page.getByLabel('Work list year');
      const options = await year.locator('option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value));
      for (const v of [options[1], 'all', options[0]]) {
        await year.selectOption(v);
        const r = await expectAllDrawn(page, scope);
        expect(r.planned).toEqual(first.planned);
      }
    } finally {
      await context.close();
    }
  });
});
