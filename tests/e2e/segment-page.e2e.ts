// The segment page as an engineer uses it: add a survey, record a treatment,
// edit an attribute — each refused first with a plain message at the field,
// then saved and seen on the page, and the network summary follows.
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

const networkPci = async (page: Page) =>
  (await page.getByText('Network PCI (length-weighted)').locator('..').locator('.num').textContent())?.trim();
const attribute = (page: Page, name: string) =>
  page.getByTestId('attributes').locator('dt', { hasText: name }).locator('xpath=following-sibling::dd[1]');

describe('segment page: surveys, treatments and attributes through the UI', () => {
  it('adds a survey, records a treatment, edits the width, and the page and the network show them', async () => {
    const { page, context, consoleErrors, outside } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      const pciBefore = await networkPci(page);
      expect(pciBefore).toMatch(/^\d+\.\d$/);

      await page.getByRole('link', { name: 'Roads' }).click();
      await page.getByLabel('Road name or segment id').fill('BC-E10-05');
      await page.waitForFunction(
        () => document.querySelector('[data-testid=segment-table]')?.getAttribute('data-total') === '1',
      );
      await page.getByRole('link', { name: 'BC-E10-05' }).click();
      await page.getByRole('heading', { name: 'County Highway 14 · BC-E10-05' }).waitFor();
      const today = new Date().toISOString().slice(0, 10);

      // 1. A survey: a PCI of 140 is refused at the field, 4 is taken and becomes the latest PCI.
      await page.getByRole('button', { name: 'Add a survey' }).click();
      const survey = page.getByRole('form', { name: 'Add a survey' });
      await survey.getByLabel('PCI', { exact: true }).fill('140');
      await survey.getByLabel('Source').fill('Windshield check');
      await survey.getByRole('button', { name: 'Add the survey' }).click();
      await survey.getByText('Must be 100 or less').waitFor();
      expect(await survey.getByLabel('PCI', { exact: true }).getAttribute('aria-invalid')).toBe('true');
      await survey.getByLabel('PCI', { exact: true }).fill('4');
      await survey.getByRole('button', { name: 'Add the survey' }).click();
      await survey.waitFor({ state: 'detached' });
      const firstSurvey = page.getByTestId('survey-table').locator('tbody tr').first();
      await expect.poll(() => firstSurvey.textContent(), SLOW).toBe(`${today}4Windshield check`);
      await expect
        .poll(() => attribute(page, 'Latest PCI').textContent())
        .toMatch(new RegExp(`^4 \\(Broken up;.*on ${today}$`));

      // 2. A treatment from the catalog, with a cost.
      await page.getByRole('button', { name: 'Record a treatment' }).click();
      const job = page.getByRole('form', { name: 'Record a treatment' });
      await job.getByLabel('From the catalog').selectOption({ label: 'Mill and overlay (2 in)' });
      expect(await job.getByLabel('Thickness (in)').inputValue()).toBe('2');
      expect(await job.getByLabel('Kind of work').inputValue()).toBe('mill_and_overlay');
      await job.getByLabel('Cost ($)').fill('-5');
      await job.getByRole('button', { name: 'Record the treatment' }).click();
      await job.getByText('Must be at least 0').waitFor();
      await job.getByLabel('Cost ($)').fill('152,400');
      await job.getByLabel('Notes').fill('Contract 26-03');
      await job.getByRole('button', { name: 'Record the treatment' }).click();
      await job.waitFor({ state: 'detached' });
      const row = page.getByTestId('treatment-history').locator('tbody tr').first();
      await expect.poll(() => row.textContent(), SLOW).toContain('Mill and overlay (2 in)');
      const text = (await row.textContent()) ?? '';
      expect(text).toContain(today);
      expect(text).toContain('$152,400');
      expect(text).toContain('Contract 26-03');
      expect(text).toContain('2 in');
      expect(await attribute(page, 'Last treatment').textContent()).toBe(`mill and overlay, ${today.slice(0, 4)}`);
      expect(await page.getByTestId('pci-chart').getByTestId('treatment-mark').count()).toBeGreaterThanOrEqual(1);

      // 3. An attribute: a zero width is refused in words, 30 ft is saved.
      await page.getByRole('button', { name: 'Edit attributes' }).click();
      const edit = page.getByRole('form', { name: 'Edit attributes' });
      await edit.getByLabel('Width (ft)').fill('0');
      await edit.getByRole('button', { name: 'Save the attributes' }).click();
      await edit.getByText('Must be more than 0').waitFor();
      expect(await edit.locator('[data-field-error]').allTextContents()).toEqual(['Must be more than 0']);
      await edit.getByLabel('Width (ft)').fill('30');
      await edit.getByRole('button', { name: 'Save the attributes' }).click();
      await edit.waitFor({ state: 'detached' });
      await expect.poll(() => attribute(page, 'Width').textContent(), SLOW).toBe('30.0 ft');

      // The network summary, reached through the rail (no reload), has the new PCI in it.
      await page.getByRole('link', { name: 'Network' }).click();
      await expect.poll(() => networkPci(page), SLOW).not.toBe(pciBefore);
      expect(Number(await networkPci(page))).toBeLessThan(Number(pciBefore));
      expect(consoleErrors).toEqual([]);
      expect(outside).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('Activity tells the admin who did it and what changed, in words', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'admin@brannock.example');
      await page.getByRole('link', { name: 'Activity' }).click();
      const table = page.getByTestId('audit-table');
      await table.waitFor();
      const row = (action: string) => table.locator(`tr[data-action="${action}"]`).first();
      const job = (await row('treatment.record').textContent()) ?? '';
      expect(job).toContain('Recorded a treatment');
      expect(job).toContain('segment BC-E10-05 (County Highway 14)');
      expect(job).toContain('Ruben Osei');
      expect(job).toMatch(/Last treatment year: \d{4} → \d{4}/);
      expect(job).toContain('Cost ($): $152,400');
      expect(await row('segment.update').textContent()).toContain('Width (ft): 40 → 30');
      expect(await row('survey.add').textContent()).toMatch(/Latest PCI: \d+ → 4/);
      // No code names or JSON anywhere in the table.
      const pieces = await table.evaluate((el) => {
        const out: string[] = [];
        const walk = document.createTreeWalker(el, NodeFilter.SHOW_TEXT);
        for (let n = walk.nextNode(); n; n = walk.nextNode()) if (n.textContent?.trim()) out.push(n.textContent.trim());
        return out;
      });
      expect(pieces.length).toBeGreaterThan(20);
      expect(pieces.filter((p) => /[{}"]|\b[a-z]+[A-Z]\w*|\b[a-z]+_[a-z]+/.test(p))).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('a viewer sees the history but no buttons to change it', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'viewer@brannock.example');
      await page.goto(page.url().replace(/\/network$/, '/roads/5'));
      await page.getByTestId('treatments-card').waitFor();
      for (const name of ['Add a survey', 'Record a treatment', 'Edit attributes'])
        expect(await page.getByRole('button', { name }).count()).toBe(0);
    } finally {
      await context.close();
    }
  });
});
