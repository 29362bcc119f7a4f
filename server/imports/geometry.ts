// Geometry checks, reprojection to WGS84 and lengths. CRS definitions come
// from the epsg-index package (PROJ strings for every EPSG code), never typed by hand.
import { length as turfLength } from '@turf/turf';
import proj4 from 'proj4';
import type { Geometry } from './read-file';

type Position = number[];
export type LineGeometry =
  | { type: 'LineString'; coordinates: Position[] }
  | { type: 'MultiLineString'; coordinates: Position[][] };

let epsgIndex: Record<string, { proj4?: string; name?: string }> | null = null;

async function epsgDefs() {
  if (!epsgIndex) epsgIndex = (await import('epsg-index/all.json', { with: { type: 'json' } })).default as never;
  return epsgIndex!;
}

export async function crsDefinition(crs: string): Promise<{ proj4: string; name: string } | null> {
  const code = crs.replace(/^EPSG:/i, '');
  const entry = (await epsgDefs())[code];
  return entry?.proj4 ? { proj4: entry.proj4, name: entry.name ?? crs } : null;
}

const isPosition = (p: unknown): p is Position =>
  Array.isArray(p) && p.length >= 2 && p.length <= 4 && p.every((v) => typeof v === 'number' && Number.isFinite(v));

/** A reason the geometry is unusable, or null when it is a proper line. */
export function geometryProblem(g: Geometry | null | undefined): string | null {
  if (!g) return null;
  if (g.type === 'LineString') {
    const c = g.coordinates;
    if (!Array.isArray(c) || c.length < 2 || !c.every(isPosition))
      return 'a LineString needs at least two [x, y] positions of finite numbers';
    return null;
  }
  if (g.type === 'MultiLineString') {
    const c = g.coordinates;
    if (!Array.isArray(c) || c.length === 0) return 'the MultiLineString has no lines';
    for (const line of c) {
      if (!Array.isArray(line) || line.length < 2 || !line.every(isPosition))
        return 'each line of a MultiLineString needs at least two positions of finite numbers';
    }
    return null;
  }
  if (g.type === 'unreadable WKT') return 'is not readable WKT (e.g. LINESTRING (-98.5 38.8, -98.49 38.8))';
  return `geometry type ${String(g.type)} is not a road centreline (use LineString or MultiLineString)`;
}

function positions(g: LineGeometry): Position[] {
  return g.type === 'LineString' ? g.coordinates : g.coordinates.flat();
}

export function looksLonLat(g: LineGeometry) {
  return positions(g).every(([x, y]) => x >= -180 && x <= 180 && y >= -90 && y <= 90);
}

export function reproject(g: LineGeometry, fromProj4: string): LineGeometry {
  const t = proj4(fromProj4, 'WGS84');
  const one = (p: Position) => {
    const [x, y] = t.forward([p[0], p[1]]);
    return [Math.round(x * 1e7) / 1e7, Math.round(y * 1e7) / 1e7];
  };
  return g.type === 'LineString'
    ? { type: 'LineString', coordinates: g.coordinates.map(one) }
    : { type: 'MultiLineString', coordinates: g.coordinates.map((l) => l.map(one)) };
}

/** Geodesic length in miles (turf). */
export function lengthMiles(g: LineGeometry) {
  return turfLength({ type: 'Feature', properties: {}, geometry: g } as never, { units: 'miles' });
}

/** Drops Z/M values: the map and the engine use x, y only. */
export function to2d(g: LineGeometry): LineGeometry {
  const two = (p: Position) => [p[0], p[1]];
  return g.type === 'LineString'
    ? { type: 'LineString', coordinates: g.coordinates.map(two) }
    : { type: 'MultiLineString', coordinates: g.coordinates.map((l) => l.map(two)) };
}
