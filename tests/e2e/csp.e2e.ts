import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Harness, newPage, signIn, startHarness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h?.stop();
});

describe('content security policy in the browser', () => {
  it('no screen triggers a CSP violation or loads anything from outside', async () => {
    const { page, context, outside, consoleErrors } = await newPage(h);
    try {
      await page.addInitScript(() => {
        (window as unknown as { __csp: string[] }).__csp = [];
        document.addEventListener('securitypolicyviolation', (e) =>
          (window as unknown as { __csp: string[] }).__csp.push(`${e.violatedDirective} ${e.blockedURI}`),
        );
      });
      await signIn(page, h.url, 'admin@brannock.example');
      const base = page.url().replace(/\/network$/, '');
      const violations: string[] = [];
      for (const screen of [
        'network',
        'roads',
        'roads/5',
        'imports',
        'catalog',
        'compare',
        'forecast',
        'plans',
        'members',
        'settings',
        'activity',
        'sent-mail',
      ]) {
        await page.goto(`${base}/${screen}`);
        await page.waitForLoadState('networkidle');
        await page.waitForTimeout(600);
        const v = await page.evaluate(() => (window as unknown as { __csp: string[] }).__csp);
        violations.push(...v.map((x) => `${screen}: ${x}`));
      }
      await page.goto(`${h.url}/api/docs/`);
      await page.waitForLoadState('networkidle');
      expect(violations).toEqual([]);
      expect(consoleErrors.filter((e) => /Content Security Policy|Refused to/.test(e))).toEqual([]);
      expect(outside).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
