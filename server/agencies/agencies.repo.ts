import { eq } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/common';
import type { Db } from '../db/client';
import { statement } from '../db/statements';
import { agencies, memberships } from '../db/schema';

export function membershipFor(db: Db, userId: string, agencyId: string): Role | null {
  // Asked on every agency request: a cached prepared statement rather than the query builder.
  const row = statement(db.$client, 'SELECT role FROM memberships WHERE user_id = ? AND agency_id = ?').get(
    userId,
    agencyId,
  ) as { role: Role } | undefined;
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
