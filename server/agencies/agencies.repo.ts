import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { agencies } from '../db/schema';

export function agencyById(db: Pick<Db, 'select'>, agencyId: string) {
  return db.select().from(agencies).where(eq(agencies.id, agencyId)).get() ?? null;
}

export function updateAgency(
  tx: Pick<Db, 'update'>,
  agencyId: string,
  set: Partial<Pick<typeof agencies.$inferInsert, 'name' | 'units'>>,
) {
  tx.update(agencies).set(set).where(eq(agencies.id, agencyId)).run();
}
