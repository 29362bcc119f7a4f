// Writes the sample import files in data/samples/ (all of the fictional
// Brannock County): `npx tsx scripts/make-samples.ts`. The files are committed.
import fs from 'node:fs';
import path from 'node:path';
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import proj4 from 'proj4';
import epsg from 'epsg-index/all.json' with { type: 'json' };
import { seededRandom } from '../server/seed/demo-network';

const out = path.resolve('data/samples');
fs.mkdirSync(out, { recursive: true });
const r = seededRandom(7);

// Prairie View Addition: a new subdivision north-east of Tallow Creek, 6 × 4 blocks.
const origin: [number, number] = [-98.43, 38.83];
const blockMi = 0.08;
const streets = ['Bluestem Dr', 'Switchgrass Ln', 'Sideoats Ct', 'Indiangrass Way', 'Buffalo Grass Rd'];
const aves = [
  'Meadowlark Ave',
  'Kestrel Ave',
  'Plover Ave',
  'Bobwhite Ave',
  'Killdeer Ave',
  'Dickcissel Ave',
  'Bunting Ave',
];
const toLonLat = (x: number, y: number): [number, number] => {
  const lat = origin[1] + y / 69.05;
  const lon = origin[0] + x / (69.05 * Math.cos((origin[1] * Math.PI) / 180));
  return [Math.round(lon * 1e6) / 1e6, Math.round(lat * 1e6) / 1e6];
};

type Row = Record<string, string | number>;
const rows: Row[] = [];
const geoms: [number, number][][] = [];
for (let dir = 0; dir < 2; dir++) {
  const lines = dir === 0 ? 5 : 7;
  const steps = dir === 0 ? 6 : 4;
  for (let line = 0; line < lines; line++) {
    for (let k = 0; k < steps; k++) {
      const a = dir === 0 ? [k, line] : [line, k];
      const b = dir === 0 ? [k + 1, line] : [line, k + 1];
      const coords = [toLonLat(a[0] * blockMi, a[1] * blockMi), toLonLat(b[0] * blockMi, b[1] * blockMi)];
      const year = 2018 + Math.floor(r() * 6);
      rows.push({
        segment_id: `PV-${dir === 0 ? 'S' : 'A'}${line + 1}-${k + 1}`,
        road_name: dir === 0 ? streets[line] : aves[line],
        from_desc: dir === 0 ? aves[k] : streets[k],
        to_desc: dir === 0 ? aves[k + 1] : streets[k + 1],
        length_mi: blockMi,
        width_ft: 30,
        lanes: 2,
        functional_class: line === 2 ? 'minor_collector' : 'local',
        surface: 'asphalt',
        adt: Math.round(150 + r() * 900),
        truck_pct: Math.round((2 + r() * 4) * 10) / 10,
        pci: Math.round(70 + r() * 28),
        pci_date: `2026-0${6 + Math.floor(r() * 3)}-1${Math.floor(r() * 9)}`,
        last_treatment: 'new construction',
        last_treatment_year: year,
        district: 'Northeast',
      });
      geoms.push(coords);
    }
  }
}

const fields = Object.keys(rows[0]);
// The CSV carries each centreline as WKT in a geometry column, as GIS exports to CSV do.
const wkt = (c: [number, number][]) => `LINESTRING (${c.map((p) => p.join(' ')).join(', ')})`;
const csvRows = rows.map((row, i) => ({ ...row, geometry: wkt(geoms[i]) }));
fs.writeFileSync(
  path.join(out, 'brannock-prairie-view.csv'),
  `${Papa.unparse(csvRows, { columns: [...fields, 'geometry'] })}\n`,
);

