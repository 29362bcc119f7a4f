// The Roads screen's map with 5,000 and with 50,000 segments: time from opening
// the screen to the map idle with features drawn, in headless Debian chromium.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { loadConfig } from '../server/config';
import { createDeps } from '../server/create-deps';
import { runImport } from '../server/imports/imports.service';
import { DEMO_ACCOUNTS } from '../server/seed/seed';
import { seedDemo } from '../server/seed/seed';
import { startServerProcess } from '../tests/helpers/server-process';
import { syntheticCsv } from './synthetic-network';

const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
if (!fs.existsSync(chromiumPath)) {
  console.log(`skipped: no chromium at ${chromiumPath} (apt-get install chromium)`);
  process.exit(0);
}
if (!fs.existsSync('dist/index.html')) {
  console.log('skipped: build the client first (npm run build)');
  process.exit(0);
}
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-mapbench-'));
const dbPath = path.join(dir, 'map.db');
const config = loadConfig({ NODE_ENV: 'test', DATABASE_PATH: dbPath, APP_URL: 'http://localhost:1' });
const built = await createDeps(config, { mailCatcher: false });
const { deps } = built;
const { db, sqlite } = deps;
const ids = await seedDemo(db);
const consultant = db.$client.prepare('SELECT id FROM users WHERE email = ?').get(DEMO_ACCOUNTS[5].email) as {
  id: string;
};
const opts = {
  kind: 'segments' as const,
  mode: 'all-or-nothing' as const,
  dryRun: false,
  dateFormat: 'auto' as const,
  saveMapping: false,
};
sqlite.exec(`DELETE FROM segments WHERE agency_id = '${ids.marlow}'`);
await runImport(deps, ids.marlow, consultant.id, { name: 'syn5k.csv', buffer: Buffer.from(syntheticCsv(5_000)) }, opts);
sqlite.exec(`DELETE FROM segments WHERE agency_id = '${ids.brannock}'`);
await runImport(
  deps,
  ids.brannock,
  consultant.id,
  { name: 'syn50k.csv', buffer: Buffer.from(syntheticCsv(50_000)) },
  opts,
);
await built.close();

const { child: server, url } = await startServerProcess({ DATABASE_PATH: dbPath });
const browser = await chromium.launch({
  executablePath: chromiumPath,
  args: [
    '--no-sandbox',
    '--enable-unsafe-swiftshader',
    '--disable-background-networking',
    '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1, EXCLUDE localhost',
  ],
});
const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
await page.goto(`${url}/sign-in`);
await page.getByLabel('E-mail').fill('consultant@example.com');
await page.getByLabel('Password').fill('wearcourse-demo');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForURL(/\/network/);
const cdp = await page.context().newCDPSession(page);
await cdp.send('Performance.enable');

for (const [label, agencyId] of [
  ['5,000', ids.marlow],
  ['50,000', ids.brannock],
] as const) {
  const runs: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t0 = Date.now();
    await page.goto(`${url}/a/${agencyId}/roads`);
    await page.waitForFunction(
      () => {
        const el = document.querySelector('[data-testid=network-map] .maplibregl-map') as
          | (HTMLElement & {
              __map?: { loaded(): boolean; areTilesLoaded(): boolean; queryRenderedFeatures(o: object): unknown[] };
            })
          | null;
        const m = el?.__map;
        return (
          !!m && m.loaded() && m.areTilesLoaded() && m.queryRenderedFeatures({ layers: ['segments-line'] }).length > 0
        );
      },
      null,
      { timeout: 120_000, polling: 100 },
    );
    runs.push(Date.now() - t0);
  }
  const metrics = (await cdp.send('Performance.getMetrics')).metrics;
  const heap = metrics.find((m) => m.name === 'JSHeapUsedSize')?.value ?? 0;
  runs.sort((a, b) => a - b);
  console.log(
    `map with ${label} segments: open → idle with features ${runs[1]} ms (median of 3: ${runs.join(', ')}), page JS heap ${(heap / 1024 / 1024).toFixed(0)} MB`,
  );
}
await browser.close();
server.kill('SIGTERM');
fs.rmSync(dir, { recursive: true, force: true });
process.exit(0);
