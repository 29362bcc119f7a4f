// Work lists as CSV or XLSX: one row per treated segment, by year.
import ExcelJS from 'exceljs';
import { type AnyPlanResult, headline } from '../../shared/plan-headline';
import { toCsv } from '../csv';

type Work = AnyPlanResult['work'][number];
/** From–to limits by segment row, for results stored before work items carried them. */
export type Limits = Map<number, { fromDesc: string | null; toDesc: string | null }>;
const NO_LIMITS: Limits = new Map();

// Plain-word headers, each with how its value is read off a work item.
const COLUMNS: [string, (w: Work, l: Limits) => string | number][] = [
  ['Year', (w) => w.calendarYear],
  ['Segment ID', (w) => w.segmentId],
  ['Road name', (w) => w.roadName],
  ['From', (w, l) => w.fromDesc ?? l.get(w.ref)?.fromDesc ?? ''],
  ['To', (w, l) => w.toDesc ?? l.get(w.ref)?.toDesc ?? ''],
  ['Treatment', (w) => w.treatment],
  ['Mix', (w) => w.mix ?? ''],
  ['Thickness (in)', (w) => w.thicknessIn ?? ''],
  ['Tons', (w) => Math.round(w.tons)],
  ['Area (SY)', (w) => Math.round(w.areaSy)],
  ['Lane-miles', (w) => Math.round(w.laneMiles * 1000) / 1000],
  ['Cost ($)', (w) => Math.round(w.cost)],
  ['PCI before', (w) => Math.round(w.pciBefore)],
  ['PCI after', (w) => Math.round(w.pciAfter)],
  ['Strategy', (w) => w.strategy ?? ''],
  ['Structural caution', (w) => w.structuralFlag ?? ''],
];
export const WORK_LIST_HEADERS = COLUMNS.map(([h]) => h);
const values = (w: Work, l: Limits) => COLUMNS.map(([, get]) => get(w, l));

export function workListCsv(r: AnyPlanResult, limits: Limits = NO_LIMITS) {
  return toCsv(
    WORK_LIST_HEADERS,
    r.work.map((w) => values(w, limits)),
  );
}

export async function workListXlsx(r: AnyPlanResult, title: string, limits: Limits = NO_LIMITS) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const ws = wb.addWorksheet('Work list');
  ws.columns = WORK_LIST_HEADERS.map((k) => ({ header: k, width: Math.max(10, k.length + 2) }));
  for (const w of r.work) ws.addRow(values(w, limits));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  const h = headline(r);
  const mixes = Object.keys(h.tonsTotal).sort();
  const years = wb.addWorksheet('By year');
  years.columns = [
    { header: 'Year', key: 'y' },
    { header: 'Budget ($)', key: 'b', width: 14 },
    { header: 'Spent ($)', key: 's', width: 14 },
    { header: 'Network PCI', key: 'p', width: 12 },
    { header: 'Backlog ($)', key: 'k', width: 14 },
    { header: 'Failed lane-miles', key: 'f', width: 16 },
    ...mixes.map((m, i) => ({ header: `Tons of ${m}`, key: `t${i}`, width: Math.max(12, m.length + 10) })),
  ];
  r.years.forEach((y, yi) =>
    years.addRow({
      y: y.calendarYear,
      b: Math.round(y.budget),
      s: Math.round(y.spent),
      p: Math.round(y.networkPci * 10) / 10,
      k: Math.round(y.backlog),
      f: Math.round(h.failedByYear[yi] * 10) / 10,
      ...Object.fromEntries(mixes.map((m, i) => [`t${i}`, Math.round(h.tonsByYear[yi]?.[m] ?? 0)])),
    }),
  );
  const about = wb.addWorksheet('About');
  about.addRow([`${title} — work list from Wearcourse`]);
  about.addRow([
    'Constant base-year dollars. Planning estimate, not a design; agency specifications and licensed engineering judgement govern.',
  ]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
