import type { ReactNode } from 'react';
import { astmRating, conditionBand } from '@shared/condition';
import { Term } from '@/components/ui/term';
import { CLASS_LABELS, fmt1, fmt2, fmtInt, SURFACE_LABELS } from '@/lib/format';
import type { SegmentDetail } from '../api/get-segment';

/** The segment's attributes as label and value, in the order the segment page lists them. */
export function attributes(s: SegmentDetail): [string, ReactNode][] {
  const band = conditionBand(s.pci);
  return [
    ['From – to', `${s.fromDesc ?? '—'} – ${s.toDesc ?? '—'}`],
    ['Length', `${fmt2(s.lengthMi)} mi`],
    ['Width', `${fmt1(s.widthFt)} ft`],
    ['Lanes', String(s.lanes)],
    [
      'Lane-miles',
      <>
        {fmt2(s.laneMiles)} <Term id="lane-mile">lane-mi</Term>
      </>,
    ],
    [
      'Area',
      <>
        {fmtInt(s.areaSy)} <Term id="sy">SY</Term>
      </>,
    ],
    ['Functional class', CLASS_LABELS[s.functionalClass]],
    ['Surface', SURFACE_LABELS[s.surface]],
    [
      'Traffic',
      s.adt === null ? (
        '—'
      ) : (
        <>
          {fmtInt(s.adt)} vehicles/day (<Term id="adt">ADT</Term>)
        </>
      ),
    ],
    ['Trucks', s.truckPct === null ? '—' : `${fmt1(s.truckPct)} % of traffic`],
    ['District', s.district ?? '—'],
    [
      'Latest PCI',
      s.pci === null
        ? '—'
        : `${fmtInt(s.pci)} (${band?.label}; ASTM D6433 “${astmRating(s.pci)}”) on ${s.pciDate ?? '—'}`,
    ],
    ['Last treatment', s.lastTreatment ? `${s.lastTreatment}, ${s.lastTreatmentYear ?? 'year not recorded'}` : '—'],
  ];
}
