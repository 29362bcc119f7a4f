import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import { CurveOverrideBodySchema, FamilyListQuerySchema, FamilyListSchema } from '../../shared/schemas/forecast';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import * as service from './forecast.service';

export function forecastRoutes(api: ApiRoutes, deps: Deps) {
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/forecast/families',
    tag: 'Forecast',
    summary:
      'Pavement families with their deterioration curve (fitted by least squares where there are enough surveys), n, RMSE and the survey points',
    access: { kind: 'agency', role: 'engineer' },
    params: AgencyParamsSchema,
    query: FamilyListQuerySchema,
    response: FamilyListSchema,
    handler: ({ agency, query }) => service.familyList(deps, agency!.id, query.points === 'true'),
  });
  api.typed({
    method: 'put',
    path: '/api/agencies/:agencyId/forecast/curves',
    tag: 'Forecast',
    summary: "Set a family's curve by hand (or clear it with curve: null to go back to the fit or the default)",
    access: { kind: 'agency', role: 'engineer' },
    params: AgencyParamsSchema,
    body: CurveOverrideBodySchema,
    response: OkSchema,
    handler: ({ agency, user, body }) => service.setCurve(deps, agency!.id, user!.id, body.familyKey, body.curve),
  });
}
