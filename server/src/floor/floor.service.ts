import { Inject, Injectable, type OnModuleDestroy, type OnModuleInit } from '@nestjs/common';
import type { Subscription } from 'rxjs';
import { and, asc, eq, getTableColumns, gte, inArray, isNull, min, ne, sql } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import {
  buildLedger,
  isOpenLine,
  technicianState,
  type Ledger,
  type LedgerPunch,
  type PartsHoldDto,
  type TechnicianState,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import {
  bays,
  jobLines,
  partsHolds,
  punches,
  repairOrders,
  timerReadings,
  timers,
  users,
} from '../db/schema/index.js';
import { toPunchDto, type LineSeconds } from '../labour/labour.service.js';
import { LiveService, type Audience } from '../live/live.service.js';
import { lastShiftOutIn, prepareReadFrom } from '../punches/last-shift-out.js';
import { ShopService } from '../shop/shop.service.js';
import { toPartsHoldDto } from '../work/parts-hold.dto.js';
import { describeVehicle } from './describe-vehicle.js';

const HOUR_MS = 3600_000;
/**
 * Punches kept for every technician: enough to judge a punch up to 12 h late against 48 h before it. The
 * window reaches back further, to the shift-out before it, so a shift left open for days is still open here.
 */
const RECENT_MS = 72 * HOUR_MS;

export type FloorLine = typeof jobLines.$inferSelect & {
  repairOrderNumber: string;
  vehicle: string;
  /** The line's latest parts hold, open or received; null when it never waited for parts. */
  parts: PartsHoldDto | null;
};
export type FloorBay = typeof bays.$inferSelect & {
  parked: { id: number; number: string; vehicle: string } | null;
};
export type FloorTimer = typeof timers.$inferSelect & {
  readings: (typeof timerReadings.$inferSelect)[];
};
export interface FloorTechnician {
  id: number;
  name: string;
  skillLevel: number;
}

/** One technician's punches in memory and the ledger last built from them. */
interface TechnicianPunches {
  /**
   * Punches at or after this instant are all here, in time order. It is a shift-out that no correction
   * replaced (or 0): every shift the window holds began in it.
   */
  windowStart: number;
  punches: LedgerPunch[];
  built: {
    ledger: Ledger;
    at: number;
    state: TechnicianState;
    /** The ledger's closed seconds per job line, as pairs: read on every snapshot. */
    jobSeconds: [lineId: number, seconds: number][];
  } | null;
}

/**
 * The floor in memory: active technicians with their recent punches and ledgers, the open job lines
 * (neither done nor cancelled),
 * the bays and the running timers. Built once from the database at start-up; after that each use case
 * says what it changed, and the model takes it in once the use case has committed. Screens, dispatch
 * and the punch checks read it without a query. The ledger rules stay in `shared`: the model only
 * decides which punches each technician's ledger is built from.
 */
@Injectable()
export class FloorService implements OnModuleInit, OnModuleDestroy {
  private technicianList: FloorTechnician[] = [];
  private readonly clocks = new Map<number, TechnicianPunches>();
  private readonly lines = new Map<number, FloorLine>();
  private bayList: FloorBay[] = [];
  private changes = 0;
  private timerList: FloorTimer[] = [];
  private readonly queries: ReturnType<typeof prepareFloorQueries>;
  private readonly readFrom: ReturnType<typeof prepareReadFrom>;
  private subscription: Subscription | null = null;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
    private readonly shop: ShopService,
    private readonly live: LiveService,
  ) {
    this.queries = prepareFloorQueries(db);
    this.readFrom = prepareReadFrom(db);
  }

  onModuleInit(): void {
    this.load();
    this.subscription = this.shop.changed$.subscribe(() => this.settingsChanged());
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
  }

  /** Everything from the database, as at start-up. */
  load(now = new Date()): void {
    this.changes++;
    this.lines.clear();
    for (const row of this.queries.openLines.all()) this.lines.set(row.id, toFloorLine(row));
    this.bayList = this.queries.bays.all().map(toFloorBay);
    this.timerList = this.loadTimers();
    this.clocks.clear();
    this.loadTechnicians(now.getTime());
  }

  // What a committed use case changed. Each waits for the commit and is dropped on a rollback.

  punchRecorded(punch: LedgerPunch): void {
    this.afterCommit(() => {
      const clock = this.clocks.get(punch.technicianId);
      if (!clock) return;
      if (Date.parse(punch.at) < clock.windowStart || punch.supersedes !== null) {
        // A correction can reach back past the window: read that technician again.
        this.clocks.set(punch.technicianId, this.readClock(punch.technicianId, Date.now()));
        return;
      }
      insertInTimeOrder(clock.punches, punch);
      clock.built = null;
    });
  }

  linesChanged(lineIds: readonly number[]): void {
    if (lineIds.length === 0) return;
    this.afterCommit(() =>
      this.takeLines(lineIds, this.queries.linesById.all({ ids: JSON.stringify(lineIds) })),
    );
  }

  /**
   * A repair order's own record changed (the customer or vehicle it records): its lines and the bays it
   * is parked in are read again. Every other line and bay keeps its record, so only their tiles change.
   */
  repairOrdersChanged(repairOrderIds: readonly number[]): void {
    if (repairOrderIds.length === 0) return;
    this.afterCommit(() => {
      const ids = JSON.stringify(repairOrderIds);
      const rows = this.queries.linesOfRepairOrders.all({ ids });
      this.takeLines(
        rows.map((row) => row.id),
        rows,
      );
      const parked = new Map(this.queries.baysParkedWith.all({ ids }).map((row) => [row.bay.id, row]));
      if (parked.size > 0)
        this.bayList = this.bayList.map((bay) => {
          const row = parked.get(bay.id);
          return row ? toFloorBay(row) : bay;
        });
    });
  }

  baysChanged(): void {
    this.afterCommit(() => (this.bayList = this.queries.bays.all().map(toFloorBay)));
  }

  timersChanged(): void {
    this.afterCommit(() => (this.timerList = this.loadTimers()));
  }

  /** A technician added, renamed, deactivated or given another skill level. */
  techniciansChanged(): void {
    this.afterCommit(() => this.loadTechnicians(Date.now()));
  }

  /** The shop's rules changed (split, concurrent jobs): every ledger is built again. */
  private settingsChanged(): void {
    this.changes++;
    for (const clock of this.clocks.values()) clock.built = null;
    this.live.changed();
  }

  // Reads: all from memory.

  /** Rises with every change the model takes in: what was worked out from it at another version is stale. */
  get version(): number {
    return this.changes;
  }

  technicians(): readonly FloorTechnician[] {
    return this.technicianList;
  }

  openLines(): FloorLine[] {
    return [...this.lines.values()];
  }

  openLine(id: number): FloorLine | undefined {
    return this.lines.get(id);
  }

  bays(): readonly FloorBay[] {
    return this.bayList;
  }

  runningTimers(): readonly FloorTimer[] {
    return this.timerList;
  }

  /** The technician's recent punches (at least the last 72 hours), in time order. */
  punchesOf(technicianId: number): readonly LedgerPunch[] {
    return this.clocks.get(technicianId)?.punches ?? [];
  }

  ledgerOf(technicianId: number, now: Date): Ledger | null {
    return this.built(technicianId, now)?.ledger ?? null;
  }

  stateOf(technicianId: number, now: Date): TechnicianState | null {
    return this.built(technicianId, now)?.state ?? null;
  }

  /**
   * Who hears of a change to the line: the floor screens, and the kiosks of its technician, of the
   * technician it had before this change (the model still holds the line as it was until the commit),
   * and of everyone clocked on it.
   */
  lineAudience(line: { id: number; technicianId: number | null }, now = new Date()): Audience {
    const before = this.lines.get(line.id)?.technicianId ?? null;
    const concerned = new Set([...this.clockedOn(line.id, now), line.technicianId, before]);
    concerned.delete(null);
    return { to: 'floor', technicianIds: [...concerned] as number[] };
  }

  /** Technicians clocked on each line right now, by line id; a line nobody is on is left out. */
  clockedOnLines(now: Date): Map<number, number[]> {
    const result = new Map<number, number[]>();
    for (const tech of this.technicianList)
      for (const lineId of this.stateOf(tech.id, now)?.openJobLineIds ?? []) {
        const onLine = result.get(lineId);
        if (onLine) onLine.push(tech.id);
        else result.set(lineId, [tech.id]);
      }
    return result;
  }

  /** Technicians clocked on the line right now. */
  clockedOn(jobLineId: number, now: Date): number[] {
    return this.clockedOnLines(now).get(jobLineId) ?? [];
  }

  /**
   * Clocked seconds on each open line up to `now`, per technician and in all, with the split rule. A
   * ledger is built when its punches change; between punches an open line's time grows at its share
   * of the wall clock, which is what a fresh ledger would count.
   */
  lineSeconds(now: Date): Map<number, LineSeconds> {
    const result = new Map<number, LineSeconds>();
    this.eachClockedShare(now, (lineId, technicianId, seconds) => {
      const line = result.get(lineId) ?? { total: 0, byTechnician: new Map<number, number>() };
      line.total += seconds;
      line.byTechnician.set(technicianId, seconds);
      result.set(lineId, line);
    });
    return result;
  }

  /** `lineSeconds` in all only, for the screens: each change of the floor reads it. */
  lineTotals(now: Date): Map<number, number> {
    const result = new Map<number, number>();
    this.eachClockedShare(now, (lineId, _, seconds) =>
      result.set(lineId, (result.get(lineId) ?? 0) + seconds),
    );
    return result;
  }

  private eachClockedShare(
    now: Date,
    visit: (lineId: number, technicianId: number, seconds: number) => void,
  ): void {
    const { concurrentSplit } = this.shop.settings();
    for (const tech of this.technicianList) {
      const built = this.built(tech.id, now);
      if (!built) continue;
      const open = built.state.openJobLineIds;
      const share = concurrentSplit === 'even' && open.length > 0 ? 1 / open.length : 1;
      const running = Math.max(0, now.getTime() - built.at) / 1000;
      // Indexed, not destructured: destructuring each pair costs an iterator, on every snapshot.
      for (const pair of built.jobSeconds) {
        const lineId = pair[0];
        const closed = pair[1];
        if (!this.lines.has(lineId)) continue;
        const seconds = closed + (open.includes(lineId) ? running * share : 0);
        if (seconds !== 0) visit(lineId, tech.id, seconds);
      }
    }
  }

  /** The lines as read again: those still open replace what the model held, the others leave it. */
  private takeLines(lineIds: readonly number[], rows: LineQueryRow[]): void {
    for (const id of lineIds) this.lines.delete(id);
    const open = rows.filter(isOpenLine);
    for (const row of open) this.lines.set(row.id, toFloorLine(row));
    this.widenWindowsFor(open.map((row) => row.id));
  }

  private afterCommit(apply: () => void): void {
    this.uow.afterCommit(() => {
      apply();
      this.changes++;
      this.live.changed();
    });
  }

  private built(technicianId: number, now: Date): TechnicianPunches['built'] {
    const clock = this.clocks.get(technicianId);
    if (!clock) return null;
    if (!clock.built) {
      this.prune(clock, now.getTime());
      const ledger = buildLedger(clock.punches, now, this.shop.ledgerSettings(now));
      clock.built = {
        ledger,
        at: now.getTime(),
        state: technicianState(ledger),
        jobSeconds: Object.entries(ledger.totals.jobSeconds).map(([lineId, seconds]) => [
          Number(lineId),
          seconds,
        ]),
      };
    }
    return clock.built;
  }

  /** Drops the shifts that ended before anything still needed: recent punches and those on open lines. */
  private prune(clock: TechnicianPunches, now: number): void {
    const start = lastShiftOutIn(clock.punches, this.neededFrom(clock.punches, now));
    if (start === null || start <= clock.windowStart) return;
    const keep = clock.punches.findIndex((punch) => Date.parse(punch.at) >= start);
    clock.punches.splice(0, keep === -1 ? clock.punches.length : keep);
    clock.windowStart = start;
  }

  /** The earliest instant the window must hold: 72 hours back, or the first punch on a line still open. */
  private neededFrom(list: readonly LedgerPunch[], now: number): number {
    const first = list.find((punch) => punch.jobLineId !== null && this.lines.has(punch.jobLineId));
    return Math.min(now - RECENT_MS, first ? Date.parse(first.at) : Infinity);
  }

  private loadTechnicians(now: number): void {
    this.technicianList = this.queries.technicians.all();
    const ids = new Set(this.technicianList.map((tech) => tech.id));
    for (const id of this.clocks.keys()) if (!ids.has(id)) this.clocks.delete(id);
    const firsts = this.firstPunchesOnOpenLines();
    for (const id of ids)
      if (!this.clocks.has(id)) this.clocks.set(id, this.readClock(id, now, firsts.get(id)));
  }

  /** A technician's punches from far enough back to hold any open shift and every punch on open lines. */
  private readClock(
    technicianId: number,
    now: number,
    first = this.firstPunchesOnOpenLines().get(technicianId),
  ): TechnicianPunches {
    const needed = Math.min(now - RECENT_MS, first ? first.getTime() : Infinity);
    const windowStart = this.readFrom(technicianId, needed);
    const list = this.db
      .select()
      .from(punches)
      .where(and(eq(punches.technicianId, technicianId), gte(punches.at, new Date(windowStart))))
      .orderBy(asc(punches.at), asc(punches.id))
      .all()
      .map(toPunchDto);
    return { windowStart, punches: list, built: null };
  }

  /**
   * Each technician's first punch on a line still open, read through the job-line index (a few rows
   * per line). Asked per technician, SQLite walks that technician's whole history instead: 20 ms each
   * on three years of punches.
   */
  private firstPunchesOnOpenLines(): Map<number, Date> {
    const lineIds = [...this.lines.keys()];
    if (lineIds.length === 0) return new Map();
    const rows = this.db
      .select({ technicianId: punches.technicianId, first: min(punches.at) })
      .from(punches)
      .where(inArray(punches.jobLineId, lineIds))
      .groupBy(punches.technicianId)
      .all();
    return new Map(
      rows.flatMap(({ technicianId, first }) => (first ? [[technicianId, first] as const] : [])),
    );
  }

  /** A line opened again may have punches from before a technician's window: read those again. */
  private widenWindowsFor(lineIds: number[]): void {
    if (lineIds.length === 0) return;
    const firsts = this.db
      .select({ technicianId: punches.technicianId, first: min(punches.at) })
      .from(punches)
      .where(inArray(punches.jobLineId, lineIds))
      .groupBy(punches.technicianId)
      .all();
    for (const { technicianId, first } of firsts) {
      const clock = this.clocks.get(technicianId);
      if (clock && first && first.getTime() < clock.windowStart)
        this.clocks.set(technicianId, this.readClock(technicianId, Date.now()));
      else if (clock) clock.built = null;
    }
  }

  private loadTimers(): FloorTimer[] {
    const running = this.queries.runningTimers.all();
    if (running.length === 0) return [];
    const readings = this.db
      .select()
      .from(timerReadings)
      .where(
        inArray(
          timerReadings.timerId,
          running.map((timer) => timer.id),
        ),
      )
      .orderBy(asc(timerReadings.at))
      .all();
    return running.map((timer) => ({ ...timer, readings: readings.filter((r) => r.timerId === timer.id) }));
  }
}

