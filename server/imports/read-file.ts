// Turns an uploaded file (CSV, XLSX, GeoJSON or a zipped shapefile) into one
// plain table: column names, and rows numbered the way the user sees them in
// their own program (spreadsheet row, or feature number in GeoJSON).
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import Papa from 'papaparse';
import { unescapeFormula } from '../csv';
import { HttpError } from '../http/errors';
import { boundedUnzip } from './bounded-unzip';

export type Cell = string | number | null;
export type Geometry = { type: string; coordinates: unknown };
export type RawRow = {
  row: number;
  values: Record<string, Cell>;
  geometry?: Geometry | null;
  /** Cells that could not be read as a value (column → reason), e.g. a nested GeoJSON property. */
  unreadable?: Record<string, string>;
};
export type FileFormat = 'csv' | 'xlsx' | 'geojson' | 'shapefile';
export type RawTable = {
  format: FileFormat;
  columns: string[];
  rows: RawRow[];
  /** EPSG code named by the file itself (a GeoJSON `crs` member). */
  crsHint: string | null;
  /** The shapefile's .prj text (WKT); its coordinates are left as they are in the file. */
  prj: string | null;
  hasGeometry: boolean;
};

export const MAX_ROWS = 100_000;
/**
 * A workbook or zipped shapefile may expand to at most this much when unzipped. A zip
 * that declares more is refused before inflating; one that lies is stopped at the cap.
 */
export const MAX_WORKBOOK_EXPANDED_BYTES = 200 * 1024 * 1024;
export const MAX_SHAPEFILE_EXPANDED_BYTES = 200 * 1024 * 1024;

const fileError = (message: string) => new HttpError(400, 'bad_file', message);

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

/** The sizes a zip declares for its parts, read from its directory without inflating anything. */
export function zipExpandedBytes(zip: JSZip) {
  let total = 0;
  for (const f of Object.values(zip.files))
    total += (f as unknown as { _data?: { uncompressedSize?: number } })._data?.uncompressedSize ?? 0;
  return total;
}

/**
 * The quick refusal: a zip that itself declares more than the cap is refused before
 * anything is inflated. The declared sizes can lie; boundedUnzip holds the real cap.
 */
export async function refuseDeclaredOver(
  buf: Buffer,
  o: { maxBytes: number; what: string; advice: string; notAZip: string },
) {
  const { maxBytes, what, advice } = o;
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(buf);
  } catch {
    throw fileError(o.notAZip);
  }
  const expanded = zipExpandedBytes(zip);
  if (expanded > maxBytes)
    throw fileError(
      `${what} expands to ${Math.round(expanded / 1024 / 1024)} MB when unzipped, more than the ${Math.round(maxBytes / 1024 / 1024)} MB limit; ${advice}`,
    );
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

type GeoFeature = { type?: string; properties?: Record<string, unknown> | null; geometry?: Geometry | null };

function crsFromGeoJson(doc: { crs?: { properties?: { name?: string } } }): string | null {
  const name = doc.crs?.properties?.name;
  if (!name) return null;
  const m = String(name).match(/EPSG:{1,2}(\d+)/i);
  if (!m) return null;
  return m[1] === '4326' || /CRS84/i.test(name) ? null : `EPSG:${m[1]}`;
}

const NESTED = 'is a nested object or list; only text, numbers and true/false are read';

export function tableFromFeatures(
  features: GeoFeature[],
  format: FileFormat,
  crsHint: string | null,
  prj: string | null = null,
): RawTable {
  if (features.length === 0) throw fileError('The file has no features.');
  if (features.length > MAX_ROWS)
    throw fileError(`The file has more than ${MAX_ROWS.toLocaleString('en-US')} features; split it.`);
  const columns: string[] = [];
  const seen = new Set<string>();
  const rows: RawRow[] = features.map((f, i) => {
    const values: Record<string, Cell> = {};
    let unreadable: Record<string, string> | undefined;
    const props = f && typeof f === 'object' && f.properties && typeof f.properties === 'object' ? f.properties : {};
    for (const [k, v] of Object.entries(props)) {
      if (!seen.has(k)) {
        seen.add(k);
        columns.push(k);
      }
      // Objects and arrays are never turned into text: String() of a deeply nested list recurses.
      if (v !== null && typeof v === 'object') {
        values[k] = null;
        unreadable = { ...unreadable, [k]: NESTED };
      } else
        values[k] = v === null || v === undefined || v === '' ? null : typeof v === 'number' ? v : String(v).trim();
    }
    return { row: i + 1, values, geometry: f?.geometry ?? null, unreadable };
  });
  return { format, columns, rows, crsHint, prj, hasGeometry: true };
}

