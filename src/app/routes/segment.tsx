import { Link, useParams } from 'react-router-dom';
import { astmRating, conditionBand } from '@shared/condition';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { useSegment } from '@/features/segments/api/get-segment';
import { PciHistoryChart } from '@/features/segments/components/pci-history-chart';
import { CLASS_LABELS, fmt1, fmt2, fmtInt, SURFACE_LABELS } from '@/lib/format';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

export function SegmentPage() {
  const { agencyId } = useAgency();
  const id = Number(useParams().segmentRef);
  const seg = useSegment(agencyId, id);
  const nearby = useSegmentsGeoJson(agencyId, {});
  if (seg.isLoading) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  if (seg.error || !seg.data) return <NotFoundPage inline />;
  const s = seg.data;
  const band = conditionBand(s.pci);
  const first = s.surveys[0];
  const latest = s.surveys.at(-1);
  const caption =
    first && latest && first !== latest
      ? `PCI went from ${fmtInt(first.pci)} in ${first.surveyDate.slice(0, 4)} to ${fmtInt(latest.pci)} in ${latest.surveyDate.slice(0, 4)} (${s.surveys.length} surveys).`
      : latest
        ? `One survey: PCI ${fmtInt(latest.pci)} on ${latest.surveyDate}.`
        : 'No condition surveys recorded.';
  const attrs: [string, string][] = [
    ['From – to', `${s.fromDesc ?? '—'} – ${s.toDesc ?? '—'}`],
    ['Length', `${fmt2(s.lengthMi)} mi`],
    ['Width', `${fmt1(s.widthFt)} ft`],
    ['Lanes', String(s.lanes)],
    ['Lane-miles', `${fmt2(s.laneMiles)} lane-mi`],
    ['Area', `${fmtInt(s.areaSy)} SY`],
    ['Functional class', CLASS_LABELS[s.functionalClass]],
    ['Surface', SURFACE_LABELS[s.surface]],
    ['ADT', s.adt === null ? '—' : `${fmtInt(s.adt)} vehicles/day`],
    ['Trucks', s.truckPct === null ? '—' : `${fmt1(s.truckPct)} %`],
    ['District', s.district ?? '—'],
    [
      'Latest PCI',
      s.pci === null
        ? '—'
        : `${fmtInt(s.pci)} (${band?.label}; ASTM D6433 “${astmRating(s.pci)}”) on ${s.pciDate ?? '—'}`,
    ],
  ];
  return (
    <div>
      <div className="mb-2 text-sm">
        <Link to=".." relative="path" className="text-accent hover:underline">
          ← Roads
        </Link>
      </div>
      <PageHeader title={`${s.roadName} · ${s.segmentId}`} caption={caption} />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-4">
          <Card title="Condition history">
            {s.surveys.length ? (
              <PciHistoryChart surveys={s.surveys} treatmentYear={s.lastTreatmentYear} treatment={s.lastTreatment} />
            ) : (
              <EmptyState>No surveys yet — import a condition survey file under Imports.</EmptyState>
            )}
          </Card>
          <Card title="Treatment history">
            {s.lastTreatment ? (
              <p className="text-sm">
                Last treatment: <strong>{s.lastTreatment}</strong> in{' '}
                <span className="num">{s.lastTreatmentYear ?? 'an unrecorded year'}</span>
                {s.lastTreatmentYear && (
                  <span className="text-asphalt-muted">
                    {' '}
                    ({new Date().getFullYear() - s.lastTreatmentYear} years ago)
                  </span>
                )}
                .
              </p>
            ) : (
              <p className="text-sm text-asphalt-muted">No treatment recorded.</p>
            )}
          </Card>
          {s.surveys.length > 0 && (
            <Card title="Surveys">
              <table className="num w-full text-sm">
                <thead className="text-left text-xs uppercase text-asphalt-muted">
                  <tr>
                    <th className="py-1">Date</th>
                    <th className="text-right">PCI</th>
                    <th className="pl-4">Source</th>
                  </tr>
                </thead>
                <tbody>
                  {[...s.surveys].reverse().map((v) => (
                    <tr key={v.surveyDate} className="border-t border-asphalt-line/60">
                      <td className="py-1">{v.surveyDate}</td>
                      <td className="text-right">{fmtInt(v.pci)}</td>
                      <td className="pl-4 text-asphalt-muted">{v.source ?? '—'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </Card>
          )}
        </div>
        <div className="space-y-4">
          <Card title="Attributes">
            <dl className="grid grid-cols-[9rem_1fr] gap-y-1 text-sm">
              {attrs.map(([k, v]) => (
                <div key={k} className="contents">
                  <dt className="text-asphalt-muted">{k}</dt>
                  <dd className="num">{v}</dd>
                </div>
              ))}
            </dl>
            {s.notes && <p className="mt-3 whitespace-pre-wrap border-t border-asphalt-line pt-2 text-sm">{s.notes}</p>}
          </Card>
          {s.geometry ? (
            <LazyNetworkMap agencyId={agencyId} features={nearby.data} highlight={s.geometry} height={300} compact />
          ) : (
            <EmptyState>This segment has no geometry.</EmptyState>
          )}
        </div>
      </div>
    </div>
  );
}
