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
}
declare module 'wkx' {
  export class Geometry {
    static parse(value: string | Buffer): Geometry;
    static parseGeoJSON(value: object): Geometry;
    toGeoJSON(): { type: string; coordinates: unknown };
    toWkt(): string;
  }
}
