// A saved comparison as CSV or XLSX: the ranked results, cost lines and cash flows.
import ExcelJS from 'exceljs';
import type { ComparisonResult } from '../../shared/engine/lcca/comparison';
import { toCsv } from '../csv';
import type { Db } from '../db/client';
import { fileSlug } from '../http/download';
import { HttpError, notFound } from '../http/errors';
import * as repo from './comparisons.repo';

/**
 * What the request thread checks before the export takes a slot: the comparison is the agency's and has a
 * result. Reads the name and whether a result is stored, never the result itself.
 */
export function exportableComparison(db: Db, agencyId: string, analysisId: string) {
  const row = repo.exportable(db, agencyId, analysisId);
  if (!row) throw notFound('No such analysis');
  if (!row.hasResult) throw new HttpError(409, 'no_result', 'This comparison has no result yet; run it first');
  return { name: row.name, base: fileSlug(row.name).slice(0, 60) || 'comparison' };
}

/** The export itself, in a worker: the stored result is read, parsed and written out there. */
export async function comparisonFile(db: Db, agencyId: string, analysisId: string, format: 'csv' | 'xlsx') {
  const row = repo.withResult(db, agencyId, analysisId);
  if (!row?.result) throw notFound('No such analysis with a result');
  const result = JSON.parse(row.result) as ComparisonResult;
  return format === 'xlsx' ? await comparisonXlsx(row.name, result) : comparisonCsv(result);
}

/** One row per alternative, keyed by plain-word headers (the CSV and the workbook's first sheet). */
export function resultRows(result: ComparisonResult): Record<string, string | number>[] {
  return result.alternatives.map((a, i) => ({
    Alternative: a.name,
    Rank: result.ranking.indexOf(i) + 1,
    'Present value ($)': Math.round(a.presentValue),
    'EUAC ($ per year)': Math.round(a.euac),
    'Present value per lane-mile ($)': Math.round(a.perLaneMile),
    'First cost ($)': Math.round(a.firstCost),
    'Initial tons': Math.round(a.initialTons),
    'Remaining life value ($)': Math.round(a.remainingServiceLifeValue),
    'Savings against the baseline ($)': Math.round(result.vsBaseline[i].savings),
    'Savings per lane-mile ($)': Math.round(result.vsBaseline[i].savingsPerLaneMile),
    'Probability cheapest': result.monteCarlo ? result.monteCarlo.probabilityCheapest[i] : '',
    'Present value, 5th percentile ($)': result.monteCarlo ? Math.round(result.monteCarlo.stats[i].p5) : '',
    'Present value, 95th percentile ($)': result.monteCarlo ? Math.round(result.monteCarlo.stats[i].p95) : '',
  }));
}

export function comparisonCsv(result: ComparisonResult) {
  const rows = resultRows(result);
  return toCsv(
    Object.keys(rows[0] ?? {}),
    rows.map((r) => Object.values(r)),
  );
}

export async function comparisonXlsx(name: string, result: ComparisonResult) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const summary = wb.addWorksheet('Results');
  const rows = resultRows(result);
  summary.columns = Object.keys(rows[0]).map((k) => ({ header: k, key: k, width: Math.max(12, k.length + 2) }));
  for (const r of rows) summary.addRow(r);
  summary.getRow(1).font = { bold: true };
  const flows = wb.addWorksheet('Cash flows');
  flows.columns = [
    { header: 'Alternative', key: 'a', width: 30 },
    { header: 'Year', key: 'y' },
    { header: 'Activity', key: 'l', width: 50 },
    { header: 'Cost ($)', key: 'c', width: 14 },
    { header: 'Present value ($)', key: 'p', width: 14 },
  ];
  for (const a of result.alternatives)
    for (const c of a.cashFlows)
      flows.addRow({ a: a.name, y: c.year, l: c.label, c: Math.round(c.cost), p: Math.round(c.presentValue) });
  const lines = wb.addWorksheet('First cost lines');
  lines.columns = [
    { header: 'Alternative', key: 'a', width: 30 },
    { header: 'Item', key: 'l', width: 60 },
    { header: 'Quantity', key: 'q', width: 14 },
    { header: 'Unit', key: 'u' },
    { header: 'Unit cost ($)', key: 'uc', width: 12 },
    { header: 'Amount ($)', key: 'm', width: 14 },
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
