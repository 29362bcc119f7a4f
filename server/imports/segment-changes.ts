// What one accepted row does to the inventory: add a segment, update one (and
// which fields, before → after), or leave it as it is. A re-import never blanks a
// field the file does not carry.
import { FIELD_LABELS, MAX_LISTED_CHANGES, type SegmentChange } from '../../shared/schemas/imports';
import type { SegmentRow } from '../segments/segments.repo';
import type { LineGeometry } from './geometry';
import type { SegmentInput } from './normalize';

export type Accepted = { row: number; seg: SegmentInput; geometry: LineGeometry | null };
export type Planned = {
  a: Accepted;
  kind: 'add' | 'update' | 'same';
  segmentRef?: number;
  patch: Record<string, unknown>;
  /** The patch's fields whose stored value differs. */
  changed: string[];
  newSurvey: boolean;
};

const OPTIONAL: [string, keyof SegmentInput][] = [
  ['from_desc', 'fromDesc'],
  ['to_desc', 'toDesc'],
  ['adt', 'adt'],
  ['truck_pct', 'truckPct'],
  ['last_treatment', 'lastTreatment'],
  ['last_treatment_year', 'lastTreatmentYear'],
  ['district', 'district'],
  ['notes', 'notes'],
];

/** The segment's column names (snake_case, as in the table and the import's fields) by property. */
export const FIELD_OF: Record<string, keyof typeof FIELD_LABELS> = {
  roadName: 'road_name',
  fromDesc: 'from_desc',
  toDesc: 'to_desc',
  lengthMi: 'length_mi',
  widthFt: 'width_ft',
  lanes: 'lanes',
  functionalClass: 'functional_class',
  surface: 'surface',
  adt: 'adt',
  truckPct: 'truck_pct',
  lastTreatment: 'last_treatment',
  lastTreatmentYear: 'last_treatment_year',
  district: 'district',
  notes: 'notes',
  geometry: 'geometry',
};

export function planSegment(a: Accepted, old: SegmentRow | undefined, carries: (field: string) => boolean): Planned {
  const s = a.seg;
  const patch: Record<string, unknown> = {
    roadName: s.roadName,
    widthFt: s.widthFt,
    lanes: s.lanes,
    functionalClass: s.functionalClass,
    surface: s.surface,
  };
  if (s.lengthMi !== null) patch.lengthMi = s.lengthMi;
  for (const [field, prop] of OPTIONAL) if (carries(field)) patch[prop] = s[prop];
  if (a.geometry) patch.geometry = JSON.stringify(a.geometry);
  if (!old) return { a, kind: 'add', patch, changed: [], newSurvey: s.pci !== null };
  const changed = Object.keys(patch).filter((k) => (old as Record<string, unknown>)[k] !== patch[k]);
  const newSurvey =
    s.pci !== null &&
    (s.pciDate === null
      ? old.pci !== s.pci
      : old.pciDate === null || s.pciDate > old.pciDate || (s.pciDate === old.pciDate && old.pci !== s.pci));
  return { a, kind: changed.length || newSurvey ? 'update' : 'same', segmentRef: old.id, patch, changed, newSurvey };
}

const shown = (k: string, v: unknown) => {
  if (v === null || v === undefined || v === '') return '—';
  if (k === 'geometry') return '(line)';
  if (k === 'functionalClass' || k === 'surface') return String(v).replace(/_/g, ' ');
  const s = String(v);
  return s.length > 80 ? `${s.slice(0, 80)}…` : s;
};

/** The first "would update" rows, field by field, in the user's words. */
export function describeChanges(planned: Planned[], existing: Map<string, SegmentRow>): SegmentChange[] {
  return planned
    .filter((p) => p.kind === 'update')
    .slice(0, MAX_LISTED_CHANGES)
    .map((p) => {
      const old = existing.get(p.a.seg.segmentId)! as Record<string, unknown>;
      const fields = p.changed.map((k) => ({
        field: FIELD_OF[k],
        label: FIELD_LABELS[FIELD_OF[k]],
        before: k === 'geometry' ? '(line)' : shown(k, old[k]),
        after: k === 'geometry' ? '(a different line)' : shown(k, p.patch[k]),
      }));
      if (p.newSurvey)
        fields.push({
          field: 'pci',
          label: FIELD_LABELS.pci,
          before: `${shown('pci', old.pci)}${old.pciDate ? ` (${old.pciDate})` : ''}`,
          after: `${p.a.seg.pci}${p.a.seg.pciDate ? ` (${p.a.seg.pciDate})` : ''}`,
        });
      return { row: p.a.row, segmentId: p.a.seg.segmentId, fields };
    });
}
