// GIS files: GeoJSON features and zipped shapefiles become the same plain table.
// Coordinates are left as the file has them; the importer reprojects them once.
import { boundedUnzip } from './bounded-unzip';
import {
  type Cell,
  type FileFormat,
  fileError,
  type Geometry,
  MAX_ROWS,
  MAX_SHAPEFILE_EXPANDED_BYTES,
  type RawRow,
  type RawTable,
  refuseDeclaredOver,
} from './raw-table';

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
