import { and, eq } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/common';
import type { Db } from '../db/client';
import { agencies, memberships } from '../db/schema';

export function membershipFor(db: Db, userId: string, agencyId: string): Role | null {
  const row = db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.agencyId, agencyId)))
    .get();
  return row?.role ?? null;
}

export function membershipsOf(db: Db, userId: string) {
  return db
    .select({ agencyId: agencies.id, agencyName: agencies.name, role: memberships.role })
    .from(memberships)
    .innerJoin(agencies, eq(agencies.id, memberships.agencyId))
    .where(eq(memberships.userId, userId))
    .orderBy(agencies.name)
    .all();
}

export function agencyById(db: Db, agencyId: string) {
  return db.select().from(agencies).where(eq(agencies.id, agencyId)).get() ?? null;
}
