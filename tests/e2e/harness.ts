// Starts the real server (tsx server/index.ts) on a free port with a fresh
// SQLite file, and Debian's chromium through playwright-core. No browser is
// downloaded; no request may leave the machine.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { type Browser, chromium, type Page } from 'playwright-core';
import { startServerProcess } from '../helpers/server-process';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export type Harness = { url: string; browser: Browser; dbPath: string; stop: () => Promise<void> };

export async function startHarness(): Promise<Harness> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-e2e-'));
  const dbPath = path.join(dir, 'e2e.db');
  const { child, url } = await startServerProcess({ DATABASE_PATH: dbPath, SIGNIN_RATE_LIMIT: '100' });
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--no-sandbox',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--disable-quic',
      '--enable-unsafe-swiftshader',
      '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1, EXCLUDE localhost',
    ],
  });
  return {
    url,
    browser,
    dbPath,
    stop: async () => {
      await browser.close();
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A fresh page that records requests to anything but this server, data: and blob:. */
export async function newPage(h: Harness) {
  const context = await h.browser.newContext({ viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  const outside: string[] = [];
  const consoleErrors: string[] = [];
  page.on('request', (req) => {
    const u = req.url();
    if (!u.startsWith(h.url) && !u.startsWith('data:') && !u.startsWith('blob:')) outside.push(u);
  });
  page.on('console', (msg) => {
    if (msg.type() === 'error' && !/GPU stall due to ReadPixels/.test(msg.text())) consoleErrors.push(msg.text());
  });
  return { page, context, outside, consoleErrors };
}

export async function signIn(page: Page, url: string, email: string, password = 'wearcourse-demo') {
  await page.goto(`${url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/a\/[^/]+\/network/);
}

export async function navLabels(page: Page) {
  await page.getByTestId('nav').waitFor();
  return (await page.getByTestId('nav').getByRole('link').allTextContents()).map((s) => s.trim());
}