// The same rows as a workbook with the headers a county spreadsheet might use.
const wb = new ExcelJS.Workbook();
const ws = wb.addWorksheet('Segments');
const xlsxHeaders = [
  'Segment ID',
  'Road Name',
  'From',
  'To',
  'Length (mi)',
  'Width (ft)',
  'Lanes',
  'Functional Class',
  'Surface Type',
  'AADT',
  'Truck %',
  'PCI',
  'Survey Date',
  'Last Treatment',
  'Last Treatment Year',
  'District',
];
ws.addRow(xlsxHeaders);
const classLabel: Record<string, string> = { local: 'Local', minor_collector: 'Minor Collector' };
for (const row of rows) {
  ws.addRow([
    row.segment_id,
    row.road_name,
    row.from_desc,
    row.to_desc,
    row.length_mi,
    row.width_ft,
    row.lanes,
    classLabel[String(row.functional_class)],
    'Asphalt',
    row.adt,
    row.truck_pct,
    row.pci,
    row.pci_date,
    row.last_treatment,
    row.last_treatment_year,
    row.district,
  ]);
}
await wb.xlsx.writeFile(path.join(out, 'brannock-prairie-view.xlsx'));

const featureCollection = (coords: (c: [number, number][]) => number[][], extra: object = {}) => ({
  type: 'FeatureCollection',
  ...extra,
  features: rows.map((row, i) => {
    const { length_mi: _len, ...props } = row;
    return { type: 'Feature', properties: props, geometry: { type: 'LineString', coordinates: coords(geoms[i]) } };
  }),
});
fs.writeFileSync(
  path.join(out, 'brannock-prairie-view.geojson'),
  `${JSON.stringify(
    featureCollection((c) => c),
    null,
    1,
  )}\n`,
);

// State Plane twin: NAD83 / Kansas North (ftUS), EPSG:3419, definition from epsg-index.
const def = (epsg as Record<string, { proj4: string }>)['3419'].proj4;
const toSp = proj4('WGS84', def);
const sp = featureCollection((c) => c.map((p) => toSp.forward(p).map((v: number) => Math.round(v * 1000) / 1000)), {
  crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::3419' } },
});
fs.writeFileSync(path.join(out, 'brannock-prairie-view-stateplane.geojson'), `${JSON.stringify(sp, null, 1)}\n`);

// Surveys for the new subdivision, a year apart.
const surveys = rows.map((row) => ({
  segment_id: row.segment_id,
  survey_date: '2025-07-15',
  pci: Math.min(100, Number(row.pci) + 3),
  source: 'windshield survey',
}));
fs.writeFileSync(path.join(out, 'brannock-prairie-view-surveys.csv'), `${Papa.unparse(surveys)}\n`);

// A deliberately messy sheet: every row after the header shows one kind of mistake.
const messy = [
  'Segment ID;Road Name;From;To;Length (mi);Width (ft);Lanes;Functional Class;Surface;ADT;PCI;Survey Date',
  'RD-101;Section Line 5;Road K;Road L;1.000;22;2;Local;Chip Seal;120;64;2026-06-02',
  'RD-102;Section Line 5;Road L;Road M;1,000;22;2;Local;Chip Seal;95;58;2026-06-02',
  'RD-103;Section Line 5;Road M;Road N;0.998;-22;2;Local;Asphalt;140;71;2026-06-02',
  'RD-104;Section Line 5;Road N;Road O;1.002;24;two;Local;Asphalt;160;66;2026-06-03',
  'RD-105;;Road O;Road P;1.001;24;2;Local;Asphalt;150;61;2026-06-03',
  'RD-106;Section Line 5;Road P;Road Q;0.999;24;2;Arterial Road;Asphalt;210;59;2026-06-03',
  'RD-107;Section Line 5;Road Q;Road R;1.000;24;2;Major Collector;Cobblestone;450;55;2026-06-04',
  'RD-108;Section Line 5;Road R;Road S;1.003;24;2;Major Collector;Asphalt;470;140;2026-06-04',
  'RD-109;Section Line 5;Road S;Road T;0.997;24;2;Major Collector;Asphalt;455;62;06/04/2026',
  'RD-101;Section Line 5;Road T;Road U;1.000;24;2;Major Collector;Asphalt;460;67;2026-06-04',
  'RD-110;Section Line 5;Road U;Road V;;24;2;Local;Gravel;60;;',
  'RD-111;Section Line 5;Road V;Road W;1.001;24;2;Local;Asphalt;abc;73;2026-06-05',
];
fs.writeFileSync(path.join(out, 'brannock-messy.csv'), `\ufeff${messy.join('\r\n')}\r\n`);
console.log(`wrote ${fs.readdirSync(out).length} files to ${out}`);
