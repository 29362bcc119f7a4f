import { z } from 'zod';
import type { StudyResult } from '../../shared/engine/lcca/study';
import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  AnalysisListSchema,
  AnalysisParamsSchema,
  EvaluateBodySchema,
  EvaluateResultSchema,
  SaveAnalysisBodySchema,
  StudyRequestSchema,
} from '../../shared/schemas/lcca';
import { RunViewSchema } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import { HttpError } from '../http/errors';
import { studyCsv, studyXlsx } from './lcca.export';
import * as service from './lcca.service';

export function lccaRoutes(api: ApiRoutes, deps: Deps) {
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  api.add({
    method: 'post',
    path: '/api/lcca/evaluate',
    tag: 'Life-cycle cost',
    summary:
      'Stateless life-cycle cost evaluation (FHWA method): per alternative the net present value (costs less remaining service life value), EUAC, RSL and discounted cash flows. Alternatives are lists of activities {year, cost, serviceLifeYears}, or plans priced per SY / lane-mile / job with group quantities.',
    access: { kind: 'signed-in' },
    body: EvaluateBodySchema,
    response: EvaluateResultSchema,
    handler: ({ body }) => service.evaluate(body),
  });
  api.add({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses/runs',
    tag: 'Life-cycle cost',
    summary:
      'Start a comparison of 2–6 catalog-based alternatives on a group of segments (or a typed-in section); runs off the request thread with Monte Carlo. Answers 202 with the run to poll at /api/agencies/{agencyId}/runs/{runId}.',
    access: engineer,
    params: AgencyParamsSchema,
    body: StudyRequestSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, body }) => service.startComparison(deps, agency!.id, user!.id, body),
  });
  api.add({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses',
    tag: 'Life-cycle cost',
    summary:
      'Save a finished run with the snapshot of every input (catalog prices, economics, quantities), so that it reproduces exactly',
    access: engineer,
    params: AgencyParamsSchema,
    body: SaveAnalysisBodySchema,
    status: 201,
    response: z.object({ id: z.string() }),
    handler: ({ agency, user, body }) => service.saveAnalysis(deps, agency!.id, user!.id, body.name, body.runId),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses',
    tag: 'Life-cycle cost',
    summary: 'Saved comparisons',
    access: engineer,
    params: AgencyParamsSchema,
    response: AnalysisListSchema,
    handler: ({ agency }) => service.listAnalyses(deps, agency!.id),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses/:analysisId',
    tag: 'Life-cycle cost',
    summary: 'A saved comparison: its input snapshot and its result',
    access: engineer,
    params: AnalysisParamsSchema,
    handler: ({ agency, params }) => service.getAnalysis(deps, agency!.id, params.analysisId),
  });
  api.add({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses/:analysisId/rerun',
    tag: 'Life-cycle cost',
    summary:
      'Run a saved comparison again from its own snapshot (its own prices); answers 202 with the run to poll, and the saved result is replaced when it finishes',
    access: engineer,
    params: AnalysisParamsSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, params }) => service.rerunAnalysis(deps, agency!.id, user!.id, params.analysisId),
  });
  api.add({
    method: 'delete',
    path: '/api/agencies/:agencyId/analyses/:analysisId',
    tag: 'Life-cycle cost',
    summary: 'Delete a saved comparison',
    access: engineer,
    params: AnalysisParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => {
      service.deleteAnalysis(deps, agency!.id, user!.id, params.analysisId);
      return { ok: true };
    },
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses/:analysisId/export',
    tag: 'Life-cycle cost',
    summary: 'A saved comparison as CSV (results) or XLSX (results, cash flows, cost lines)',
    access: engineer,
    params: AnalysisParamsSchema,
    query: z.object({ format: z.enum(['csv', 'xlsx']).default('csv') }),
    responseDescription: 'text/csv or an XLSX workbook',
    handler: async ({ agency, params, query, res }) => {
      const a = service.getAnalysis(deps, agency!.id, params.analysisId);
      if (!a.result) throw new HttpError(409, 'no_result', 'This comparison has no result yet; run it first');
      const base =
        a.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .slice(0, 60) || 'comparison';
      if (query.format === 'xlsx') {
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.setHeader('Content-Disposition', `attachment; filename="${base}.xlsx"`);
        res.send(await studyXlsx(a.name, a.result as StudyResult));
      } else {
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.setHeader('Content-Disposition', `attachment; filename="${base}.csv"`);
        res.send(studyCsv(a.result as StudyResult));
      }
    },
  });
}
