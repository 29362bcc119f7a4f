// The brief's plain-words paragraph, shared by the print page and the PDF.
import type { PlanResult } from './run-plan';

const money = (v: number) =>
  Math.abs(v) >= 1e6 ? `$${(v / 1e6).toFixed(2)}M` : `$${Math.round(v).toLocaleString('en-US')}`;
const int = (v: number) => Math.round(v).toLocaleString('en-US');

export function briefSummary(r: PlanResult, agencyName: string) {
  const first = r.years[0];
  const last = r.years[r.years.length - 1];
  const avg = r.summary.totalBudget / r.years.length;
  return (
    `With ${money(avg)} a year for ${r.years.length} year${r.years.length === 1 ? '' : 's'} (${first.calendarYear}–${last.calendarYear}), ` +
    `${agencyName}'s network PCI goes from ${r.summary.startPci.toFixed(0)} to ${r.summary.finalPci.toFixed(0)} by ${last.calendarYear}; ` +
    `with no work it would fall to ${r.summary.finalPciDoNothing.toFixed(0)}. ` +
    `The plan treats ${int(r.summary.segmentsTreated)} segments and spends ${money(r.summary.totalSpent)} of ${money(r.summary.totalBudget)}. ` +
    `The backlog of needed but unfunded work goes from ${money(r.summary.backlogStart)} to ${money(r.summary.backlogEnd)}.`
  );
}

export const BRIEF_CAUTIONS =
  'This is a planning estimate, not a pavement design. Before work is let: confirm the structure of each road (a thin overlay on a weak base can fail early), follow the agency’s specifications for mixes and for paving in cold weather, and plan work-zone traffic control to the applicable manual. Local codes, agency specifications and the judgement of a licensed engineer govern.';

export function briefMethod(r: PlanResult) {
  return (
    `Condition is forecast with deterioration curves (PCI against age since the last treatment) fitted by least squares to the agency's own surveys, or editable defaults where a family has too few. ` +
    `Surveyed condition is aged to the start year. Each segment's candidates are treatment strategies — a first treatment in a year where the catalog's rules allow it, alone or followed by further work when the road falls to a treatment's trigger condition — and after work a road follows the curve of the family it then belongs to, for the life its mix and lift give. ` +
    `The benefit of a strategy is the area between the condition curves with and without it over one window for every option (the plan's years and a tail after them), weighted by lane-miles; its life-cycle cost comes from the same method as the comparisons (FHWA), with the remaining service life credited. ` +
    `${r.method === 'exact' ? 'The work was chosen by mixed-integer programming (HiGHS)' : r.method === 'fast' ? 'The work was chosen by a Lagrangian relaxation method' : 'The work was chosen worst-first'} to give the most benefit within each year's budget (${r.solution.status}; within ${(r.solution.gap * 100).toFixed(2)} % of the best possible). ` +
    `Costs are planning estimates in constant base-year dollars from the catalog's unit prices, traffic control and add-ons; mobilisation is priced per contract, not per segment.`
  );
}
