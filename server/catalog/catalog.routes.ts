import { AgencyParamsSchema, OkSchema } from '../../shared/schemas/common';
import {
  CatalogItemParamsSchema,
  CatalogSchema,
  EconomicsSchema,
  MixInputSchema,
  MixSchema,
  PriceHistorySchema,
  TreatmentInputSchema,
  TreatmentSchema,
} from '../../shared/schemas/catalog';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import * as service from './catalog.service';

export function catalogRoutes(api: ApiRoutes, deps: Deps) {
  const admin = { kind: 'agency', role: 'admin' } as const;
  const base = '/api/agencies/:agencyId/catalog';
  api.typed({
    method: 'get',
    path: base,
    tag: 'Catalog',
    summary: 'Mixes, treatments and economics (discount rate, analysis period, per-job costs)',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    response: CatalogSchema,
    handler: ({ agency }) => service.catalog(deps, agency!.id),
  });
  api.typed({
    method: 'get',
    path: `${base}/price-history`,
    tag: 'Catalog',
    summary: 'Every price and life change with its effective date',
    access: { kind: 'agency', role: 'engineer' },
    params: AgencyParamsSchema,
    response: PriceHistorySchema,
    handler: ({ agency }) => service.priceHistory(deps, agency!.id),
  });
  api.typed({
    method: 'post',
    path: `${base}/mixes`,
    tag: 'Catalog',
    summary: 'Add a mix',
    access: admin,
    params: AgencyParamsSchema,
    body: MixInputSchema,
    response: MixSchema,
    status: 201,
    handler: ({ agency, user, body }) => service.saveMix(deps, agency!.id, user!.id, null, body),
  });
  api.typed({
    method: 'put',
    path: `${base}/mixes/:itemId`,
    tag: 'Catalog',
    summary: 'Change a mix (price changes are kept with their effective date)',
    access: admin,
    params: CatalogItemParamsSchema,
    body: MixInputSchema,
    response: MixSchema,
    handler: ({ agency, user, params, body }) => service.saveMix(deps, agency!.id, user!.id, params.itemId, body),
  });
  api.typed({
    method: 'delete',
    path: `${base}/mixes/:itemId`,
    tag: 'Catalog',
    summary: 'Remove a mix no treatment uses',
    access: admin,
    params: CatalogItemParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => service.deleteMix(deps, agency!.id, user!.id, params.itemId),
  });
  api.typed({
    method: 'post',
    path: `${base}/treatments`,
    tag: 'Catalog',
    summary: 'Add a treatment',
    access: admin,
    params: AgencyParamsSchema,
    body: TreatmentInputSchema,
    response: TreatmentSchema,
    status: 201,
    handler: ({ agency, user, body }) => service.saveTreatment(deps, agency!.id, user!.id, null, body),
  });
  api.typed({
    method: 'put',
    path: `${base}/treatments/:itemId`,
    tag: 'Catalog',
    summary: 'Change a treatment',
    access: admin,
    params: CatalogItemParamsSchema,
    body: TreatmentInputSchema,
    response: TreatmentSchema,
    handler: ({ agency, user, params, body }) => service.saveTreatment(deps, agency!.id, user!.id, params.itemId, body),
  });
  api.typed({
    method: 'delete',
    path: `${base}/treatments/:itemId`,
    tag: 'Catalog',
    summary: 'Remove a treatment',
    access: admin,
    params: CatalogItemParamsSchema,
    response: OkSchema,
    handler: ({ agency, user, params }) => service.deleteTreatment(deps, agency!.id, user!.id, params.itemId),
  });
  api.typed({
    method: 'put',
    path: `${base}/economics`,
    tag: 'Catalog',
    summary: 'Set the discount rate (with its source), analysis period, base year, per-job costs and add-ons',
    access: admin,
    params: AgencyParamsSchema,
    body: EconomicsSchema,
    response: EconomicsSchema,
    handler: ({ agency, user, body }) => service.saveEconomics(deps, agency!.id, user!.id, body),
  });
}
