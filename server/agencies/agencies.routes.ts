import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { AgencyParamsSchema } from '../../shared/schemas/common';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import { agencies } from '../db/schema';
import type { ApiRoutes } from '../http/api';
import { agencyById } from './agencies.repo';

const AgencySettingsSchema = z.object({ name: z.string().trim().min(2).max(120), units: z.enum(['us', 'metric']) });

export function agencyRoutes(api: ApiRoutes, deps: Deps) {
  const view = (id: string) => {
    const a = agencyById(deps.db, id)!;
    return { id: a.id, name: a.name, kind: a.kind, units: a.units };
  };
  api.add({ method: 'get', path: '/api/agencies/:agencyId/settings', tag: 'Agency', summary: 'Agency name, kind and display units', access: { kind: 'agency', role: 'viewer' }, params: AgencyParamsSchema, handler: ({ agency }) => view(agency!.id) });
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
        recordAudit(tx, { agencyId: agency!.id, userId: user!.id, action: 'agency.settings', entity: 'agency', entityId: agency!.id, detail: { before, after: body } });
      });
      return view(agency!.id);
    },
  });
}
