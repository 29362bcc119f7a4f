// Export of the filtered segment list. Headers and class/surface values are plain
// words the importer reads back, so an exported file re-imports as "unchanged".
import ExcelJS from 'exceljs';
import wkx from 'wkx';
import { EXPORT_HEADERS, SEGMENT_FIELDS } from '../../shared/schemas/imports';
import { toCsv } from '../csv';
import type { SegmentRow } from './segments.repo';

const words = (v: string) => v.replace(/_/g, ' ');
const HEADERS = SEGMENT_FIELDS.map((f) => EXPORT_HEADERS[f]);

function record(r: SegmentRow): Record<(typeof SEGMENT_FIELDS)[number], string | number | null> {
  return {
    segment_id: r.segmentId,
    road_name: r.roadName,
    from_desc: r.fromDesc,
    to_desc: r.toDesc,
    length_mi: r.lengthMi,
    width_ft: r.widthFt,
    lanes: r.lanes,
    functional_class: words(r.functionalClass),
    surface: words(r.surface),
    adt: r.adt,
    truck_pct: r.truckPct,
    pci: r.pci,
    pci_date: r.pciDate,
    last_treatment: r.lastTreatment,
    last_treatment_year: r.lastTreatmentYear,
    district: r.district,
    notes: r.notes,
    geometry: r.geometry ? wkx.Geometry.parseGeoJSON(JSON.parse(r.geometry)).toWkt() : null,
  };
}

export function segmentsCsv(rows: SegmentRow[]) {
  return toCsv(
    HEADERS,
    rows.map((r) => {
      const rec = record(r);
      return SEGMENT_FIELDS.map((f) => rec[f]);
    }),
  );
}

export async function segmentsXlsx(rows: SegmentRow[], agencyName: string) {
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Wearcourse';
  const ws = wb.addWorksheet('Segments');
  ws.columns = SEGMENT_FIELDS.map((f) => ({
    header: EXPORT_HEADERS[f],
    key: f,
    width: Math.max(10, EXPORT_HEADERS[f].length + 2),
  }));
  for (const r of rows) ws.addRow(record(r));
  ws.getRow(1).font = { bold: true };
  ws.views = [{ state: 'frozen', ySplit: 1 }];
  const about = wb.addWorksheet('About');
  about.addRow([
    `${agencyName} — segment inventory exported from Wearcourse on ${new Date().toISOString().slice(0, 10)}`,
  ]);
  about.addRow(['Lengths in miles, widths in feet. Re-import this file to update segments by their segment ID.']);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
