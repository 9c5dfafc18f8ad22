import { and, eq } from 'drizzle-orm';
import { referencedOrFail } from '../common/not-found.js';
import type { Db } from '../db/database.js';
import { bays } from '../db/schema/index.js';

/** The bay a request body names, when it exists and is in use; 400 otherwise. */
export function referencedBay(db: Db, bayId: number): typeof bays.$inferSelect {
  return referencedOrFail(
    db
      .select()
      .from(bays)
      .where(and(eq(bays.id, bayId), eq(bays.active, true)))
      .get(),
    'active bay',
  );
}
