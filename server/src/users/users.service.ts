import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
import type { CreateUserBody, UpdateUserBody, UserDto } from '@baytime/shared';
import { hashSecret } from '../auth/passwords.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail, isUniqueViolation } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { FloorService } from '../floor/floor.service.js';
import { users } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import type { Principal } from '../auth/principal.js';

type UserRow = typeof users.$inferSelect;

export function toUserDto(row: UserRow): UserDto {
  return {
    id: row.id,
    name: row.name,
    role: row.role,
    email: row.email,
    badge: row.badge,
    skillLevel: row.skillLevel,
    flatRateCents: row.flatRateCents,
    hourlyRateCents: row.hourlyRateCents,
    overtimeExempt: row.overtimeExempt,
    active: row.active,
  };
}

@Injectable()
export class UsersService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly floor: FloorService,
    private readonly live: LiveService,
  ) {}

  list(): UserDto[] {
    return this.db.select().from(users).orderBy(asc(users.name)).all().map(toUserDto);
  }

  async create(body: CreateUserBody, actor: Principal | null): Promise<UserDto> {
    const { password, pin, email, ...rest } = body;
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
      this.audit.record({ actorId: actor?.id ?? null, action: 'create', entity: 'user', entityId: row.id });
      this.floor.techniciansChanged();
      return toUserDto(row);
    });
  }

  async update(id: number, body: UpdateUserBody, actor: Principal): Promise<UserDto> {
    const current = foundOrFail(this.db.select().from(users).where(eq(users.id, id)).get(), 'User');
    if (Object.keys(body).length === 0) return toUserDto(current);
    if (body.active === false && id === actor.id)
      throw new ConflictException('You cannot deactivate your own account: ask another owner');
    if (body.role !== undefined && body.role !== current.role && id === actor.id)
      throw new ConflictException('You cannot change your own role: ask another owner');
    this.assertSignInFor(body.role ?? current.role, current, body);
    const { password, pin, email, ...rest } = body;
    const changes: Partial<typeof users.$inferInsert> = { ...rest };
    if (email !== undefined) changes.email = email.toLowerCase();
    if (password !== undefined) changes.passwordHash = await hashSecret(password);
    if (pin !== undefined) changes.pinHash = await hashSecret(pin);
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
      const row = this.updateOrConflict(id, changes);
      this.audit.record({
        actorId: actor.id,
        action: 'update',
        entity: 'user',
        entityId: id,
        detail: { fields, changes: changed },
      });
      this.floor.techniciansChanged();
      if (body.active === false) this.live.endSessions({ userId: id }, 'account-inactive');
      else if (body.role !== undefined && body.role !== current.role)
        this.live.endSessions({ userId: id }, 'role-changed');
      return toUserDto(row);
    });
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
