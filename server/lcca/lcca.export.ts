// A saved comparison as CSV or XLSX: the ranked results, cost lines and cash flows.
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import type { StudyResult } from '../../shared/engine/lcca/study';

export function resultRows(result: StudyResult) {
  return result.alternatives.map((a, i) => ({
    alternative: a.name,
    rank: result.ranking.indexOf(i) + 1,
    net_present_value: Math.round(a.presentValue),
    euac: Math.round(a.euac),
    npv_per_lane_mile: Math.round(a.perLaneMile),
    first_cost: Math.round(a.firstCost),
    initial_tons: Math.round(a.initialTons),
    remaining_life_value: Math.round(a.remainingServiceLifeValue),
    savings_vs_baseline: Math.round(result.vsBaseline[i].savings),
    savings_per_lane_mile: Math.round(result.vsBaseline[i].savingsPerLaneMile),
    probability_cheapest: result.monteCarlo ? result.monteCarlo.probabilityCheapest[i] : '',
    p5: result.monteCarlo ? Math.round(result.monteCarlo.stats[i].p5) : '',
    p95: result.monteCarlo ? Math.round(result.monteCarlo.stats[i].p95) : '',
  }));
}

export function studyCsv(result: StudyResult) {
  return `${Papa.unparse(resultRows(result))}\n`;
}

export async function studyXlsx(name: string, result: StudyResult) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const summary = wb.addWorksheet('Results');
  const rows = resultRows(result);
  summary.columns = Object.keys(rows[0]).map((k) => ({ header: k, key: k, width: Math.max(12, k.length + 2) }));
  for (const r of rows) summary.addRow(r);
  summary.getRow(1).font = { bold: true };
  const flows = wb.addWorksheet('Cash flows');
  flows.columns = [
    { header: 'alternative', key: 'a', width: 30 },
    { header: 'year', key: 'y' },
    { header: 'activity', key: 'l', width: 50 },
    { header: 'cost', key: 'c', width: 14 },
    { header: 'present_value', key: 'p', width: 14 },
  ];
  for (const a of result.alternatives)
    for (const c of a.cashFlows)
      flows.addRow({ a: a.name, y: c.year, l: c.label, c: Math.round(c.cost), p: Math.round(c.presentValue) });
  const lines = wb.addWorksheet('First cost lines');
  lines.columns = [
    { header: 'alternative', key: 'a', width: 30 },
    { header: 'item', key: 'l', width: 60 },
    { header: 'quantity', key: 'q', width: 14 },
    { header: 'unit', key: 'u' },
    { header: 'unit_cost', key: 'uc', width: 12 },
    { header: 'amount', key: 'm', width: 14 },
  ];
  for (const a of result.alternatives)
    for (const l of a.initial.costLines.lines)
      lines.addRow({ a: a.name, l: l.label, q: l.quantity, u: l.unit, uc: l.unitCost, m: Math.round(l.amount) });
  const about = wb.addWorksheet('About');
  about.addRow([`${name} — life-cycle cost comparison from Wearcourse`]);
  about.addRow([
    `Discount rate ${(result.discountRate * 100).toFixed(2)} % (real), analysis period ${result.analysisPeriodYears} years; constant dollars.`,
  ]);
  about.addRow([
    'Planning estimate, not a pavement design; agency specifications and licensed engineering judgement govern.',
  ]);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
