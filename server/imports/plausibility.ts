// Values that pass the hard limits but are unlikely on a real road: shown as
// warnings in the check step, so a wrong unit or a shifted column is caught before
// it is written. The thresholds are common practice, not a standard: US travel
// lanes are 9 to 12 ft (AASHTO's Green Book range, from memory), with shoulders or
// parking a paved width per lane rarely passes 24 ft; a segment runs between two
// intersections, so a local street segment of many miles is unusual.
import type { FunctionalClass } from '../../shared/schemas/segments';
import type { ImportIssue } from '../../shared/schemas/imports';
import type { SegmentInput } from './normalize';

const MIN_FT_PER_LANE = 8;
const MIN_FT_PER_LANE_HIGH_SPEED = 10;
const MAX_FT_PER_LANE = 24;
const MAX_LOCAL_SEGMENT_MI = 5;
const MAX_SEGMENT_MI = 25;
const HIGH_SPEED: FunctionalClass[] = ['interstate', 'freeway', 'principal_arterial'];
const LOCAL: FunctionalClass[] = ['local', 'minor_collector'];

const words = (c: string) => c.replace(/_/g, ' ');

export function plausibilityWarnings(row: number, seg: SegmentInput, mapping: Record<string, string>): ImportIssue[] {
  const out: ImportIssue[] = [];
  const col = (f: string) => mapping[f] ?? f;
  if (seg.widthFt > 0 && seg.lanes > 0) {
    const perLane = seg.widthFt / seg.lanes;
    const min = HIGH_SPEED.includes(seg.functionalClass) ? MIN_FT_PER_LANE_HIGH_SPEED : MIN_FT_PER_LANE;
    if (perLane < min)
      out.push({
        row,
        column: col('width_ft'),
        value: `${seg.widthFt} ft`,
        message: `gives ${perLane.toFixed(1)} ft per lane for ${seg.lanes} lane${seg.lanes === 1 ? '' : 's'} on a ${words(seg.functionalClass)} road, narrower than a travel lane; check the width unit and the lanes`,
      });
    else if (perLane > MAX_FT_PER_LANE)
      out.push({
        row,
        column: col('width_ft'),
        value: `${seg.widthFt} ft`,
        message: `gives ${perLane.toFixed(1)} ft per lane for ${seg.lanes} lane${seg.lanes === 1 ? '' : 's'}, wider than a lane with its shoulder or parking; check the width unit and the lanes`,
      });
  }
  if (seg.lengthMi !== null) {
    const max = LOCAL.includes(seg.functionalClass) ? MAX_LOCAL_SEGMENT_MI : MAX_SEGMENT_MI;
    if (seg.lengthMi > max)
      out.push({
        row,
        column: col('length_mi'),
        value: `${seg.lengthMi} mi`,
        message: `is a long segment for a ${words(seg.functionalClass)} road (over ${max} mi); segments usually run between intersections — check the length unit`,
      });
  }
  return out;
}
