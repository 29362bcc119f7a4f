import { useState } from 'react';
import { FUNCTIONAL_CLASSES, type FunctionalClass } from '@shared/schemas/segments';
import { Select, TextInput } from '@/components/ui/field';
import { Card } from '@/components/ui/page';
import { CLASS_LABELS, fmt1, fmtInt } from '@/lib/format';
import type { ComparePage } from '../hooks/use-compare-page';
import type { TypedSection } from '../lib/roads';

const TYPED_FIELDS: { key: Exclude<keyof TypedSection, 'functionalClass'>; label: string }[] = [
  { key: 'lengthMi', label: 'Length (mi)' },
  { key: 'widthFt', label: 'Width (ft)' },
  { key: 'lanes', label: 'Lanes' },
  { key: 'adt', label: 'ADT (vehicles/day)' },
  { key: 'truckPct', label: 'Trucks (%)' },
  { key: 'pci', label: 'PCI' },
];

/** Roads shown by id and name before the list folds. */
const FOLDED = 6;

function PickedRoads({ page }: { page: ComparePage }) {
  const [all, setAll] = useState(false);
  const ids = page.roads.kind === 'segments' ? page.roads.ids : [];
  const items = page.selection.data?.items ?? [];
  const totals = page.selection.data?.totals;
  const shown = all ? items : items.slice(0, FOLDED);
  return (
    <div className="text-sm" data-testid="compare-selection">
      <p>
        <strong>{fmtInt(ids.length)}</strong> segment{ids.length === 1 ? '' : 's'} from Roads
        {totals && (
          <>
            : {fmt1(totals.miles)} mi, {fmt1(totals.laneMiles)} lane-mi, {fmtInt(totals.areaSy)} SY
            {totals.weightedPci !== null && <>, PCI {fmtInt(totals.weightedPci)} (length-weighted)</>}
          </>
        )}
        .
      </p>
      <ul className="mt-2 divide-y divide-asphalt-line/60 text-xs" data-testid="compare-roads">
        {shown.map((s) => (
          <li key={s.id} className="flex items-baseline gap-2 py-1" data-segment-id={s.segmentId}>
            <span className="num w-20 shrink-0 font-semibold">{s.segmentId}</span>
            <span className="min-w-0 flex-1">
              {s.roadName}
              {s.fromDesc && s.toDesc && (
                <span className="text-asphalt-muted">
                  , {s.fromDesc} to {s.toDesc}
                </span>
              )}
            </span>
            <span className="num shrink-0 text-asphalt-muted">
              {fmt1(s.lengthMi)} mi · PCI {fmtInt(s.pci)}
            </span>
          </li>
        ))}
      </ul>
      <div className="mt-1 flex flex-wrap gap-3 text-xs">
        {items.length > FOLDED && (
          <button type="button" className="text-accent hover:underline" onClick={() => setAll(!all)}>
            {all ? 'Show fewer' : `Show all ${fmtInt(items.length)}`}
          </button>
        )}
        {ids.length > items.length && page.selection.data && (
          <span className="text-asphalt-muted">first {fmtInt(items.length)} listed; all are compared</span>
        )}
        <button type="button" className="text-accent hover:underline" onClick={page.switchToTypedSection}>
          Type in a section instead
        </button>
      </div>
    </div>
  );
}

function TypedSectionForm({ page, section }: { page: ComparePage; section: TypedSection }) {
  const set = (s: TypedSection) => page.setRoads({ kind: 'typed', section: s });
  return (
    <div className="grid grid-cols-3 gap-2 text-sm" data-testid="typed-section">
      {TYPED_FIELDS.map((f) => (
        <label key={f.key}>
          <span className="text-xs text-asphalt-muted">{f.label}</span>
          <TextInput
            aria-label={f.label}
            type="number"
            value={section[f.key]}
            onChange={(e) => set({ ...section, [f.key]: Number(e.target.value) })}
          />
        </label>
      ))}
      <label className="col-span-3">
        <span className="text-xs text-asphalt-muted">Functional class</span>
        <Select
          aria-label="Class of typed-in section"
          value={section.functionalClass}
          onChange={(e) => set({ ...section, functionalClass: e.target.value as FunctionalClass })}
        >
          {FUNCTIONAL_CLASSES.map((c) => (
            <option key={c} value={c}>
              {CLASS_LABELS[c]}
            </option>
          ))}
        </Select>
      </label>
      <p className="col-span-3 text-xs text-asphalt-muted">
        Or pick segments under Roads and choose “Compare alternatives for selection”.
      </p>
    </div>
  );
}

export function RoadsCard({ page }: { page: ComparePage }) {
  return (
    <Card title="Roads">
      {page.roads.kind === 'segments' ? (
        <PickedRoads page={page} />
      ) : (
        <TypedSectionForm page={page} section={page.roads.section} />
      )}
    </Card>
  );
}
