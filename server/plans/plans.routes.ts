import loadHighs from 'highs';
import { z } from 'zod';
import { type Highs, type Instance, solveExact, solveFast, solveRanking } from '../../shared/engine/plan/optimize';
import type { PlanResult } from '../../shared/engine/plan/run-plan';
import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  BudgetSearchBodySchema,
  OptimizeBodySchema,
  OptimizeResultSchema,
  PlanBodySchema,
  PlanParamsSchema,
  PlanRunParamsSchema,
  PlanSummarySchema,
  PublishBodySchema,
} from '../../shared/schemas/plans';
import { RunParamsSchema, RunStateSchema } from '../../shared/schemas/lcca';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import { HttpError } from '../http/errors';
import { briefPdf } from './brief-pdf';
import { workListCsv, workListXlsx } from './plans.export';
import * as service from './plans.service';

let highsPromise: Promise<Highs> | null = null;
const highs = () => (highsPromise ??= loadHighs() as unknown as Promise<Highs>);

export const MAX_EXACT_STATELESS = 20_000;

export function planRoutes(api: ApiRoutes, deps: Deps) {
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  const viewer = { kind: 'agency', role: 'viewer' } as const;
  const base = '/api/agencies/:agencyId/plans';

  api.add({
    method: 'post',
    path: '/api/plan/optimize',
    tag: 'Plans',
    summary:
      'Stateless optimiser for your own candidates: budgets[i] is year i’s budget; each segment takes at most one option (or nothing); method exact (HiGHS), fast (Lagrangian) or ranking. Answers the choice, total benefit, spending by year, an upper bound and the gap.',
    access: { kind: 'signed-in' },
    body: OptimizeBodySchema,
    response: OptimizeResultSchema,
    handler: async ({ body }) => {
      const inst: Instance = {
        budgets: body.budgets,
        segments: body.segments.map((s) => ({
          id: s.id,
          priority: s.priority,
          options: s.options.map((o) => ({
            id: o.id,
            benefit: o.benefit,
            costs: o.costs ?? [{ year: o.year!, cost: o.cost! }],
          })),
        })),
      };
      const options = inst.segments.reduce((n, s) => n + s.options.length, 0);
      if (body.method === 'exact') {
        if (options > MAX_EXACT_STATELESS)
          throw new HttpError(
            400,
            'invalid_request',
            `Invalid request: method — the exact method takes at most ${MAX_EXACT_STATELESS} options here; use fast`,
            [{ path: 'body.method', message: 'too many options for exact' }],
          );
        return solveExact(inst, await highs(), { timeLimitSeconds: body.timeLimitSeconds });
      }
      return body.method === 'fast' ? solveFast(inst) : solveRanking(inst);
    },
  });

  api.add({
    method: 'get',
    path: base,
    tag: 'Plans',
    summary: 'Plan scenarios (viewers see published ones only)',
    access: viewer,
    params: AgencyParamsSchema,
    response: z.object({ items: z.array(PlanSummarySchema) }),
    handler: ({ agency }) => service.listPlans(deps, agency!.id, agency!.role),
  });
  api.add({
    method: 'post',
    path: base,
    tag: 'Plans',
    summary: 'Create a plan scenario',
    access: engineer,
    params: AgencyParamsSchema,
    body: PlanBodySchema,
    response: PlanSummarySchema,
    status: 201,
    handler: ({ agency, user, body }) => service.createPlan(deps, agency!.id, user!.id, body.name, body.settings),
  });
  api.add({
    method: 'get',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'One plan scenario',
    access: viewer,
    params: PlanParamsSchema,
    response: PlanSummarySchema,
    handler: ({ agency, params }) => service.getPlan(deps, agency!.id, params.planId, agency!.role),
  });
  api.add({
    method: 'put',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'Change a plan scenario',
    access: engineer,
    params: PlanParamsSchema,
    body: PlanBodySchema,
    response: PlanSummarySchema,
    handler: ({ agency, user, params, body }) =>
      service.updatePlan(deps, agency!.id, user!.id, params.planId, body.name, body.settings),
  });
  api.add({
    method: 'delete',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'Delete a plan scenario and its runs',
    access: engineer,
    params: PlanParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => {
      service.deletePlan(deps, agency!.id, user!.id, params.planId);
      return { ok: true };
    },
  });
  api.add({
    method: 'post',
    path: `${base}/:planId/run`,
    tag: 'Plans',
    summary: 'Run the plan in a worker; answers 202 with the run id to poll. The run keeps a snapshot of its inputs.',
    access: engineer,
    params: PlanParamsSchema,
    status: 202,
    handler: ({ agency, user, params }) => service.startRun(deps, agency!.id, user!.id, params.planId),
  });
  api.add({
    method: 'get',
    path: `${base}/:planId/runs/:runId`,
    tag: 'Plans',
    summary: 'Progress and result of a plan run',
    access: engineer,
    params: PlanRunParamsSchema,
    handler: ({ agency, params }) => service.runView(deps, agency!.id, params.planId, params.runId, agency!.role),
  });
  api.add({
    method: 'delete',
    path: `${base}/:planId/runs/:runId`,
    tag: 'Plans',
    summary: 'Cancel a running plan',
    access: engineer,
    params: PlanRunParamsSchema,
    handler: ({ agency, params }) => service.cancelRun(deps, agency!.id, params.planId, params.runId),
  });
  api.add({
    method: 'get',
    path: `${base}/:planId/result`,
    tag: 'Plans',
    summary: 'The latest finished result (viewers: published plans only)',
    access: viewer,
    params: PlanParamsSchema,
    handler: ({ agency, params }) => ({ latest: service.latestResult(deps, agency!.id, params.planId, agency!.role) }),
  });
  api.add({
    method: 'post',
    path: `${base}/:planId/publish`,
    tag: 'Plans',
    summary: 'Publish (or withdraw) a plan; optionally e-mail the agency’s viewers a link',
    access: engineer,
    params: PlanParamsSchema,
    body: PublishBodySchema,
    handler: ({ agency, user, params, body }) =>
      service.publish(deps, agency!.id, user!.id, params.planId, body.publish, body.notifyViewers),
  });
  api.add({
    method: 'post',
    path: `${base}/:planId/budget-search`,
    tag: 'Plans',
    summary:
      'Start the search for the flat annual budget that holds the network at a target PCI; poll the run at /api/agencies/{agencyId}/jobs/{runId}',
    access: engineer,
    params: PlanParamsSchema,
    body: BudgetSearchBodySchema,
    response: RunStateSchema,
    status: 202,
    handler: ({ agency, params, body }) => service.startBudgetSearch(deps, agency!.id, params.planId, body.targetPci),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/jobs/:runId',
    tag: 'Plans',
    summary: 'Progress and result of a background job (budget search)',
    access: engineer,
    params: RunParamsSchema,
    response: RunStateSchema,
    handler: ({ agency, params }) => deps.jobs.get(agency!.id, params.runId),
  });
  api.add({
    method: 'get',
    path: `${base}/:planId/work-list`,
    tag: 'Plans',
    summary: 'The latest result’s work list as CSV or XLSX',
    access: viewer,
    params: PlanParamsSchema,
    query: z.object({ format: z.enum(['csv', 'xlsx']).default('csv') }),
    responseDescription: 'text/csv or an XLSX workbook',
    handler: async ({ agency, params, query, res }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestResult(deps, agency!.id, params.planId, agency!.role);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const name =
        plan.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .slice(0, 60) || 'plan';
      if (query.format === 'xlsx') {
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.setHeader('Content-Disposition', `attachment; filename="${name}-work-list.xlsx"`);
        res.send(await workListXlsx(latest.result as PlanResult, plan.name));
      } else {
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', `attachment; filename="${name}-work-list.csv"`);
        res.send(workListCsv(latest.result as PlanResult));
      }
    },
  });
  api.add({
    method: 'get',
    path: `${base}/:planId/brief.pdf`,
    tag: 'Plans',
    summary:
      'The council brief as PDF: summary, network PCI chart, condition bands, backlog, map of the first years’ work, the first two years’ work list, method notes and cautions',
    access: viewer,
    params: PlanParamsSchema,
    responseDescription: 'application/pdf',
    handler: async ({ agency, params, res, user }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestResult(deps, agency!.id, params.planId, agency!.role);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const geo = service.segmentGeometries(deps, agency!.id);
      const pdf = await briefPdf({
        plan,
        result: latest.result as PlanResult,
        geometries: geo,
        author: user!.name,
        agencyName: service.agencyName(deps, agency!.id),
      });
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader(
        'Content-Disposition',
        `inline; filename="${plan.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-brief.pdf"`,
      );
      res.send(pdf);
    },
  });
}
