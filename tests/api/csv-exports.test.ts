// Spreadsheet formula injection in the five CSV exports. OWASP's "CSV Injection" guidance:
// a cell beginning with =, +, -, @, tab or carriage return is prefixed with a single quote so a
// spreadsheet shows it as text. Plain numbers (also negative ones) stay numbers.
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ComparisonResult } from '../../shared/engine/lcca/comparison';
import type { PlanResult } from '../../shared/engine/plan/run-plan';
import { FORMULA_LEADING, toCsv, unescapeFormula } from '../../server/csv';
import { comparisonCsv } from '../../server/comparisons/comparisons.export';
import { workListCsv } from '../../server/plans/plans.export';
import { createTestApp, type TestApp } from '../helpers/test-app';

const HOSTILE = [
  '=HYPERLINK("http://attacker.example","x")',
  "+1+cmd|' /C calc'!A0",
  '-2+3',
  '@SUM(A1:A9)',
  '\tTab',
  '\rCR',
];
const cells = (csv: string) => Papa.parse<string[]>(csv.trim()).data;

let t: TestApp;
let eng: Awaited<ReturnType<TestApp['as']>>;
let admin: Awaited<ReturnType<TestApp['as']>>;
beforeAll(async () => {
  t = await createTestApp();
  eng = await t.as('engineer@brannock.example');
  admin = await t.as('admin@brannock.example');
});
afterAll(() => t.close());

describe('the CSV writer', () => {
  it.each(HOSTILE)('prefixes %j with a single quote', (cell) => {
    const [, row] = cells(toCsv(['a'], [[cell]]));
    expect(row[0]).toBe(`'${cell}`);
    expect(unescapeFormula(row[0])).toBe(cell);
  });

  it('keeps numbers numeric, negative ones included, and leaves ordinary text alone', () => {
    const [, row] = cells(toCsv(['n', 's', 't', 'u'], [[-1250, '-12.5', '+3', 'Main St']]));
    expect(row).toEqual(['-1250', '-12.5', '+3', 'Main St']);
    expect(FORMULA_LEADING.test('-12.5')).toBe(false);
    expect(FORMULA_LEADING.test('-12.5+A1')).toBe(true);
  });
});

describe('each export escapes formula-leading cells', () => {
  it('segments: escaped cells, and the file still re-imports as unchanged', async () => {
    const seg = (await eng.get(`/api/agencies/${t.ids.brannock}/segments?q=BC-E00-01&limit=1`)).body.items[0];
    const patched = await eng
      .patch(`/api/agencies/${t.ids.brannock}/segments/${seg.id}`)
      .send({ roadName: HOSTILE[0], district: HOSTILE[3], notes: HOSTILE[1] });
    expect(patched.status).toBe(200);
    const csv = await eng.get(`/api/agencies/${t.ids.brannock}/segments/export?format=csv&q=${seg.segmentId}`);
    const [head, row] = cells(csv.text);
    expect(row[head.indexOf('Road name')]).toBe(`'${HOSTILE[0]}`);
    expect(row[head.indexOf('District')]).toBe(`'${HOSTILE[3]}`);
    expect(row[head.indexOf('Notes')]).toBe(`'${HOSTILE[1]}`);
    const re = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .field('dryRun', 'true')
      .attach('file', Buffer.from(csv.text), 'export.csv');
    expect(re.body).toMatchObject({ added: 0, updated: 0, unchanged: 1, rejected: 0 });
  });

  it('audit trail: a segment id that looks like a formula is escaped', async () => {
    const imported = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .attach(
        'file',
        Buffer.from(
          'segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\n=1+2,Audit Rd,1,24,2,local,asphalt\n',
        ),
        'a.csv',
      );
    expect(imported.status).toBe(200);
    const csv = await admin.get(`/api/agencies/${t.ids.brannock}/audit.csv?action=segment.import`);
    const [head, ...rows] = cells(csv.text);
    expect(head).toEqual(['When (UTC)', 'Who', 'E-mail', 'What happened', 'To what', 'Changes', 'Recorded detail']);
    // The segment id reaches the readable columns and the recorded detail; no cell may start like a formula.
    expect(rows.some((r) => r.some((c) => c.includes('=1+2')))).toBe(true);
    expect(rows.every((r) => r.every((c) => !/^[=+\-@\t\r]/.test(c) || /^-?\d/.test(c)))).toBe(true);
  });

  it('rejected rows: the kept cells are escaped', async () => {
    const res = await eng
      .post(`/api/agencies/${t.ids.brannock}/imports`)
      .field('mode', 'skip-invalid')
      .attach(
        'file',
        Buffer.from(
          `segment_id,road_name,length_mi,width_ft,lanes,functional_class,surface\nR-1,${HOSTILE[3]},1,24,two,local,asphalt\nR-2,Good Rd,1,24,2,local,asphalt\n`,
        ),
        'r.csv',
      );
    expect(res.body).toMatchObject({ added: 1, rejected: 1 });
    const csv = await eng.get(`/api/agencies/${t.ids.brannock}/imports/${res.body.importId}/rejected.csv`);
    const [head, row] = cells(csv.text);
    expect(head[0]).toBe('Row');
    expect(head.at(-1)).toBe('Reason');
    expect(row[head.indexOf('road_name')]).toBe(`'${HOSTILE[3]}`);
  });

  it('work list: road, treatment and mix names are escaped; a negative cost stays a number', () => {
    const work = {
      calendarYear: 2027,
      segmentId: HOSTILE[2],
      roadName: HOSTILE[0],
      treatment: HOSTILE[3],
      mix: HOSTILE[4],
      thicknessIn: 1.5,
      tons: 100,
      areaSy: 7040,
      laneMiles: 2,
      cost: -5000,
      pciBefore: 40,
      pciAfter: 95,
    };
    const [head, row] = cells(workListCsv({ work: [work] } as unknown as PlanResult));
    expect(head).toEqual([
      'Year',
      'Segment ID',
      'Road name',
      'From',
      'To',
      'Treatment',
      'Mix',
      'Thickness (in)',
      'Tons',
      'Area (SY)',
      'Lane-miles',
      'Cost ($)',
      'PCI before',
      'PCI after',
      'Strategy',
      'Structural caution',
    ]);
    expect([row[1], row[2], row[5], row[6]]).toEqual([
      `'${HOSTILE[2]}`,
      `'${HOSTILE[0]}`,
      `'${HOSTILE[3]}`,
      `'${HOSTILE[4]}`,
    ]);
    expect(row[11]).toBe('-5000');
  });

  it('comparison: an alternative named like a formula is escaped; negative savings stay numbers', () => {
    const alt = (name: string) => ({
      name,
      presentValue: 1000,
      euac: 50,
      perLaneMile: 500,
      firstCost: 800,
      initialTons: 10,
      remainingServiceLifeValue: 0,
    });
    const result = {
      alternatives: [alt('Baseline'), alt(HOSTILE[0])],
      ranking: [0, 1],
      vsBaseline: [
        { savings: 0, savingsPerLaneMile: 0 },
        { savings: -1234, savingsPerLaneMile: -617 },
      ],
      monteCarlo: null,
    } as unknown as ComparisonResult;
    const [head, , row] = cells(comparisonCsv(result));
    expect(head.slice(0, 3)).toEqual(['Alternative', 'Rank', 'Present value ($)']);
    expect(head.every((h) => !/[a-z][A-Z]|_/.test(h))).toBe(true);
    expect(row[0]).toBe(`'${HOSTILE[0]}`);
    expect(row[head.indexOf('Savings against the baseline ($)')]).toBe('-1234');
  });
});
