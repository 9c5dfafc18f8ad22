import { Inject, Injectable } from '@nestjs/common';
import { asc, eq, isNull } from 'drizzle-orm';
import type { CreateScreenBody, ScreenPairing } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { screens } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import { hashPairingCode, newPairingCode } from './pairing-code.js';

const PAIRING_CODE_LIFETIME_MS = 30 * 60_000;

export interface ScreenDto {
  id: number;
  name: string;
  pairedAt: string | null;
  lastSeenAt: string | null;
  revokedAt: string | null;
  pairingExpiresAt: string | null;
}

const iso = (date: Date | null) => date?.toISOString() ?? null;

@Injectable()
export class ScreensService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
  ) {}

  list(): ScreenDto[] {
    return this.db
      .select()
      .from(screens)
      .orderBy(asc(screens.id))
      .all()
      .map((row) => ({
        id: row.id,
        name: row.name,
        pairedAt: iso(row.pairedAt),
        lastSeenAt: iso(row.lastSeenAt),
        revokedAt: iso(row.revokedAt),
        pairingExpiresAt: iso(row.pairingExpiresAt),
      }));
  }

  /** A new screen with a one-time code, shown once: only its hash is kept. */
  @Transactional()
  create({ name }: CreateScreenBody, actor: Principal | null): ScreenPairing {
    const row = this.db
      .insert(screens)
      .values({ name, createdBy: actor?.id ?? null, createdAt: new Date() })
      .returning()
      .get();
    this.audit.record({ actorId: actor?.id ?? null, action: 'create', entity: 'screen', entityId: row.id });
    return this.newCode(row.id);
  }

  /**
   * A code for the first wall screen of a new shop: 'paired' once one is, 'pending' while a code
   * made earlier still works. An unpaired screen gets a fresh code rather than a new screen joining
   * it at every start.
   */
  @Transactional()
  firstScreenCode(name: string, now = new Date()): ScreenPairing | 'paired' | 'pending' {
    const current = this.db.select().from(screens).where(isNull(screens.revokedAt)).all();
    if (current.some((screen) => screen.pairedAt)) return 'paired';
    if (current.some((screen) => screen.pairingExpiresAt && screen.pairingExpiresAt > now)) return 'pending';
    const waiting = current.find((screen) => !screen.pairedAt);
    return waiting ? this.newCode(waiting.id) : this.create({ name }, null);
  }

  private newCode(id: number): ScreenPairing {
    const code = newPairingCode();
    const expiresAt = new Date(Date.now() + PAIRING_CODE_LIFETIME_MS);
    this.db
      .update(screens)
      .set({ pairingCodeHash: hashPairingCode(code), pairingExpiresAt: expiresAt })
      .where(eq(screens.id, id))
      .run();
    return { id, code, expiresAt: expiresAt.toISOString() };
  }

  @Transactional()
  revoke(id: number, actor: Principal): ScreenDto {
    foundOrFail(this.db.select().from(screens).where(eq(screens.id, id)).get(), 'Screen');
    this.db
      .update(screens)
      .set({ revokedAt: new Date(), pairingCodeHash: null })
      .where(eq(screens.id, id))
      .run();
    this.audit.record({ actorId: actor.id, action: 'revoke', entity: 'screen', entityId: id });
    this.live.endSessions({ screenId: id }, 'screen-revoked');
    return foundOrFail(
      this.list().find((screen) => screen.id === id),
      'Screen',
    );
  }

  seen(id: number): void {
    this.db.update(screens).set({ lastSeenAt: new Date() }).where(eq(screens.id, id)).run();
  }
}
