import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { AgencyParamsSchema } from '../../shared/schemas/common';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import { agencies } from '../db/schema';
import type { ApiRoutes } from '../http/api';
import multer from 'multer';
import { HttpError } from '../http/errors';
import { agencyById } from './agencies.repo';
import { restoreAgency } from './agency-archive';
import { agencyExportTask } from './agencies.tasks';

const archiveUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: 200 * 1024 * 1024, files: 1 },
}).single('file');

const AgencySettingsSchema = z.object({ name: z.string().trim().min(2).max(120), units: z.enum(['us', 'metric']) });

export function agencyRoutes(api: ApiRoutes, deps: Deps) {
  const view = (id: string) => {
    const a = agencyById(deps.db, id)!;
    return { id: a.id, name: a.name, kind: a.kind, units: a.units };
  };
  api.add({
    method: 'get',
    path: '/api/agencies/:agencyId/settings',
    tag: 'Agency',
    summary: 'Agency name, kind and display units',
    access: { kind: 'agency', role: 'viewer' },
    params: AgencyParamsSchema,
    handler: ({ agency }) => view(agency!.id),
  });
  api.add({
    method: 'put',
    path: '/api/agencies/:agencyId/settings',
    tag: 'Agency',
    summary: 'Rename the agency or change its display units',
    access: { kind: 'agency', role: 'admin' },
    params: AgencyParamsSchema,
    body: AgencySettingsSchema,
    handler: ({ agency, user, body }) => {
      deps.db.transaction((tx) => {
        const before = view(agency!.id);
        tx.update(agencies).set(body).where(eq(agencies.id, agency!.id)).run();
        recordAudit(tx, {
          agencyId: agency!.id,
          userId: user!.id,
          action: 'agency.settings',
          entity: 'agency',
          entityId: agency!.id,
          detail: { before, after: body },
        });
      });
      return view(agency!.id);
    },
  });
  api.add({
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
      deps.db.transaction((tx) =>
        recordAudit(tx, {
          agencyId: agency!.id,
          userId: user!.id,
          action: 'agency.export',
          entity: 'agency',
          entityId: agency!.id,
          detail: out.counts,
        }),
      );
      res.setHeader('Content-Type', 'application/zip');
      res.setHeader(
        'Content-Disposition',
        `attachment; filename="${out.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-export-${out.exportedAt.slice(0, 10)}.zip"`,
      );
      res.send(Buffer.from(out.buffer));
    },
  });
  api.add({
    method: 'post',
    path: '/api/agencies/restore',
    tag: 'Agency',
    summary:
      'Restore an agency export into a new agency, with the caller as its admin (multipart: file, optional name)',
    access: { kind: 'signed-in' },
    body: z.object({ name: z.string().trim().min(2).max(120).optional() }),
    status: 201,
    before: [
      (req, res, next) => {
        if (!req.is('multipart/form-data'))
          return next(
            new HttpError(
              415,
              'unsupported_media_type',
              'Send the archive as multipart/form-data with the field "file"',
            ),
          );
        archiveUpload(req, res, (err: unknown) =>
          err ? next(new HttpError(400, 'bad_upload', `Upload refused: ${(err as Error).message}`)) : next(),
        );
      },
    ],
    handler: async ({ user, body, req }) => {
      if (!req.file)
        throw new HttpError(400, 'invalid_request', 'Invalid request: file — attach the archive in the field "file"', [
          { path: 'file', message: 'is required' },
        ]);
      return restoreAgency(deps, user!.id, req.file.buffer, body.name);
    },
  });
}
