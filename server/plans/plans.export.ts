// Work lists as CSV or XLSX: one row per treated segment, by year.
import ExcelJS from 'exceljs';
import type { PlanResult } from '../../shared/engine/plan/run-plan';
import { toCsv } from '../csv';

type Work = PlanResult['work'][number];

// Plain-word headers, each with how its value is read off a work item.
const COLUMNS: [string, (w: Work) => string | number][] = [
  ['Year', (w) => w.calendarYear],
  ['Segment ID', (w) => w.segmentId],
  ['Road name', (w) => w.roadName],
  ['Treatment', (w) => w.treatment],
  ['Mix', (w) => w.mix ?? ''],
  ['Thickness (in)', (w) => w.thicknessIn ?? ''],
  ['Tons', (w) => Math.round(w.tons)],
  ['Area (SY)', (w) => Math.round(w.areaSy)],
  ['Lane-miles', (w) => Math.round(w.laneMiles * 1000) / 1000],
  ['Cost ($)', (w) => Math.round(w.cost)],
  ['PCI before', (w) => Math.round(w.pciBefore)],
  ['PCI after', (w) => Math.round(w.pciAfter)],
];
export const WORK_LIST_HEADERS = COLUMNS.map(([h]) => h);
const values = (w: Work) => COLUMNS.map(([, get]) => get(w));

export function workListCsv(r: PlanResult) {
  return toCsv(WORK_LIST_HEADERS, r.work.map(values));
}

export async function workListXlsx(r: PlanResult, title: string) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const ws = wb.addWorksheet('Work list');
  ws.columns = WORK_LIST_HEADERS.map((k) => ({ header: k, width: Math.max(10, k.length + 2) }));
  for (const w of r.work) ws.addRow(values(w));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  const years = wb.addWorksheet('By year');
  years.columns = [
    { header: 'Year', key: 'y' },
    { header: 'Budget ($)', key: 'b', width: 14 },
    { header: 'Spent ($)', key: 's', width: 14 },
    { header: 'Network PCI', key: 'p', width: 12 },
    { header: 'Backlog ($)', key: 'k', width: 14 },
  ];
  for (const y of r.years)
    years.addRow({
      y: y.calendarYear,
      b: Math.round(y.budget),
      s: Math.round(y.spent),
      p: Math.round(y.networkPci * 10) / 10,
      k: Math.round(y.backlog),
    });
  const about = wb.addWorksheet('About');
  about.addRow([`${title} — work list from Wearcourse`]);
  about.addRow([
    'Constant base-year dollars. Planning estimate, not a design; agency specifications and licensed engineering judgement govern.',
  ]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
