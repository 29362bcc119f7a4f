// The Activity trail reads in words: who, what was done to which record (by its
// name, not an id), and each change as field: before → after.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
let admin: Awaited<ReturnType<TestApp['as']>>;
let base: string;
beforeAll(async () => {
  t = await createTestApp();
  admin = await t.as('admin@brannock.example');
  base = `/api/agencies/${t.ids.brannock}`;
  const seg = (await admin.get(`${base}/segments?q=BC-E10-05&limit=1`)).body.items[0];
  await admin.patch(`${base}/segments/${seg.id}`).send({ widthFt: 30, functionalClass: 'minor_arterial' });
  await admin.post(`${base}/segments/${seg.id}/surveys`).send({ surveyDate: '2026-09-01', pci: 40 });
  const plan = await admin.post(`${base}/plans`).send({
    name: 'Council ask',
    settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 2_400_000 },
  });
  await admin.put(`${base}/plans/${plan.body.id}`).send({
    name: 'Council ask',
    settings: { startYear: 2027, horizonYears: 5, budgetMode: 'flat', annualBudget: 2_600_000 },
  });
  await admin.put(`${base}/settings`).send({ name: 'Brannock County', units: 'metric' });
});
afterAll(() => t.close());

const camelOrSnake = /\b[a-z]+[A-Z][A-Za-z]*\b|\b[a-z]+_[a-z_]+\b/;

describe('activity in words', () => {
  it('names the record and says each change as before → after', async () => {
    const res = await admin.get(`${base}/audit?limit=10`);
    expect(res.status).toBe(200);
    const byAction = (a: string) => res.body.items.find((i: { action: string }) => i.action === a);

    const edit = byAction('segment.update');
    expect(edit.what).toBe('segment BC-E10-05 (County Highway 14)');
    expect(edit.actionText).toBe('edited a segment');
    expect(edit.userName).toBeTruthy();
    expect(edit.changes).toEqual(
      expect.arrayContaining([
        { field: 'Width (ft)', before: '40', after: '30' },
        { field: 'Functional class', before: 'principal arterial', after: 'minor arterial' },
      ]),
    );

    const survey = byAction('survey.add');
    expect(survey.changes).toEqual([{ field: 'Latest PCI', before: expect.any(String), after: '40' }]);
    expect(survey.facts).toEqual(expect.arrayContaining([{ field: 'Survey date', value: '2026-09-01' }]));

    const plan = byAction('plan.update');
    expect(plan.what).toBe('plan “Council ask”');
    expect(plan.changes).toEqual([{ field: 'Annual budget ($)', before: '$2,400,000', after: '$2,600,000' }]);

    expect(byAction('plan.create').what).toBe('plan “Council ask”');
    const settings = byAction('agency.settings');
    expect(settings.what).toBe('Brannock County');
    expect(settings.changes).toEqual([{ field: 'Units', before: 'us', after: 'metric' }]);

    // Nothing a person reads is in code: no camelCase or snake_case field names, no JSON.
    for (const i of res.body.items) {
      for (const c of [...i.changes, ...i.facts]) expect(c.field).not.toMatch(camelOrSnake);
      expect(`${i.what} ${i.actionText}`).not.toMatch(/[{}]/);
    }
  });

  it('the CSV has headers and changes in words', async () => {
    const res = await admin.get(`${base}/audit.csv?entity=segment`);
    expect(res.status).toBe(200);
    const [header, ...lines] = res.text.trim().split(/\r?\n/);
    expect(header).toBe('When (UTC),Who,E-mail,What happened,To what,Changes,Recorded detail');
    expect(lines.join('\n')).toContain('edited a segment,segment BC-E10-05 (County Highway 14),');
    expect(lines.join('\n')).toContain('Width (ft): 40 → 30');
  });

  it('only admins read it, and only their own agency’s', async () => {
    const eng = await t.as('engineer@brannock.example');
    expect((await eng.get(`${base}/audit`)).status).toBe(403);
    const marlow = await t.as('admin@marlow.example');
    expect((await marlow.get(`${base}/audit`)).status).toBe(404);
    const own = await marlow.get(`/api/agencies/${t.ids.marlow}/audit`);
    expect(own.body.items.some((i: { what: string }) => i.what.includes('BC-E10-05'))).toBe(false);
    expect((await admin.get(`${base}/audit?entity=nonsense`)).body.error.issues[0].path).toBe('query.entity');
  });
});
