import { z } from 'zod';
import { AgencyParamsSchema } from '../../shared/schemas/common';
import {
  ImportHistorySchema,
  ImportOptionsSchema,
  ImportParamsSchema,
  ImportReportSchema,
  SavedMappingSchema,
} from '../../shared/schemas/imports';
import type { Deps } from '../deps';
import { type ApiRoutes, sendJsonText } from '../http/api';
import { sendDownload } from '../http/download';
import { HttpError } from '../http/errors';
import { singleFileUpload } from '../http/upload';
import * as service from './imports.service';
import { importTask } from './imports.tasks';

export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024;

export function importRoutes(api: ApiRoutes, deps: Deps) {
  const uploadOne = singleFileUpload({
    what: 'file',
    maxBytes: MAX_UPLOAD_BYTES,
    limits: { fields: 12, fieldSize: 64 * 1024, parts: 16 },
    nameField: true,
    unreadable: 'The upload could not be read as multipart/form-data',
  });
  const engineer = { kind: 'agency', role: 'engineer' } as const;
  api.typed({
    method: 'post',
    path: '/api/agencies/:agencyId/imports',
    tag: 'Imports',
    summary:
      'Import segments (kind=segments) or condition surveys (kind=surveys) from CSV, XLSX, GeoJSON or a zipped shapefile. Multipart: file, and optional mapping (JSON: our field → the file’s column), crs (EPSG:code), mode (all-or-nothing | skip-invalid), dryRun, lengthUnit, widthUnit. 200 when it wrote or would write; 422 with the same report when all-or-nothing refused the file.',
    access: engineer,
    params: AgencyParamsSchema,
    body: ImportOptionsSchema,
    response: ImportReportSchema,
    before: [uploadOne],
    heavy: true,
    handler: async ({ agency, user, body, req, res, signal }) => {
      if (!req.file)
        throw new HttpError(
          400,
          'invalid_request',
          'Invalid request: file — attach the file in the multipart field "file"',
          [{ path: 'file', message: 'is required' }],
        );
      const name = service.uploadName(req.file.originalname);
      // Reading, checking and writing run in a worker; the upload's bytes move there (not copied).
      const bytes = req.file.buffer;
      const { status, report } = await deps.pool.run(
        importTask,
        { agencyId: agency!.id, userId: user!.id, name, bytes, options: body },
        { userId: user!.id, agencyId: agency!.id },
        { signal, transfer: [bytes] },
      );
      if (report.importId) deps.listCache?.bump(agency!.id);
      res.status(status);
      return sendJsonText(res, JSON.stringify(report));
    },
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/imports',
    tag: 'Imports',
    summary: 'Import history: who, when, which file, and the counts',
    access: engineer,
    params: AgencyParamsSchema,
    response: ImportHistorySchema,
    handler: ({ agency }) => service.history(deps, agency!.id),
  });
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/imports/mapping',
    tag: 'Imports',
    summary: 'The column mapping remembered from the last import of this kind',
    access: engineer,
    params: AgencyParamsSchema,
    query: z.object({ kind: z.enum(['segments', 'surveys']).default('segments') }),
    response: SavedMappingSchema,
    handler: ({ agency, query }) => service.mappingFor(deps, agency!.id, query.kind),
  });
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/imports/:importId/rejected.csv',
    tag: 'Imports',
    summary: 'The rows an import rejected, as CSV with a reason column',
    access: engineer,
    params: ImportParamsSchema,
    responseDescription: 'text/csv',
    handler: ({ agency, params, res }) => {
      const f = service.rejectedFile(deps, agency!.id, params.importId);
      sendDownload(res, f.base.replace(/"/g, ''), 'csv', f.csv);
    },
  });
}
