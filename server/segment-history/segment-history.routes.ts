import {
  SurveyInputSchema,
  TreatmentRecordInputSchema,
  TreatmentRecordListSchema,
  TreatmentRecordSchema,
} from '../../shared/schemas/segment-history';
import { SegmentDetailSchema, SegmentParamsSchema } from '../../shared/schemas/segments';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import * as service from './segment-history.service';

// A segment's history: condition surveys added by hand and the work done on it.
export function segmentHistoryRoutes(api: ApiRoutes, deps: Deps) {
  const base = '/api/agencies/:agencyId/segments/:id';
  api.typed({
    method: 'post',
    path: `${base}/surveys`,
    tag: 'Segments',
    summary: 'Add a condition survey; the newest survey becomes the latest PCI (engineers and admins)',
    access: { kind: 'agency', role: 'engineer' },
    params: SegmentParamsSchema,
    body: SurveyInputSchema,
    status: 201,
    response: SegmentDetailSchema,
    handler: ({ agency, user, params, body }) => service.addSurvey(deps, agency!.id, user!.id, params.id, body),
  });
  api.typed({
    method: 'get',
    path: `${base}/treatments`,
    tag: 'Segments',
    summary: 'The work done on a segment, newest first',
    access: { kind: 'agency', role: 'viewer' },
    params: SegmentParamsSchema,
    response: TreatmentRecordListSchema,
    handler: ({ agency, params }) => service.treatmentHistory(deps, agency!.id, params.id),
  });
  api.typed({
    method: 'post',
    path: `${base}/treatments`,
    tag: 'Segments',
    summary:
      'Record work done on a segment; the newest becomes its last treatment, and a PCI after the work is kept as a survey (engineers and admins)',
    access: { kind: 'agency', role: 'engineer' },
    params: SegmentParamsSchema,
    body: TreatmentRecordInputSchema,
    status: 201,
    response: TreatmentRecordSchema,
    handler: ({ agency, user, params, body }) => service.recordTreatment(deps, agency!.id, user!.id, params.id, body),
  });
}
