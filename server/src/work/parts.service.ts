import { ConflictException, Inject, Injectable } from '@nestjs/common';
import { and, eq, isNull } from 'drizzle-orm';
import type { JobLineDto, PartsDetailsBody, PartsHoldDto } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { jobLines, partsHolds } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LiveService } from '../live/live.service.js';
import { announceLine } from './announce-line.js';
import { toPartsHoldDto } from './parts-hold.dto.js';

type LineRow = typeof jobLines.$inferSelect;
type PartsRow = typeof partsHolds.$inferSelect;

/** What a line held for parts waits for, and the parts coming in, which sends the line back to work. */
@Injectable()
export class PartsService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly floor: FloorService,
  ) {}

  /** Part of holding a line for parts: its open parts hold, with the part a technician named. */
  noteHold(jobLineId: number, part: string | undefined, now: Date): void {
    const open = this.openFor(jobLineId);
    if (!open) this.db.insert(partsHolds).values({ jobLineId, part, createdAt: now, updatedAt: now }).run();
    else if (part)
      this.db.update(partsHolds).set({ part, updatedAt: now }).where(eq(partsHolds.id, open.id)).run();
  }

  /** The office records or corrects the part, its state, the supplier and when it is expected. */
  @Transactional()
  record(jobLineId: number, body: PartsDetailsBody, actor: Principal, now = new Date()): PartsHoldDto {
    const line = this.heldForParts(jobLineId);
    const open = this.openFor(jobLineId);
    const values = {
      ...body,
      expectedAt: body.expectedAt ? new Date(body.expectedAt) : null,
      updatedAt: now,
    };
    const row = open
      ? this.db.update(partsHolds).set(values).where(eq(partsHolds.id, open.id)).returning().get()
      : this.db
          .insert(partsHolds)
          .values({ jobLineId, ...values, createdAt: now })
          .returning()
          .get();
    this.audit.record(
      { actorId: actor.id, action: 'parts', entity: 'job-line', entityId: jobLineId, detail: body },
      now,
    );
    announceLine(line, this.live, this.floor);
    return toPartsHoldDto(row);
  }

  /** The parts are in: the line goes back to the queue of the technician assigned to it. */
  @Transactional()
  received(jobLineId: number, actor: Principal, now = new Date()): JobLineDto {
    this.heldForParts(jobLineId);
    const open = this.openFor(jobLineId);
    if (open)
      this.db
        .update(partsHolds)
        .set({ receivedAt: now, receivedBy: actor.id, updatedAt: now })
        .where(eq(partsHolds.id, open.id))
        .run();
    else
      this.db
        .insert(partsHolds)
        .values({ jobLineId, receivedAt: now, receivedBy: actor.id, createdAt: now, updatedAt: now })
        .run();
    const line = this.db
      .update(jobLines)
      .set({ status: 'queued', holdReason: null, heldAt: null, updatedAt: now })
      .where(eq(jobLines.id, jobLineId))
      .returning()
      .get();
    this.audit.record(
      { actorId: actor.id, action: 'parts-received', entity: 'job-line', entityId: jobLineId },
      now,
    );
    return announceLine(line, this.live, this.floor);
  }

  private heldForParts(jobLineId: number): LineRow {
    const line = foundOrFail(
      this.db.select().from(jobLines).where(eq(jobLines.id, jobLineId)).get(),
      'Job line',
    );
    if (line.status !== 'held' || line.holdReason !== 'parts')
      throw new ConflictException('That line is not held for parts');
    return line;
  }

  private openFor(jobLineId: number): PartsRow | undefined {
    return this.db
      .select()
      .from(partsHolds)
      .where(and(eq(partsHolds.jobLineId, jobLineId), isNull(partsHolds.receivedAt)))
      .get();
  }
}