function insertInTimeOrder(list: LedgerPunch[], punch: LedgerPunch): void {
  const at = Date.parse(punch.at);
  let index = list.length;
  while (index > 0 && Date.parse(list[index - 1]!.at) > at) index--;
  list.splice(index, 0, punch);
}

type LineQueryRow = typeof jobLines.$inferSelect & {
  repairOrderNumber: string;
  vehicleYear: number;
  vehicleMake: string;
  vehicleModel: string;
  parts: typeof partsHolds.$inferSelect | null;
};

function toFloorLine({
  repairOrderNumber,
  vehicleYear,
  vehicleMake,
  vehicleModel,
  parts,
  ...line
}: LineQueryRow): FloorLine {
  return {
    ...line,
    repairOrderNumber,
    vehicle: describeVehicle({ year: vehicleYear, make: vehicleMake, model: vehicleModel }),
    parts: parts ? toPartsHoldDto(parts) : null,
  };
}

function toFloorBay({
  bay,
  parkedRepairOrder,
}: {
  bay: typeof bays.$inferSelect;
  parkedRepairOrder: typeof repairOrders.$inferSelect | null;
}): FloorBay {
  return {
    ...bay,
    parked: parkedRepairOrder
      ? {
          id: parkedRepairOrder.id,
          number: parkedRepairOrder.number,
          vehicle: describeVehicle({
            year: parkedRepairOrder.vehicleYear,
            make: parkedRepairOrder.vehicleMake,
            model: parkedRepairOrder.vehicleModel,
          }),
        }
      : null,
  };
}

