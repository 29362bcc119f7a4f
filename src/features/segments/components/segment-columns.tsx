import { FUNCTIONAL_CLASSES, type Segment, SURFACES } from '@shared/schemas/segments';
import { CLASS_LABELS, SURFACE_LABELS } from '@/lib/format';
import type { EditKind } from './segment-cell-editor';

export type Column = {
  id: string;
  header: string;
  /** A glossary entry for the header's term, shown as a small "?" beside it. */
  term?: string;
  width: number;
  num?: boolean;
  sortable?: boolean;
  /** Kept in view when the table scrolls sideways. */
  sticky?: boolean;
};

// What matters first comes first: which segment, which road, its condition,
// then size, class and traffic; the limits last. The select and segment
// columns stay put when the rest scroll sideways beside the map.
export const COLUMNS: Column[] = [
  { id: 'select', header: '', width: 34, sticky: true },
  { id: 'segmentId', header: 'Segment', width: 104, sortable: true, sticky: true },
  { id: 'roadName', header: 'Road', width: 160, sortable: true },
  { id: 'pci', header: 'PCI', term: 'pci', width: 64, num: true, sortable: true },
  { id: 'lengthMi', header: 'Length (mi)', width: 84, num: true, sortable: true },
  { id: 'lanes', header: 'Lanes', width: 60, num: true, sortable: true },
  { id: 'widthFt', header: 'Width (ft)', width: 80, num: true, sortable: true },
  { id: 'functionalClass', header: 'Class', width: 136, sortable: true },
  { id: 'surface', header: 'Surface', width: 92, sortable: true },
  { id: 'adt', header: 'ADT', term: 'adt', width: 76, num: true, sortable: true },
  { id: 'district', header: 'District', width: 112, sortable: true },
  { id: 'fromTo', header: 'From – to', width: 240 },
];

export const STICKY_LEFT: Record<string, number> = { select: 0, segmentId: 34 };

// Columns an engineer may change in place (double-click a cell).
export const EDITABLE: Partial<Record<keyof Segment, EditKind>> = {
  roadName: { type: 'text' },
  widthFt: { type: 'number' },
  lanes: { type: 'number' },
  functionalClass: { type: 'choice', options: FUNCTIONAL_CLASSES, labels: CLASS_LABELS },
  surface: { type: 'choice', options: SURFACES, labels: SURFACE_LABELS },
  adt: { type: 'number' },
  district: { type: 'text', nullable: true },
};
