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

const FAMILY = 'Asphalt, collectors, last treatment: overlay or mill and overlay';

describe('forecast, acting as an engineer', () => {
  it('picks a family, edits its curve and sees it move, keeps it after a reload, then goes back to the fit', async () => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Forecast' }).click();
      const pick = page.getByTestId('families').getByRole('button', { name: FAMILY });
      await pick.click();
      expect(await pick.getAttribute('aria-pressed')).toBe('true');
      await page.getByRole('heading', { name: FAMILY }).waitFor();
      const caption = page.getByTestId('fit-caption');
      const used = page.getByTestId('curve-used');
      const fittedCaption = await caption.textContent();
      const fittedPath = await used.getAttribute('d');
      expect(fittedCaption).toMatch(/fitted to [\d,]+ surveys, RMSE \d+\.\d PCI points/);

      await page.getByRole('button', { name: 'Edit this curve' }).click();
      const b = page.getByLabel('Shape (b)');
      // Out of range: no draft drawn, and the field says why when saving.
      await b.fill('5');
      expect(await page.getByTestId('curve-draft').count()).toBe(0);
      await page.getByRole('button', { name: 'Save curve' }).click();
      await page.getByRole('alert').filter({ hasText: 'Must be 1 to 3' }).waitFor();
      expect(await b.getAttribute('aria-invalid')).toBe('true');

      // A good curve is drawn as a draft before it is saved.
      await page.getByLabel('Rate (a), PCI points').fill('0.1');
      await b.fill('2.2');
      await page.getByTestId('curve-draft').waitFor();
      expect(await page.getByTestId('curve-draft').getAttribute('d')).not.toBe(fittedPath);
      await page.getByRole('button', { name: 'Save curve' }).click();
      await page.getByText('Curve saved; plans use it from their next run').waitFor();

      // Look again: the curve plans use has moved, the fit stays as a dashed line.
      await expect.poll(() => used.getAttribute('d'), LOOK_AGAIN).not.toBe(fittedPath);
      await page.getByTestId('curve-fit').waitFor();
      // Ages by the curve's inverse, age = ((P0 − PCI) / a)^(1/b), worked by hand:
      // (30 / 0.1)^(1/2.2) = 13.36 and (60 / 0.1)^(1/2.2) = 18.32.
      const edited = await caption.textContent();
      expect(edited).toContain('PCI = 100.00 − 0.100 × age^2.20 (set by hand for this agency)');
      expect(edited).toContain('reaches PCI 70 after 13.4 years and 40 after 18.3 years');
      await expect.poll(() => pick.textContent(), LOOK_AGAIN).toMatch(/set by hand/);

      // Kept after a reload.
      await page.reload();
      await page.getByTestId('families').getByRole('button', { name: FAMILY }).click();
      await expect.poll(() => caption.textContent(), LOOK_AGAIN).toContain('set by hand for this agency');

      await page.getByRole('button', { name: 'Go back to the fitted curve' }).click();
      await page.getByText('Back to the fitted curve', { exact: true }).waitFor();
      await expect.poll(() => caption.textContent(), LOOK_AGAIN).toBe(fittedCaption);
      expect(await used.getAttribute('d')).toBe(fittedPath);
      expect(await page.getByTestId('curve-fit').count()).toBe(0);
      expect(outside).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
