import { BadRequestException, ForbiddenException, Inject, Injectable } from '@nestjs/common';
import { and, asc, desc, eq, gte, inArray, lt, or } from 'drizzle-orm';
import {
  buildLedger,
  formatDayClockTime,
  refusalAbout,
  shopDayKey,
  workweekBounds,
  PUNCH_WORDS,
  inSentence,
  workweekDays,
  workweekName,
  workweekOf,
  wholeSeconds,
  wholeSecondsOfParts,
  type LedgerTotals,
  type Timecard,
  type TimecardQuery,
  type TimecardTotals,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { auditLog, jobLines, punches, repairOrders, users } from '../db/schema/index.js';
import { toPunchDto } from '../labour/labour.service.js';
import { prepareReadFrom } from '../punches/last-shift-out.js';
import { PunchesService } from '../punches/punches.service.js';
import { ReportsService } from '../reports/reports.service.js';
import { ShopService } from '../shop/shop.service.js';

/**
 * Punches before the week give context: at least this far back, and further to the shift-out before the
 * week when a shift was left open longer than that.
 */
const LOOKBACK_MS = 36 * 3600_000;

/** The week's totals in whole seconds, each rounded once, as the reports round them. */
const totals = (week: LedgerTotals): TimecardTotals => ({
  attendanceSeconds: wholeSeconds(week.attendanceSeconds),
  clockedSeconds: wholeSeconds(week.clockedSeconds),
  idleSeconds: wholeSeconds(week.idleSeconds),
  mealBreakSeconds: wholeSeconds(week.mealBreakSeconds),
  restBreakSeconds: wholeSeconds(week.restBreakSeconds),
});

/** The days' totals in whole seconds that add up to the week's: each rounded at its running total. */
function dayTotals(days: readonly LedgerTotals[]): TimecardTotals[] {
  const column = (key: keyof TimecardTotals) => wholeSecondsOfParts(days.map((day) => day[key]));
  const [attendance, clocked, idle, meal, rest] = [
    column('attendanceSeconds'),
    column('clockedSeconds'),
    column('idleSeconds'),
    column('mealBreakSeconds'),
    column('restBreakSeconds'),
  ];
  return days.map((_, i) => ({
    attendanceSeconds: attendance[i]!,
    clockedSeconds: clocked[i]!,
    idleSeconds: idle[i]!,
    mealBreakSeconds: meal[i]!,
    restBreakSeconds: rest[i]!,
  }));
}

@Injectable()
export class TimecardsService {
  private readonly readFrom: ReturnType<typeof prepareReadFrom>;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
    private readonly punches: PunchesService,
    private readonly reports: ReportsService,
  ) {
    this.readFrom = prepareReadFrom(db);
  }

  get(query: TimecardQuery, actor: Principal, now = new Date()): Timecard {
    const technicianId = actor.role === 'technician' ? actor.id : query.technicianId;
    if (technicianId === undefined) throw new BadRequestException('Say which technician (technicianId)');
    if (actor.role === 'technician' && query.technicianId !== undefined && query.technicianId !== actor.id)
      throw new ForbiddenException('A technician sees only their own timecard');
    const technician = foundOrFail(
      this.db
        .select()
        .from(users)
        .where(and(eq(users.id, technicianId), eq(users.role, 'technician')))
        .get(),
      'Technician',
    );
    const settings = this.shop.settings();
    const week = query.week ?? workweekOf(now, settings);
    const { from, to } = workweekBounds(week, settings);
    const until = new Date(Math.min(to.getTime(), now.getTime()));
    const start = this.readFrom(technicianId, from.getTime(), LOOKBACK_MS);

    const rows = this.db
      .select()
      .from(punches)
      .where(
        and(eq(punches.technicianId, technicianId), gte(punches.at, new Date(start)), lt(punches.at, to)),
      )
      .orderBy(asc(punches.at))
      .all();
    const all = rows.map(toPunchDto);
    const ledger = buildLedger(all, until, this.shop.ledgerSettings());
    const supersededBy = new Map(all.filter((p) => p.supersedes).map((p) => [p.supersedes!, p.id]));
    const names = this.namesOf([...new Set(all.map((p) => p.recordedBy))]);
    const lines = this.linesOf([
      ...new Set(all.flatMap((punch) => (punch.jobLineId === null ? [] : [punch.jobLineId]))),
    ]);
    const inWeek = (interval: { from: Date; to: Date }) => interval.to > from && interval.from < to;
    const iso = (interval: { from: Date; to: Date; open: boolean }) => ({
      from: interval.from.toISOString(),
      to: interval.to.toISOString(),
      open: interval.open,
    });

    const flags: string[] = [];
    const openShift = ledger.shifts.find((s) => s.open);
    if (openShift && shopDayKey(openShift.from, settings.timeZone) !== shopDayKey(until, settings.timeZone))
      flags.push(
        `Still on shift since ${formatDayClockTime(openShift.from, settings.timeZone, settings.clockFormat)}: a ${inSentence(PUNCH_WORDS['shift-out'])} may be missing`,
      );
    if (ledger.breaks.some((b) => b.open && until.getTime() - b.from.getTime() > 2 * 3600_000))
      flags.push(
        `On a break for more than 2 hours: a ${inSentence(PUNCH_WORDS['break-end'])} may be missing`,
      );
    // Punches read from before the week only give context; their anomalies belong to an earlier card.
    const weekIds = new Set(all.filter((p) => new Date(p.at) >= from).map((p) => p.id));
    const anomalies = ledger.anomalies
      .filter((a) => weekIds.has(a.punchId))
      .map((a) =>
        actor.id === technicianId ? a : { ...a, reason: refusalAbout(a.reason, technician.name) },
      );
    if (anomalies.length) flags.push(`${anomalies.length} punch(es) did not fit and were not counted`);

    const punchIds = all.map((p) => p.id);
    const weekDays = workweekDays(week, settings);
    const dayFigures = dayTotals(weekDays.map((day) => ledger.within(day.from, day.to)));
    const summary = this.reports.technicianWeek(week, technicianId, actor.role, now);
    const exceptions =
      summary.pay?.exceptions ??
      this.reports.exceptions(week, now).exceptions.filter((e) => e.technicianId === technicianId);
    return {
      technician: { id: technician.id, name: technician.name },
      week,
      weekName: workweekName(week, settings),
      from: from.toISOString(),
      to: to.toISOString(),
      timeZone: settings.timeZone,
      punches: all
        .filter((p) => new Date(p.at) >= from)
        .map((p) => ({
          ...p,
          supersededBy: supersededBy.get(p.id) ?? null,
          recordedByName: names.get(p.recordedBy) ?? '?',
        })),
      shifts: ledger.shifts.filter(inWeek).map(iso),
      breaks: ledger.breaks.filter(inWeek).map((b) => ({ ...iso(b), kind: b.kind })),
      jobs: ledger.jobs.filter(inWeek).map((job) => {
        const [start, end] = [
          new Date(Math.max(job.from.getTime(), from.getTime())),
          new Date(Math.min(job.to.getTime(), to.getTime())),
        ];
        return {
          ...iso(job),
          jobLineId: job.jobLineId,
          title: lines.get(job.jobLineId)?.title ?? '?',
          repairOrderNumber: lines.get(job.jobLineId)?.number ?? '?',
          seconds: wholeSeconds((end.getTime() - start.getTime()) / 1000),
          // A line is open once at a time, so within its own span the line's seconds are this interval's.
          countedSeconds: wholeSeconds(ledger.within(start, end).jobSeconds[job.jobLineId] ?? 0),
        };
      }),
      lines: [...lines].map(([jobLineId, { title, number }]) => ({
        jobLineId,
        title,
        repairOrderNumber: number,
      })),
      days: weekDays.map((day, i) => ({ day: day.day, ...dayFigures[i]! })),
      totals: totals(ledger.within(from, to)),
      anomalies,
      flags,
      held: this.punches.held(technicianId, from, to),
      exceptions,
      closed: summary.closed,
      summary,
      audit: this.auditOf(punchIds),
    };
  }

  private namesOf(ids: number[]): Map<number, string> {
    if (!ids.length) return new Map();
    return new Map(
      this.db
        .select({ id: users.id, name: users.name })
        .from(users)
        .where(inArray(users.id, ids))
        .all()
        .map((u) => [u.id, u.name]),
    );
  }

  private linesOf(ids: number[]): Map<number, { title: string; number: string }> {
    if (!ids.length) return new Map();
    const rows = this.db
      .select({ id: jobLines.id, title: jobLines.title, number: repairOrders.number })
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .where(inArray(jobLines.id, ids))
      .all();
    return new Map(rows.map((row) => [row.id, row]));
  }

  private auditOf(punchIds: string[]): Timecard['audit'] {
    if (!punchIds.length) return [];
    return this.db
      .select({ at: auditLog.at, actor: users.name, action: auditLog.action, detail: auditLog.detail })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(and(eq(auditLog.entity, 'punch'), or(inArray(auditLog.entityId, punchIds))))
      .orderBy(desc(auditLog.at))
      .all()
      .map((entry) => ({
        at: entry.at.toISOString(),
        actor: entry.actor ?? 'system',
        action: entry.action,
        detail: entry.detail ?? null,
      }));
  }
}
