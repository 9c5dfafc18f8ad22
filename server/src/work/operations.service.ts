import { Inject, Injectable } from '@nestjs/common';
import { asc, eq } from 'drizzle-orm';
import type { OperationDto, OperationInput, UpdateOperationBody } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { operations } from '../db/schema/index.js';

/** The shop's own menu of operations with default book hours, which RO lines start from. */
@Injectable()
export class OperationsService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
  ) {}

  list(): OperationDto[] {
    return this.db
      .select()
      .from(operations)
      .where(eq(operations.active, true))
      .orderBy(asc(operations.title))
      .all();
  }

  @Transactional()
  create(body: OperationInput, actor: Principal): OperationDto {
    const row = this.db.insert(operations).values(body).returning().get();
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'operation',
      entityId: row.id,
      detail: body,
    });
    return row;
  }

  @Transactional()
  update(id: number, body: UpdateOperationBody, actor: Principal): OperationDto {
    const current = foundOrFail(
      this.db.select().from(operations).where(eq(operations.id, id)).get(),
      'Operation',
    );
    if (Object.keys(body).length === 0) return current;
    const row = this.db.update(operations).set(body).where(eq(operations.id, id)).returning().get();
    this.audit.record({
      actorId: actor.id,
      action: 'update',
      entity: 'operation',
      entityId: id,
      detail: body,
    });
    return row;
  }
}
