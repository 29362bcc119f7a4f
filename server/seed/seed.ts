import { hashPassword, DEMO_PASSWORD } from '../auth/passwords';
import { newId } from '../auth/tokens';
import type { Db, Sqlite } from '../db/client';
import { agencies, memberships, mixes, segments, surveys, treatments, users } from '../db/schema';
import { DEMO_ECONOMICS, DEMO_MIXES, DEMO_TREATMENTS } from './demo-catalog';
import { brannockCounty, cityOfMarlow, type DemoSegment } from './demo-network';

export const DEMO_ACCOUNTS = [
  { email: 'admin@brannock.example', name: 'Dana Whitlock', note: 'admin, Brannock County' },
  { email: 'engineer@brannock.example', name: 'Ruben Osei', note: 'engineer, Brannock County' },
  { email: 'viewer@brannock.example', name: 'Commissioner Ada Pruitt', note: 'viewer, Brannock County' },
  { email: 'admin@marlow.example', name: 'Lena Marsh', note: 'admin, City of Marlow' },
  { email: 'engineer@marlow.example', name: 'Theo Banks', note: 'engineer, City of Marlow' },
  { email: 'consultant@example.com', name: 'Priya Nandakumar', note: 'engineer in both agencies' },
] as const;

export function hasAnyAgency(db: Db) {
  return !!db.select({ id: agencies.id }).from(agencies).limit(1).get();
}

function insertNetwork(db: Db, agencyId: string, network: DemoSegment[]) {
  for (const s of network) {
    const latest = s.surveys.at(-1);
    const row = db
      .insert(segments)
      .values({
        agencyId,
        segmentId: s.segmentId,
        roadName: s.roadName,
        fromDesc: s.fromDesc,
        toDesc: s.toDesc,
        lengthMi: s.lengthMi,
        widthFt: s.widthFt,
        lanes: s.lanes,
        functionalClass: s.functionalClass,
        surface: s.surface,
        adt: s.adt,
        truckPct: s.truckPct,
        district: s.district,
        lastTreatment: s.lastTreatment,
        lastTreatmentYear: s.lastTreatmentYear,
        pci: latest?.pci ?? null,
        pciDate: latest?.surveyDate ?? null,
        geometry: JSON.stringify(s.geometry),
      })
      .returning({ id: segments.id })
      .get();
    for (const v of s.surveys) {
      db.insert(surveys)
        .values({ agencyId, segmentRef: row.id, surveyDate: v.surveyDate, pci: v.pci, source: 'demo survey' })
        .run();
    }
  }
}

function insertCatalog(db: Db, agencyId: string) {
  const ids: Record<string, string> = {};
  for (const { key, ...m } of DEMO_MIXES) {
    ids[key] = newId();
    db.insert(mixes)
      .values({ ...m, id: ids[key], agencyId, isDemo: true })
      .run();
  }
  for (const { mixKey, ...t } of DEMO_TREATMENTS) {
    db.insert(treatments)
      .values({
        ...t,
        id: newId(),
        agencyId,
        mixId: mixKey ? ids[mixKey] : null,
        isDemo: true,
      })
      .run();
  }
}

/** Seeds the demo agencies, accounts and networks into an empty database. */
export async function seedDemo(db: Db) {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const brannock = newId();
  const marlow = newId();
  const ids = Object.fromEntries(DEMO_ACCOUNTS.map((a) => [a.email, newId()]));
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    t.insert(agencies)
      .values([
        {
          id: brannock,
          name: 'Brannock County',
          kind: 'county',
          state: 'demo',
          baseYear: 2027,
          discountRate: 0.02,
          discountRateSource: 'Demo value — cite your own (e.g. OMB Circular A-94 Appendix C real rate)',
          analysisPeriodYears: 40,
          ...DEMO_ECONOMICS,
        },
        {
          id: marlow,
          name: 'City of Marlow',
          kind: 'city',
          state: 'demo',
          baseYear: 2027,
          discountRate: 0.02,
          discountRateSource: 'Demo value — cite your own (e.g. OMB Circular A-94 Appendix C real rate)',
          analysisPeriodYears: 35,
          ...DEMO_ECONOMICS,
        },
      ])
      .run();
    t.insert(users)
      .values(
        DEMO_ACCOUNTS.map((a) => ({ id: ids[a.email], email: a.email, name: a.name, passwordHash, isDemo: true })),
      )
      .run();
    t.insert(memberships)
      .values([
        { agencyId: brannock, userId: ids['admin@brannock.example'], role: 'admin' },
        { agencyId: brannock, userId: ids['engineer@brannock.example'], role: 'engineer' },
        { agencyId: brannock, userId: ids['viewer@brannock.example'], role: 'viewer' },
        { agencyId: marlow, userId: ids['admin@marlow.example'], role: 'admin' },
        { agencyId: marlow, userId: ids['engineer@marlow.example'], role: 'engineer' },
        { agencyId: brannock, userId: ids['consultant@example.com'], role: 'engineer' },
        { agencyId: marlow, userId: ids['consultant@example.com'], role: 'engineer' },
      ])
      .run();
    insertNetwork(t, brannock, brannockCounty());
    insertNetwork(t, marlow, cityOfMarlow());
    insertCatalog(t, brannock);
    insertCatalog(t, marlow);
  });
  return { brannock, marlow };
}

/** Empties every table (for `npm run seed -- --reset`). */
export function wipe(sqlite: Sqlite) {
  const tables = sqlite
    .prepare(
      "SELECT name FROM sqlite_master WHERE type='table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%'",
    )
    .all() as { name: string }[];
  sqlite.pragma('foreign_keys = OFF');
  sqlite.transaction(() => {
    for (const t of tables) sqlite.exec(`DELETE FROM "${t.name}"`);
  })();
  sqlite.pragma('foreign_keys = ON');
}
