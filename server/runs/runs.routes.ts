import { RunParamsSchema, RunViewSchema } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import { type ApiRoutes, sendJsonText } from '../http/api';
import * as service from './runs.service';

export function runRoutes(api: ApiRoutes, deps: Deps) {
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/runs/:runId',
    tag: 'Runs',
    summary:
      'Progress and, when done, the result of a run (plan, budget search or comparison). A run cut off by a server restart answers status failed with a message saying so.',
    access: engineer,
    params: RunParamsSchema,
    response: RunViewSchema,
    handler: ({ agency, params, res }) => sendJsonText(res, service.runJson(deps, agency!.id, params.runId)),
  });
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/runs/:runId/cancel',
    tag: 'Runs',
    summary: 'Cancel a run: its worker is stopped and the run ends as cancelled (a run already ended is left as it is)',
    access: engineer,
    params: RunParamsSchema,
    response: RunViewSchema,
    handler: ({ agency, params }) => service.cancelRun(deps, agency!.id, params.runId),
  });
}