/**
 * Statements prepared once: the model reads the same shapes after every change. A line or bay shows the
 * vehicle as its repair order records it, as the office does: a later visit that corrects the vehicle
 * on file does not rewrite an RO still open, and an edit of the RO does.
 */
function prepareFloorQueries(db: Db) {
  const lineColumns = {
    ...getTableColumns(jobLines),
    repairOrderNumber: repairOrders.number,
    vehicleYear: repairOrders.vehicleYear,
    vehicleMake: repairOrders.vehicleMake,
    vehicleModel: repairOrders.vehicleModel,
    parts: partsHolds,
  };
  const latestParts = sql`(select max(${partsHolds.id}) from ${partsHolds} where ${partsHolds.jobLineId} = ${jobLines.id})`;
  const linesWithVehicle = () =>
    db
      .select(lineColumns)
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .leftJoin(partsHolds, eq(partsHolds.id, latestParts));
  const inIds = (column: SQLiteColumn) =>
    sql`${column} in (select value from json_each(${sql.placeholder('ids')}))`;
  const baysWithParked = () =>
    db
      .select({ bay: bays, parkedRepairOrder: repairOrders })
      .from(bays)
      .leftJoin(repairOrders, eq(repairOrders.id, bays.repairOrderId));
  return {
    technicians: db
      .select({ id: users.id, name: users.name, skillLevel: users.skillLevel })
      .from(users)
      .where(and(eq(users.role, 'technician'), eq(users.active, true)))
      .orderBy(asc(users.name))
      .prepare(),
    // Both terms, so SQLite may walk the partial index of lines not done.
    openLines: linesWithVehicle()
      .where(and(ne(jobLines.status, 'done'), ne(jobLines.status, 'cancelled')))
      .prepare(),
    linesById: linesWithVehicle().where(inIds(jobLines.id)).prepare(),
    /** Every line of the repair orders, open or not: a handful each, through the RO index of lines. */
    linesOfRepairOrders: linesWithVehicle().where(inIds(jobLines.repairOrderId)).prepare(),
    /** Each bay with the repair order parked in it (check, ready) when no open line says more. */
    bays: baysWithParked().where(eq(bays.active, true)).orderBy(asc(bays.position), asc(bays.id)).prepare(),
    /** The active bays the repair orders are parked in. */
    baysParkedWith: baysWithParked()
      .where(and(eq(bays.active, true), inIds(bays.repairOrderId)))
      .prepare(),
    runningTimers: db.select().from(timers).where(isNull(timers.endedAt)).prepare(),
  };
}
