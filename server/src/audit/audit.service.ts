import { Inject, Injectable } from '@nestjs/common';
import { callingKey } from '../common/caller-context.js';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';

export interface AuditEntry {
  actorId: number | null;
  action: string;
  entity: string;
  entityId: string | number;
  detail?: Record<string, unknown>;
}

@Injectable()
export class AuditService {
  constructor(@Inject(DB) private readonly db: Db) {}

  /** A change made through an integration key is recorded as the key's, under its name. */
  record(entry: AuditEntry, at = new Date()): void {
    const key = callingKey();
    this.db
      .insert(auditLog)
      .values({
        ...entry,
        entityId: String(entry.entityId),
        at,
        ...(key && {
          actorId: null,
          integrationKeyId: key.id,
          detail: { ...entry.detail, integrationKey: key.name },
        }),
      })
      .run();
  }
}
