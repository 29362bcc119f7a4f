// The agency itself: its settings, and its export's audit entry. Other modules read an agency through
// this service, never through agencies.repo.
import type { AgencySettings, AgencyView } from '../../shared/schemas/agency';
import { recordAudit } from '../audit';
import type { Deps } from '../deps';
import * as repo from './agencies.repo';

export const agencyById = (deps: Pick<Deps, 'db'>, agencyId: string) => repo.agencyById(deps.db, agencyId);

export function agencyView(deps: Pick<Deps, 'db'>, agencyId: string): AgencyView {
  const a = repo.agencyById(deps.db, agencyId)!;
  return { id: a.id, name: a.name, kind: a.kind, units: a.units };
}

export function updateSettings(deps: Deps, agencyId: string, userId: string, body: AgencySettings): AgencyView {
  deps.db.transaction((tx) => {
    const before = agencyView(deps, agencyId);
    repo.updateAgency(tx, agencyId, body);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'agency.settings',
      entity: 'agency',
      entityId: agencyId,
      detail: { before, after: body },
    });
  });
  return agencyView(deps, agencyId);
}

export function recordExport(deps: Deps, agencyId: string, userId: string, counts: Record<string, number>) {
  deps.db.transaction((tx) =>
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'agency.export',
      entity: 'agency',
      entityId: agencyId,
      detail: counts,
    }),
  );
}
