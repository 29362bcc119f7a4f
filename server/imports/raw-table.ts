// The plain table every upload becomes: column names, and rows numbered the way
// the user sees them in their own program (spreadsheet row, or feature number).
import JSZip from 'jszip';
import { HttpError } from '../http/errors';

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

export const fileError = (message: string) => new HttpError(400, 'bad_file', message);

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
