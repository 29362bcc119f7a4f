// Which coordinate system a file's positions are in. One source wins, and the
// positions are reprojected once: the system the user chose, else the file's own
// (a shapefile's .prj, a GeoJSON `crs` member). When both are given and they put
// the same point in different places, the import says so.
import { distance } from '@turf/turf';
import proj4 from 'proj4';
import type { ImportIssue } from '../../shared/schemas/imports';
import { HttpError } from '../http/errors';
import { crsDefinition, geometryProblem, type LineGeometry } from './geometry';
import type { RawTable } from './read-file';

export type CrsChoice = {
  /** PROJ definition (or WKT) to reproject from; null for longitude/latitude. */
  proj: string | null;
  crs: string | null;
  note: string | null;
  warnings: ImportIssue[];
};

const wktName = (wkt: string) => wkt.match(/^\s*(?:PROJCS|GEOGCS|PROJCRS|GEOGCRS)\s*\[\s*"([^"]+)"/i)?.[1] ?? null;

async function epsg(code: string) {
  const def = await crsDefinition(code);
  if (!def)
    throw new HttpError(
      400,
      'invalid_request',
      `Invalid request: crs — ${code} is not a known EPSG coordinate system`,
      [{ path: 'crs', message: `${code} is not a known EPSG coordinate system` }],
    );
  return def;
}

function firstPosition(table: RawTable): { row: number; xy: [number, number] } | null {
  for (const r of table.rows) {
    if (!r.geometry || geometryProblem(r.geometry)) continue;
    const g = r.geometry as LineGeometry;
    const p = g.type === 'LineString' ? g.coordinates[0] : g.coordinates[0][0];
    return { row: r.row, xy: [p[0], p[1]] };
  }
  return null;
}

export async function resolveCrs(table: RawTable, chosenCode: string | undefined): Promise<CrsChoice> {
  const warnings: ImportIssue[] = [];
  const chosen = chosenCode ? { code: chosenCode.toUpperCase(), ...(await epsg(chosenCode.toUpperCase())) } : null;
  let file: { proj: string; label: string; code: string | null } | null = null;
  if (table.prj) {
    try {
      proj4(table.prj, 'WGS84');
      file = { proj: table.prj, label: `the shapefile's .prj (${wktName(table.prj) ?? 'unnamed'})`, code: null };
    } catch {
      warnings.push({
        row: 0,
        column: '.prj',
        value: table.prj.slice(0, 60),
        message: 'the .prj file could not be read; choose the coordinate system the shapefile uses',
      });
    }
  } else if (table.crsHint) {
    const def = await crsDefinition(table.crsHint);
    if (def)
      file = { proj: def.proj4, label: `the file's crs member (${table.crsHint}, ${def.name})`, code: table.crsHint };
  }
  if (!chosen)
    return {
      proj: file?.proj ?? null,
      crs: file?.code ?? null,
      note: file ? `Coordinates read in ${file.label}.` : null,
      warnings,
    };
  const note = `Coordinates read in ${chosen.code} (${chosen.name}), as chosen.`;
  if (file && file.code !== chosen.code) {
    const p = firstPosition(table);
    if (p) {
      const a = proj4(chosen.proj4, 'WGS84').forward(p.xy);
      const b = proj4(file.proj, 'WGS84').forward(p.xy);
      const km = Number.isFinite(a[0] + a[1] + b[0] + b[1]) ? distance(a, b, { units: 'kilometers' }) : Infinity;
      if (km > 0.001)
        warnings.push({
          row: p.row,
          column: 'geometry',
          value: '',
          message: `${chosen.code} as chosen and ${file.label} disagree: the first point lands ${km === Infinity ? 'off the map' : `${km.toFixed(km < 10 ? 3 : 0)} km`} apart. The chosen ${chosen.code} was used; clear the choice to use the file's own.`,
        });
    }
  }
  return { proj: chosen.proj4, crs: chosen.code, note, warnings };
}
