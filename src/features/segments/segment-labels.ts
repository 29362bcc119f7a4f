// What a user reads for each segment field: in forms, errors and the table.
export const SEGMENT_FIELD_LABELS: Record<string, string> = {
  segmentId: 'Segment id',
  roadName: 'Road name',
  fromDesc: 'From',
  toDesc: 'To',
  lengthMi: 'Length (mi)',
  widthFt: 'Width (ft)',
  lanes: 'Lanes',
  functionalClass: 'Functional class',
  surface: 'Surface',
  adt: 'ADT (vehicles/day)',
  truckPct: 'Trucks (% of ADT)',
  district: 'District',
  notes: 'Notes',
  pci: 'PCI',
};
