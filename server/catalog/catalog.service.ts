import { and, eq } from 'drizzle-orm';
import type { Economics, MixInput, TreatmentInput } from '../../shared/schemas/catalog';
import { recordAudit } from '../audit';
import { newId } from '../auth/tokens';
import type { Deps } from '../deps';
import { agencies, mixes, priceHistory, treatments } from '../db/schema';
import { HttpError, notFound } from '../http/errors';
import * as repo from './catalog.repo';

type Tx = Parameters<Parameters<Deps['db']['transaction']>[0]>[0];

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

function logPrices(
  tx: Tx,
  agencyId: string,
  userId: string,
  entity: string,
  entityId: string,
  name: string,
  before: Record<string, unknown> | null,
  after: Record<string, unknown>,
  fields: string[],
  effectiveDate: string,
) {
  for (const f of fields) {
    const b = before ? before[f] : null;
    const a = after[f];
    if (JSON.stringify(b) === JSON.stringify(a)) continue;
    tx.insert(priceHistory)
      .values({
        agencyId,
        entity,
        entityId,
        name,
        field: f,
        before: b === null || b === undefined ? null : JSON.stringify(b),
        after: JSON.stringify(a),
        effectiveDate,
        userId,
      })
      .run();
  }
}

const MIX_PRICE_FIELDS = ['pricePerTon', 'spreadRateLbPerSyIn', 'refLifeYears'];
const TREATMENT_PRICE_FIELDS = ['costItems', 'lifeYears'];

export function saveMix(deps: Deps, agencyId: string, userId: string, id: string | null, input: MixInput) {
  return deps.db.transaction((tx) => {
    const before = id ? repo.mixRow(deps.db, agencyId, id) : null;
    if (id && !before) throw notFound('No such mix');
    const mixId = id ?? newId();
    if (before)
      tx.update(mixes)
        .set({ ...input, isDemo: false })
        .where(eq(mixes.id, mixId))
        .run();
    else
      tx.insert(mixes)
        .values({ ...input, id: mixId, agencyId })
        .run();
    logPrices(
      tx,
      agencyId,
      userId,
      'mix',
      mixId,
      input.name,
      before ?? null,
      input,
      MIX_PRICE_FIELDS,
      input.priceEffectiveDate,
    );
    recordAudit(tx, {
      agencyId,
      userId,
      action: before ? 'catalog.mix.update' : 'catalog.mix.create',
      entity: 'mix',
      entityId: mixId,
      detail: { before: before ?? null, after: input },
    });
    return repo.toMix(tx.select().from(mixes).where(eq(mixes.id, mixId)).get()!);
  });
}

export function saveTreatment(deps: Deps, agencyId: string, userId: string, id: string | null, input: TreatmentInput) {
  if (input.mixId && !repo.mixRow(deps.db, agencyId, input.mixId)) {
    throw new HttpError(400, 'invalid_request', 'Invalid request: body.mixId — is not a mix of this agency', [
      { path: 'body.mixId', message: 'is not a mix of this agency' },
    ]);
  }
  return deps.db.transaction((tx) => {
    const beforeRow = id ? repo.treatmentRow(deps.db, agencyId, id) : null;
    if (id && !beforeRow) throw notFound('No such treatment');
    const before = beforeRow ? repo.toTreatment(beforeRow) : null;
    const tid = id ?? newId();
    const row = {
      ...input,
      costItems: JSON.stringify(input.costItems),
      effect: JSON.stringify(input.effect),
      applicability: JSON.stringify(input.applicability),
    };
    if (before)
      tx.update(treatments)
        .set({ ...row, isDemo: false })
        .where(eq(treatments.id, tid))
        .run();
    else
      tx.insert(treatments)
        .values({ ...row, id: tid, agencyId })
        .run();
    logPrices(
      tx,
      agencyId,
      userId,
      'treatment',
      tid,
      input.name,
      before,
      input,
      TREATMENT_PRICE_FIELDS,
      input.priceEffectiveDate,
    );
    recordAudit(tx, {
      agencyId,
      userId,
      action: before ? 'catalog.treatment.update' : 'catalog.treatment.create',
      entity: 'treatment',
      entityId: tid,
      detail: { before, after: input },
    });
    return repo.toTreatment(tx.select().from(treatments).where(eq(treatments.id, tid)).get()!);
  });
}

export function deleteMix(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    const row = repo.mixRow(deps.db, agencyId, id);
    if (!row) throw notFound('No such mix');
    const used = tx
      .select({ id: treatments.id, name: treatments.name })
      .from(treatments)
      .where(and(eq(treatments.agencyId, agencyId), eq(treatments.mixId, id)))
      .all();
    if (used.length)
      throw new HttpError(
        409,
        'in_use',
        `${row.name} is used by ${used.map((u) => u.name).join(', ')}; change those treatments first`,
      );
    tx.delete(mixes).where(eq(mixes.id, id)).run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'catalog.mix.delete',
      entity: 'mix',
      entityId: id,
      detail: { before: row },
    });
  });
}

export function deleteTreatment(deps: Deps, agencyId: string, userId: string, id: string) {
  deps.db.transaction((tx) => {
    const row = repo.treatmentRow(deps.db, agencyId, id);
    if (!row) throw notFound('No such treatment');
    tx.delete(treatments).where(eq(treatments.id, id)).run();
    recordAudit(tx, {
      agencyId,
      userId,
      action: 'catalog.treatment.delete',
      entity: 'treatment',
      entityId: id,
      detail: { before: repo.toTreatment(row) },
    });
  });
}

export function saveEconomics(deps: Deps, agencyId: string, userId: string, e: Economics) {
  deps.db.transaction((tx) => {
    const before = repo.economicsOf(deps.db, agencyId);
    tx.update(agencies).set(e).where(eq(agencies.id, agencyId)).run();
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
