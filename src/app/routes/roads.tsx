import { useState } from 'react';
import { CONDITION_BANDS, conditionBand, NO_DATA_COLOR } from '@shared/condition';
import { FUNCTIONAL_CLASSES } from '@shared/schemas/segments';
import { Button } from '@/components/ui/button';
import { Select, TextInput } from '@/components/ui/field';
import { EmptyState, PageHeader } from '@/components/ui/page';
import { useSegments } from '@/features/segments/api/get-segments';
import { CLASS_LABELS, fmt1, fmt2, fmtInt, SURFACE_LABELS } from '@/lib/format';
import { useAgency } from '../use-agency';

const PAGE = 100;

export function RoadsPage() {
  const { agencyId } = useAgency();
  const [q, setQ] = useState('');
  const [cls, setCls] = useState('');
  const [band, setBand] = useState('');
  const [offset, setOffset] = useState(0);
  const list = useSegments(agencyId, { q, class: cls, band, limit: PAGE, offset });
  const data = list.data;
  return (
    <div>
      <PageHeader
        title="Roads"
        caption={data ? `${fmtInt(data.totals.count)} segments · ${fmt1(data.totals.miles)} mi · ${fmt1(data.totals.laneMiles)} lane-mi · ${fmtInt(data.totals.areaSy)} SY · PCI ${fmt1(data.totals.weightedPci)} (length-weighted)` : undefined}
      />
      <div className="mb-3 flex flex-wrap gap-2">
        <TextInput aria-label="Road name or segment id" placeholder="Road name or segment id" className="max-w-xs" value={q} onChange={(e) => { setQ(e.target.value); setOffset(0); }} />
        <Select aria-label="Functional class" className="max-w-[12rem]" value={cls} onChange={(e) => { setCls(e.target.value); setOffset(0); }}>
          <option value="">All classes</option>
          {FUNCTIONAL_CLASSES.map((c) => <option key={c} value={c}>{CLASS_LABELS[c]}</option>)}
        </Select>
        <Select aria-label="Condition band" className="max-w-[12rem]" value={band} onChange={(e) => { setBand(e.target.value); setOffset(0); }}>
          <option value="">All conditions</option>
          {CONDITION_BANDS.map((b) => <option key={b.id} value={b.id}>{b.label} ({b.min}–{b.max})</option>)}
          <option value="none">No PCI</option>
        </Select>
      </div>
      {data && data.total === 0 ? (
        <EmptyState>No segments match. Clear the filters, or import a spreadsheet or GIS file.</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded border border-asphalt-line bg-white">
          <table className="num w-full text-sm" data-testid="segment-table">
            <thead className="bg-paper text-left text-xs uppercase tracking-wide text-asphalt-muted">
              <tr>
                <th className="px-3 py-2">Segment</th><th className="px-3 py-2">Road</th><th className="px-3 py-2">From – to</th>
                <th className="px-3 py-2 text-right">Length (mi)</th><th className="px-3 py-2 text-right">Width (ft)</th><th className="px-3 py-2 text-right">Lanes</th>
                <th className="px-3 py-2">Class</th><th className="px-3 py-2">Surface</th><th className="px-3 py-2 text-right">PCI</th>
              </tr>
            </thead>
            <tbody>
              {data?.items.map((s) => {
                const b = conditionBand(s.pci);
                return (
                  <tr key={s.id} className="border-t border-asphalt-line/60">
                    <td className="px-3 py-1.5 font-semibold">{s.segmentId}</td>
                    <td className="px-3 py-1.5">{s.roadName}</td>
                    <td className="px-3 py-1.5 text-asphalt-muted">{s.fromDesc} – {s.toDesc}</td>
                    <td className="px-3 py-1.5 text-right">{fmt2(s.lengthMi)}</td>
                    <td className="px-3 py-1.5 text-right">{fmtInt(s.widthFt)}</td>
                    <td className="px-3 py-1.5 text-right">{s.lanes}</td>
                    <td className="px-3 py-1.5">{CLASS_LABELS[s.functionalClass]}</td>
                    <td className="px-3 py-1.5">{SURFACE_LABELS[s.surface]}</td>
                    <td className="px-3 py-1.5 text-right">
                      <span className="inline-flex items-center gap-1.5">
                        <span className="inline-block h-2.5 w-2.5 rounded-full" style={{ background: b?.color ?? NO_DATA_COLOR }} />
                        {s.pci === null ? '—' : fmtInt(s.pci)}
                      </span>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
      {data && data.total > PAGE && (
        <div className="mt-3 flex items-center gap-3 text-sm">
          <Button variant="secondary" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - PAGE))}>Previous</Button>
          <span className="num text-asphalt-muted">{offset + 1}–{Math.min(offset + PAGE, data.total)} of {fmtInt(data.total)}</span>
          <Button variant="secondary" disabled={offset + PAGE >= data.total} onClick={() => setOffset(offset + PAGE)}>Next</Button>
        </div>
      )}
    </div>
  );
}
