import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card, EmptyState, PageHeader } from '@/components/ui/page';
import { Term } from '@/components/ui/term';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import { useSegment } from '@/features/segments/api/get-segment';
import { useTreatmentRecords } from '@/features/segments/api/segment-history';
import { attributes } from '@/features/segments/components/segment-attributes';
import { PciHistoryChart } from '@/features/segments/components/pci-history-chart';
import { SegmentEditForm } from '@/features/segments/components/segment-edit-form';
import { SurveyForm } from '@/features/segments/components/survey-form';
import { TreatmentForm } from '@/features/segments/components/treatment-form';
import { TreatmentHistory } from '@/features/segments/components/treatment-history';
import { fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

type Open = 'survey' | 'treatment' | 'edit' | null;

export function SegmentPage() {
  const { agencyId, membership } = useAgency();
  const id = Number(useParams().segmentRef);
  const seg = useSegment(agencyId, id);
  const records = useTreatmentRecords(agencyId, id);
  const nearby = useSegmentsGeoJson(agencyId, {});
  const [open, setOpen] = useState<Open>(null);
  const canEdit = membership?.role === 'admin' || membership?.role === 'engineer';
  if (seg.isLoading) return <div className="text-sm text-asphalt-muted">Loading…</div>;
  if (seg.error || !seg.data) return <NotFoundPage inline />;
  const s = seg.data;
  const first = s.surveys[0];
  const latest = s.surveys.at(-1);
  const caption =
    first && latest && first !== latest
      ? `PCI went from ${fmtInt(first.pci)} in ${first.surveyDate.slice(0, 4)} to ${fmtInt(latest.pci)} in ${latest.surveyDate.slice(0, 4)} (${s.surveys.length} surveys).`
      : latest
        ? `One survey: PCI ${fmtInt(latest.pci)} on ${latest.surveyDate}.`
        : 'No condition surveys recorded.';
  const jobs = records.data?.items ?? [];
  const marks = jobs.map((r) => ({ date: r.treatedOn, label: `${r.name} ${r.treatedOn.slice(0, 4)}` }));
  if (
    s.lastTreatment &&
    s.lastTreatmentYear &&
    !jobs.some((r) => Number(r.treatedOn.slice(0, 4)) === s.lastTreatmentYear)
  )
    marks.push({ date: String(s.lastTreatmentYear), label: `${s.lastTreatment} ${s.lastTreatmentYear}` });
  const toggle = (what: Exclude<Open, null>) => setOpen(open === what ? null : what);

  return (
    <div>
      <div className="mb-2 text-sm">
        <Link to=".." relative="path" className="text-accent hover:underline">
          ← Roads
        </Link>
      </div>
      <PageHeader title={`${s.roadName} · ${s.segmentId}`} caption={caption} />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="min-w-0 space-y-4">
          <Card title="Condition history">
            {s.surveys.length ? (
              <PciHistoryChart surveys={s.surveys} treatments={marks} />
            ) : (
              <EmptyState>
                No surveys yet — {canEdit ? 'add one under Surveys below, or ' : ''}import a condition survey file under
                Imports.
              </EmptyState>
            )}
          </Card>
          <Card
            title="Treatment history"
            testId="treatments-card"
            actions={
              canEdit && (
                <Button variant={open === 'treatment' ? 'ghost' : 'secondary'} onClick={() => toggle('treatment')}>
                  Record a treatment
                </Button>
              )
            }
          >
            {open === 'treatment' && (
              <div className="mb-3">
                <TreatmentForm
                  agencyId={agencyId}
                  segmentRef={s.id}
                  segmentId={s.segmentId}
                  onDone={() => setOpen(null)}
                />
              </div>
            )}
            <TreatmentHistory records={jobs} inventory={{ name: s.lastTreatment, year: s.lastTreatmentYear }} />
          </Card>
          <Card
            title="Surveys"
            testId="surveys-card"
            actions={
              canEdit && (
                <Button variant={open === 'survey' ? 'ghost' : 'secondary'} onClick={() => toggle('survey')}>
                  Add a survey
                </Button>
              )
            }
          >
            {open === 'survey' && (
              <div className="mb-3">
                <SurveyForm
                  agencyId={agencyId}
                  segmentRef={s.id}
                  segmentId={s.segmentId}
                  latestDate={s.pciDate}
                  onDone={() => setOpen(null)}
                />
              </div>
            )}
            {s.surveys.length > 0 ? (
              <table className="num w-full text-sm" data-testid="survey-table">
                <thead className="text-left text-xs font-bold text-asphalt-muted">
                  <tr>
                    <th className="py-1">Date</th>
                    <th className="text-right">
                      <Term id="pci">PCI</Term>
                    </th>
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
            ) : (
              <p className="text-sm text-asphalt-muted">No surveys recorded.</p>
            )}
          </Card>
        </div>
        <div className="min-w-0 space-y-4">
          <Card
            title="Attributes"
            testId="attributes-card"
            actions={
              canEdit &&
              open !== 'edit' && (
                <Button variant="secondary" onClick={() => setOpen('edit')}>
                  Edit attributes
                </Button>
              )
            }
          >
            {open === 'edit' ? (
              <SegmentEditForm agencyId={agencyId} segment={s} onDone={() => setOpen(null)} />
            ) : (
              <>
                <dl className="grid grid-cols-[9rem_minmax(0,1fr)] gap-y-1 text-sm" data-testid="attributes">
                  {attributes(s).map(([k, v]) => (
                    <div key={k} className="contents">
                      <dt className="text-asphalt-muted">{k}</dt>
                      <dd className="num">{v}</dd>
                    </div>
                  ))}
                </dl>
                {s.notes && (
                  <p className="mt-3 whitespace-pre-wrap border-t border-asphalt-line pt-2 text-sm">{s.notes}</p>
                )}
              </>
            )}
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
