import { AgencyParamsSchema } from '../../shared/schemas/common';
import {
  DistrictListSchema,
  NetworkSummarySchema,
  SegmentDetailSchema,
  SegmentListQuerySchema,
  SegmentListResponseSchema,
  SegmentParamsSchema,
  SegmentUpdateSchema,
} from '../../shared/schemas/segments';
import type { Deps } from '../deps';
import { type ApiRoutes, sendJsonText } from '../http/api';
import { fileSlug, sendDownload } from '../http/download';
import { z } from 'zod';
import * as service from './segments.service';
import { segmentsExportTask } from './segments.tasks';

const FilterQuerySchema = SegmentListQuerySchema.omit({ limit: true, offset: true });

export function segmentRoutes(api: ApiRoutes, deps: Deps) {
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/segments',
    tag: 'Segments',
    summary: 'Paged, filtered segment list with totals for the filtered set',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    query: SegmentListQuerySchema,
    response: SegmentListResponseSchema,
    handler: ({ agency, query, res }) => sendJsonText(res, service.segmentListJson(deps, agency!.id, query)),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/network',
    tag: 'Segments',
    summary: 'Network totals: centreline miles, lane-miles, length-weighted PCI, lane-miles by condition band',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    response: NetworkSummarySchema,
    handler: ({ agency }) => service.networkSummary(deps, agency!.id),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/districts',
    tag: 'Segments',
    summary: "The agency's districts with their segment counts, for the district filter",
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    response: DistrictListSchema,
    handler: ({ agency }) => service.districtList(deps, agency!.id),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/segments/:id',
    tag: 'Segments',
    summary: 'One segment with its survey history',
    access: { kind: 'agency', role: 'viewer' },
    params: SegmentParamsSchema,
    response: SegmentDetailSchema,
    handler: ({ agency, params }) => service.segmentDetail(deps, agency!.id, params.id),
  });
  api.typed({
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
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/segments.geojson',
    tag: 'Segments',
    summary:
      'Segments with geometry as GeoJSON for the map (id, segment id, road name, PCI, class), same filters as the list',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    query: FilterQuerySchema,
    responseDescription: 'application/geo+json FeatureCollection',
    handler: ({ agency, query, res }) => {
      res.setHeader('Content-Type', 'application/geo+json; charset=utf-8');
      res.send(service.segmentMap(deps, agency!.id, query));
    },
  });
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/segments/export',
    tag: 'Segments',
    summary: 'The filtered segment list as CSV or XLSX, with the canonical import headers',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    query: FilterQuerySchema.extend({ format: z.enum(['csv', 'xlsx']).default('csv') }),
    responseDescription: 'text/csv or an XLSX workbook',
    heavy: true,
    handler: async ({ agency, user, query, res, signal }) => {
      const { format, ...filter } = query;
      const out = await deps.pool.run(
        segmentsExportTask,
        { agencyId: agency!.id, query: filter, format },
        { userId: user!.id, agencyId: agency!.id },
        { signal },
      );
      sendDownload(res, `${fileSlug(out.name)}-segments`, format, out.body);
    },
  });
}
