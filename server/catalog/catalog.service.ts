// The catalog's rules: who may change what is decided by the routes; here an
// item belongs to the agency, a treatment's mix is the agency's own, a mix in
// use stays, every price change is kept with its effective date, and every
// write lands in one transaction with its audit entry.
import {
  type Economics,
  MIX_PRICE_FIELDS,
  type MixInput,
  type PriceField,
  type PriceValue,
  TREATMENT_PRICE_FIELDS,
  type TreatmentInput,
} from '../../shared/schemas/catalog';
import { recordAudit } from '../audit';
import { newId } from '../ids';
import type { Deps } from '../deps';
import { HttpError, notFound } from '../http/errors';
import * as repo from './catalog.repo';

/** Mixes, treatments and economics as the Catalog screen and other modules read them. */
export function catalog(deps: Deps, agencyId: string) {
  const m = repo.listMixes(deps.db, agencyId);
  const t = repo.listTreatments(deps.db, agencyId);
  return {
    mixes: m,
    treatments: t,
    economics: repo.economicsOf(deps.db, agencyId),
    demoValues: [...m, ...t].some((x) => x.isDemo),
  };
}

// Reads for other modules (comparisons, plans, the agency export): the same
// shapes as the repo's, reached through the service.
export const listMixes = (deps: Pick<Deps, 'db'>, agencyId: string) => repo.listMixes(deps.db, agencyId);
export const listTreatments = (deps: Pick<Deps, 'db'>, agencyId: string) => repo.listTreatments(deps.db, agencyId);
export const economicsOf = (deps: Pick<Deps, 'db'>, agencyId: string) => repo.economicsOf(deps.db, agencyId);

export const priceHistory = (deps: Deps, agencyId: string) => ({ items: repo.history(deps.db, agencyId) });

function logPrices(
  db: repo.Conn,
  agencyId: string,
  userId: string,
  item: { entity: 'mix' | 'treatment'; id: string; name: string; effectiveDate: string },
  before: Partial<Record<PriceField, PriceValue>> | null,
  after: Partial<Record<PriceField, PriceValue>>,
  fields: readonly PriceField[],
) {
  for (const f of fields) {
    const b = before?.[f] ?? null;
    const a = after[f] ?? null;
    if (JSON.stringify(b) === JSON.stringify(a)) continue;
    repo.insertPriceChange(db, agencyId, {
      entity: item.entity,
      entityId: item.id,
      name: item.name,
      field: f,
      before: b,
      after: a,
      effectiveDate: item.effectiveDate,
      userId,
    });
  }
}

export function saveMix(deps: Deps, agencyId: string, userId: string, id: string | null, input: MixInput) {
  return deps.db.transaction((tx) => {
    const before = id ? repo.mixRow(tx, agencyId, id) : null;
    if (id && !before) throw notFound('No such mix');
    const mixId = id ?? newId();
    if (before) repo.updateMix(tx, agencyId, mixId, input);
    else repo.insertMix(tx, agencyId, mixId, input);
    const item = { entity: 'mix', id: mixId, name: input.name, effectiveDate: input.priceEffectiveDate } as const;
    logPrices(tx, agencyId, userId, item, before ?? null, input, MIX_PRICE_FIELDS);
    recordAudit(tx, {
      agencyId,
      userId,
      action: before ? 'catalog.mix.update' : 'catalog.mix.create',
      entity: 'mix',
      entityId: mixId,
      detail: { before: before ?? null, after: input },
    });
    return repo.toMix(repo.mixRow(tx, agencyId, mixId)!);
  });
}

export function saveTreatment(deps: Deps, agencyId: string, userId: string, id: string | null, input: TreatmentInput) {
  if (input.mixId && !repo.mixRow(deps.db, agencyId, input.mixId)) {
    throw new HttpError(400, 'invalid_request', 'Invalid request: body.mixId — is not a mix of this agency', [
      { path: 'body.mixId', message: 'is not a mix of this agency' },
    ]);
  }
  return deps.db.transaction((tx) => {
    const beforeRow = id ? repo.treatmentRow(tx, agencyId, id) : null;
    if (id && !beforeRow) throw notFound('No such treatment');
    const before = beforeRow ? repo.toTreatment(beforeRow) : null;
    const tid = id ?? newId();
    if (before) repo.updateTreatment(tx, agencyId, tid, input);
    else repo.insertTreatment(tx, agencyId, tid, input);
    const item = { entity: 'treatment', id: tid, name: input.name, effectiveDate: input.priceEffectiveDate } as const;
    logPrices(tx, agencyId, userId, item, before, input, TREATMENT_PRICE_FIELDS);
    recordAudit(tx, {
      agencyId,
      userId,
      action: before ? 'catalog.treatment.update' : 'catalog.treatment.create',
      entity: 'treatment',
      entityId: tid,
      detail: { before, after: input },
    });
    return repo.toTreatment(repo.treatmentRow(tx, agencyId, tid)!);
  });
}

export function deleteMix(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    const row = repo.mixRow(tx, agencyId, id);
    if (!row) throw notFound('No such mix');
    const used = repo.treatmentsUsingMix(tx, agencyId, id);
    if (used.length)
      throw new HttpError(
        409,
        'in_use',
        `${row.name} is used by ${used.map((u) => u.name).join(', ')}; change those treatments first`,
      );
    repo.deleteMix(tx, agencyId, id);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'catalog.mix.delete',
      entity: 'mix',
      entityId: id,
      detail: { before: row },
    });
  });
  return { ok: true as const };
}

export function deleteTreatment(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    const row = repo.treatmentRow(tx, agencyId, id);
    if (!row) throw notFound('No such treatment');
    repo.deleteTreatment(tx, agencyId, id);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'catalog.treatment.delete',
      entity: 'treatment',
      entityId: id,
      detail: { before: repo.toTreatment(row) },
    });
  });
  return { ok: true as const };
}

export function saveEconomics(deps: Deps, agencyId: string, userId: string, e: Economics) {
  deps.db.transaction((tx) => {
    const before = repo.economicsOf(tx, agencyId);
    repo.setEconomics(tx, agencyId, e);
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'catalog.economics.update',
      entity: 'agency',
      entityId: agencyId,
      detail: { before, after: e },
    });
  });
  return repo.economicsOf(deps.db, agencyId);
}
