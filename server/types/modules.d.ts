declare module 'better-sqlite3-session-store' {
  import type session from 'express-session';
  type StoreCtor = new (options: {
    client: unknown;
    expired?: { clear?: boolean; intervalMs?: number };
  }) => session.Store;
  export default function factory(s: typeof session): StoreCtor;
}
declare module 'epsg-index/all.json' {
  const value: Record<string, { proj4?: string; name?: string; unit?: string }>;
  export default value;
}
declare module 'shpjs' {
  export default function shp(input: ArrayBuffer | Buffer | string): Promise<unknown>;
  /** Without a projection the coordinates are returned as stored in the file. */
  export function parseShp(shp: Uint8Array | ArrayBuffer, prj?: string): unknown[];
  export function parseDbf(dbf: Uint8Array | ArrayBuffer, cpg?: Uint8Array | string): Record<string, unknown>[];
  export function combine(parts: [unknown[], Record<string, unknown>[] | undefined]): unknown;
}
declare module 'wkx' {
  export class Geometry {
    static parse(value: string | Buffer): Geometry;
    static parseGeoJSON(value: object): Geometry;
    toGeoJSON(): { type: string; coordinates: unknown };
    toWkt(): string;
  }
}
