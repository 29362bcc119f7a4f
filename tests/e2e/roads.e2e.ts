// Roads as a superintendent uses it at 1280 px: PCI in view beside the map,
// district from a list, sorting by traffic, an empty filter that says so, and
// an in-place edit refused in plain words before it is saved.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

/** Generous: two cores shared by several test runs. */
const SLOW = { timeout: 20_000 };

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

const total = (page: Page) => page.getByTestId('segment-table').getAttribute('data-total');
const rows = (page: Page) => page.locator('[data-testid=segment-table] [role=row][data-segment]');
/** The text of one column in the first n rows, by the column's header text. */
async function column(page: Page, header: string, n = 8) {
  const headers = await page.locator('[data-testid=segment-table] [role=columnheader]').allTextContents();
  // A header reads "ADT ↑" plus its glossary hint "?What is ADT?": compare the name only.
  const i = headers.findIndex((t) => t.split('?')[0].replace(/[↑↓]/g, '').trim() === header);
  expect(i, JSON.stringify(headers)).toBeGreaterThanOrEqual(0);
  const out: string[] = [];
  for (let r = 0; r < n; r++) out.push((await rows(page).nth(r).locator('[role=cell]').nth(i).textContent()) ?? '');
  return out;
}

describe('Roads', () => {
  it('shows PCI in view at 1280 px, filters by district from a list, sorts by ADT, and says when nothing matches', async () => {
    const { page, context, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      await rows(page).first().waitFor();
      // PCI's header and the first row's PCI are inside the table's visible box, with no sideways scroll.
      const box = (await page.getByTestId('segment-scroller').boundingBox())!;
      const pci = (await page.getByRole('columnheader', { name: /PCI/ }).boundingBox())!;
      expect(pci.x + pci.width).toBeLessThanOrEqual(box.x + box.width);
      expect(await page.getByTestId('segment-scroller').evaluate((el) => el.scrollLeft)).toBe(0);

      // District: a choice list from the agency's own districts, with counts.
      const district = page.getByLabel('District');
      const options = await district.locator('option').allTextContents();
      expect(options).toEqual([
        'All districts',
        expect.stringMatching(/^Northeast \(\d+\)$/),
        expect.stringMatching(/^Northwest \(\d+\)$/),
        expect.stringMatching(/^Southeast \(\d+\)$/),
        expect.stringMatching(/^Southwest \(\d+\)$/),
        expect.stringMatching(/^Tallow Creek \(\d+\)$/),
      ]);
      const nw = Number(options[2].match(/\((\d+)\)/)![1]);
      await district.selectOption('Northwest');
      await expect.poll(() => total(page), SLOW).toBe(String(nw));
      expect(new Set(await column(page, 'District'))).toEqual(new Set(['Northwest']));

      // Sort by ADT: up, then down.
      await page.getByRole('button', { name: 'ADT', exact: true }).click();
      await expect.poll(async () => (await column(page, 'ADT', 1))[0], SLOW).not.toBe('—');
      const up = (await column(page, 'ADT')).map((v) => Number(v.replace(/,/g, '')));
      expect(up).toEqual([...up].sort((a, b) => a - b));
      await page.getByRole('button', { name: 'ADT ↑' }).click();
      await expect
        .poll(async () => Number((await column(page, 'ADT', 1))[0].replace(/,/g, '')), SLOW)
        .toBeGreaterThan(1000);
      const down = (await column(page, 'ADT')).map((v) => Number(v.replace(/,/g, '')));
      expect(down).toEqual([...down].sort((a, b) => b - a));

      // Nothing matches: the table says which filters and offers to clear them.
      await page.getByLabel('Road name or segment id').fill('no such road');
      const empty = page.getByTestId('empty-filtered');
      await empty.waitFor();
      expect(await empty.textContent()).toContain('No segments match these filters.');
      expect(await empty.textContent()).toContain('road or id “no such road”, district Northwest');
      await empty.getByRole('button', { name: 'Clear the filters' }).click();
      await expect.poll(() => total(page), SLOW).toBe('1224');
      expect(await page.getByLabel('Road name or segment id').inputValue()).toBe('');
      expect(await district.inputValue()).toBe('');

      // The segment id is a link to its page.
      const first = rows(page).first();
      const id = await first.getAttribute('data-segment');
      expect(await first.getByRole('link', { name: id! }).getAttribute('href')).toMatch(/\/roads\/\d+$/);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('an in-place edit is refused at the cell in words, then saved', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      const first = rows(page).first();
      await first.waitFor();
      const id = (await first.getAttribute('data-segment'))!;
      const headers = await page.locator('[data-testid=segment-table] [role=columnheader]').allTextContents();
      const widthCell = first.locator('[role=cell]').nth(headers.findIndex((t) => t.startsWith('Width (ft)')));
      await widthCell.dblclick();
      const input = page.getByLabel(`Width (ft) of ${id}`);
      await input.fill('0');
      await input.press('Enter');
      await page.getByRole('alert').filter({ hasText: 'Width (ft): Must be more than 0' }).waitFor();
      expect(await input.getAttribute('aria-invalid')).toBe('true');
      await input.fill('26');
      await input.press('Enter');
      await page.getByText(`${id}: Width (ft) saved`).waitFor();
      await expect.poll(() => widthCell.textContent(), SLOW).toBe('26');
    } finally {
      await context.close();
    }
  });

  it('the glossary opens from the rail on every screen, and from a term where it is used', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'viewer@brannock.example');
      const base = page.url().replace(/\/network$/, '');
      for (const screen of ['network', 'roads', 'roads/5', 'plans']) {
        await page.goto(`${base}/${screen}`);
        await page.getByRole('button', { name: 'Help & glossary' }).click();
        const panel = page.getByTestId('help-panel');
        await panel.waitFor();
        for (const term of ['PCI', 'EUAC', 'Present value', 'Remaining service life', 'SN', 'ESAL', 'Lane-mile'])
          await panel.locator('dt', { hasText: term }).first().waitFor();
        await page.keyboard.press('Escape');
        await panel.waitFor({ state: 'detached' });
      }
      // A term in a table header: its meaning on hover, the glossary at that entry on click.
      await page.goto(`${base}/roads`);
      const hint = page.getByRole('button', { name: 'What is ADT?' });
      await hint.hover();
      await page.getByRole('tooltip').getByText('Vehicles a day on the segment').waitFor();
      await hint.click();
      const panel = page.getByTestId('help-panel');
      await panel.waitFor();
      await expect
        .poll(async () => panel.locator('[data-term=adt]').evaluate((el) => el.className), SLOW)
        .toContain('bg-accent-light');
      await panel.getByLabel('Find a term').fill('discount');
      const found = await panel.locator('dt').allTextContents();
      expect(found).toEqual(
        expect.arrayContaining(['Present value · PV', 'Discount rate', 'Break-even discount rate']),
      );
      expect(found).not.toContain('PCI · Pavement Condition Index');
    } finally {
      await context.close();
    }
  });
});
