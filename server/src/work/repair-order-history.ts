import { and, asc, eq, inArray, or } from 'drizzle-orm';
import {
  BAY_STATE_WORDS,
  oneLine,
  lineWithTitleWords,
  atStart,
  formatBookHours,
  formatDayClockTime,
  formatPhone,
  HOLD_REASON_LABELS,
  PARTS_STATE_WORDS,
  sentToWords,
  shortName,
  type HoldReason,
  type PartsState,
  type RepairOrderHistoryEntry,
  PRIORITY_WORDS,
  inSentence,
  type Priority,
} from '@baytime/shared';
import type { Db } from '../db/database.js';
import { auditLog, bays, findings, jobLines, shopSettings, users } from '../db/schema/index.js';

/** An RO's story is bounded by its life; this many entries is far more than any visit makes. */
const HISTORY_LIMIT = 1000;

type AuditRow = typeof auditLog.$inferSelect;

/** The people, bays and lines the trail names by id, and its moments as the shop reads its clocks. */
interface Names {
  person: (id: unknown) => string;
  bay: (id: unknown) => string;
  line: (id: unknown) => string;
  findingLine: (id: unknown) => string;
  when: (instant: unknown) => string;
}

const text = (value: unknown): string | null => (typeof value === 'string' ? value : null);
const hours = (value: unknown) => formatBookHours(Number(value));
const count = new Intl.NumberFormat('en-US');

/** Past this a long text no longer fits one line of the history beside what it became. */
const LONG_TEXT_SHOWN = 60;

/** A long text on one line, cut at a word with "…" past 60 characters: “Rattle over bumps and a…”. */
const shortQuote = (value: unknown) => `“${oneLine(String(value), LONG_TEXT_SHOWN)}”`;

/** The fields an edit changes, as a person names them, with how a value reads. */
const FIELDS: Readonly<Record<string, { name: string; value?: (value: unknown, names: Names) => string }>> = {
  customerName: { name: 'customer name', value: String },
  customerPhone: { name: 'phone', value: (value) => formatPhone(String(value)) },
  customerEmail: { name: 'e-mail', value: String },
  vehicleYear: { name: 'year', value: String },
  vehicleMake: { name: 'make', value: String },
  vehicleModel: { name: 'model', value: String },
  vehiclePlate: { name: 'plate', value: String },
  odometer: { name: 'odometer', value: (value) => count.format(Number(value)) },
  concern: { name: 'concern', value: shortQuote },
  promisedAt: { name: 'promise', value: (value, names) => names.when(value) },
  title: { name: 'title', value: (value) => `“${String(value)}”` },
  bookHours: { name: 'book time', value: hours },
  skillLevel: { name: 'skill', value: String },
  cause: { name: 'cause', value: shortQuote },
  correction: { name: 'correction', value: shortQuote },
};

/** An edit's changes: "plate none → KX 2210; odometer 32,500 → 33,100; concern “Rattle” → “Clunk”". */
function changesWords(changes: unknown, names: Names): string {
  return Object.entries((changes ?? {}) as Record<string, { from: unknown; to: unknown }>)
    .map(([key, { from, to }]) => {
      const { name, value } = FIELDS[key] ?? { name: key };
      if (!value) return name;
      const shown = (v: unknown) => (v === null ? 'none' : value(v, names));
      return `${name} ${shown(from)} → ${shown(to)}`;
    })
    .join('; ');
}

/** What a line waits for: "Front brake pads · Ordered · Lakeside Parts · due Thu, Dec 10, 9:00 am". */
function partsWords(d: Record<string, unknown>, names: Names): string {
  return [
    text(d.part),
    d.state ? PARTS_STATE_WORDS[d.state as PartsState] : null,
    text(d.supplier),
    d.expectedAt ? `due ${names.when(d.expectedAt)}` : null,
  ]
    .filter(Boolean)
    .join(' · ');
}

