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
import type { Principal } from '../auth/principal.js';
import { PAY_RATE_FIELDS, PayRatesService } from '../payroll/pay-rates.service.js';
import { FIRST_RULES_FROM, ShopService } from '../shop/shop.service.js';

type UserRow = typeof users.$inferSelect;

function rateChanges(body: Partial<PayRate>): Partial<PayRate> {
  return Object.fromEntries(
    PAY_RATE_FIELDS.filter((field) => body[field] !== undefined).map((field) => [field, body[field]]),
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
  ) {}

  list(): UserDto[] {
    return this.db
      .select()
      .from(users)
      .orderBy(asc(users.name))
      .all()
      .map((row) => this.toDto(row));
  }

  /** A user with the rates in force today and every rate on record. */
  toDto(row: UserRow, now = new Date()): UserDto {
    const today = shopDayKey(now, this.shop.settings(now).timeZone);
    const {
      effectiveFrom: _from,
      recordedAt: _at,
      ...rate
    } = this.rates.ratesOn([row.id], today).get(row.id)!;
    return {
      id: row.id,
      name: row.name,
      role: row.role,
      email: row.email,
      badge: row.badge,
      skillLevel: row.skillLevel,
      ...rate,
      active: row.active,
      payRates: this.rates.history(row.id),
    };
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
      // A new technician's first rate covers every week on record unless the owner dates it.
      if (row.role === 'technician')
        this.rates.record(row.id, rate, effectiveFrom ?? FIRST_RULES_FROM, actor?.id ?? null);
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
    const { password, pin, email, effectiveFrom, ...rest } = body;
    const rate = rateChanges(rest);
    for (const field of PAY_RATE_FIELDS) delete rest[field];
    if (effectiveFrom !== undefined && Object.keys(rate).length === 0)
      throw new BadRequestException('effectiveFrom goes with a change of pay type, rate or overtime rule');
    if (Object.keys(rate).length > 0 && current.role !== 'technician')
      throw new BadRequestException('Only technicians have pay rates here');
    const changes: Partial<typeof users.$inferInsert> = { ...rest };
    if (email !== undefined) changes.email = email.toLowerCase();
    if (password !== undefined) changes.passwordHash = await hashSecret(password);
    if (pin !== undefined) changes.pinHash = await hashSecret(pin);
    const fields = Object.keys(body).map((key) =>
      key === 'password' || key === 'pin' ? `${key} (changed)` : key,
    );
    return this.uow.run(() => {
      const row = Object.keys(changes).length > 0 ? this.updateOrConflict(id, changes) : current;
      const from = effectiveFrom ?? this.rates.currentWeekStart();
      if (Object.keys(rate).length > 0) this.rates.record(id, rate, from, actor.id);
      this.audit.record({
        actorId: actor.id,
        action: 'update',
        entity: 'user',
        entityId: id,
        detail: { fields, ...(Object.keys(rate).length > 0 ? { rate, effectiveFrom: from } : {}) },
      });
      this.floor.techniciansChanged();
      return this.toDto(row);
    });
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
