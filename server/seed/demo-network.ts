// Builds the fictional demo networks (Brannock County with its seat Tallow
// Creek, and the City of Marlow). Everything here is invented for the demo
// scenario: geometry, traffic, treatment years and the survey curve.
import { rng } from '../../shared/engine/random';
import type { FunctionalClass, Surface } from '../../shared/schemas/segments';

export type DemoSegment = {
  segmentId: string;
  roadName: string;
  fromDesc: string;
  toDesc: string;
  lengthMi: number;
  widthFt: number;
  lanes: number;
  functionalClass: FunctionalClass;
  surface: Surface;
  adt: number;
  truckPct: number;
  district: string;
  lastTreatment: string | null;
  lastTreatmentYear: number | null;
  geometry: { type: 'LineString'; coordinates: [number, number][] };
  surveys: { surveyDate: string; pci: number }[];
};

/** The seeded generator of the engine, so the demo is the same on every machine. */
export const seededRandom = rng;

type Rand = () => number;
const pick = <T>(r: Rand, xs: readonly T[]) => xs[Math.floor(r() * xs.length)];
const between = (r: Rand, lo: number, hi: number) => lo + (hi - lo) * r();
const normal = (r: Rand) => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

// Demo survey curve (invented for the scenario): PCI = 100 − a·age^b.
const DEMO_CURVE: Record<Surface, { a: number; b: number }> = {
  asphalt: { a: 0.7, b: 1.45 },
  chip_seal: { a: 1.3, b: 1.35 },
  concrete: { a: 0.35, b: 1.5 },
  gravel: { a: 0, b: 1 },
  other: { a: 1, b: 1.4 },
};

const TREATMENT_BY_SURFACE: Record<Surface, string[]> = {
  asphalt: ['thin overlay', 'mill and overlay', 'structural overlay', 'reconstruction'],
  chip_seal: ['chip seal'],
  concrete: ['reconstruction'],
  gravel: [],
  other: ['reconstruction'],
};

export const SURVEY_YEARS = [2019, 2020, 2021, 2022, 2023, 2024, 2025, 2026];

function history(r: Rand, surface: Surface, busy: boolean) {
  if (surface === 'gravel') return { lastTreatment: null, lastTreatmentYear: null, surveys: [] };
  const curve = DEMO_CURVE[surface];
  const rate = curve.a * between(r, 0.75, 1.3) * (busy ? 1.15 : 1);
  const lastYear = Math.round(between(r, 2002, 2025));
  const priorYear = lastYear - Math.round(between(r, 10, 18));
  const surveys = SURVEY_YEARS.map((y) => {
    const age = y >= lastYear ? y - lastYear : y - priorYear;
    const pci = Math.max(0, Math.min(100, 100 - rate * age ** curve.b + normal(r) * 3));
    const day = String(1 + Math.floor(r() * 28)).padStart(2, '0');
    const month = pick(r, ['05', '06', '07', '08']);
    return { surveyDate: `${y}-${month}-${day}`, pci: round(pci, 0) };
  });
  return { lastTreatment: pick(r, TREATMENT_BY_SURFACE[surface]), lastTreatmentYear: lastYear, surveys };
}

const MI_PER_DEG_LAT = 69.05;
const toLonLat = (origin: [number, number], xMi: number, yMi: number): [number, number] => {
  const [lon0, lat0] = origin;
  const lat = lat0 + yMi / MI_PER_DEG_LAT;
  const lon = lon0 + xMi / (MI_PER_DEG_LAT * Math.cos((lat0 * Math.PI) / 180));
  return [round(lon, 6), round(lat, 6)];
};

const STREETS = [
  'Main',
  'Oak',
  'Elm',
  'Cedar',
  'Walnut',
  'Pine',
  'Maple',
  'Hickory',
  'Ash',
  'Locust',
  'Spruce',
  'Willow',
];
const ordinal = (n: number) =>
  `${n}${n % 10 === 1 && n !== 11 ? 'st' : n % 10 === 2 && n !== 12 ? 'nd' : n % 10 === 3 && n !== 13 ? 'rd' : 'th'}`;

