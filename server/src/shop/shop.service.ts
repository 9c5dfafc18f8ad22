import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
import {
  FEDERAL_MINIMUM_WAGE_CENTS,
  PAY_RULE_FIELDS,
  shopDayKey,
  workweekDays,
  workweekName,
  workweekOf,
  type DatedPayRules,
  type LedgerRules,
  type LedgerSettings,
  type PayRules,
  type ShopSettings,
  type UpdateShopBody,
  type WorkweekSettings,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { Subject } from 'rxjs';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { earlierJobLimits, earlierLedgerRules, payRules, shopSettings } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import { closedWeeksMovedBy, firstClosedWeekFrom } from '../payroll/closed-week-days.js';

const WEEKDAY_HOURS = { open: '07:30', close: '17:30' };

/** A new shop's settings until the owner changes them. */
export const DEFAULT_SHOP: ShopSettings = {
  name: 'My shop',
  timeZone: 'America/Chicago',
  workweekStartDay: 0,
  workweekStartHour: 0,
  units: 'us',
  clockFormat: '12h',
  maxConcurrentJobs: 1,
  concurrentSplit: 'even',
  minimumWageCents: FEDERAL_MINIMUM_WAGE_CENTS,
  localMinimumWageCents: null,
  overtimeRules: 'federal',
  openingHours: [null, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, WEEKDAY_HOURS, null],
  kioskIdleSeconds: 60,
  payNonProductiveSeparately: true,
  minimumMealMinutes: 30,
  longShiftHours: 14,
  minimumClockedMinutesForDone: 6,
  minimumClockedHoursForEfficiency: 8,
  apportionSpanningLines: true,
  kioskShowsPay: true,
  techniciansTakeUnassigned: true,
  phone: null,
  labourRateCents: 0,
  taxNote: '',
  approvalLinkHours: 72,
};

/** The first pay rules of a shop apply from a day before any record. */
export const FIRST_RULES_FROM = '2000-01-01';

type SettingsRow = Omit<ShopSettings, keyof PayRules>;

const WORKWEEK_FIELDS: readonly (keyof WorkweekSettings)[] = [
  'workweekStartDay',
  'workweekStartHour',
  'timeZone',
];

const rulesOf = (settings: PayRules): PayRules => ({
  overtimeRules: settings.overtimeRules,
  minimumWageCents: settings.minimumWageCents,
  localMinimumWageCents: settings.localMinimumWageCents,
  payNonProductiveSeparately: settings.payNonProductiveSeparately,
});

@Injectable()
export class ShopService {
  /** Read on every request and every board refresh; only this service writes the rows. */
  private cachedRow: SettingsRow | null = null;
  /** The dated pay rules, oldest first. */
  private cachedRules: DatedPayRules[] | null = null;
  /** The last settings handed out, kept while neither their row nor their day's rules change. */
  private lastSettings: { row: SettingsRow; rules: DatedPayRules; settings: ShopSettings } | null = null;
  /** The ledger rules of before each change, oldest first. */
  private cachedEarlier: LedgerSettings['earlier'] | null = null;
  /** The jobs-at-once limit before each change of it, oldest first. */
  private cachedJobLimits: { until: number; maxConcurrentJobs: number }[] | null = null;
  /** The last ledger settings handed out, kept while the settings and the earlier rules stay the same. */
  private lastLedger: {
    settings: ShopSettings;
    earlier: LedgerSettings['earlier'];
    ledger: LedgerSettings;
  } | null = null;
  /** The settings as saved, once the change has committed. */
  readonly changed$ = new Subject<ShopSettings>();

  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
  ) {}

  /** The settings, with the pay rules in force today. */
  settings(now = new Date()): ShopSettings {
    const row = this.row();
    const rules = this.rulesFor(shopDayKey(now, row.timeZone));
    const last = this.lastSettings;
    if (last?.row === row && last.rules === rules) return last.settings;
    // A punch reads them a few dozen times: one shared object, frozen so no reader changes it for the rest.
    const settings = Object.freeze({ ...row, ...rules });
    this.lastSettings = { row, rules, settings };
    return settings;
  }

  /**
   * How punches are counted: the current ledger rules, with the earlier ones and until when each was in
   * force, so time is counted under the rules of its moment. Pass these to every ledger.
   */
  ledgerSettings(now = new Date()): LedgerSettings {
    const settings = this.settings(now);
    this.cachedEarlier ??= this.db
      .select()
      .from(earlierLedgerRules)
      .orderBy(asc(earlierLedgerRules.until))
      .all()
      .map((row) => ({ ...ledgerRulesOf(row), until: row.until.getTime() }));
    const last = this.lastLedger;
    if (last?.settings === settings && last.earlier === this.cachedEarlier) return last.ledger;
    const ledger = Object.freeze({ ...ledgerRulesOf(settings), earlier: this.cachedEarlier });
    this.lastLedger = { settings, earlier: this.cachedEarlier, ledger };
    return ledger;
  }

  /** The jobs-at-once limit in force at an instant: what a punch added for that moment is held to. */
  jobsAtOnceAt(at: Date): number {
    this.cachedJobLimits ??= this.db
      .select()
      .from(earlierJobLimits)
      .orderBy(asc(earlierJobLimits.until))
      .all()
      .map((row) => ({ until: row.until.getTime(), maxConcurrentJobs: row.maxConcurrentJobs }));
    const earlier = this.cachedJobLimits.find((limit) => at.getTime() < limit.until);
    return earlier?.maxConcurrentJobs ?? this.settings().maxConcurrentJobs;
  }

  /** The pay rules in force on a day ('YYYY-MM-DD' in the shop's zone). */
  rulesFor(day: string): DatedPayRules {
    const rules = this.rules();
    const found = rules.findLast((rule) => rule.effectiveFrom <= day);
    return found ?? rules[0] ?? { ...rulesOf(DEFAULT_SHOP), effectiveFrom: FIRST_RULES_FROM };
  }

  /** Every dated set of pay rules, oldest first. */
  payRulesHistory(): DatedPayRules[] {
    return [...this.rules()];
  }

  /** Creates the settings row and the first pay rules on first start; keeps existing ones as they are. */
  ensure(initial: Partial<ShopSettings> = {}): void {
    this.forget();
    const settings = { ...DEFAULT_SHOP, ...initial };
    this.db
      .insert(shopSettings)
      .values({ ...settings, id: 1, updatedAt: new Date() })
      .onConflictDoNothing()
      .run();
    if (this.rules().length === 0) this.saveRules(rulesOf(settings), FIRST_RULES_FROM, null);
  }

  @Transactional()
  update(body: UpdateShopBody, actor: Principal, now = new Date()): ShopSettings {
    this.ensure();
    const { payRulesFrom, ...changes } = body;
    if (Object.keys(changes).length === 0) return this.settings(now);
    const rulesChanged = PAY_RULE_FIELDS.some((field) => field in changes);
    const current = this.settings(now);
    const after = { ...current, ...changes };
    if (WORKWEEK_FIELDS.some((field) => field in changes)) {
      // 29 CFR 778.105 lets a shop change its workweek if the change is meant to last and not to evade overtime.
      // Every week's bounds follow the current settings, though, so a change that moved a closed week would count
      // the hours it paid again in the open weeks beside it.
      const moved = closedWeeksMovedBy(this.db, after);
      if (moved.length > 0) throw new ConflictException(workweekRefusal(moved, current));
    }
    if (rulesChanged) {
      // A change of rules counts from the start of the running workweek unless the owner dates it.
      const from = payRulesFrom ?? workweekDays(workweekOf(now, after), after)[0]!.day;
      const rules = { ...this.rulesFor(from), ...pick(changes) };
      if (rules.overtimeRules === 'california' && rules.minimumWageCents <= FEDERAL_MINIMUM_WAGE_CENTS)
        throw new BadRequestException(
          'California rules need the state minimum wage: set it above the federal $7.25 first',
        );
      const closed = firstClosedWeekFrom(this.db, from, after);
      if (closed)
        throw new ConflictException(
          `Those rules would change the ${closed} pay week, which is closed: date them after it, or reopen it`,
        );
      this.saveRules(rules, from, actor.id);
    }
    const before = ledgerRulesOf(current);
    const ledgerChanged = (Object.keys(before) as (keyof LedgerRules)[]).some(
      (field) => field in changes && changes[field] !== before[field],
    );
    if (ledgerChanged)
      this.db
        .insert(earlierLedgerRules)
        .values({ ...before, until: now })
        .run();
    if (changes.maxConcurrentJobs !== undefined && changes.maxConcurrentJobs !== current.maxConcurrentJobs)
      this.db
        .insert(earlierJobLimits)
        .values({ maxConcurrentJobs: current.maxConcurrentJobs, until: now })
        .run();
    const rowChanges = Object.fromEntries(
      Object.entries(changes).filter(([key]) => !(PAY_RULE_FIELDS as readonly string[]).includes(key)),
    );
    this.db
      .update(shopSettings)
      .set({ ...rowChanges, updatedAt: now })
      .where(eq(shopSettings.id, 1))
      .run();
    this.forget();
    this.audit.record({ actorId: actor.id, action: 'update', entity: 'shop', entityId: 1, detail: body });
    this.uow.afterCommit(() => {
      this.forget();
      this.changed$.next(this.settings());
      // Every kiosk takes the split rule and idle sign-out from the settings.
      this.live.publish('shop.updated', { shop: this.settings() }, { to: 'everyone' });
    });
    return this.settings(now);
  }

  private saveRules(rules: PayRules, effectiveFrom: string, actorId: number | null): void {
    const values = { ...rulesOf(rules), effectiveFrom, recordedAt: new Date(), recordedBy: actorId };
    this.db
      .insert(payRules)
      .values(values)
      .onConflictDoUpdate({ target: payRules.effectiveFrom, set: values })
      .run();
    this.cachedRules = null;
  }

  private row(): SettingsRow {
    if (this.cachedRow) return this.cachedRow;
    const row = this.db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
    if (!row) return DEFAULT_SHOP;
    const { id: _id, updatedAt: _updatedAt, ...settings } = row;
    this.cachedRow = settings;
    return settings;
  }

  private rules(): DatedPayRules[] {
    this.cachedRules ??= this.db
      .select()
      .from(payRules)
      .orderBy(asc(payRules.effectiveFrom))
      .all()
      .map((row) => ({ ...rulesOf(row), effectiveFrom: row.effectiveFrom }));
    return this.cachedRules;
  }

  private forget(): void {
    this.cachedRow = null;
    this.cachedRules = null;
    this.cachedEarlier = null;
    this.cachedJobLimits = null;
  }
}

const ledgerRulesOf = (rules: LedgerRules): LedgerRules => ({
  concurrentSplit: rules.concurrentSplit,
  minimumMealMinutes: rules.minimumMealMinutes,
});

function pick(changes: Partial<ShopSettings>): Partial<PayRules> {
  return Object.fromEntries(
    PAY_RULE_FIELDS.filter((field) => field in changes).map((field) => [field, changes[field]]),
  );
}

function workweekRefusal(moved: string[], current: WorkweekSettings): string {
  const others = moved.length - 1;
  const before = others === 0 ? '' : ` and ${others} closed ${others === 1 ? 'week' : 'weeks'} before it`;
  return (
    'The workweek cannot change while pay weeks are closed under the current one: the closed ' +
    `${workweekName(moved[0]!, current, true)}${before} ` +
    'would move, and hours already paid could be counted twice. ' +
    `Reopen ${others > 0 ? 'those weeks' : 'it'} first, or keep the current start day, hour and time zone`
  );
}