export function readGeoJson(buf: Buffer): RawTable {
  let doc: unknown;
  try {
    let text = buf.toString('utf8');
    if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    doc = JSON.parse(text);
  } catch {
    throw fileError('This file is not valid JSON, so it cannot be read as GeoJSON.');
  }
  if (!doc || typeof doc !== 'object') throw fileError('This file is not GeoJSON (expected a FeatureCollection).');
  const d = doc as { type?: string; features?: unknown };
  let features: GeoFeature[];
  if (d.type === 'FeatureCollection' && Array.isArray(d.features)) features = d.features as GeoFeature[];
  else if (d.type === 'Feature') features = [d as GeoFeature];
  else throw fileError('This file is not GeoJSON (expected a FeatureCollection of LineString features).');
  return tableFromFeatures(features, 'geojson', crsFromGeoJson(doc as never));
}

export async function readShapefileZip(buf: Buffer): Promise<RawTable> {
  const { parseShp, parseDbf, combine } = await import('shpjs');
  await refuseDeclaredOver(buf, {
    maxBytes: MAX_SHAPEFILE_EXPANDED_BYTES,
    what: 'This zipped shapefile',
    advice: 'zip fewer layers.',
    notAZip: 'This file is not a readable zip of a shapefile (.shp, .dbf, .prj).',
  });
  const parts = await boundedUnzip(buf, {
    maxBytes: MAX_SHAPEFILE_EXPANDED_BYTES,
    what: 'This zipped shapefile',
    want: (n) => !n.includes('__MACOSX') && /\.(shp|dbf|prj|cpg)$/i.test(n),
  });
  const byExt = (base: string, ext: string) =>
    [...parts.entries()].find(([n]) => n.slice(0, -4) === base && n.slice(-4).toLowerCase() === ext)?.[1];
  const layers = [...parts.keys()].filter((n) => n.toLowerCase().endsWith('.shp')).map((n) => n.slice(0, -4));
  if (!layers.length) throw fileError('This zip does not hold a shapefile (.shp, .dbf, .prj).');
  const prjs = new Set(layers.map((l) => byExt(l, '.prj')?.toString('utf8').trim() ?? ''));
  if (prjs.size > 1)
    throw fileError('The layers in this zip use different coordinate systems (.prj files); zip one layer at a time.');
  const prj = [...prjs][0] || null;
  const features: GeoFeature[] = [];
  try {
    for (const layer of layers) {
      // No .prj handed to shpjs: the coordinates stay as in the file and are reprojected
      // once, by the importer, from whichever coordinate system wins (the chosen one or the .prj).
      const shapes = parseShp(byExt(layer, '.shp')!);
      const dbf = byExt(layer, '.dbf');
      const cpg = byExt(layer, '.cpg');
      const collection = combine([shapes, dbf ? parseDbf(dbf, cpg) : undefined]) as { features: GeoFeature[] };
      features.push(...collection.features);
    }
  } catch (err) {
    throw fileError(`This zip does not hold a readable shapefile (.shp, .dbf, .prj): ${(err as Error).message}`);
  }
  return tableFromFeatures(features, 'shapefile', null, prj);
}

export async function readTable(fileName: string, buf: Buffer): Promise<RawTable> {
  if (buf.length === 0) throw fileError('The file is empty.');
  const format = detectFormat(fileName, buf);
  if (format === 'csv') return readCsv(buf);
  if (format === 'xlsx') return readXlsx(buf);
  if (format === 'geojson') return readGeoJson(buf);
  return readShapefileZip(buf);
}
