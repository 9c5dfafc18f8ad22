import { and, asc, eq, inArray, or } from 'drizzle-orm';
import {
  BAY_STATE_WORDS,
  lineWithTitleWords,
  atStart,
  HOLD_REASON_LABELS,
  shortName,
  type HoldReason,
  type RepairOrderHistoryEntry,
  PRIORITY_WORDS,
  inSentence,
  type Priority,
} from '@baytime/shared';
import type { Db } from '../db/database.js';
import { auditLog, bays, findings, jobLines, users } from '../db/schema/index.js';

/** An RO's story is bounded by its life; this many entries is far more than any visit makes. */
const HISTORY_LIMIT = 1000;

type AuditRow = typeof auditLog.$inferSelect;

interface Names {
  person: (id: unknown) => string;
  bay: (id: unknown) => string;
  line: (id: unknown) => string;
  findingLine: (id: unknown) => string;
}

const text = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const hours = (value: unknown) => `${Number(value)} h`;

/** Words for each audited change to the RO, its lines and its findings; null for what is not news. */
function describe({ entity, action, entityId, detail }: AuditRow, names: Names): string | null {
  const d = detail ?? {};
  if (entity === 'repair-order') {
    switch (action) {
      case 'create':
        return 'Repair order written';
      case 'edit':
        return `Details changed: ${Object.keys((d.changes as object) ?? {}).join(', ')}`;
      case 'line-added':
        return `${atStart(lineWithTitleWords(Number(d.lineNo), String(d.title)))} added (${hours(d.bookHours)})`;
      case 'line-removed':
        return `${atStart(lineWithTitleWords(Number(d.lineNo), String(d.title)))} removed`;
      case 'lines-reordered':
        return 'Lines put in a new order';
      case 'final-check':
        return `${BAY_STATE_WORDS.check} recorded in ${String(d.bayName)}${text(d.note) ? `: ${text(d.note)}` : ''}`;
      case 'ready-notice':
        return `Ready notice e-mailed to ${String(d.to)}`;
      case 'close':
        return 'Vehicle picked up: repair order closed';
      case 'finding-approved':
        return `Finding approved: ${String(d.title)} added (${hours(d.bookHours)})`;
      case 'finding-declined':
        return `Finding declined${text(d.note) ? `: ${text(d.note)}` : ''}`;
      case 'finding-answer-changed':
        return `Finding's answer changed to ${String(d.answer)}: ${String(d.reason)}`;
      default:
        return null;
    }
  }
  if (entity === 'job-line') {
    const line = atStart(names.line(entityId));
    switch (action) {
      case 'update': {
        const was = (d.was ?? {}) as { technicianId?: number | null; bayId?: number | null };
        const parts: string[] = [];
        if (d.technicianId !== undefined && d.technicianId !== was.technicianId)
          parts.push(
            d.technicianId === null
              ? `taken back to the queue from ${names.person(was.technicianId)}`
              : was.technicianId
                ? `reassigned from ${names.person(was.technicianId)} to ${names.person(d.technicianId)}`
                : `assigned to ${names.person(d.technicianId)}`,
          );
        if (d.bayId !== undefined && d.bayId !== was.bayId)
          parts.push(d.bayId === null ? 'taken out of its bay' : `moved to ${names.bay(d.bayId)}`);
        if (d.status === 'done' || d.completedAt) parts.push('marked done');
        if (d.status === 'held') parts.push(`held: ${HOLD_REASON_LABELS[d.holdReason as HoldReason]}`);
        if (d.priority) parts.push(`priority ${inSentence(PRIORITY_WORDS[d.priority as Priority])}`);
        return parts.length ? `${line} ${parts.join(', ')}` : null;
      }
      case 'done':
        return `${line} done${text(d.correction) ? `: ${text(d.correction)}` : ''}`;
      case 'hold':
        return `${line} held: ${HOLD_REASON_LABELS[d.reason as HoldReason]}`;
      case 'resume':
        return `${line} back in the queue`;
      case 'cancel':
        return `${line} cancelled: ${String(d.reason)}`;
      case 'edit':
        return `${line} changed: ${Object.keys((d.changes as object) ?? {}).join(', ')}`;
      case 'take':
        return `${line} taken from the queue`;
      default:
        return null;
    }
  }
  const on = names.findingLine(entityId);
  switch (action) {
    case 'create':
      return `Finding reported on ${on}`;
    case 'request-approval':
      return `Approval request for the finding on ${on} e-mailed to ${String(d.to)}`;
    default:
      // The answer is told once, by the RO's own row.
      return null;
  }
}

/** What happened to the RO, its lines and findings, from the audit trail; oldest first. */
export function repairOrderHistory(db: Db, repairOrderId: number): RepairOrderHistoryEntry[] {
  const lines = db.select().from(jobLines).where(eq(jobLines.repairOrderId, repairOrderId)).all();
  const lineIds = lines.map((line) => line.id);
  const found = lineIds.length
    ? db
        .select({ id: findings.id, jobLineId: findings.jobLineId })
        .from(findings)
        .where(inArray(findings.jobLineId, lineIds))
        .all()
    : [];
  const rows = db
    .select({ entry: auditLog, actorName: users.name })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.actorId))
    .where(
      or(
        and(eq(auditLog.entity, 'repair-order'), eq(auditLog.entityId, String(repairOrderId))),
        lineIds.length
          ? and(eq(auditLog.entity, 'job-line'), inArray(auditLog.entityId, lineIds.map(String)))
          : undefined,
        found.length
          ? and(
              eq(auditLog.entity, 'finding'),
              inArray(
                auditLog.entityId,
                found.map((f) => String(f.id)),
              ),
            )
          : undefined,
      ),
    )
    .orderBy(asc(auditLog.at), asc(auditLog.id))
    .limit(HISTORY_LIMIT)
    .all();
  const people = new Map(
    db
      .select({ id: users.id, name: users.name })
      .from(users)
      .all()
      .map((u) => [u.id, shortName(u.name)]),
  );
  const bayNames = new Map(
    db
      .select({ id: bays.id, name: bays.name })
      .from(bays)
      .all()
      .map((b) => [b.id, b.name]),
  );
  const lineNames = new Map(
    lines.map((line) => [String(line.id), lineWithTitleWords(line.lineNo, line.title)]),
  );
  const findingLines = new Map(
    found.map((f) => [String(f.id), lineNames.get(String(f.jobLineId)) ?? 'a line']),
  );
  const names: Names = {
    person: (id) => people.get(Number(id)) ?? 'someone',
    bay: (id) => bayNames.get(Number(id)) ?? 'a bay',
    line: (id) => lineNames.get(String(id)) ?? 'A line',
    findingLine: (id) => findingLines.get(String(id)) ?? 'a line',
  };
  return rows.flatMap(({ entry, actorName }) => {
    const words = describe(entry, names);
    return words
      ? [{ at: entry.at.toISOString(), actorName, action: `${entry.entity}.${entry.action}`, text: words }]
      : [];
  });
}
