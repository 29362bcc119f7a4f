// Text that reaches the council brief is bounded where it enters (the agency name at
// 120 characters), and the PDF clips every name once more: an agency name stored
// longer by any other way still gives a brief with the name cut, not a frozen server.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@marlow.example');
});
afterAll(() => t.close());

describe('names in the brief', () => {
  it('the settings refuse an agency name over 120 characters, naming the field', async () => {
    const admin = await t.as('admin@marlow.example');
    const res = await admin
      .put(`/api/agencies/${t.ids.marlow}/settings`)
      .send({ name: 'x'.repeat(20_000), units: 'us' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('body.name');
  });

  it('a 20,000-character name stored behind the schemas reaches the PDF cut to 120 characters', async () => {
    const base = `/api/agencies/${t.ids.marlow}/plans`;
    const plan = await eng.post(base).send({
      name: 'Brief limits',
      settings: { startYear: 2027, horizonYears: 2, budgetMode: 'flat', annualBudget: 500_000, method: 'fast' },
    });
    const start = await eng.post(`${base}/${plan.body.id}/run`);
    for (let i = 0; i < 300; i++) {
      const r = await eng.get(`/api/agencies/${t.ids.marlow}/runs/${start.body.id}`);
      if (r.body.status !== 'running') break;
      await new Promise((res) => setTimeout(res, 100));
    }
    t.sqlite.prepare('UPDATE agencies SET name = ? WHERE id = ?').run('M'.repeat(20_000), t.ids.marlow);
    const pdf = await eng
      .get(`${base}/${plan.body.id}/brief.pdf`)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const text = (pdf.body as Buffer).toString('latin1');
    // The document title carries the agency name, written by pdfkit as a UTF-16BE string
    // (each 'M' is the bytes 00 4D): its longest run of M is the clipped name.
    // biome-ignore lint/suspicious/noControlCharactersInRegex: the NUL byte is the point: UTF-16BE 'M' is 00 4D
    const runs = [...text.matchAll(/(?:\u0000M)+/g)].map((m) => m[0].length / 2);
    const longest = Math.max(0, ...runs);
    expect(longest).toBeGreaterThanOrEqual(100);
    expect(longest).toBeLessThanOrEqual(120);
  });
});
