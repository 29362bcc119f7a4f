import { Link } from 'react-router-dom';
import { ConditionBar } from '@/components/condition-bar';
import { Card, EmptyState, PageHeader, Stat } from '@/components/ui/page';
import { useNetwork } from '@/features/network/api/get-network';
import { fmt1, fmtInt } from '@/lib/format';
import { useAgency } from '../use-agency';

export function NetworkPage() {
  const { agencyId } = useAgency();
  const net = useNetwork(agencyId);
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
          No segments yet — import a spreadsheet or GIS file under <Link to="../imports" className="text-accent underline">Imports</Link>.
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
        </div>
      )}
    </div>
  );
}
