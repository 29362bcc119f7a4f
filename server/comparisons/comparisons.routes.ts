import { z } from 'zod';
import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  ComparisonListSchema,
  ComparisonParamsSchema,
  ComparisonSchema,
  EvaluateBodySchema,
  EvaluateResultSchema,
  SaveComparisonBodySchema,
  SavedComparisonSchema,
  ComparisonRequestSchema,
} from '../../shared/schemas/comparisons';
import { RunViewSchema } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import { sendDownload } from '../http/download';
import { exportableComparison } from './comparisons.export';
import { comparisonExportTask } from './comparisons.tasks';
import * as service from './comparisons.service';

export function comparisonRoutes(api: ApiRoutes, deps: Deps) {
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  api.typed({
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
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses/runs',
    tag: 'Life-cycle cost',
    summary:
      'Start a comparison of 2–6 catalog-based alternatives on a group of segments (or a typed-in section); runs off the request thread with Monte Carlo. Answers 202 with the run to poll at /api/agencies/{agencyId}/runs/{runId}.',
    access: engineer,
    params: AgencyParamsSchema,
    body: ComparisonRequestSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, body }) => service.startComparison(deps, agency!.id, user!.id, body),
  });
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses',
    tag: 'Life-cycle cost',
    summary:
      'Save a finished run with the snapshot of every input (catalog prices, economics, quantities), so that it reproduces exactly',
    access: engineer,
    params: AgencyParamsSchema,
    body: SaveComparisonBodySchema,
    status: 201,
    response: SavedComparisonSchema,
    handler: ({ agency, user, body }) => service.saveComparison(deps, agency!.id, user!.id, body.name, body.runId),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses',
    tag: 'Life-cycle cost',
    summary: 'Saved comparisons',
    access: engineer,
    params: AgencyParamsSchema,
    response: ComparisonListSchema,
    handler: ({ agency }) => service.listComparisons(deps, agency!.id),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses/:analysisId',
    tag: 'Life-cycle cost',
    summary: 'A saved comparison: its input snapshot and its result',
    access: engineer,
    params: ComparisonParamsSchema,
    response: ComparisonSchema,
    handler: ({ agency, params }) => service.getComparison(deps, agency!.id, params.analysisId),
  });
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/analyses/:analysisId/rerun',
    tag: 'Life-cycle cost',
    summary:
      'Run a saved comparison again from its own snapshot (its own prices); answers 202 with the run to poll, and the saved result is replaced when it finishes',
    access: engineer,
    params: ComparisonParamsSchema,
    response: RunViewSchema,
    status: 202,
    heavy: true,
    handler: ({ agency, user, params }) => service.rerunComparison(deps, agency!.id, user!.id, params.analysisId),
  });
  api.typed({
    method: 'delete',
    path: '/api/agencies/:agencyId/analyses/:analysisId',
    tag: 'Life-cycle cost',
    summary: 'Delete a saved comparison',
    access: engineer,
    params: ComparisonParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => service.deleteComparison(deps, agency!.id, user!.id, params.analysisId),
  });
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/analyses/:analysisId/export',
    tag: 'Life-cycle cost',
    summary: 'A saved comparison as CSV (results) or XLSX (results, cash flows, cost lines)',
    access: engineer,
    params: ComparisonParamsSchema,
    query: z.object({ format: z.enum(['csv', 'xlsx']).default('csv') }),
    responseDescription: 'text/csv or an XLSX workbook',
    heavy: true,
    handler: async ({ agency, user, params, query, res, signal }) => {
      // Cheap checks first (exists, has a result), so a 404 or 409 takes no slot; the file is built in a worker.
      const { base } = exportableComparison(deps.db, agency!.id, params.analysisId);
      const file = await deps.pool.run(
        comparisonExportTask,
        { agencyId: agency!.id, analysisId: params.analysisId, format: query.format },
        { userId: user!.id, agencyId: agency!.id },
        { signal },
      );
      sendDownload(res, base, query.format, file);
    },
  });
}
