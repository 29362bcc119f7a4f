import type { RequestHandler } from 'express';
import rateLimit from 'express-rate-limit';
import { z } from 'zod';
import { AgencyViewSchema, RestoreReportSchema } from '../../shared/schemas/agency';
import { AgencyParamsSchema } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import type { ApiRoutes, SessionUser } from '../http/api';
import { fileSlug, sendDownload } from '../http/download';
import { HttpError } from '../http/errors';
import { singleFileUpload } from '../http/upload';
import { isAdminOfAny } from '../members/members.service';
import * as service from './agencies.service';
import { agencyExportTask, agencyRestoreTask } from './agencies.tasks';
import { AgencyNameSchema } from './archive-schemas';

export const MAX_ARCHIVE_UPLOAD_BYTES = 200 * 1024 * 1024;

const AgencySettingsSchema = z.object({ name: AgencyNameSchema, units: z.enum(['us', 'metric']) });

/**
 * Restoring creates an agency: only someone who is already an admin of one may do it,
 * unless the operator opens it to every signed-in user (ALLOW_RESTORE_BY_ANY_USER=1).
 * Checked before the upload is read.
 */
function mayRestore(deps: Deps): RequestHandler {
  return (req, _res, next) => {
    if (deps.config.restoreByAnyUser) return next();
    if (isAdminOfAny(deps, (req.user as SessionUser).id)) return next();
    next(
      new HttpError(
        403,
        'forbidden',
        'Only an admin of an agency may restore an agency archive; ask an admin, or the operator (ALLOW_RESTORE_BY_ANY_USER).',
      ),
    );
  };
}

export function agencyRoutes(api: ApiRoutes, deps: Deps) {
  api.typed({
    method: 'get',
    path: '/api/agencies/:agencyId/settings',
    tag: 'Agency',
    summary: 'Agency name, kind and display units',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    response: AgencyViewSchema,
    handler: ({ agency }) => service.agencyView(deps, agency!.id),
  });
  api.typed({
    method: 'put',
    path: '/api/agencies/:agencyId/settings',
    tag: 'Agency',
    summary: 'Rename the agency or change its display units',
    access: { kind: 'agency', role: 'admin' },
    params: AgencyParamsSchema,
    body: AgencySettingsSchema,
    response: AgencyViewSchema,
    handler: ({ agency, user, body }) => service.updateSettings(deps, agency!.id, user!.id, body),
  });
  api.file({
    method: 'get',
    path: '/api/agencies/:agencyId/export',
    tag: 'Agency',
    summary:
      "The agency's whole data as one zip: segments (GeoJSON and CSV), surveys, catalog, plans, comparisons, curves, with a manifest of SHA-256 hashes",
    access: { kind: 'agency', role: 'admin' },
    params: AgencyParamsSchema,
    responseDescription: 'application/zip',
    heavy: true,
    handler: async ({ agency, user, res, signal }) => {
      const out = await deps.pool.run(
        agencyExportTask,
        { agencyId: agency!.id },
        { userId: user!.id, agencyId: agency!.id },
        { signal },
      );
      service.recordExport(deps, agency!.id, user!.id, out.counts);
      sendDownload(res, `${fileSlug(out.name)}-export-${out.exportedAt.slice(0, 10)}`, 'zip', out.buffer);
    },
  });
  api.typed({
    method: 'post',
    path: '/api/agencies/restore',
    tag: 'Agency',
    summary:
      'Restore an agency export into a new agency, with the caller as its admin (multipart: file, optional name). Only admins of an agency may restore (unless the operator allows everyone); every file is checked and nothing is written unless all of it is sound.',
    access: { kind: 'signed-in' },
    body: z.object({ name: AgencyNameSchema.optional() }),
    response: RestoreReportSchema,
    status: 201,
    before: [
      mayRestore(deps),
      rateLimit({
        windowMs: 60 * 60 * 1000,
        limit: deps.config.restoreRateLimit,
        standardHeaders: 'draft-8',
        legacyHeaders: false,
        keyGenerator: (req) => `restore|${(req.user as SessionUser).id}`,
        handler: (_req, res) =>
          res.status(429).json({
            error: {
              code: 'rate_limited',
              message: `At most ${deps.config.restoreRateLimit} restores an hour; try again later.`,
            },
          }),
      }),
      singleFileUpload({ what: 'archive', maxBytes: MAX_ARCHIVE_UPLOAD_BYTES, limits: { fields: 4, parts: 6 } }),
    ],
    heavy: true,
    handler: async ({ user, body, req, signal }) => {
      if (!req.file)
        throw new HttpError(400, 'invalid_request', 'Invalid request: file — attach the archive in the field "file"', [
          { path: 'file', message: 'is required' },
        ]);
      // Unzipping, checking and writing run in a worker; the archive's bytes move there (not copied).
      // The new agency does not exist yet, so the per-person and global caps apply.
      const bytes = req.file.buffer;
      const report = await deps.pool.run(
        agencyRestoreTask,
        { userId: user!.id, bytes, name: body.name },
        { userId: user!.id, agencyId: null },
        { signal, transfer: [bytes] },
      );
      deps.listCache?.bump(report.agencyId);
      return report;
    },
  });
}
