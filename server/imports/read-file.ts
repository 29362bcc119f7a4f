// Turns an uploaded file (CSV, XLSX, GeoJSON or a zipped shapefile) into one
// plain table: column names, and rows numbered the way the user sees them in
// their own program (spreadsheet row, or feature number in GeoJSON).
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import Papa from 'papaparse';
import { unescapeFormula } from '../csv';
import { boundedUnzip } from './bounded-unzip';
import {
  type Cell,
  type FileFormat,
  fileError,
  MAX_ROWS,
  MAX_WORKBOOK_EXPANDED_BYTES,
  type RawRow,
  type RawTable,
  refuseDeclaredOver,
} from './raw-table';
import { readGeoJson, readShapefileZip } from './read-gis';

export * from './raw-table';
export { readGeoJson, readShapefileZip, tableFromFeatures } from './read-gis';

export function detectFormat(fileName: string, buf: Buffer): FileFormat {
  const name = fileName.toLowerCase();
  if (name.endsWith('.csv') || name.endsWith('.txt')) return 'csv';
  if (name.endsWith('.xlsx')) return 'xlsx';
  if (name.endsWith('.geojson') || name.endsWith('.json')) return 'geojson';
  if (name.endsWith('.zip')) return 'shapefile';
  if (name.endsWith('.xls')) throw fileError('Old .xls workbooks are not read; save the sheet as .xlsx or CSV.');
  // Sniff: a zip signature is a workbook or a zipped shapefile; '{' is JSON.
  if (buf.subarray(0, 2).toString('latin1') === 'PK') return 'xlsx';
  if (buf.toString('utf8', 0, 64).trimStart().startsWith('{')) return 'geojson';
  throw fileError(`Unsupported file type for "${fileName}"; use CSV, XLSX, GeoJSON or a zipped shapefile.`);
}

function checkColumns(columns: string[]) {
  const seen = new Set<string>();
  columns.forEach((c, i) => {
    if (!c) throw fileError(`Column ${i + 1} of the header row has no name.`);
    const key = c.toLowerCase();
    if (seen.has(key)) throw fileError(`The header row names the column "${c}" twice.`);
    seen.add(key);
  });
}
const DELIMITERS = [',', ';', '\t', '|'];

/**
 * The separator is read off the header row (the one most used outside quotes):
 * guessing from all rows is misled by decimal commas ("0,125") in a file separated by semicolons.
 */
function delimiterOf(text: string): { delimiter: string } | { delimitersToGuess: string[] } {
  const header = (text.match(/^[^\r\n]*/)?.[0] ?? '').replace(/"[^"]*"/g, '');
  const counts = DELIMITERS.map((d) => [d, header.split(d).length - 1] as const).sort((a, b) => b[1] - a[1]);
  return counts[0][1] > 0 ? { delimiter: counts[0][0] } : { delimitersToGuess: DELIMITERS };
}

export function readCsv(buf: Buffer): RawTable {
  let text = buf.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1); // BOM from spreadsheet exports
  if (text.includes('\u0000')) throw fileError('This file is binary, not CSV text.');
  if (text.trim() === '') throw fileError('The file is empty.');
  const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false, ...delimiterOf(text) });
  const data = parsed.data;
  const header = (data[0] ?? []).map((h) => String(h).trim());
  // Every import needs several columns: one column means the separator was not understood.
  if (header.length === 1) {
    throw fileError(
      `Only one column was found ("${header[0].slice(0, 60)}"). Separate the columns with commas, semicolons, tabs or "|".`,
    );
  }
  checkColumns(header);
  const rows: RawRow[] = [];
  for (let i = 1; i < data.length; i++) {
    const line = data[i];
    if (line.every((v) => String(v).trim() === '')) continue;
    if (rows.length >= MAX_ROWS)
      throw fileError(`The file has more than ${MAX_ROWS.toLocaleString('en-US')} rows; split it.`);
    const values: Record<string, Cell> = {};
    header.forEach((h, j) => {
      const v = line[j];
      values[h] = v === undefined || String(v).trim() === '' ? null : unescapeFormula(String(v).trim());
    });
    if (line.length > header.length && line.slice(header.length).some((v) => String(v).trim() !== '')) {
      values.__extra = `${line.length} values for ${header.length} columns`;
    }
    rows.push({ row: i + 1, values });
  }
  if (rows.length === 0) throw fileError('The file has a header row but no data rows.');
  return { format: 'csv', columns: header, rows, crsHint: null, prj: null, hasGeometry: false };
}

