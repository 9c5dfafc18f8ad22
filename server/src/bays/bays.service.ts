import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
} from '@nestjs/common';
import { and, asc, eq, ne, or } from 'drizzle-orm';
import {
  BAY_STATE_WORDS,
  type BayDto,
  type BayOrderBody,
  type CreateBayBody,
  type FinalCheckBody,
  type UpdateBayBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { countRows, DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { bays, jobLines } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LiveService } from '../live/live.service.js';

type BayRow = typeof bays.$inferSelect;

const toBayDto = ({ id, name, kind, position, active }: BayRow): BayDto => ({
  id,
  name,
  kind,
  position,
  active,
});

/** "bay 1" beside "Bay 1" reads as the same bay: names are compared without case, accents still count. */
const BAY_NAMES = new Intl.Collator('en', { sensitivity: 'accent', usage: 'search' });

@Injectable()
export class BaysService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly floor: FloorService,
    private readonly live: LiveService,
  ) {}

  list(): BayDto[] {
    return this.db.select().from(bays).orderBy(asc(bays.position), asc(bays.id)).all().map(toBayDto);
  }

  @Transactional()
  create(body: CreateBayBody, actor: Principal): BayDto {
    this.assertNameFree(body.name);
    const position = countRows(this.db, bays);
    const row = this.db
      .insert(bays)
      .values({ ...body, position, phaseSince: new Date() })
      .returning()
      .get();
    this.audit.record({ actorId: actor.id, action: 'create', entity: 'bay', entityId: row.id, detail: body });
    this.floor.baysChanged();
    return toBayDto(row);
  }

  /** Rename, change kind, retire or bring back a bay. A bay with work in it cannot be retired. */
  @Transactional()
  update(id: number, body: UpdateBayBody, actor: Principal): BayDto {
    const current = this.find(id);
    if (Object.keys(body).length === 0) return toBayDto(current);
    if (body.name !== undefined) this.assertNameFree(body.name, id);
    if (body.active === false && current.active) this.assertEmpty(current);
    const row = this.db.update(bays).set(body).where(eq(bays.id, id)).returning().get();
    this.audit.record({ actorId: actor.id, action: 'update', entity: 'bay', entityId: id, detail: body });
    this.floor.baysChanged();
    return toBayDto(row);
  }

  /** Every bay in use, in the order the wall shows them; retired bays keep their place after them. */
  @Transactional()
  reorder({ bayIds }: BayOrderBody, actor: Principal): BayDto[] {
    const active = this.db.select().from(bays).where(eq(bays.active, true)).all();
    const ids = new Set(bayIds);
    if (ids.size !== bayIds.length || ids.size !== active.length || !active.every((bay) => ids.has(bay.id)))
      throw new BadRequestException({
        statusCode: 400,
        message: 'Give every bay in use once',
        issues: [{ path: ['bayIds'], message: 'Give every bay in use once' }],
      });
    bayIds.forEach((id, position) => this.db.update(bays).set({ position }).where(eq(bays.id, id)).run());
    this.audit.record({
      actorId: actor.id,
      action: 'reorder',
      entity: 'bay',
      entityId: 'all',
      detail: { bayIds },
    });
    this.floor.baysChanged();
    return this.list();
  }

  /** The vehicle has left: the bay is free for the next one. */
  @Transactional()
  release(id: number, actor: Principal): BayDto {
    const bay = this.find(id);
    const row = this.db
      .update(bays)
      .set({ phase: 'free', phaseSince: new Date(), repairOrderId: null })
      .where(eq(bays.id, id))
      .returning()
      .get();
    this.audit.record({ actorId: actor.id, action: 'release', entity: 'bay', entityId: id });
    // The bay forgets the RO once free, so the RO's own row is what lets its history tell the release.
    if (bay.repairOrderId !== null) {
      this.audit.record({
        actorId: actor.id,
        action: 'bay-released',
        entity: 'repair-order',
        entityId: bay.repairOrderId,
        detail: { bayId: id, bayName: bay.name },
      });
      this.live.publish('repair-order.updated', { repairOrderId: bay.repairOrderId });
    }
    this.floor.baysChanged();
    return toBayDto(row);
  }

  /**
   * The road test or final check is done: a bay in `check` goes to `ready`. A technician records it
   * for a vehicle they worked on; the foreman, advisor or owner for any.
   */
  @Transactional()
  finalCheck(id: number, body: FinalCheckBody, actor: Principal, now = new Date()): BayDto {
    const bay = this.find(id);
    if (bay.phase !== 'check' || bay.repairOrderId === null)
      throw new ConflictException(`${bay.name} is not waiting for its ${BAY_STATE_WORDS.check}`);
    if (actor.role === 'technician' && !this.workedOn(bay.repairOrderId, actor.id))
      throw new ForbiddenException('You did not work on that vehicle: ask the foreman');
    const row = this.db
      .update(bays)
      .set({ phase: 'ready', phaseSince: now })
      .where(eq(bays.id, id))
      .returning()
      .get();
    const detail = { bayId: id, bayName: bay.name, ...(body.note && { note: body.note }) };
    this.audit.record({ actorId: actor.id, action: 'final-check', entity: 'bay', entityId: id, detail });
    this.audit.record({
      actorId: actor.id,
      action: 'final-check',
      entity: 'repair-order',
      entityId: bay.repairOrderId,
      detail,
    });
    this.live.publish('repair-order.updated', { repairOrderId: bay.repairOrderId });
    this.floor.baysChanged();
    return toBayDto(row);
  }

  private find(id: number): BayRow {
    return foundOrFail(this.db.select().from(bays).where(eq(bays.id, id)).get(), 'Bay');
  }

  private workedOn(repairOrderId: number, technicianId: number): boolean {
    return !!this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(
        and(
          eq(jobLines.repairOrderId, repairOrderId),
          or(eq(jobLines.technicianId, technicianId), eq(jobLines.completedBy, technicianId)),
        ),
      )
      .get();
  }

  private assertEmpty(bay: BayRow): void {
    const open = this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(and(eq(jobLines.bayId, bay.id), ne(jobLines.status, 'done'), ne(jobLines.status, 'cancelled')))
      .get();
    if (open || bay.repairOrderId !== null)
      throw new ConflictException(`${bay.name} has work in it: move the work or release the bay first`);
  }

  private assertNameFree(name: string, exceptId?: number): void {
    const same = this.db
      .select({ id: bays.id, name: bays.name })
      .from(bays)
      .all()
      .find((bay) => bay.id !== exceptId && BAY_NAMES.compare(bay.name, name) === 0);
    if (same) throw new ConflictException(`There is already a bay called ${same.name}`);
  }
}
