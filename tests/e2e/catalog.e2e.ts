import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

// A refetch after a save can take seconds on a loaded machine.
const LOOK_AGAIN = { timeout: 20_000 };

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

const DENSE = 'Dense-graded 12.5 mm';
const mixRow = (page: Page, name: string) => page.getByTestId('mix-table').locator('tr', { hasText: name });

describe('catalog, acting as an admin', () => {
  it('refuses a bad price at the field, saves a price with its effective date, and shows it in the history', async () => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    const writes: string[] = [];
    page.on('request', (r) => r.method() === 'PUT' && writes.push(r.url()));
    try {
      await signIn(page, h.url, 'admin@brannock.example');
      await page.getByRole('link', { name: 'Catalog' }).click();
      await page.getByRole('button', { name: `Change price of ${DENSE}` }).click();
      const price = page.getByLabel(`Price ($/ton) — ${DENSE}`);
      const date = page.getByLabel(`Takes effect — ${DENSE}`);

      // A negative price is refused under the field and nothing is sent.
      await price.fill('-5');
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      await page.getByRole('alert').filter({ hasText: 'Must be more than $0' }).waitFor();
      expect(await price.getAttribute('aria-invalid')).toBe('true');
      // Text that is not a number says so, in words.
      await price.fill('seventy');
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      await page.getByRole('alert').filter({ hasText: 'Must be a number' }).waitFor();
      expect(writes).toEqual([]);

      await price.fill('76.50');
      await date.fill('2027-01-15');
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      await page.getByText(`${DENSE} saved; its price takes effect on 2027-01-15`).waitFor();
      expect(writes).toHaveLength(1);
      // Look again: the row shows the new price and its date, out of edit mode.
      await expect.poll(() => mixRow(page, DENSE).textContent(), LOOK_AGAIN).toMatch(/\$76\.50[\s\S]*2027-01-15/);
      expect(await page.getByLabel(`Price ($/ton) — ${DENSE}`).count()).toBe(0);

      // A treatment's cost item, typed per SY.
      await page.getByRole('button', { name: 'Change prices of Crack seal' }).click();
      await page.getByLabel('Crack sealing ($ per SY) — Crack seal').fill('0.45');
      await page.getByLabel('Takes effect — Crack seal').fill('2027-02-01');
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      await page.getByText('Crack seal saved; its prices take effect on 2027-02-01').waitFor();
      await page.getByTestId('treatment-table').getByText('Crack sealing: $0.45 per SY').waitFor();

      // The history, newest first, in plain words with units.
      await page.getByRole('button', { name: 'Show price history' }).click();
      const rows = page.getByTestId('price-history').locator('tbody tr');
      await rows.first().waitFor();
      const cells = async (i: number) => (await rows.nth(i).locator('td').allTextContents()).map((s) => s.trim());
      const [first, second] = [await cells(0), await cells(1)];
      expect(first.slice(0, 5)).toEqual([
        'Crack seal',
        'Cost items',
        'Crack sealing: $0.40 per SY',
        'Crack sealing: $0.45 per SY',
        '2027-02-01',
      ]);
      expect(second.slice(0, 5)).toEqual([DENSE, 'Price ($/ton)', '$74.00/ton', '$76.50/ton', '2027-01-15']);
      expect(second[6]).toBe('Dana Whitlock');

      // Economics: an analysis period of 0 years is refused at its field; a good rate is kept after a reload.
      const period = page.getByLabel('Analysis period (yr)');
      await period.fill('0');
      await page.getByRole('button', { name: 'Save economics' }).click();
      await page.getByRole('alert').filter({ hasText: 'Must be 1 to 100 years' }).waitFor();
      expect(await period.getAttribute('aria-invalid')).toBe('true');
      await period.fill('40');
      const rate = page.getByLabel('Discount rate, real (%)');
      await rate.fill('3.5');
      await page.getByRole('button', { name: 'Save economics' }).click();
      await page.getByText('Economics saved').waitFor();
      await page.reload();
      await expect.poll(() => page.getByLabel('Discount rate, real (%)').inputValue(), LOOK_AGAIN).toBe('3.5');
      expect(outside).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('an engineer reads the new price and cannot change it', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Catalog' }).click();
      await mixRow(page, DENSE).waitFor();
      expect(await mixRow(page, DENSE).textContent()).toMatch(/\$76\.50[\s\S]*2027-01-15/);
      expect(await page.getByRole('button', { name: /^Change price/ }).count()).toBe(0);
      expect(await page.getByLabel('Discount rate, real (%)').isDisabled()).toBe(true);
    } finally {
      await context.close();
    }
  });
});
