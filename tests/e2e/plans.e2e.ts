import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

describe('budget plan, end to end', () => {
  it('creates a scenario on the demo county, runs it, sees charts and the map, publishes, opens the brief PDF', async () => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    let planUrl: string;
    try {
      await signIn(page, h.url, 'engineer@brannock.example');
      await page.getByRole('link', { name: 'Plans' }).click();
      await page.getByLabel('Scenario name').fill('Council ask');
      await page.getByLabel('Annual budget').fill('2400000');
      await page.getByRole('button', { name: 'Create scenario' }).click();
      await page.getByLabel('Horizon').fill('6');
      await page.getByRole('button', { name: 'Save inputs' }).click();
      await page.getByText('Scenario saved').waitFor();
      await page.getByRole('button', { name: 'Run the plan', exact: true }).click();
      await page.getByTestId('plan-results').waitFor({ timeout: 120_000 });
      expect(await page.getByTestId('plan-caption').textContent()).toMatch(
        /network PCI goes from \d+ in 2027 to \d+ by 2032/,
      );
      for (const id of ['pci-by-year', 'bands-by-year', 'backlog-by-year']) await page.getByTestId(id).waitFor();
      expect(await page.getByTestId('work-list').locator('tbody tr').count()).toBeGreaterThan(5);
      // Find the budget: a run of its own, polled at the same runs endpoint as the plan run.
      await page.getByLabel('Target PCI').fill('65');
      await page.getByRole('button', { name: 'Find', exact: true }).click();
      await page.getByTestId('budget-search').waitFor({ timeout: 120_000 });
      expect(await page.getByTestId('budget-search').textContent()).toMatch(
        /About \$[\d,.]+[MK]? a year reaches PCI 65|PCI 65 is out of reach/,
      );
      // The map colours planned work: rendered features with a planned year exist.
      await page.waitForFunction(
        () => {
          const el = document.querySelector('[data-testid=plan-results] [data-testid=network-map] .maplibregl-map') as
            | (HTMLElement & {
                __map?: { loaded(): boolean; queryRenderedFeatures(o: object): { state: { py?: number } }[] };
              })
            | null;
          return (
            !!el?.__map &&
            el.__map.loaded() &&
            el.__map.queryRenderedFeatures({ layers: ['segments-line'] }).some((f) => (f.state.py ?? -1) >= 0)
          );
        },
        null,
        { timeout: 60_000 },
      );
      await page.getByRole('button', { name: 'Publish', exact: true }).click();
      await page.getByRole('dialog', { name: 'Publish this plan?' }).waitFor();
      await page.getByRole('button', { name: 'Yes, publish' }).click();
      await page.getByText(/Published; 1 viewer\(s\) e-mailed/).waitFor();
      planUrl = page.url();
      // The print page: the same brief, drawn in the browser.
      await page.getByRole('link', { name: 'Brief', exact: true }).click();
      await page.getByTestId('brief').waitFor();
      await page.getByTestId('brief-map').waitFor();
      for (const heading of ['Summary', 'Network condition', 'Backlog', 'Work list, first two years', 'Cautions'])
        await page.getByRole('heading', { name: heading }).waitFor();
      await page.goBack();
      const pdfHref = await page.getByRole('link', { name: 'Council brief (PDF)' }).getAttribute('href');
      const pdf = await page.request.get(`${h.url}${pdfHref}`);
      expect(pdf.status()).toBe(200);
      expect(pdf.headers()['content-type']).toBe('application/pdf');
      const text = (await pdf.body()).toString('latin1');
      expect((text.match(/\/Type \/Page\b/g) ?? []).length).toBeGreaterThanOrEqual(2);
      for (const heading of [
        'Summary',
        'The plan in four numbers',
        'Budget choices side by side',
        'Network condition',
        'Lane-miles by condition band',
        'Backlog',
        'Map of the planned work',
        'Work list, first two years',
        'Method',
        'Cautions',
      ])
        expect(text).toContain(`(${heading})`);
      expect(outside).toEqual([]);
      expect(consoleErrors).toEqual([]);
    } finally {
      await context.close();
    }

    // The viewer, e-mailed, reads the published plan but cannot run it.
    const viewer = await newPage(h);
    try {
      await signIn(viewer.page, h.url, 'viewer@brannock.example');
      await viewer.page.goto(planUrl!);
      await viewer.page.getByTestId('plan-results').waitFor({ timeout: 60_000 });
      expect(await viewer.page.getByRole('button', { name: 'Run the plan' }).count()).toBe(0);
    } finally {
      await viewer.context.close();
    }
  });
});
