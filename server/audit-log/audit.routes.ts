import { AgencyParamsSchema } from '../../shared/schemas/common';
import { AuditListSchema, AuditQuerySchema } from '../../shared/schemas/audit';
import type { Deps } from '../deps';
import type { ApiRoutes } from '../http/api';
import { sendDownload } from '../http/download';
import * as service from './audit.service';

export function auditRoutes(api: ApiRoutes, deps: Deps) {
  const admin = { kind: 'agency', role: 'admin' } as const;
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/audit',
    tag: 'Activity',
    summary:
      'The audit trail: who did what to which record and when, each change in words (field, before, after), and the stored detail',
    access: admin,
    params: AgencyParamsSchema,
    query: AuditQuerySchema,
    response: AuditListSchema,
    handler: ({ agency, query }) => service.auditList(deps, agency!.id, query),
  });
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/audit.csv',
    tag: 'Activity',
    summary: 'The filtered audit trail as CSV, changes in words',
    access: admin,
    params: AgencyParamsSchema,
    query: AuditQuerySchema,
    responseDescription: 'text/csv',
    handler: ({ agency, query, res }) => {
      sendDownload(res, 'activity', 'csv', service.auditCsv(deps, agency!.id, query));
    },
  });
}
