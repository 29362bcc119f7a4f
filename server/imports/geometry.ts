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

/**
 * A segment's line is stored with at most this many positions (simplified above it,
 * with a warning); a line of more than MAX_VERTICES_READ is refused. One road segment
 * between two intersections never needs more: at 1,000 positions a 10-mile segment
 * still has one every 16 m. Unbounded lines made the map's GeoJSON tens of MB.
 */
export const MAX_VERTICES_STORED = 1_000;
export const MAX_VERTICES_READ = 100_000;
export const MAX_LINE_PARTS = 500;

const fmt = (n: number) => n.toLocaleString('en-US');

/** A reason the geometry is unusable, or null when it is a proper line. */
export function geometryProblem(g: Geometry | null | undefined): string | null {
  if (!g) return null;
  if (g.type === 'LineString') {
    const c = g.coordinates;
    if (!Array.isArray(c) || c.length < 2 || !c.every(isPosition))
      return 'a LineString needs at least two [x, y] positions of finite numbers';
    if (c.length > MAX_VERTICES_READ)
      return `the line has ${fmt(c.length)} positions, more than ${fmt(MAX_VERTICES_READ)}; simplify or split it in your GIS`;
    return null;
  }
  if (g.type === 'MultiLineString') {
    const c = g.coordinates;
    if (!Array.isArray(c) || c.length === 0) return 'the MultiLineString has no lines';
    if (c.length > MAX_LINE_PARTS) return `the MultiLineString has more than ${MAX_LINE_PARTS} parts`;
    let total = 0;
    for (const line of c) {
      if (!Array.isArray(line) || line.length < 2 || !line.every(isPosition))
        return 'each line of a MultiLineString needs at least two positions of finite numbers';
      total += line.length;
    }
    if (total > MAX_VERTICES_READ)
      return `the lines have ${fmt(total)} positions, more than ${fmt(MAX_VERTICES_READ)}; simplify or split them in your GIS`;
    return null;
  }
  if (g.type === 'unreadable WKT') return 'is not readable WKT (e.g. LINESTRING (-98.5 38.8, -98.49 38.8))';
  return `geometry type ${String(g.type)} is not a road centreline (use LineString or MultiLineString)`;
}

export function vertexCount(g: LineGeometry) {
  return g.type === 'LineString' ? g.coordinates.length : g.coordinates.reduce((n, l) => n + l.length, 0);
}

// Douglas–Peucker with an explicit stack (turf's recursive version overflows the
// call stack on long zigzag lines). Distances in degrees, longitude scaled by cos(latitude).
function simplifyLine(line: Position[], tolerance: number): Position[] {
  const k = Math.cos(((line[0][1] ?? 0) * Math.PI) / 180);
  const keep = new Uint8Array(line.length);
  keep[0] = keep[line.length - 1] = 1;
  const stack: [number, number][] = [[0, line.length - 1]];
  const t2 = tolerance * tolerance;
  while (stack.length) {
    const [a, b] = stack.pop()!;
    const ax = line[a][0] * k;
    const ay = line[a][1];
    const dx = line[b][0] * k - ax;
    const dy = line[b][1] - ay;
    const len2 = dx * dx + dy * dy;
    let worst = -1;
    let at = -1;
    for (let i = a + 1; i < b; i++) {
      const px = line[i][0] * k - ax;
      const py = line[i][1] - ay;
      const u = len2 === 0 ? 0 : Math.max(0, Math.min(1, (px * dx + py * dy) / len2));
      const ex = px - u * dx;
      const ey = py - u * dy;
      const d2 = ex * ex + ey * ey;
      if (d2 > worst) {
        worst = d2;
        at = i;
      }
    }
    if (at >= 0 && worst > t2) {
      keep[at] = 1;
      stack.push([a, at], [at, b]);
    }
  }
  return line.filter((_, i) => keep[i]);
}

/**
 * The line with at most MAX_VERTICES_STORED positions (Douglas–Peucker, the
 * tolerance doubled from about 0.1 m until it fits). Ends are kept.
 */
export function fitVertices(g: LineGeometry): { geometry: LineGeometry; simplifiedFrom: number | null } {
  const n = vertexCount(g);
  if (n <= MAX_VERTICES_STORED) return { geometry: g, simplifiedFrom: null };
  let out = g;
  for (let tolerance = 1e-6; tolerance < 1 && vertexCount(out) > MAX_VERTICES_STORED; tolerance *= 2)
    out =
      g.type === 'LineString'
        ? { type: 'LineString', coordinates: simplifyLine(g.coordinates, tolerance) }
        : { type: 'MultiLineString', coordinates: g.coordinates.map((l) => simplifyLine(l, tolerance)) };
  return { geometry: out, simplifiedFrom: n };
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