function cellValue(v: ExcelJS.CellValue): Cell {
  if (v === null || v === undefined) return null;
  if (typeof v === 'number') return v;
  if (typeof v === 'string') return v.trim() === '' ? null : unescapeFormula(v.trim());
  if (typeof v === 'boolean') return String(v);
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if (typeof v === 'object') {
    if ('result' in v) return cellValue(v.result as ExcelJS.CellValue);
    if ('richText' in v)
      return (
        v.richText
          .map((r) => r.text)
          .join('')
          .trim() || null
      );
    if ('text' in v) return String(v.text).trim() || null;
    if ('error' in v) return null;
  }
  return String(v);
}

export async function readXlsx(buf: Buffer): Promise<RawTable> {
  if (buf.subarray(0, 2).toString('latin1') !== 'PK') throw fileError('This file is not an Excel workbook (.xlsx).');
  await refuseDeclaredOver(buf, {
    maxBytes: MAX_WORKBOOK_EXPANDED_BYTES,
    what: 'This workbook',
    advice: 'save it as CSV or split it.',
    notAZip: 'This file is not a readable Excel workbook (.xlsx).',
  });
  // Inflate under the hard cap first; ExcelJS then reads only what was inflated here
  // (re-packed without compression), never the original zip.
  const parts = await boundedUnzip(buf, { maxBytes: MAX_WORKBOOK_EXPANDED_BYTES, what: 'This workbook' });
  if (!parts.has('[Content_Types].xml')) throw fileError('This zip is not an Excel workbook (.xlsx).');
  const stored = new JSZip();
  for (const [name, bytes] of parts) stored.file(name, bytes);
  const wb = new ExcelJS.Workbook();
  try {
    const repacked = await stored.generateAsync({ type: 'nodebuffer', compression: 'STORE' });
    await wb.xlsx.load(repacked as unknown as ArrayBuffer);
  } catch {
    throw fileError('This file is not a readable Excel workbook (.xlsx).');
  }
  const sheet = wb.worksheets.find((s) => s.actualRowCount > 0);
  if (!sheet) throw fileError('The workbook is empty.');
  if (sheet.actualRowCount > MAX_ROWS + 1)
    throw fileError(`The sheet has more than ${MAX_ROWS.toLocaleString('en-US')} rows; split it.`);
  let headerRow = 0;
  let header: string[] = [];
  const rows: RawRow[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, n) => {
    const cells: Cell[] = [];
    const count = Math.max(row.cellCount, header.length);
    for (let c = 1; c <= count; c++) cells.push(cellValue(row.getCell(c).value));
    if (!headerRow) {
      headerRow = n;
      header = cells.map((h) => (h === null ? '' : String(h).trim()));
      while (header.length && header[header.length - 1] === '') header.pop();
      return;
    }
    if (cells.every((v) => v === null)) return;
    const values: Record<string, Cell> = {};
    header.forEach((h, j) => {
      values[h] = cells[j] ?? null;
    });
    rows.push({ row: n, values });
  });
  checkColumns(header);
  if (rows.length === 0) throw fileError('The sheet has a header row but no data rows.');
  return { format: 'xlsx', columns: header, rows, crsHint: null, prj: null, hasGeometry: false };
}

export async function readTable(fileName: string, buf: Buffer): Promise<RawTable> {
  if (buf.length === 0) throw fileError('The file is empty.');
  const format = detectFormat(fileName, buf);
  if (format === 'csv') return readCsv(buf);
  if (format === 'xlsx') return readXlsx(buf);
  if (format === 'geojson') return readGeoJson(buf);
  return readShapefileZip(buf);
}
