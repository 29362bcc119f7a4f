// The roads a comparison runs on: segments picked under Roads, or a section
// typed in. Both turn into the request's group, and a saved comparison's group
// turns back into them, so reopening it shows (and re-runs on) the same roads.
import type { Group } from '@shared/schemas/comparisons';
import type { FunctionalClass } from '@shared/schemas/segments';
import { areaSy, laneMiles } from '@shared/engine/quantities';

export type TypedSection = {
  lengthMi: number;
  widthFt: number;
  lanes: number;
  adt: number;
  truckPct: number;
  pci: number;
  functionalClass: FunctionalClass;
};

export type Roads = { kind: 'segments'; ids: number[] } | { kind: 'typed'; section: TypedSection };

export const DEFAULT_SECTION: TypedSection = {
  lengthMi: 1,
  widthFt: 24,
  lanes: 2,
  adt: 1500,
  truckPct: 8,
  pci: 55,
  functionalClass: 'major_collector',
};

export const TYPED_SEGMENT_ID = 'typed-in';

export function typedGroup(t: TypedSection): Group {
  return {
    label: `Typed-in section, ${t.lengthMi} mi × ${t.widthFt} ft`,
    segmentIds: [],
    areaSy: areaSy(t.lengthMi, t.widthFt),
    laneMiles: laneMiles(t.lengthMi, t.lanes),
    centrelineMiles: t.lengthMi,
    segments: [
      {
        segmentId: TYPED_SEGMENT_ID,
        adt: t.adt,
        truckPct: t.truckPct,
        functionalClass: t.functionalClass,
        pci: t.pci,
        lengthMi: t.lengthMi,
      },
    ],
  };
}

/**
 * The group for picked segments. The server recomputes the quantities and the
 * per-segment traffic from the agency's own rows; what is sent here only has
 * to be valid, so the totals of the list stand in.
 */
export function segmentGroup(ids: number[], totals: { miles: number; laneMiles: number; areaSy: number }): Group {
  return {
    label: `${ids.length} selected segment${ids.length === 1 ? '' : 's'}`,
    segmentIds: ids,
    areaSy: Math.max(totals.areaSy, 1e-6),
    laneMiles: Math.max(totals.laneMiles, 1e-6),
    centrelineMiles: Math.max(totals.miles, 1e-6),
    segments: [],
  };
}

const round = (v: number, d = 2) => Number(v.toFixed(d));

/** The roads of a saved comparison: its segment ids, or its typed-in section rebuilt from the quantities. */
export function roadsOfGroup(g: Group): Roads {
  if (g.segmentIds.length) return { kind: 'segments', ids: g.segmentIds };
  const s = g.segments[0];
  const lengthMi = g.centrelineMiles;
  return {
    kind: 'typed',
    section: {
      lengthMi: round(lengthMi, 4),
      widthFt: round((g.areaSy * 9) / (lengthMi * 5280)),
      lanes: Math.max(1, Math.round(g.laneMiles / lengthMi)),
      adt: s?.adt ?? DEFAULT_SECTION.adt,
      truckPct: s?.truckPct ?? DEFAULT_SECTION.truckPct,
      pci: s?.pci ?? DEFAULT_SECTION.pci,
      functionalClass: s?.functionalClass ?? DEFAULT_SECTION.functionalClass,
    },
  };
}
