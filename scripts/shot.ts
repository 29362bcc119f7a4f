// Screenshots of screens for a visual check: `npx tsx scripts/shot.ts <email> <path> [<path>…]`
// against a running server (BASE_URL, default http://localhost:3000). Writes /tmp/shot-N.png.
import { chromium } from 'playwright-core';

const [email, ...paths] = process.argv.slice(2);
const base = process.env.BASE_URL ?? 'http://localhost:3000';
const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
  args: ['--no-sandbox', '--enable-unsafe-swiftshader', '--disable-background-networking'],
});
const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
page.on('console', (m) => m.type() === 'error' && console.log('console:', m.text()));
await page.goto(`${base}/sign-in`);
await page.getByLabel('E-mail').fill(email);
await page.getByLabel('Password').fill('wearcourse-demo');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForURL(/\/network/);
const agency = page.url().match(/\/a\/([^/]+)/)![1];
let n = 0;
for (const p of paths) {
  await page.goto(`${base}/a/${agency}/${p}`);
  await page.waitForTimeout(Number(process.env.WAIT ?? 2500));
  await page.screenshot({ path: `/tmp/shot-${++n}.png`, fullPage: process.env.FULL === '1' });
  console.log(`/tmp/shot-${n}.png ← ${p}`);
}
await browser.close();
