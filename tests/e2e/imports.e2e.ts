// The Imports screen as an engineer uses it: the check's counts follow the chosen mode and
// match what the write then reports; unknown classes and surfaces are matched to ours; the
// date format is a choice; "would update" shows each field before and after.
import fs from 'node:fs';
import os from 'node:os';
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

const counts = async (page: Page) => (await page.getByTestId('import-counts').textContent()) ?? '';

async function readAndCheck(page: Page, file: string) {
  await page.getByRole('link', { name: 'Imports' }).click();
  await page.getByLabel('File').setInputFiles(file);
  await page.getByRole('button', { name: 'Read the file' }).click();
  await page.getByTestId('mapping-table').waitFor();
  await page.getByRole('button', { name: 'Check the file' }).click();
  await page.getByTestId('import-counts').waitFor();
}

describe('imports: check, match values, write', () => {
  it('the messy sample: counts follow the mode, values are matched, and the write adds what the check said', async () => {
    const { page, context, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await readAndCheck(page, path.resolve('data/samples/brannock-messy.csv'));
      expect(await page.getByTestId('import-errors').locator('tbody tr').count()).toBe(10);
      expect(await counts(page)).toContain('Would add0');
      expect(await page.getByTestId('import-refused').textContent()).toMatch(
        /Skipping the 10 rejected rows would add 2/,
      );
      expect(await page.getByRole('button', { name: /^Write/ }).isDisabled()).toBe(true);
      // The US date is read as one, and says so.
      expect(await page.getByTestId('import-read-notes').textContent()).toContain('month/day/year (US)');

      await page.getByLabel('Skip the rejected rows, write the rest').check();
      expect(await counts(page)).toContain('Would add2');
      expect(await page.getByTestId('import-refused').count()).toBe(0);

      // Match the two unknown values, check again: two more good rows.
      await page.getByLabel('Wearcourse functional class for Arterial Road').selectOption('principal_arterial');
      await page.getByLabel('Wearcourse surface for Cobblestone').selectOption('other');
      await page.getByRole('button', { name: 'Check again with these matches' }).click();
      await page.waitForFunction(() =>
        document.querySelector('[data-testid=import-counts]')?.textContent?.includes('Would add4'),
      );
      expect(await page.getByTestId('import-errors').locator('tbody tr').count()).toBe(8);

      await page.getByRole('button', { name: 'Write 4 rows' }).click();
      await page.getByTestId('import-result').waitFor();
      expect(await page.getByTestId('import-result').textContent()).toBe(
        'Added 4, updated 0, unchanged 0, rejected 8.',
      );
      await page.getByRole('link', { name: 'Download the rejected rows (CSV with reasons)' }).waitFor();
      // A refused dry run answers 422 with its report (expected); anything else logged is a fault.
      const faults = consoleErrors.filter((e) => !/status of 422/.test(e));
      expect(faults, faults.join('\n')).toEqual([]);
    } finally {
      await context.close();
    }
  });

  it('day/month/year is a choice in the column step, and the check says how dates were read', async () => {
    const { page, context } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Imports' }).click();
      await page.getByLabel('File').setInputFiles(path.resolve('data/samples/brannock-messy.csv'));
      await page.getByRole('button', { name: 'Read the file' }).click();
      await page.getByLabel('Dates written as').selectOption('dmy');
      await page.getByRole('button', { name: 'Check the file' }).click();
      await page.getByTestId('import-read-notes').waitFor();
      expect(await page.getByTestId('import-read-notes').textContent()).toContain('read as day/month/year');
    } finally {
      await context.close();
    }
  });

  it('"would update" lists each changed field with its value now and from the file', async () => {
    const { page, context } = await newPage(h);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wc-imp-'));
    try {
      await signIn(page, h.url, 'engineer@marlow.example');
      const original = fs.readFileSync(path.resolve('data/samples/brannock-prairie-view.csv'), 'utf8');
      const first = path.join(dir, 'prairie.csv');
      fs.writeFileSync(first, original);
      await readAndCheck(page, first);
      await page.getByRole('button', { name: 'Write 58 rows' }).click();
      await page.getByTestId('import-result').waitFor();
      await page.getByRole('button', { name: 'Import another file' }).click();

      const edited = path.join(dir, 'prairie-edited.csv');
      fs.writeFileSync(edited, original.replace('PV-S1-1,Bluestem Dr', 'PV-S1-1,Bluestem Drive'));
      await page.getByLabel('File').setInputFiles(edited);
      await page.getByRole('button', { name: 'Read the file' }).click();
      await page.getByRole('button', { name: 'Check the file' }).click();
      await page.getByTestId('import-changes').waitFor();
      expect(await counts(page)).toContain('Would update1');
      const row = await page.getByTestId('import-changes').locator('tbody tr').first().textContent();
      expect(row).toContain('PV-S1-1');
      expect(row).toContain('Road name');
      expect(row).toContain('Bluestem Dr');
      expect(row).toContain('Bluestem Drive');
    } finally {
      await context.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
