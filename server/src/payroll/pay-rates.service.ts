import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { desc, inArray } from 'drizzle-orm';
import { workweekDays, workweekOf, type DatedPayRate, type PayRate } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { payRates } from '../db/schema/index.js';
import { FIRST_RULES_FROM, ShopService } from '../shop/shop.service.js';
import { firstClosedWeekFrom } from './closed-week-days.js';

export const PAY_RATE_FIELDS = [
  'payType',
  'flatRateCents',
  'hourlyRateCents',
  'guaranteeCents',
  'overtimeExempt',
] as const satisfies readonly (keyof PayRate)[];

const NO_RATE: DatedPayRate = {
  payType: 'flat-rate',
  flatRateCents: 0,
  hourlyRateCents: 0,
  guaranteeCents: 0,
  overtimeExempt: false,
  effectiveFrom: FIRST_RULES_FROM,
  recordedAt: new Date(0).toISOString(),
};

const toDated = (row: typeof payRates.$inferSelect): DatedPayRate => ({
  payType: row.payType,
  flatRateCents: row.flatRateCents,
  hourlyRateCents: row.hourlyRateCents,
  guaranteeCents: row.guaranteeCents,
  overtimeExempt: row.overtimeExempt,
  effectiveFrom: row.effectiveFrom,
  recordedAt: row.recordedAt.toISOString(),
});

/**
 * Technicians' rates, each in force from its date (a day in the shop's zone) until the next. A workweek is
 * paid with the rates in force on its first day: a rate dated in the middle of a week applies from the next.
 */
@Injectable()
export class PayRatesService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {}

  /** Every rate of each user, newest first. */
  histories(userIds: readonly number[]): Map<number, DatedPayRate[]> {
    const result = new Map<number, DatedPayRate[]>(userIds.map((id) => [id, []]));
    if (userIds.length === 0) return result;
    for (const row of this.db
      .select()
      .from(payRates)
      .where(inArray(payRates.userId, [...userIds]))
      .orderBy(desc(payRates.effectiveFrom))
      .all())
      result.get(row.userId)!.push(toDated(row));
    return result;
  }

  /** Each user's rate in force on `day`. */
  ratesOn(userIds: readonly number[], day: string): Map<number, DatedPayRate> {
    const result = new Map<number, DatedPayRate>(userIds.map((id) => [id, NO_RATE]));
    if (userIds.length === 0) return result;
    const rows = this.db
      .select()
      .from(payRates)
      .where(inArray(payRates.userId, [...userIds]))
      .orderBy(payRates.effectiveFrom)
      .all();
    for (const row of rows) if (row.effectiveFrom <= day) result.set(row.userId, toDated(row));
    return result;
  }

  /** The first day of the running workweek: a change of rate with no date counts from it. */
  currentWeekStart(now = new Date()): string {
    const settings = this.shop.settings(now);
    return workweekDays(workweekOf(now, settings), settings)[0]!.day;
  }

  /**
   * Records `changes` on top of the rate in force on `effectiveFrom`. Refused when a closed pay week begins
   * on or after that day: a closed week never changes.
   */
  record(
    userId: number,
    changes: Partial<PayRate>,
    effectiveFrom: string,
    actorId: number | null,
    now = new Date(),
  ): DatedPayRate {
    const rate = this.withChanges(userId, changes, effectiveFrom);
    const closed = firstClosedWeekFrom(this.db, effectiveFrom, this.shop.settings(now));
    if (closed)
      throw new ConflictException(
        `That rate would change the ${closed} pay week, which is closed: date it after that week, or reopen it`,
      );
    return this.save(userId, rate, effectiveFrom, actorId, now);
  }

  /**
   * The first rate of a technician added in the same use case. They have no hours in any week yet (a closed
   * week refuses punches and corrections dated in it), so however far back it is dated it changes no closed
   * week's pay: no closed week refuses it.
   */
  recordFirst(
    userId: number,
    rate: Partial<PayRate>,
    effectiveFrom: string,
    actorId: number | null,
    now = new Date(),
  ): DatedPayRate {
    return this.save(userId, this.withChanges(userId, rate, effectiveFrom), effectiveFrom, actorId, now);
  }

  /** `changes` on top of the rate in force on `effectiveFrom`, checked. */
  private withChanges(userId: number, changes: Partial<PayRate>, effectiveFrom: string): PayRate {
    const rate = { ...this.ratesOn([userId], effectiveFrom).get(userId)!, ...changes };
    if (rate.payType === 'flat-rate-guarantee' && rate.guaranteeCents <= 0)
      throw new BadRequestException('A flat rate with an hourly guarantee needs the guarantee');
    return rate;
  }

  private save(
    userId: number,
    rate: PayRate,
    effectiveFrom: string,
    actorId: number | null,
    now: Date,
  ): DatedPayRate {
    const values = {
      userId,
      effectiveFrom,
      payType: rate.payType,
      flatRateCents: rate.flatRateCents,
      hourlyRateCents: rate.hourlyRateCents,
      guaranteeCents: rate.guaranteeCents,
      overtimeExempt: rate.overtimeExempt,
      recordedAt: now,
      recordedBy: actorId,
    };
    const row = this.db
      .insert(payRates)
      .values(values)
      .onConflictDoUpdate({ target: [payRates.userId, payRates.effectiveFrom], set: values })
      .returning()
      .get();
    return toDated(row);
  }
}
