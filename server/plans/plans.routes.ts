import { z } from 'zod';
import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  BudgetSearchBodySchema,
  OptimizeBodySchema,
  OptimizeResultSchema,
  PlanBodySchema,
  PlanParamsSchema,
  PlanSummarySchema,
  PublishBodySchema,
} from '../../shared/schemas/plans';
import { RunViewSchema } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import { HttpError } from '../http/errors';
import * as service from './plans.service';
import { briefTask, optimizeTask, workListTask } from './plans.tasks';

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
    heavy: true,
    bodyInWorker: true,
    handler: ({ rawBody, user, signal }) =>
      deps.pool.run(optimizeTask, rawBody!, { userId: user!.id, agencyId: null }, { signal, transfer: [rawBody!] }),
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
    summary:
      'Run the plan in a worker; answers 202 with the run (poll it at /api/agencies/{agencyId}/runs/{runId}). The run keeps a snapshot of its inputs.',
    access: engineer,
    params: PlanParamsSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, params }) => service.startRun(deps, agency!.id, user!.id, params.planId),
  });
  api.add({
    method: 'get',
    path: `${base}/:planId/result`,
    tag: 'Plans',
    summary: 'The latest finished result (viewers: published plans only)',
    access: viewer,
    params: PlanParamsSchema,
    handler: ({ agency, params, res }) => {
      res.type('application/json').send(service.latestResultJson(deps, agency!.id, params.planId, agency!.role));
    },
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
      'Start the search for the flat annual budget that holds the network at a target PCI; answers 202 with the run to poll at /api/agencies/{agencyId}/runs/{runId}',
    access: engineer,
    params: PlanParamsSchema,
    body: BudgetSearchBodySchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, params, body }) =>
      service.startBudgetSearch(deps, agency!.id, user!.id, params.planId, body.targetPci),
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
    heavy: true,
    handler: async ({ agency, user, params, query, res, signal }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestRun(deps, agency!.id, params.planId, agency!.role);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const name =
        plan.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .slice(0, 60) || 'plan';
      const body = await deps.pool.run(
        workListTask,
        { agencyId: agency!.id, runId: latest.runId, title: plan.name, format: query.format },
        { userId: user!.id, agencyId: agency!.id },
        { signal },
      );
      if (query.format === 'xlsx') {
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.setHeader('Content-Disposition', `attachment; filename="${name}-work-list.xlsx"`);
        res.send(Buffer.from(body as Uint8Array));
      } else {
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', `attachment; filename="${name}-work-list.csv"`);
        res.send(body);
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
    heavy: true,
    handler: async ({ agency, params, res, user, signal }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestRun(deps, agency!.id, params.planId, agency!.role);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const pdf = await deps.pool.run(
        briefTask,
        { agencyId: agency!.id, planId: params.planId, runId: latest.runId, author: user!.name },
        { userId: user!.id, agencyId: agency!.id },
        { signal },
      );
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader(
        'Content-Disposition',
        `inline; filename="${plan.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-brief.pdf"`,
      );
      res.send(Buffer.from(pdf));
    },
  });
}
