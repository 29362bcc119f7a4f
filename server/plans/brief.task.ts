// The council brief PDF, built in a worker from the plan (or the version being published), one
// finished run and its input snapshot (re-run at the other budgets the brief sets side by side),
// the latest budget search and the segment geometries.
import type { PlanSettingsInput } from '../../shared/schemas/plans';
import { defineTask } from '../pool/task';
import { briefPdf } from './brief-pdf';
import { budgetChoices } from './brief-choices';
import {
  agencyName,
  latestBudgetSearch,
  runInputOf,
  runResult,
  segmentGeometries,
  segmentLimits,
} from './plans.service';

export type BriefPayload = {
  agencyId: string;
  planId: string;
  runId: string;
  author: string;
  plan: { name: string; status: string; settings: PlanSettingsInput; version: number };
};

export default defineTask(async (p: BriefPayload, ctx) => {
  const deps = { db: ctx.db() };
  const result = runResult(deps, p.agencyId, p.runId);
  const choices = await budgetChoices(
    runInputOf(deps, p.agencyId, p.runId),
    result,
    latestBudgetSearch(deps, p.agencyId, p.planId),
  );
  return briefPdf({
    plan: p.plan,
    result,
    choices,
    geometries: segmentGeometries(deps, p.agencyId),
    limits: segmentLimits(deps, p.agencyId),
    author: p.author,
    agencyName: agencyName(deps, p.agencyId),
  });
});