function townGrid(
  r: Rand,
  opts: {
    prefix: string;
    origin: [number, number];
    blocks: number;
    blockMi: number;
    district: string;
    mainClass: FunctionalClass;
  },
): DemoSegment[] {
  const out: DemoSegment[] = [];
  const n = opts.blocks;
  for (let dir = 0; dir < 2; dir++) {
    for (let line = 0; line <= n; line++) {
      const isMain = line === Math.floor(n / 2);
      const name = dir === 0 ? `${STREETS[line % STREETS.length]} St` : `${ordinal(line + 1)} Ave`;
      for (let k = 0; k < n; k++) {
        const a = dir === 0 ? [k, line] : [line, k];
        const b = dir === 0 ? [k + 1, line] : [line, k + 1];
        const cross = (i: number) => (dir === 0 ? `${ordinal(i + 1)} Ave` : `${STREETS[i % STREETS.length]} St`);
        const surface: Surface = isMain ? 'asphalt' : r() < 0.1 ? 'concrete' : 'asphalt';
        const cls: FunctionalClass = isMain ? opts.mainClass : line % 4 === 0 ? 'minor_collector' : 'local';
        const busy = cls !== 'local';
        out.push({
          segmentId: `${opts.prefix}-${dir === 0 ? 'S' : 'A'}${String(line + 1).padStart(2, '0')}-${String(k + 1).padStart(2, '0')}`,
          roadName: name,
          fromDesc: cross(k),
          toDesc: cross(k + 1),
          lengthMi: opts.blockMi,
          widthFt: isMain ? 44 : busy ? 36 : 32,
          lanes: isMain ? 4 : 2,
          functionalClass: cls,
          surface,
          adt: Math.round(isMain ? between(r, 4000, 9000) : busy ? between(r, 900, 2500) : between(r, 80, 600)),
          truckPct: round(isMain ? between(r, 6, 12) : between(r, 2, 6), 1),
          district: opts.district,
          geometry: {
            type: 'LineString',
            coordinates: [
              toLonLat(opts.origin, a[0] * opts.blockMi, a[1] * opts.blockMi),
              toLonLat(opts.origin, b[0] * opts.blockMi, b[1] * opts.blockMi),
            ],
          },
          ...history(r, surface, busy),
        });
      }
    }
  }
  return out;
}

/** Brannock County: a one-mile section-line grid, two arterials, and the Tallow Creek street grid. */
export function brannockCounty(seed = 20261): DemoSegment[] {
  const r = seededRandom(seed);
  const origin: [number, number] = [-98.62, 38.71];
  const cols = 24;
  const rows = 20;
  const out: DemoSegment[] = [];
  const letter = (i: number) => String.fromCharCode(65 + i);
  const ewName = (j: number) => (j === 10 ? 'County Highway 14' : `${(j + 1) * 100} Road`);
  const nsName = (i: number) => (i === 12 ? 'Tallow Creek Parkway' : `Road ${letter(i)}`);
  const district = (x: number, y: number) =>
    y >= rows / 2 ? (x < cols / 2 ? 'Northwest' : 'Northeast') : x < cols / 2 ? 'Southwest' : 'Southeast';
  for (let dir = 0; dir < 2; dir++) {
    const lines = dir === 0 ? rows + 1 : cols + 1;
    const steps = dir === 0 ? cols : rows;
    for (let line = 0; line < lines; line++) {
      const arterial = (dir === 0 && line === 10) || (dir === 1 && line === 12);
      const collector = !arterial && line % 4 === 2;
      for (let k = 0; k < steps; k++) {
        const a: [number, number] = dir === 0 ? [k, line] : [line, k];
        const b: [number, number] = dir === 0 ? [k + 1, line] : [line, k + 1];
        const cls: FunctionalClass = arterial
          ? dir === 0
            ? 'principal_arterial'
            : 'minor_arterial'
          : collector
            ? line % 8 === 2
              ? 'major_collector'
              : 'minor_collector'
            : 'local';
        const u = r();
        const surface: Surface =
          arterial || collector ? 'asphalt' : u < 0.5 ? 'asphalt' : u < 0.78 ? 'chip_seal' : 'gravel';
        const name = dir === 0 ? ewName(line) : nsName(line);
        const cross = (i: number) => (dir === 0 ? nsName(i) : ewName(i));
        // Section lines are surveyed miles, give or take a little at the corners.
        const lengthMi = round(between(r, 0.97, 1.03), 3);
        out.push({
          segmentId: `BC-${dir === 0 ? 'E' : 'N'}${String(line).padStart(2, '0')}-${String(k).padStart(2, '0')}`,
          roadName: name,
          fromDesc: cross(k),
          toDesc: cross(k + 1),
          lengthMi,
          widthFt: arterial ? 40 : collector ? 26 : surface === 'gravel' ? 24 : 22,
          lanes: arterial && dir === 0 ? 4 : 2,
          functionalClass: cls,
          surface,
          adt: Math.round(arterial ? between(r, 2500, 7500) : collector ? between(r, 400, 1500) : between(r, 40, 350)),
          truckPct: round(arterial ? between(r, 9, 18) : between(r, 4, 12), 1),
          district: district((a[0] + b[0]) / 2, (a[1] + b[1]) / 2),
          geometry: { type: 'LineString', coordinates: [toLonLat(origin, a[0], a[1]), toLonLat(origin, b[0], b[1])] },
          ...history(r, surface, arterial || collector),
        });
      }
    }
  }
  // Tallow Creek sits in the middle of the county, clear of the section lines.
  out.push(
    ...townGrid(r, {
      prefix: 'TC',
      origin: toLonLat(origin, 12.15, 6.15),
      blocks: 10,
      blockMi: 0.07,
      district: 'Tallow Creek',
      mainClass: 'minor_arterial',
    }),
  );
  return out;
}

/** The City of Marlow: a small street grid in a neighbouring county. */
export function cityOfMarlow(seed = 20262): DemoSegment[] {
  const r = seededRandom(seed);
  return townGrid(r, {
    prefix: 'MW',
    origin: [-98.05, 38.93],
    blocks: 6,
    blockMi: 0.09,
    district: 'Marlow',
    mainClass: 'minor_arterial',
  });
}
