import { AgencyParamsSchema } from '../../shared/schemas/common';
import {
  NetworkSummarySchema,
  SegmentDetailSchema,
  SegmentListQuerySchema,
  SegmentListResponseSchema,
  SegmentParamsSchema,
  SegmentUpdateSchema,
} from '../../shared/schemas/segments';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import * as service from './segments.service';

export function segmentRoutes(api: ApiRoutes, deps: Deps) {
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/segments',
    tag: 'Segments',
    summary: 'Paged, filtered segment list with totals for the filtered set',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    query: SegmentListQuerySchema,
    response: SegmentListResponseSchema,
    handler: ({ agency, query }) => service.segmentList(deps, agency!.id, query),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/network',
    tag: 'Segments',
    summary: 'Network totals: centreline miles, lane-miles, length-weighted PCI, lane-miles by condition band',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    response: NetworkSummarySchema,
    handler: ({ agency }) => service.networkSummary(deps, agency!.id),
  });
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/segments/:id',
    tag: 'Segments',
    summary: 'One segment with its survey history',
    access: { kind: 'agency', role: 'viewer' },
    params: SegmentParamsSchema,
    response: SegmentDetailSchema,
    handler: ({ agency, params }) => service.segmentDetail(deps, agency!.id, params.id),
  });
  api.add({
    method: 'patch',
    path: '/api/agencies/:agencyId/segments/:id',
    tag: 'Segments',
    summary: "Edit a segment's attributes (engineers and admins); recorded in the audit trail",
    access: { kind: 'agency', role: 'engineer' },
    params: SegmentParamsSchema,
    body: SegmentUpdateSchema,
    response: SegmentDetailSchema,
    handler: ({ agency, user, params, body }) => service.updateSegment(deps, agency!.id, user!.id, params.id, body),
  });
}
