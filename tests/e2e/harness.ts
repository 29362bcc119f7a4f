// Starts the real server (tsx server/index.ts) on a free port with a fresh
// SQLite file, and Debian's chromium through playwright-core. No browser is
// downloaded; no request may leave the machine.
import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { type Browser, chromium, type Page } from 'playwright-core';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export type Harness = { url: string; browser: Browser; dbPath: string; stop: () => Promise<void> };

export async function startHarness(): Promise<Harness> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-e2e-'));
  const dbPath = path.join(dir, 'e2e.db');
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, NODE_ENV: 'development', PORT: '0', DATABASE_PATH: dbPath, MAIL_CATCHER_PORT: '0', SIGNIN_RATE_LIMIT: '100' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${output}`)), 120_000);
    const onData = (buf: Buffer) => {
      output += buf.toString();
      const m = output.match(/running at (http:\/\/localhost:\d+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', onData);
    child.once('exit', (code) => reject(new Error(`server exited with ${code}:\n${output}`)));
  });
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
