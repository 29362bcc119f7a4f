import { z } from 'zod';
import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  BudgetSearchBodySchema,
  OptimizeBodySchema,
  OptimizeResultSchema,
  PlanBodySchema,
  PlanParamsSchema,
  PlanRunBodySchema,
  PlanVersionListSchema,
  PlanVersionQuerySchema,
  PlanViewSchema,
  PublishVersionBodySchema,
} from '../../shared/schemas/plans';
import { PlanLatestResultSchema } from '../../shared/schemas/plan-result';
import { RunViewSchema } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import { type ApiRoutes, sendJsonText } from '../http/api';
import { HttpError } from '../http/errors';
import { parsePart } from '../http/validate';
import * as service from './plans.service';
import { briefTask, optimizeTask, workListTask } from './plans.tasks';

export function planRoutes(api: ApiRoutes, deps: Deps) {
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  const viewer = { kind: 'agency', role: 'viewer' } as const;
  const base = '/api/agencies/:agencyId/plans';

  api.typed({
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

  api.typed({
    method: 'get',
    path: base,
    tag: 'Plans',
    summary: 'Plan scenarios (viewers see published ones only)',
    access: viewer,
    params: AgencyParamsSchema,
    response: z.object({ items: z.array(PlanViewSchema) }),
    handler: ({ agency }) => service.listPlans(deps, agency!.id, agency!.role),
  });
  api.typed({
    method: 'post',
    path: base,
    tag: 'Plans',
    summary: 'Create a plan scenario',
    access: engineer,
    params: AgencyParamsSchema,
    body: PlanBodySchema,
    response: PlanViewSchema,
    status: 201,
    handler: ({ agency, user, body }) => service.createPlan(deps, agency!.id, user!.id, body.name, body.settings),
  });
  api.typed({
    method: 'get',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'One plan scenario',
    access: viewer,
    params: PlanParamsSchema,
    response: PlanViewSchema,
    handler: ({ agency, params }) => service.getPlan(deps, agency!.id, params.planId, agency!.role),
  });
  api.typed({
    method: 'put',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'Change a plan scenario',
    access: engineer,
    params: PlanParamsSchema,
    body: PlanBodySchema,
    response: PlanViewSchema,
    handler: ({ agency, user, params, body }) =>
      service.updatePlan(deps, agency!.id, user!.id, params.planId, body.name, body.settings),
  });
  api.typed({
    method: 'delete',
    path: `${base}/:planId`,
    tag: 'Plans',
    summary: 'Delete a plan scenario and its runs',
    access: engineer,
    params: PlanParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => {
      service.deletePlan(deps, agency!.id, user!.id, params.planId);
      return { ok: true as const };
    },
  });
  api.typed({
    method: 'post',
    path: `${base}/:planId/run`,
    tag: 'Plans',
    summary:
      'Run the plan in a worker; answers 202 with the run (poll it at /api/agencies/{agencyId}/runs/{runId}). A body with the unsaved name and settings saves them first (a published plan then opens a new draft version), so the run reflects them. The run keeps a snapshot of its inputs.',
    access: engineer,
    params: PlanParamsSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    // The body is optional (a bare POST runs what is saved), so it is checked here, not declared.
    handler: ({ agency, user, params, req }) =>
      service.startRun(
        deps,
        agency!.id,
        user!.id,
        params.planId,
        req.is('application/json') ? parsePart(PlanRunBodySchema, req.body ?? {}, 'body') : undefined,
      ),
  });
  api.typed({
    method: 'get',
    path: `${base}/:planId/result`,
    tag: 'Plans',
    summary:
      'The latest finished result; viewers get the published version’s pinned run, engineers that of `version` when given',
    access: viewer,
    params: PlanParamsSchema,
    query: PlanVersionQuerySchema,
    response: PlanLatestResultSchema,
    handler: ({ agency, params, query, res }) =>
      sendJsonText(res, service.latestResultJson(deps, agency!.id, params.planId, agency!.role, query.version)),
  });
  api.typed({
    method: 'post',
    path: `${base}/:planId/publish`,
    tag: 'Plans',
    summary:
      'Publish the plan (freezing its name, settings, latest run and council brief as a numbered version viewers see), put an earlier version back with `version`, or withdraw it; optionally e-mail the agency’s viewers the headline numbers and a link',
    access: engineer,
    params: PlanParamsSchema,
    body: PublishVersionBodySchema,
    response: PlanViewSchema.extend({ notified: z.number().int() }),
    heavy: true,
    handler: ({ agency, user, params, body, signal }) =>
      service.publish(
        deps,
        agency!.id,
        user!.id,
        params.planId,
        body.publish,
        body.notifyViewers,
        async ({ plan, runId }) =>
          Buffer.from(
            await deps.pool.run(
              briefTask,
              { agencyId: agency!.id, planId: params.planId, runId, author: user!.name, plan },
              { userId: user!.id, agencyId: agency!.id },
              { signal },
            ),
          ),
        body.version,
      ),
  });
  api.typed({
    method: 'get',
    path: `${base}/:planId/versions`,
    tag: 'Plans',
    summary: 'The plan’s published versions (newest first), which one viewers see, and the editable copy’s number',
    access: engineer,
    params: PlanParamsSchema,
    response: PlanVersionListSchema,
    handler: ({ agency, params }) => service.listVersions(deps, agency!.id, params.planId),
  });
  api.typed({
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
  api.file({
    method: 'get',
    path: `${base}/:planId/work-list`,
    tag: 'Plans',
    summary:
      'The latest result’s work list as CSV or XLSX (viewers: the published version’s; engineers: `version`’s when given)',
    access: viewer,
    params: PlanParamsSchema,
    query: PlanVersionQuerySchema.extend({ format: z.enum(['csv', 'xlsx']).default('csv') }),
    responseDescription: 'text/csv or an XLSX workbook',
    heavy: true,
    handler: async ({ agency, user, params, query, res, signal }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestRun(deps, agency!.id, params.planId, agency!.role, query.version);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const name =
        plan.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .slice(0, 60) || 'plan';
      const body = await deps.pool.run(
        workListTask,
        { agencyId: agency!.id, runId: latest.runId, title: latest.version?.name ?? plan.name, format: query.format },
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
  api.file({
    method: 'get',
    path: `${base}/:planId/brief.pdf`,
    tag: 'Plans',
    summary:
      'The council brief as PDF: summary, headline figures, budget choices side by side, charts with axis values, a map of the work with road names, legend, scale bar and north arrow, the work list with from–to limits, method notes and cautions. Viewers (and engineers asking for `version`) get the brief frozen when that version was published.',
    access: viewer,
    params: PlanParamsSchema,
    query: PlanVersionQuerySchema,
    responseDescription: 'application/pdf',
    heavy: true,
    handler: async ({ agency, params, query, res, user, signal }) => {
      const plan = service.getPlan(deps, agency!.id, params.planId, agency!.role);
      const latest = service.latestRun(deps, agency!.id, params.planId, agency!.role, query.version);
      if (!latest) throw new HttpError(409, 'not_run', 'Run the plan first');
      const frozen = latest.version ? service.versionBrief(deps, agency!.id, latest.version.id) : null;
      const pdf =
        frozen ??
        (await deps.pool.run(
          briefTask,
          {
            agencyId: agency!.id,
            planId: params.planId,
            runId: latest.runId,
            author: user!.name,
            plan: {
              name: latest.version?.name ?? plan.name,
              status: latest.version ? 'published' : 'draft',
              settings: latest.version ? JSON.parse(latest.version.settings) : plan.settings,
              version: latest.version?.version ?? plan.version,
            },
          },
          { userId: user!.id, agencyId: agency!.id },
          { signal },
        ));
      res.setHeader('Content-Type', 'application/pdf');
      res.setHeader(
        'Content-Disposition',
        `inline; filename="${plan.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-brief.pdf"`,
      );
      res.send(Buffer.from(pdf));
    },
  });
}
