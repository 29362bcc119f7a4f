// Crash safety: the real server as a child process, killed with SIGKILL in the
// middle of a large import, of a plan run and of a restore, then started again on the same file.
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { syntheticCsv } from '../../bench/synthetic-network';
import { editedArchive } from '../helpers/archive';
import { startServerProcess } from '../helpers/server-process';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wearcourse-crash-'));
const dbPath = path.join(dir, 'crash.db');
let child: ChildProcess | null = null;

async function start(): Promise<string> {
  const started = await startServerProcess({ DATABASE_PATH: dbPath }, 60_000);
  child = started.child;
  return started.url;
}

function kill9() {
  return new Promise<void>((resolve) => {
    child!.once('exit', () => resolve());
    child!.kill('SIGKILL');
  });
}

async function signIn(url: string, email = 'engineer@brannock.example') {
  const res = await fetch(`${url}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: url },
    body: JSON.stringify({ email, password: 'wearcourse-demo' }),
  });
  const cookie = res.headers.get('set-cookie')!.split(';')[0];
  const me = (await res.json()) as { memberships: { agencyId: string; agencyName: string }[] };
  return { cookie, agencyId: me.memberships.find((m) => m.agencyName === 'Brannock County')!.agencyId };
}

const inspect = () => {
  const db = new Database(dbPath, { readonly: true });
  const r = {
    integrity: db.pragma('integrity_check', { simple: true }),
    synthetic: (db.prepare("SELECT count(*) AS n FROM segments WHERE segment_id LIKE 'SYN-%'").get() as { n: number })
      .n,
    imports: (db.prepare('SELECT count(*) AS n FROM imports').get() as { n: number }).n,
    runs: db.prepare("SELECT status, error FROM runs WHERE kind = 'plan'").all() as {
      status: string;
      error: string | null;
    }[],
    agencies: (db.prepare('SELECT count(*) AS n FROM agencies').get() as { n: number }).n,
    strays: (
      db
        .prepare(
          `SELECT (SELECT count(*) FROM segments WHERE agency_id NOT IN (SELECT id FROM agencies))
                + (SELECT count(*) FROM memberships WHERE agency_id NOT IN (SELECT id FROM agencies))
                + (SELECT count(*) FROM mixes WHERE agency_id NOT IN (SELECT id FROM agencies)) AS n`,
        )
        .get() as { n: number }
    ).n,
    restoredAudit: (
      db.prepare("SELECT count(*) AS n FROM audit_log WHERE action = 'agency.restore'").get() as { n: number }
    ).n,
  };
  db.close();
  return r;
};

afterAll(async () => {
  if (child && child.exitCode === null && child.signalCode === null) await kill9();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('crash safety (SIGKILL)', () => {
  it('an import killed half-way leaves no rows and a sound file', { timeout: 180_000 }, async () => {
    const url = await start();
    const { cookie, agencyId } = await signIn(url);
    const form = new FormData();
    form.set('file', new Blob([syntheticCsv(50_000)]), 'big.csv');
    const pending = fetch(`${url}/api/agencies/${agencyId}/imports`, {
      method: 'POST',
      headers: { Cookie: cookie, Origin: url },
      body: form,
    }).catch(() => 'killed');
    await new Promise((r) => setTimeout(r, 700));
    await kill9();
    expect(await pending).toBe('killed');
    const after = inspect();
    expect(after.integrity).toBe('ok');
    expect(after.synthetic).toBe(0);
    expect(after.imports).toBe(0);
  });

  it('a plan run killed half-way is marked failed at the next start, and the app serves again', {
    timeout: 180_000,
  }, async () => {
    let url = await start();
    const { cookie, agencyId } = await signIn(url);
    const headers = { Cookie: cookie, Origin: url, 'Content-Type': 'application/json' };
    const plan = (await (
      await fetch(`${url}/api/agencies/${agencyId}/plans`, {
        method: 'POST',
        headers,
        body: JSON.stringify({
          name: 'crash',
          settings: { startYear: 2027, horizonYears: 20, budgetMode: 'flat', annualBudget: 3_000_000, method: 'fast' },
        }),
      })
    ).json()) as { id: string };
    const run = await fetch(`${url}/api/agencies/${agencyId}/plans/${plan.id}/run`, { method: 'POST', headers });
    expect(run.status).toBe(202);
    await new Promise((r) => setTimeout(r, 150));
    expect(inspect().runs).toEqual([{ status: 'running', error: null }]);
    await kill9();
    url = await start();
    const after = inspect();
    expect(after.integrity).toBe('ok');
    expect(after.runs).toEqual([
      { status: 'failed', error: JSON.stringify({ message: 'interrupted by a server restart — run it again' }) },
    ]);
    expect(await (await fetch(`${url}/api/health`)).json()).toEqual({ ok: true });
    // Polling the cut-off run says so (not a 404).
    const again = await signIn(url);
    const polled = await fetch(`${url}/api/agencies/${agencyId}/runs/${((await run.json()) as { id: string }).id}`, {
      headers: { Cookie: again.cookie },
    });
    expect(polled.status).toBe(200);
    expect(await polled.json()).toMatchObject({
      status: 'failed',
      error: { message: 'interrupted by a server restart — run it again' },
    });
    // And the plan can run again.
    const r2 = await fetch(`${url}/api/agencies/${agencyId}/plans/${plan.id}/run`, {
      method: 'POST',
      headers: { ...headers, Cookie: again.cookie, Origin: url },
    });
    expect(r2.status).toBe(202);
    await kill9();
  });

  it('a restore killed half-way leaves no agency, no stray rows and a sound file', { timeout: 240_000 }, async () => {
    const url = await start();
    const { cookie, agencyId } = await signIn(url, 'admin@brannock.example');
    const exported = Buffer.from(
      await (await fetch(`${url}/api/agencies/${agencyId}/export`, { headers: { Cookie: cookie } })).arrayBuffer(),
    );
    // Grow the archive to 40,000 segments (each original feature repeated under new ids), so the
    // restore's one transaction runs long enough to be killed inside it.
    const big = await editedArchive(exported, (files) => {
      const geo = JSON.parse(files['segments.geojson']) as { features: { properties: { segment_id: string } }[] };
      const base = geo.features;
      geo.features = Array.from({ length: 40_000 }, (_, i) => {
        const f = base[i % base.length];
        return i < base.length ? f : { ...f, properties: { ...f.properties, segment_id: `COPY-${i}` } };
      });
      files['segments.geojson'] = JSON.stringify(geo);
    });
    const agenciesBefore = inspect().agencies;
    const wal = `${dbPath}-wal`;
    const walBefore = fs.existsSync(wal) ? fs.statSync(wal).size : 0;
    const form = new FormData();
    form.set('file', new Blob([new Uint8Array(big)]), 'big-export.zip');
    const pending = fetch(`${url}/api/agencies/restore`, {
      method: 'POST',
      headers: { Cookie: cookie, Origin: url },
      body: form,
    })
      .then((r) => `answered ${r.status}`)
      .catch(() => 'killed');
    // Uncommitted pages spill into the WAL while the transaction runs: kill once it has grown by 2 MB.
    const deadline = Date.now() + 120_000;
    while ((fs.existsSync(wal) ? fs.statSync(wal).size : 0) < walBefore + 2 * 1024 * 1024) {
      if (Date.now() > deadline) throw new Error('the restore never started writing');
      await new Promise((r) => setTimeout(r, 20));
    }
    await kill9();
    expect(await pending).toBe('killed');
    const after = inspect();
    expect(after.integrity).toBe('ok');
    expect(after.agencies).toBe(agenciesBefore);
    expect(after.strays).toBe(0);
    expect(after.restoredAudit).toBe(0);
    // And the server starts again on the same file and serves.
    const again = await start();
    expect(await (await fetch(`${again}/api/health`)).json()).toEqual({ ok: true });
    await kill9();
  });
});
