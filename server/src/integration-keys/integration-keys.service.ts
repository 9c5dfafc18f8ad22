import {
  ConflictException,
  ForbiddenException,
  HttpException,
  HttpStatus,
  Inject,
  Injectable,
  UnauthorizedException,
} from '@nestjs/common';
import { ThrottlerStorageService } from '@nestjs/throttler';
import { and, desc, eq, isNull } from 'drizzle-orm';
import { createHash, randomBytes } from 'node:crypto';
import {
  INTEGRATION_KEY_PREFIX,
  type CreateIntegrationKeyBody,
  type CreatedIntegrationKey,
  type IntegrationKeyDto,
  type IntegrationScope,
} from '@baytime/shared';
import { AuditService } from '../audit/audit.service.js';
import type { Principal } from '../auth/principal.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { integrationKeys, users } from '../db/schema/index.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';

/** Calls one key may make in a minute: a nightly sync of a busy shop fits, a runaway loop does not. */
export const KEY_CALLS_PER_MINUTE = 120;
const MINUTE_MS = 60_000;

export const KEY_THROTTLE = Symbol('integration key throttle');

/** 256 random bits: a fast hash is enough to keep, since the key cannot be guessed (common practice). */
function hashKey(secret: string): string {
  return createHash('sha256').update(secret).digest('hex');
}

type KeyRow = typeof integrationKeys.$inferSelect;

@Injectable()
export class IntegrationKeysService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    @Inject(KEY_THROTTLE) private readonly throttle: ThrottlerStorageService,
  ) {}

  list(): IntegrationKeyDto[] {
    return this.withCreator()
      .orderBy(desc(integrationKeys.createdAt), desc(integrationKeys.id))
      .all()
      .map(({ key, createdByName }) => toDto(key, createdByName));
  }

  /** A revoked key's name is free again: a key is replaced by revoking it and making one of the same name. */
  @Transactional()
  create(body: CreateIntegrationKeyBody, actor: Principal, now = new Date()): CreatedIntegrationKey {
    const taken = this.db
      .select({ id: integrationKeys.id })
      .from(integrationKeys)
      .where(and(eq(integrationKeys.name, body.name), isNull(integrationKeys.revokedAt)))
      .get();
    if (taken) throw new ConflictException('A key in use already has that name');
    const secret = `${INTEGRATION_KEY_PREFIX}${randomBytes(32).toString('base64url')}`;
    const row = this.db
      .insert(integrationKeys)
      .values({
        name: body.name,
        scopes: body.scopes,
        hint: secret.slice(0, INTEGRATION_KEY_PREFIX.length + 6),
        secretHash: hashKey(secret),
        createdBy: actor.id,
        createdAt: now,
      })
      .returning()
      .get();
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'integration-key',
      entityId: row.id,
      detail: { name: row.name, scopes: row.scopes },
    });
    return { key: toDto(row, actor.name), secret };
  }

  @Transactional()
  revoke(id: number, actor: Principal, now = new Date()): IntegrationKeyDto {
    const { key: row, createdByName } = foundOrFail(
      this.withCreator().where(eq(integrationKeys.id, id)).get(),
      'Integration key',
    );
    if (row.revokedAt) return toDto(row, createdByName);
    const revoked = this.db
      .update(integrationKeys)
      .set({ revokedAt: now })
      .where(eq(integrationKeys.id, id))
      .returning()
      .get()!;
    this.audit.record({
      actorId: actor.id,
      action: 'revoke',
      entity: 'integration-key',
      entityId: id,
      detail: { name: row.name },
    });
    return toDto(revoked, createdByName);
  }

  private withCreator() {
    return this.db
      .select({ key: integrationKeys, createdByName: users.name })
      .from(integrationKeys)
      .leftJoin(users, eq(users.id, integrationKeys.createdBy));
  }

  /**
   * The caller behind an integration key, for a route that lets keys in with `scope`. Refuses an unknown
   * or revoked key (401), a route keys may not call or a scope the key lacks (403), and a key past its
   * calls per minute (429). Each admitted call is audited under the key's name and dates its last use.
   */
  async admit(
    secret: string,
    scope: IntegrationScope | undefined,
    call: { method: string; path: string },
  ): Promise<Principal> {
    const key = this.db
      .select()
      .from(integrationKeys)
      .where(eq(integrationKeys.secretHash, hashKey(secret)))
      .get();
    if (!key || key.revokedAt) throw new UnauthorizedException('That integration key is unknown or revoked');
    if (!scope) throw new ForbiddenException('An integration key cannot do that');
    if (!key.scopes.includes(scope)) throw new ForbiddenException(`This key lacks the ${scope} scope`);
    const hits = await this.throttle.increment(
      `integration-key:${key.id}`,
      MINUTE_MS,
      KEY_CALLS_PER_MINUTE,
      MINUTE_MS,
      'integration-key',
    );
    if (hits.isBlocked)
      throw new HttpException(
        `This key made more than ${KEY_CALLS_PER_MINUTE} calls in a minute. Try again in ${hits.timeToBlockExpire} s.`,
        HttpStatus.TOO_MANY_REQUESTS,
      );
    this.recordCall(key, call);
    return {
      id: key.createdBy,
      name: key.name,
      role: 'owner',
      integrationKey: { id: key.id, name: key.name },
    };
  }

  @Transactional()
  private recordCall(key: KeyRow, call: { method: string; path: string }, now = new Date()): void {
    this.db.update(integrationKeys).set({ lastUsedAt: now }).where(eq(integrationKeys.id, key.id)).run();
    this.audit.record({
      actorId: null,
      action: 'call',
      entity: 'integration-key',
      entityId: key.id,
      detail: { integrationKey: key.name, method: call.method, path: call.path },
    });
  }
}

function toDto(row: KeyRow, createdByName: string | null): IntegrationKeyDto {
  return {
    id: row.id,
    name: row.name,
    scopes: row.scopes,
    hint: row.hint,
    createdAt: row.createdAt.toISOString(),
    createdByName,
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}
