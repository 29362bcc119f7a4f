import { Link } from 'react-router-dom';
import { ConditionBar } from '@/components/condition-bar';
import { Card, EmptyState, PageHeader, Stat } from '@/components/ui/page';
import { RecentActivity } from '@/features/activity/components/recent-activity';
import { useSegmentsGeoJson } from '@/features/map/api/get-segments-geojson';
import { LazyNetworkMap } from '@/features/map/components/lazy-network-map';
import { useNetwork } from '@/features/network/api/get-network';
import { LatestPlan } from '@/features/network/components/latest-plan';
import { fmt1, fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';

export function NetworkPage() {
  const { agencyId, membership } = useAgency();
  const net = useNetwork(agencyId);
  const geo = useSegmentsGeoJson(agencyId, {});
  if (net.isLoading) return <div className="text-sm text-asphalt-muted">Loading the network…</div>;
  if (net.error) return <div role="alert">{net.error.message}</div>;
  const n = net.data!;
  const caption =
    n.weightedPci === null
      ? 'No condition surveys yet.'
      : `${fmtInt(n.laneMiles)} lane-miles with a length-weighted PCI of ${fmt1(n.weightedPci)}${n.latestSurveyYear ? ` (latest surveys ${n.latestSurveyYear})` : ''}.`;
  return (
    <div>
      <PageHeader title={`${n.agencyName} network`} caption={caption} />
      {n.segments === 0 ? (
        <EmptyState>
          No segments yet — import a spreadsheet or GIS file under{' '}
          <Link to="../imports" className="text-accent underline">
            Imports
          </Link>
          .
        </EmptyState>
      ) : (
        <div className="space-y-5">
          <div className="grid grid-cols-2 gap-4 md:grid-cols-4">
            <Card>
              <Stat label="Segments" value={fmtInt(n.segments)} />
            </Card>
            <Card>
              <Stat label="Centreline" value={fmt1(n.centrelineMiles)} unit="mi" />
            </Card>
            <Card>
              <Stat label="Lanes" value={fmt1(n.laneMiles)} unit="lane-mi" />
            </Card>
            <Card>
              <Stat label="Network PCI (length-weighted)" value={fmt1(n.weightedPci)} />
            </Card>
          </div>
          <Card title="Lane-miles by condition band">
            <ConditionBar byBand={n.laneMilesByBand} />
            <p className="mt-3 text-xs text-asphalt-muted">
              Bands group the ASTM D6433 PCI rating scale into five for council use. Unpaved roads carry no PCI.
            </p>
          </Card>
          <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <LazyNetworkMap agencyId={agencyId} features={geo.data} height={340} />
            <div className="space-y-4">
              <Card title="Latest published plan">
                <LatestPlan agencyId={agencyId} />
              </Card>
              {membership?.role === 'admin' && (
                <Card title="Recent activity">
                  <RecentActivity agencyId={agencyId} />
                </Card>
              )}
            </div>
          </div>
        </div>
      )}
    </div>
  );
}
