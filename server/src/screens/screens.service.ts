import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import type {
  CreateScreenBody,
  KioskDto,
  KioskQueueBody,
  KioskQueueNote,
  ScreenPairing,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { screens, type DeviceKind } from '../db/schema/index.js';
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
type ScreenRow = typeof screens.$inferSelect;

const toScreenDto = (row: ScreenRow): ScreenDto => ({
  id: row.id,
  name: row.name,
  pairedAt: iso(row.pairedAt),
  lastSeenAt: iso(row.lastSeenAt),
  revokedAt: iso(row.revokedAt),
  pairingExpiresAt: iso(row.pairingExpiresAt),
});

@Injectable()
export class ScreensService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
  ) {}

  /** Queue notes for the wall, kept until a kiosk reports again or one is revoked. */
  private queueNotes: KioskQueueNote[] | null = null;

  list(): ScreenDto[] {
    return this.rows('wall').map(toScreenDto);
  }

  kiosks(): KioskDto[] {
    return this.rows('kiosk').map((row) => ({
      ...toScreenDto(row),
      queue: { waiting: row.queueWaiting, since: iso(row.queueSince), reportedAt: iso(row.queueReportedAt) },
    }));
  }

  /** Kiosks still paired whose last report said punches wait on them. */
  kioskQueues(): KioskQueueNote[] {
    this.queueNotes ??= this.db
      .select()
      .from(screens)
      .where(and(eq(screens.kind, 'kiosk'), isNull(screens.revokedAt), gt(screens.queueWaiting, 0)))
      .orderBy(asc(screens.id))
      .all()
      .map((row) => ({
        kioskId: row.id,
        name: row.name,
        waiting: row.queueWaiting,
        since: iso(row.queueSince),
      }));
    return this.queueNotes;
  }

  /** A new wall screen or kiosk with a one-time code, shown once: only its hash is kept. */
  @Transactional()
  create({ name }: CreateScreenBody, actor: Principal | null, kind: DeviceKind = 'wall'): ScreenPairing {
    const row = this.db
      .insert(screens)
      .values({ kind, name, createdBy: actor?.id ?? null, createdAt: new Date() })
      .returning()
      .get();
    this.audit.record({
      actorId: actor?.id ?? null,
      action: 'create',
      entity: kind === 'wall' ? 'screen' : 'kiosk',
      entityId: row.id,
    });
    return this.newCode(row.id);
  }

  /** A kiosk says how many punches wait in its outbox and since when; the wall and office show it. */
  @Transactional()
  reportQueue(kioskId: number, { waiting, oldestQueuedAt }: KioskQueueBody, now = new Date()): void {
    this.db
      .update(screens)
      .set({
        queueWaiting: waiting,
        queueSince: waiting > 0 && oldestQueuedAt ? new Date(oldestQueuedAt) : null,
        queueReportedAt: now,
        lastSeenAt: now,
      })
      .where(eq(screens.id, kioskId))
      .run();
    this.queuesChanged();
  }

  private queuesChanged(): void {
    this.uow.afterCommit(() => (this.queueNotes = null));
    this.live.changed();
  }

  private rows(kind: DeviceKind): ScreenRow[] {
    return this.db.select().from(screens).where(eq(screens.kind, kind)).orderBy(asc(screens.id)).all();
  }

  /**
   * A code for the first wall screen of a new shop: 'paired' once one is, 'pending' while a code
   * made earlier still works. An unpaired screen gets a fresh code rather than a new screen joining
   * it at every start.
   */
  @Transactional()
  firstScreenCode(name: string, now = new Date()): ScreenPairing | 'paired' | 'pending' {
    const current = this.db
      .select()
      .from(screens)
      .where(and(eq(screens.kind, 'wall'), isNull(screens.revokedAt)))
      .all();
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
  revoke(id: number, actor: Principal, kind: DeviceKind = 'wall'): ScreenDto {
    const what = kind === 'wall' ? 'Screen' : 'Kiosk';
    foundOrFail(
      this.db
        .select()
        .from(screens)
        .where(and(eq(screens.id, id), eq(screens.kind, kind)))
        .get(),
      what,
    );
    const row = this.db
      .update(screens)
      .set({ revokedAt: new Date(), pairingCodeHash: null })
      .where(eq(screens.id, id))
      .returning()
      .get();
    this.audit.record({ actorId: actor.id, action: 'revoke', entity: what.toLowerCase(), entityId: id });
    this.live.endSessions({ screenId: id }, 'screen-revoked');
    if (kind === 'kiosk') this.queuesChanged();
    return toScreenDto(row);
  }

  seen(id: number): void {
    this.db.update(screens).set({ lastSeenAt: new Date() }).where(eq(screens.id, id)).run();
  }
}
