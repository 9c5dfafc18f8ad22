import { isNotNull, sql } from 'drizzle-orm';
import { workweekBounds, workweekDays, workweekName, type WorkweekSettings } from '@baytime/shared';
import type { Db } from '../db/database.js';
import { payWeeks } from '../db/schema/index.js';

/** Labels of the closed pay weeks, oldest first. */
export function closedWeekLabels(db: Db): string[] {
  return db
    .select({ week: payWeeks.week })
    .from(payWeeks)
    .where(isNotNull(payWeeks.closedAt))
    .all()
    .map((row) => row.week)
    .sort();
}

/**
 * The name of the earliest closed pay week that begins on or after `day` ('YYYY-MM-DD' in the shop's zone),
 * or null: a rate or rule dated `day` would change that week's pay.
 */
export function firstClosedWeekFrom(db: Db, day: string, settings: WorkweekSettings): string | null {
  const week = closedWeekLabels(db).find((label) => workweekDays(label, settings)[0]!.day >= day);
  return week ? workweekName(week, settings, true) : null;
}

/**
 * Labels of the closed pay weeks, latest first, that would not keep the bounds they were closed with under the
 * workweek `settings`: their paid hours would then fall partly in other weeks.
 */
export function closedWeeksMovedBy(db: Db, settings: WorkweekSettings): string[] {
  return db
    .select({
      week: payWeeks.week,
      from: sql<string>`json_extract(${payWeeks.snapshot}, '$.report.from')`,
      to: sql<string>`json_extract(${payWeeks.snapshot}, '$.report.to')`,
    })
    .from(payWeeks)
    .where(isNotNull(payWeeks.closedAt))
    .all()
    .filter(({ week, from, to }) => {
      const bounds = workweekBounds(week, settings);
      return bounds.from.toISOString() !== from || bounds.to.toISOString() !== to;
    })
    .map((row) => row.week)
    .sort()
    .reverse();
}
