import { Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
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
    const code = newPairingCode();
    const now = new Date();
    const expiresAt = new Date(now.getTime() + PAIRING_CODE_LIFETIME_MS);
    const row = this.db
      .insert(screens)
      .values({
        name,
        pairingCodeHash: hashPairingCode(code),
        pairingExpiresAt: expiresAt,
        createdBy: actor?.id ?? null,
        createdAt: now,
      })
      .returning()
      .get();
    this.audit.record({ actorId: actor?.id ?? null, action: 'create', entity: 'screen', entityId: row.id });
    return { id: row.id, code, expiresAt: expiresAt.toISOString() };
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
