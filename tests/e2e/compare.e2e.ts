import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

describe('compare alternatives for a selection of roads', () => {
  it('selects segments on Roads, runs the comparison with Monte Carlo, saves it and reopens it', async () => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Roads' }).click();
      await page.getByLabel('Functional class').selectOption('minor_arterial');
      await page.waitForFunction(
        () => document.querySelector('[data-testid=segment-table]')?.getAttribute('data-total') === '40',
      );
      const boxes = page.locator('[data-testid=segment-table] input[type=checkbox]');
      for (let i = 0; i < 5; i++) await boxes.nth(i).check();
      expect(await page.getByTestId('selection-count').textContent()).toBe('5 selected');
      await page.getByRole('button', { name: 'Compare alternatives for selection' }).click();
      await page.getByTestId('compare-selection').waitFor();
      expect(await page.getByTestId('compare-selection').textContent()).toMatch(/^5 segments from Roads/);
      // The second default alternative is a 1.5-in rubber-modified lift; make it 1 in.
      await page.getByTestId('alt-1-initial').getByLabel('Initial treatment (year 0) thickness').fill('1');
      await page.getByRole('button', { name: 'Compare', exact: true }).click();
      await page.getByTestId('study-results').waitFor({ timeout: 60_000 });
      const ranked = page.getByTestId('ranked-table').locator('tbody tr');
      expect(await ranked.count()).toBe(3);
      await page.getByTestId('tornado').waitFor();
      await page.getByTestId('mc-histogram').waitFor();
      // A thin lift on a busy arterial draws the structural caution.
      expect(await page.getByTestId('cautions').textContent()).toMatch(/structurally short/);
      await page.getByLabel('Comparison name').fill('Parkway north, three options');
      await page.getByRole('button', { name: 'Save' }).click();
      await page.getByText('Saved: Parkway north, three options').waitFor();
      await page.getByRole('link', { name: 'XLSX' }).waitFor();
      expect(await page.getByRole('button', { name: 'Parkway north, three options' }).count()).toBe(1);
      expect(outside).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a typed-in section needs no inventory', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'consultant@example.com');
      await page.goto(page.url().replace(/\/network$/, '/compare'));
      await page.getByTestId('typed-section').waitFor();
      await page.getByLabel('lengthMi').fill('2.5');
      await page.getByLabel('Iterations').fill('500');
      await page.getByRole('button', { name: 'Compare', exact: true }).click();
      await page.getByTestId('study-results').waitFor({ timeout: 60_000 });
      expect(await page.getByTestId('study-caption').textContent()).toMatch(/costs least/);
    } finally {
      await context.close();
    }
  });
});
