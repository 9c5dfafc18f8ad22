import { ConflictException, Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
import type { BayDto, CreateBayBody, UpdateBayBody } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { countRows, DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { bays } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';

const toBayDto = ({ id, name, kind, position, active }: typeof bays.$inferSelect): BayDto => ({
  id,
  name,
  kind,
  position,
  active,
});

@Injectable()
export class BaysService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly floor: FloorService,
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

  @Transactional()
  update(id: number, body: UpdateBayBody, actor: Principal): BayDto {
    const current = foundOrFail(this.db.select().from(bays).where(eq(bays.id, id)).get(), 'Bay');
    if (Object.keys(body).length === 0) return toBayDto(current);
    if (body.name !== undefined) this.assertNameFree(body.name, id);
    const row = this.db.update(bays).set(body).where(eq(bays.id, id)).returning().get();
    this.audit.record({ actorId: actor.id, action: 'update', entity: 'bay', entityId: id, detail: body });
    this.floor.baysChanged();
    return toBayDto(row);
  }

  /** The vehicle has left: the bay is free for the next one. */
  @Transactional()
  release(id: number, actor: Principal): BayDto {
    foundOrFail(this.db.select().from(bays).where(eq(bays.id, id)).get(), 'Bay');
    const row = this.db
      .update(bays)
      .set({ phase: 'free', phaseSince: new Date(), repairOrderId: null })
      .where(eq(bays.id, id))
      .returning()
      .get();
    this.audit.record({ actorId: actor.id, action: 'release', entity: 'bay', entityId: id });
    this.floor.baysChanged();
    return toBayDto(row);
  }

  private assertNameFree(name: string, exceptId?: number): void {
    const same = this.db.select().from(bays).where(eq(bays.name, name)).get();
    if (same && same.id !== exceptId) throw new ConflictException(`There is already a bay called ${name}`);
  }
}
