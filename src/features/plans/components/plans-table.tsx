import { Link } from 'react-router-dom';
import { budgetsOf } from '@shared/schemas/plans';
import { Card } from '@/components/ui/page';
import { PLAN_METHOD_NOTES } from '@/features/help/components/method-note';
import type { PlanSummary } from '@/features/plans/api/keys';
import { fmtMoney } from '@/lib/format';

const th = 'whitespace-nowrap px-2 py-1 font-semibold';

/** The scenarios, each header in its own cell with room around it; tick two to compare them. */
export function PlansTable({
  items,
  picked,
  onPick,
}: {
  items: PlanSummary[];
  picked: string[];
  onPick: (ids: string[]) => void;
}) {
  return (
    <Card title="Scenarios">
      <div className="overflow-x-auto">
        <table className="num w-full text-sm" data-testid="plan-list">
          <thead className="text-left text-xs text-asphalt-muted">
            <tr>
              <th className={th}>Compare</th>
              <th className={th}>Scenario</th>
              <th className={th}>Status</th>
              <th className={`${th} text-right`}>Budget, first year</th>
              <th className={th}>Years</th>
              <th className={th}>Method</th>
              <th className={th}>Last run</th>
            </tr>
          </thead>
          <tbody>
            {items.map((p) => (
              <tr key={p.id} className="border-t border-asphalt-line/60">
                <td className="px-2 py-1.5">
                  <input
                    type="checkbox"
                    aria-label={`Compare ${p.name}`}
                    checked={picked.includes(p.id)}
                    disabled={!picked.includes(p.id) && picked.length >= 4}
                    onChange={(e) => onPick(e.target.checked ? [...picked, p.id] : picked.filter((x) => x !== p.id))}
                  />
                </td>
                <td className="px-2">
                  <Link to={p.id} className="font-semibold text-accent hover:underline">
                    {p.name}
                  </Link>
                </td>
                <td className="px-2">
                  {p.status === 'published' ? (
                    <span className="whitespace-nowrap rounded bg-accent-light px-1.5 py-0.5 text-xs font-bold text-accent">
                      published{p.published ? ` v${p.published.version}` : ''}
                    </span>
                  ) : (
                    <span className="text-xs text-asphalt-muted">draft</span>
                  )}
                  {p.published && p.version !== undefined && p.version !== p.published.version && (
                    <span className="ml-1 text-xs text-asphalt-muted">draft v{p.version} open</span>
                  )}
                </td>
                <td className="px-2 text-right">{fmtMoney(budgetsOf(p.settings)[0] ?? 0)}</td>
                <td className="whitespace-nowrap px-2">
                  {p.settings.startYear}–{p.settings.startYear + p.settings.horizonYears - 1}
                </td>
                <td className="px-2">{PLAN_METHOD_NOTES[p.settings.method]?.name ?? p.settings.method}</td>
                <td className="whitespace-nowrap px-2 text-xs text-asphalt-muted">
                  {p.lastRun ? `${p.lastRun.status}, ${p.lastRun.startedAt.slice(0, 16).replace('T', ' ')}` : 'not run'}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-xs text-asphalt-muted">
        Tick two scenarios (up to four) to compare them side by side: condition, money, tons of each mix, failed
        lane-miles and the saving of one against the other.
      </p>
    </Card>
  );
}