/** Words for each audited change to the RO, its lines and its findings; null for what is not news. */
function describe({ entity, action, entityId, detail }: AuditRow, names: Names): string | null {
  const d = detail ?? {};
  if (entity === 'repair-order') {
    switch (action) {
      case 'create':
        return 'Repair order written';
      case 'edit': {
        const why = text(d.odometerOverrideReason);
        return `Details changed: ${changesWords(d.changes, names)}${why ? ` (lower reading: ${why})` : ''}`;
      }
      case 'line-added':
        return `${atStart(lineWithTitleWords(Number(d.lineNo), String(d.title)))} added (${hours(d.bookHours)})`;
      case 'line-removed':
        return `${atStart(lineWithTitleWords(Number(d.lineNo), String(d.title)))} removed`;
      case 'lines-reordered':
        return 'Lines put in a new order';
      case 'final-check':
        return `${BAY_STATE_WORDS.check} recorded in ${String(d.bayName)}${text(d.note) ? `: ${text(d.note)}` : ''}`;
      case 'bay-released':
        return `Released ${String(d.bayName)}`;
      case 'ready-notice':
        return `Ready notice sent ${sentToWords(text(d.to), text(d.mobile))}`;
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
        const was = (d.was ?? {}) as {
          technicianId?: number | null;
          bayId?: number | null;
          status?: string;
        };
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
        if ((d.status === 'queued' || d.status === 'working') && was.status === 'done')
          parts.push('opened again: no longer done');
        else if (d.status === 'queued' && was.status === 'held') parts.push('back in the queue');
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
        return `${line} changed: ${changesWords(d.changes, names)}`;
      case 'take':
        return `${line} taken from the queue`;
      case 'sign-off':
        return `${line} signed off: ${String(d.reason)}`;
      case 'parts':
        return `${line} parts recorded: ${partsWords(d, names)}`;
      case 'parts-received':
        return `${line} parts received: back in the queue`;
      default:
        return null;
    }
  }
  const on = names.findingLine(entityId);
  switch (action) {
    case 'create':
      return `Finding reported on ${on}`;
    case 'request-approval': {
      // Requests recorded before the link kept every way it went name the one address.
      const sentTo = Array.isArray(d.sentTo) ? d.sentTo.map(String) : text(d.to) ? [text(d.to)!] : [];
      // The customer's e-mail address and mobile number, whichever they have: only an address has an @.
      const email = sentTo.find((to) => to.includes('@'));
      const mobile = sentTo.find((to) => !to.includes('@'));
      return `Approval request for the finding on ${on} sent ${sentToWords(email, mobile)}`;
    }
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
  // Each entry names a line by the title it had then: walking newest-first from today's titles, a
  // title edit hands the entries before it the title it replaced.
  const titles = new Map(lines.map((line) => [String(line.id), line.title]));
  const lineNos = new Map(lines.map((line) => [String(line.id), line.lineNo]));
  const lineName = (lineId: string) => {
    const title = titles.get(lineId);
    return title === undefined ? null : lineWithTitleWords(lineNos.get(lineId)!, title);
  };
  const findingLines = new Map(found.map((f) => [String(f.id), String(f.jobLineId)]));
  const shop = db
    .select({ timeZone: shopSettings.timeZone, clockFormat: shopSettings.clockFormat })
    .from(shopSettings)
    .get()!;
  const names: Names = {
    person: (id) => people.get(Number(id)) ?? 'someone',
    bay: (id) => bayNames.get(Number(id)) ?? 'a bay',
    line: (id) => lineName(String(id)) ?? 'A line',
    findingLine: (id) => lineName(findingLines.get(String(id)) ?? '') ?? 'a line',
    when: (instant) => formatDayClockTime(String(instant), shop.timeZone, shop.clockFormat),
  };
  const history: RepairOrderHistoryEntry[] = [];
  for (const { entry, actorName } of rows.toReversed()) {
    const words = describe(entry, names);
    if (words)
      history.push({
        at: entry.at.toISOString(),
        actorName,
        action: `${entry.entity}.${entry.action}`,
        text: words,
      });
    const retitled = (entry.detail?.changes as { title?: { from: unknown } } | undefined)?.title;
    if (entry.entity === 'job-line' && entry.action === 'edit' && typeof retitled?.from === 'string')
      titles.set(entry.entityId, retitled.from);
  }
  return history.reverse();
}
