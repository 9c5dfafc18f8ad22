import { asc, eq, or } from 'drizzle-orm';
import type { Db } from '../db/database.js';
import { users } from '../db/schema/index.js';
import { inIds, technicianIdsOf, type WeekFigures } from './week-figures.service.js';

/**
 * The people a week's labour report and pay summary list, by name: every technician on the books by the end
 * of the week who is still active, and anyone with figures in the week (or in `also`: adjustments) whatever
 * their role or state today. A technician made foreman keeps the weeks they worked: the shop's figures
 * (`shopSecondsOf`, the trend) count everyone with figures, and the shop total is the sum of these rows.
 */
export function reportPeople(
  db: Db,
  week: Pick<WeekFigures, 'to' | 'technicians' | 'flagged'>,
  also: Iterable<number> = [],
): { id: number; name: string }[] {
  const withFigures = new Set([...technicianIdsOf(week), ...also]);
  return db
    .select({ id: users.id, name: users.name, active: users.active, createdAt: users.createdAt })
    .from(users)
    .where(or(eq(users.role, 'technician'), inIds(users.id, [...withFigures])))
    .orderBy(asc(users.name), asc(users.id))
    .all()
    .filter((user) => withFigures.has(user.id) || (user.active && user.createdAt < week.to))
    .map(({ id, name }) => ({ id, name }));
}
