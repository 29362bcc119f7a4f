// Work lists as CSV or XLSX: one row per treated segment, by year.
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { PlanResult } from '../../shared/engine/plan/run-plan';

const rows = (r: PlanResult) =>
  r.work.map((w) => ({
    year: w.calendarYear,
    segment_id: w.segmentId,
    road_name: w.roadName,
    treatment: w.treatment,
    mix: w.mix ?? '',
    thickness_in: w.thicknessIn ?? '',
    tons: Math.round(w.tons),
    area_sy: Math.round(w.areaSy),
    lane_miles: Math.round(w.laneMiles * 1000) / 1000,
    cost: Math.round(w.cost),
    pci_before: Math.round(w.pciBefore),
    pci_after: Math.round(w.pciAfter),
  }));

export function workListCsv(r: PlanResult) {
  const fields = [
    'year',
    'segment_id',
    'road_name',
    'treatment',
    'mix',
    'thickness_in',
    'tons',
    'area_sy',
    'lane_miles',
    'cost',
    'pci_before',
    'pci_after',
  ];
  return `${Papa.unparse({ fields, data: rows(r).map((d) => fields.map((f) => (d as Record<string, unknown>)[f])) })}\n`;
}

export async function workListXlsx(r: PlanResult, title: string) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const ws = wb.addWorksheet('Work list');
  const data = rows(r);
  const keys = Object.keys(data[0] ?? { year: '', segment_id: '' });
  ws.columns = keys.map((k) => ({ header: k, key: k, width: Math.max(10, k.length + 2) }));
  for (const d of data) ws.addRow(d);
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  const years = wb.addWorksheet('By year');
  years.columns = [
    { header: 'year', key: 'y' },
    { header: 'budget', key: 'b', width: 14 },
    { header: 'spent', key: 's', width: 14 },
    { header: 'network_pci', key: 'p', width: 12 },
    { header: 'backlog', key: 'k', width: 14 },
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
