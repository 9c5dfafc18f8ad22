import { Inject, Injectable } from '@nestjs/common';
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

  record(entry: AuditEntry, at = new Date()): void {
    this.db
      .insert(auditLog)
      .values({ ...entry, entityId: String(entry.entityId), at })
      .run();
  }
}
