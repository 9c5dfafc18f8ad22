import { ConflictException, Inject, Injectable } from '@nestjs/common';
import { eq, sql } from 'drizzle-orm';
import { workweekName, workweekOf } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { payWeeks } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';
import { closedWeekLabels } from './closed-week-days.js';

export type PayWeekRow = typeof payWeeks.$inferSelect;

/** Which pay weeks are closed, and the guard every change dated in one goes through. */
@Injectable()
export class ClosedWeeksService {
  /** Asked on every punch: prepared once. */
  private readonly weekRow;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {
    this.weekRow = db
      .select()
      .from(payWeeks)
      .where(eq(payWeeks.week, sql.placeholder('week')))
      .prepare();
  }

  /** The week's row when it is closed. */
  closed(week: string): PayWeekRow | undefined {
    const row = this.weekRow.get({ week });
    return row?.closedAt ? row : undefined;
  }

  /** When a week now open was first closed, if it was and has been reopened since. */
  firstClosedAt(week: string): Date | null {
    const row = this.weekRow.get({ week });
    return row && !row.closedAt ? (row.paidAt ?? null) : null;
  }

  /** Closed weeks, oldest first. */
  labels(): string[] {
    return closedWeekLabels(this.db);
  }

  /** 409 in plain words when `instant` falls in a closed pay week: `what` names the change ("That punch"). */
  assertOpenAt(instant: Date, what: string): void {
    const settings = this.shop.settings();
    const week = workweekOf(instant, settings);
    if (this.closed(week))
      throw new ConflictException(
        `${what} falls in the pay week ${workweekName(week, settings, true).replace(/^Week of /, 'of ')}, ` +
          'which is closed for pay: ask the owner to reopen it',
      );
  }
}
