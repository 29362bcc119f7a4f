import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, navLabels, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

const WORK = ['Network', 'Roads', 'Imports', 'Catalog', 'Compare', 'Forecast', 'Plans'];
const cases = [
  { email: 'admin@brannock.example', role: 'admin', nav: [...WORK, 'Members', 'Settings', 'Activity', 'Sent mail'] },
  { email: 'engineer@brannock.example', role: 'engineer', nav: WORK },
  { email: 'viewer@brannock.example', role: 'viewer', nav: ['Network', 'Roads', 'Plans'] },
  { email: 'engineer@marlow.example', role: 'engineer', nav: WORK },
];

describe('each demo role signs in and sees its navigation', () => {
  it.each(cases)('$email', async (c) => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, c.email);
      expect(await navLabels(page)).toEqual(c.nav);
      expect(await page.getByTestId('role').textContent()).toBe(c.role);
      await expect(page.getByText('Network PCI (length-weighted)')).toBeTruthy();
      await page.getByText('Lane-miles by condition band').waitFor();
      // A viewer typing an admin address gets the plain 404, not the screen.
      if (c.role !== 'admin') {
        await page.goto(page.url().replace(/\/network$/, '/members'));
        await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
      }
      expect(outside).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('the consultant switches between agencies and each shows its own roads', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'consultant@example.com');
      const switcher = page.getByLabel('Agency');
      const options = await switcher.locator('option').allTextContents();
      expect(options).toEqual(['Brannock County', 'City of Marlow']);
      await switcher.selectOption({ label: 'City of Marlow' });
      await page.getByRole('heading', { name: 'City of Marlow network' }).waitFor();
      await page.getByRole('link', { name: 'Roads' }).click();
      await page.locator('[data-testid=segment-table] [role=row][data-segment]').first().waitFor();
      const ids = await page
        .locator('[data-testid=segment-table] [role=row][data-segment]')
        .evaluateAll((rows) => rows.map((r) => r.getAttribute('data-segment') ?? ''));
      expect(ids.length).toBeGreaterThan(0);
      expect(ids.every((id) => id.startsWith('MW-'))).toBe(true);
    } finally {
      await context.close();
    }
  });

  it('a wrong password shows a message and stays on sign-in', async () => {
    const { page, context } = await newPage(h);
    try {
      await page.goto(`${h.url}/sign-in`);
      await page.getByLabel('E-mail').fill('viewer@brannock.example');
      await page.getByLabel('Password').fill('not the password');
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('alert').waitFor();
      expect(await page.getByRole('alert').textContent()).toMatch(/wrong e-mail or password/i);
      expect(page.url()).toMatch(/\/sign-in$/);
    } finally {
      await context.close();
    }
  });

  it('an unknown address shows the 404 page', async () => {
    const { page, context } = await newPage(h);
    try {
      await page.goto(`${h.url}/no/such/page`);
      await page.getByRole('heading', { name: 'Nothing here' }).waitFor();
    } finally {
      await context.close();
    }
  });
});
