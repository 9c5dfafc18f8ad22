import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
import {
  shopDayKey,
  type CreateUserBody,
  type PayRate,
  type UpdateUserBody,
  type UserDto,
} from '@baytime/shared';
import { hashSecret } from '../auth/passwords.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail, isUniqueViolation } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { FloorService } from '../floor/floor.service.js';
import { users } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import type { Principal } from '../auth/principal.js';
import { PAY_RATE_FIELDS, PayRatesService } from '../payroll/pay-rates.service.js';
import { FIRST_RULES_FROM, ShopService } from '../shop/shop.service.js';

type UserRow = typeof users.$inferSelect;

/** The rate fields given that differ from `current` (all given ones when there is none). */
function rateChanges(body: Partial<PayRate>, current?: PayRate): Partial<PayRate> {
  return Object.fromEntries(
    PAY_RATE_FIELDS.filter((field) => body[field] !== undefined && body[field] !== current?.[field]).map(
      (field) => [field, body[field]],
    ),
  );
}

@Injectable()
export class UsersService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly floor: FloorService,
    private readonly rates: PayRatesService,
    private readonly shop: ShopService,
    private readonly live: LiveService,
  ) {}

  list(): UserDto[] {
    return this.toDtos(this.db.select().from(users).orderBy(asc(users.name)).all());
  }

  /** A user with the rates in force today and every rate on record. */
  toDto(row: UserRow, now = new Date()): UserDto {
    return this.toDtos([row], now)[0]!;
  }

  /** Users with their rates today and on record, read together: one day, two queries, however many. */
  private toDtos(rows: readonly UserRow[], now = new Date()): UserDto[] {
    const ids = rows.map((row) => row.id);
    const today = shopDayKey(now, this.shop.settings(now).timeZone);
    const ratesToday = this.rates.ratesOn(ids, today);
    const histories = this.rates.histories(ids);
    return rows.map((row) => {
      const { effectiveFrom: _from, recordedAt: _at, ...rate } = ratesToday.get(row.id)!;
      return {
        id: row.id,
        name: row.name,
        role: row.role,
        email: row.email,
        badge: row.badge,
        skillLevel: row.skillLevel,
        ...rate,
        active: row.active,
        payRates: histories.get(row.id) ?? [],
      };
    });
  }

  async create(body: CreateUserBody, actor: Principal | null): Promise<UserDto> {
    const { password, pin, email, effectiveFrom, ...rest } = body;
    const rate = rateChanges(rest);
    for (const field of PAY_RATE_FIELDS) delete rest[field];
    const secrets = {
      passwordHash: password ? await hashSecret(password) : null,
      pinHash: pin ? await hashSecret(pin) : null,
    };
    return this.uow.run(() => {
      const row = this.insertOrConflict({
        ...rest,
        ...secrets,
        email: email?.toLowerCase() ?? null,
        createdAt: new Date(),
      });
      // A new technician's first rate covers every week on record unless the owner dates it. They have no hours
      // in any week yet, so a closed week does not refuse it.
      if (row.role === 'technician')
        this.rates.recordFirst(row.id, rate, effectiveFrom ?? FIRST_RULES_FROM, actor?.id ?? null);
      this.audit.record({ actorId: actor?.id ?? null, action: 'create', entity: 'user', entityId: row.id });
      this.floor.techniciansChanged();
      return this.toDto(row);
    });
  }

  async update(id: number, body: UpdateUserBody, actor: Principal): Promise<UserDto> {
    const current = foundOrFail(this.db.select().from(users).where(eq(users.id, id)).get(), 'User');
    if (Object.keys(body).length === 0) return this.toDto(current);
    if (body.active === false && id === actor.id)
      throw new ConflictException('You cannot deactivate your own account: ask another owner');
    if (body.role !== undefined && body.role !== current.role && id === actor.id)
      throw new ConflictException('You cannot change your own role: ask another owner');
    this.assertSignInFor(body.role ?? current.role, current, body);
    const { password, pin, email, effectiveFrom, ...rest } = body;
    if (Object.keys(rateChanges(rest)).length > 0 && (body.role ?? current.role) !== 'technician')
      throw new BadRequestException('Only technicians have pay rates here');
    // A rate as it already stands from that day is no change: nothing is recorded for it.
    const from = effectiveFrom ?? this.rates.currentWeekStart();
    const rate = rateChanges(rest, this.rates.ratesOn([id], from).get(id));
    for (const field of PAY_RATE_FIELDS) delete rest[field];
    if (effectiveFrom !== undefined && Object.keys(rate).length === 0)
      throw new BadRequestException('effectiveFrom goes with a change of pay type, rate or overtime rule');
    const changes: Partial<typeof users.$inferInsert> = { ...rest };
    if (email !== undefined) changes.email = email.toLowerCase();
    if (password !== undefined) changes.passwordHash = await hashSecret(password);
    if (pin !== undefined) changes.pinHash = await hashSecret(pin);
    // A new secret is the answer to a leaked one: every sign-in made with the old one ends.
    if (password !== undefined || pin !== undefined) changes.credentialsChangedAt = new Date();
    const fields = Object.keys(body).map((key) =>
      key === 'password' || key === 'pin' ? `${key} (changed)` : key,
    );
    // What each plain field was and became; secrets are only said to have changed.
    const changed = Object.fromEntries(
      Object.entries(rest)
        .filter(([key, value]) => current[key as keyof UserRow] !== value)
        .map(([key, value]) => [key, { from: current[key as keyof UserRow], to: value }]),
    );
    return this.uow.run(() => {
      // Here, after the awaits: a punch may have come in while a PIN or password was hashed.
      this.assertOffShiftToLeaveFloor(current, body);
      const row = Object.keys(changes).length > 0 ? this.updateOrConflict(id, changes) : current;
      if (Object.keys(rate).length > 0) this.rates.record(id, rate, from, actor.id);
      this.audit.record({
        actorId: actor.id,
        action: 'update',
        entity: 'user',
        entityId: id,
        detail: {
          fields,
          changes: changed,
          ...(Object.keys(rate).length > 0 ? { rate, effectiveFrom: from } : {}),
        },
      });
      this.floor.techniciansChanged();
      if (body.active === false) this.live.endSessions({ userId: id }, 'account-inactive');
      else if (body.role !== undefined && body.role !== current.role)
        this.live.endSessions({ userId: id }, 'role-changed');
      else if (changes.credentialsChangedAt) this.live.endSessions({ userId: id }, 'credentials-changed');
      return this.toDto(row);
    });
  }

  /**
   * A technician leaves the floor (deactivated, or given another role) only off shift: the floor would
   * drop them with their shift and jobs still running. Refused rather than clocked out now, since only the
   * office knows when they really stopped working.
   */
  private assertOffShiftToLeaveFloor(current: UserRow, body: UpdateUserBody): void {
    const leaves = body.active === false || (body.role !== undefined && body.role !== 'technician');
    if (!leaves || current.role !== 'technician') return;
    const state = this.floor.stateOf(current.id, new Date());
    if (state && state.status !== 'off')
      throw new ConflictException(
        `${current.name} is on shift: clock them out at the kiosk or on their timecard first`,
      );
  }

  /** A technician signs in with a badge and PIN, office staff with an e-mail and password. */
  private assertSignInFor(role: UserRow['role'], current: UserRow, body: UpdateUserBody): void {
    const missing = (path: string, message: string) =>
      new BadRequestException({ statusCode: 400, message, issues: [{ path: [path], message }] });
    if (role === 'technician') {
      if (!(body.badge ?? current.badge)) throw missing('badge', 'A technician needs a badge');
      if (!body.pin && !current.pinHash) throw missing('pin', 'A technician needs a PIN');
    } else if (role !== 'display') {
      if (!(body.email ?? current.email)) throw missing('email', 'Office staff need an e-mail');
      if (!body.password && !current.passwordHash) throw missing('password', 'Office staff need a password');
    }
  }

  private insertOrConflict(values: typeof users.$inferInsert): UserRow {
    try {
      return this.db.insert(users).values(values).returning().get();
    } catch (error) {
      throw isUniqueViolation(error)
        ? new ConflictException('That e-mail or badge is already in use')
        : error;
    }
  }

  private updateOrConflict(id: number, changes: Partial<typeof users.$inferInsert>): UserRow {
    try {
      return this.db.update(users).set(changes).where(eq(users.id, id)).returning().get();
    } catch (error) {
      throw isUniqueViolation(error)
        ? new ConflictException('That e-mail or badge is already in use')
        : error;
    }
  }
}
