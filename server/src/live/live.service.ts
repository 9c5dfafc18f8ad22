import { Inject, Injectable } from '@nestjs/common';
import { Subject } from 'rxjs';
import type { LiveRefusalReason, ServerToClientEvents } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { liveSequence } from '../db/schema/index.js';
import { UnitOfWork } from '../db/unit-of-work.js';

type Payload<E extends keyof ServerToClientEvents> = Omit<Parameters<ServerToClientEvents[E]>[0], 'seq'>;

/**
 * Who hears a message: everyone signed in, or the floor screens (office roles and wall displays) and
 * the kiosks of the technicians it concerns. Kiosks need only what concerns their technician: with a
 * thousand tablets open, a message to everyone costs a thousand frames.
 */
export type Audience = { to: 'everyone' } | { to: 'floor'; technicianIds?: readonly number[] };

export interface LiveMessage {
  event: keyof ServerToClientEvents;
  payload: { seq: number };
  audience: Audience;
}

/** Whose live connections must close now: a revoked screen's, or a person's whose access changed. */
export interface SessionsEnded {
  holder: { screenId: number } | { userId: number };
  reason: LiveRefusalReason;
}

/** Sequence numbers reserved per write of the mark: one write per this many messages. */
export const SEQ_BLOCK = 1000;

/**
 * The one stream of live messages. Services publish domain events here and say when the floor
 * changed; the gateway forwards messages to sockets. `seq` rises by one per message, shop-wide,
 * and across restarts: it carries on above the mark kept in the database, whatever the clock says.
 */
@Injectable()
export class LiveService {
  private lastSeq: number;
  private reservedUpTo: number;
  readonly messages$ = new Subject<LiveMessage>();
  readonly sessionsEnded$ = new Subject<SessionsEnded>();
  /** Fires once per tick however many changes were made in it. */
  readonly floorChanged$ = new Subject<void>();
  private changePending = false;

  constructor(
    private readonly uow: UnitOfWork,
    @Inject(DB) private readonly db: Db,
  ) {
    this.lastSeq = this.db.select().from(liveSequence).get()?.reservedUpTo ?? 0;
    this.reservedUpTo = this.lastSeq;
  }

  get seq(): number {
    return this.lastSeq;
  }

  publish<E extends Exclude<keyof ServerToClientEvents, 'board.snapshot' | 'session.ended'>>(
    event: E,
    payload: Payload<E>,
    audience: Audience = { to: 'floor' },
  ): void {
    // Inside a use case the message waits for the commit; a rolled-back command says nothing.
    this.uow.afterCommit(() =>
      this.messages$.next({ event, payload: { ...payload, seq: this.nextSeq() }, audience }),
    );
  }

  /** Closes the holder's live connections once the change that ends them has committed. */
  endSessions(holder: SessionsEnded['holder'], reason: LiveRefusalReason): void {
    this.uow.afterCommit(() => this.sessionsEnded$.next({ holder, reason }));
  }

  changed(): void {
    this.uow.afterCommit(() => this.floorChangedSoon());
  }

  private nextSeq(): number {
    if (this.lastSeq >= this.reservedUpTo) {
      const reservedUpTo = this.lastSeq + SEQ_BLOCK;
      this.db
        .insert(liveSequence)
        .values({ id: 1, reservedUpTo })
        .onConflictDoUpdate({ target: liveSequence.id, set: { reservedUpTo } })
        .run();
      this.reservedUpTo = reservedUpTo;
    }
    return ++this.lastSeq;
  }

  private floorChangedSoon(): void {
    if (this.changePending) return;
    this.changePending = true;
    queueMicrotask(() => {
      this.changePending = false;
      this.floorChanged$.next();
    });
  }
}
