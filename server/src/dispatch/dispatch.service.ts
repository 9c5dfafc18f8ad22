import {
  Inject,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import { setImmediate as nextTurn } from 'node:timers/promises';
import { debounceTime, interval, merge, type Subscription } from 'rxjs';
import { and, gte, isNull, ne, or } from 'drizzle-orm';
import {
  forecastTechnicianQueue,
  isLineLate,
  shareFlaggedHours,
  type DispatchBoard,
  type DispatchLane,
  type DispatchLine,
} from '@baytime/shared';
import { BoardService } from '../board/board.service.js';
import { keepServing } from '../common/keep-serving.js';
import { DB, type Db } from '../db/database.js';
import { lineIsDone } from '../db/line-is-done.js';
import { jobLines, storedEfficiencies } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';
import { waitingParts } from '../work/parts-hold.dto.js';

const FOUR_WEEKS_MS = 28 * 24 * 3600_000;
const LATE_COUNT_SETTLE_MS = 1500;
const EFFICIENCY_CACHE_MS = 5 * 60_000;
/**
 * How long after a start the stored efficiencies serve as counted: a restart's reconnecting screens
 * come first, the recount after.
 */
const STORED_EFFICIENCIES_SERVE_MS = 60_000;
/** Lines done in the last four weeks whose clocked time is read in one step of the efficiency count. */
const DONE_LINES_PER_STEP = 50;
/** How long the late lines of a view serve the office's pages while nothing went out to the screens. */
const LATE_LINES_REUSE_MS = 15_000;
const PRIORITY_RANK = { urgent: 0, high: 1, normal: 2, low: 3 } as const;
export const NO_OPENING_HOURS =
  'No forecasts: the shop has no opening hours. Set them in Admin → Shop settings.';

/**
 * Flagged ÷ clocked hours, or null (no pace of its own yet) below the shop's minimum of clocked hours.
 * No clocked time is no pace at any minimum: with a minimum of 0 it read 0 ÷ 0, and the forecast that
 * took that NaN for a pace never finished, which stopped the server.
 */
function efficiencyOf(flaggedHours: number, clockedHours: number, minimumHours: number): number | null {
  return clockedHours > 0 && clockedHours >= minimumHours ? flaggedHours / clockedHours : null;
}

const byUrgency = (a: DispatchLine, b: DispatchLine) =>
  b.clockedOn.length - a.clockedOn.length ||
  PRIORITY_RANK[a.priority] - PRIORITY_RANK[b.priority] ||
  (a.promisedAt ?? '9').localeCompare(b.promisedAt ?? '9') ||
  a.queuedAt.localeCompare(b.queuedAt);

/** A held line has no forecast, unless it waits for parts with a known arrival: it starts no earlier. */
const forecastable = (line: DispatchLine) => line.status !== 'held' || line.parts?.expectedAt != null;

interface Efficiencies {
  byTechnician: Map<number, number | null>;
  /** The whole shop's figure, for technicians without enough time of their own. */
  shop: number | null;
}

/**
 * The foreman's view: the queue (unassigned lines, and lines of technicians no longer on the floor), a
 * lane per technician with forecast finish times.
 */
@Injectable()
export class DispatchService implements OnModuleInit, OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger(DispatchService.name);
  private subscription: Subscription | null = null;
  private efficiencyCache: { at: number; minimumHours: number; values: Efficiencies } | null = null;
  /** The refresh of the efficiencies under way in the background, which a second count waits for. */
  private refreshing: Promise<void> | null = null;
  private stopped = false;
  /** The late lines of the last view, with the floor model's version and the efficiencies it counted on. */
  private lastLate: {
    floor: number;
    efficiencies: Efficiencies;
    at: number;
    lines: readonly DispatchLine[];
  } | null = null;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly labour: LabourService,
    private readonly floor: FloorService,
    private readonly shop: ShopService,
    private readonly board: BoardService,
    private readonly live: LiveService,
  ) {}

  /** Keeps the wall's count of late lines: shortly after the floor changes, and each minute as time runs. */
  onModuleInit(): void {
    this.subscription = merge(
      this.live.floorChanged$.pipe(debounceTime(LATE_COUNT_SETTLE_MS)),
      interval(60_000),
    ).subscribe(() => this.countLateLines());
  }

  /**
   * Once the shop's data is in place (after first-run seeding), the wall gets its first count. It reads
   * four weeks of clocked time (most of a second on a big shop), in steps: the server answers meanwhile.
   */
  onApplicationBootstrap(): void {
    this.efficiencyCache = this.storedEfficiencies(Date.now());
    this.countLateLines();
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
    this.stopped = true;
  }

  private countLateLines(): void {
    keepServing(this.logger, 'Counting late lines', async () => {
      await this.refreshEfficiencies(new Date());
      if (!this.stopped) this.board.setLateLines(this.view().lateCount);
    });
  }

  /**
   * The late lines as `view` counts them. Pages that ask within a few seconds of a view share its count
   * while the floor and the efficiencies stand.
   */
  lateLines(now = new Date()): readonly DispatchLine[] {
    const kept = this.lastLate;
    const sinceKept = now.getTime() - (kept?.at ?? 0);
    if (
      kept &&
      kept.floor === this.floor.version &&
      kept.efficiencies === this.efficiencyCache?.values &&
      sinceKept >= 0 &&
      sinceKept < LATE_LINES_REUSE_MS
    )
      return kept.lines;
    this.view(now);
    return this.lastLate!.lines;
  }

  view(now = new Date()): DispatchBoard {
    const settings = this.shop.settings();
    const technicians = this.floor.technicians();
    const seconds = this.floor.lineSeconds(now);
    const clockedOn = this.floor.clockedOnLines(now);
    const lines: DispatchLine[] = this.floor.openLines().map((line) => ({
      id: line.id,
      repairOrderId: line.repairOrderId,
      repairOrderNumber: line.repairOrderNumber,
      vehicle: line.vehicle,
      lineNo: line.lineNo,
      title: line.title,
      bookHours: line.bookHours,
      skillLevel: line.skillLevel,
      status: line.status,
      holdReason: line.holdReason,
      priority: line.priority,
      concern: line.concern,
      technicianId: line.technicianId,
      bayId: line.bayId,
      promisedAt: line.promisedAt?.toISOString() ?? null,
      queuedAt: line.queuedAt.toISOString(),
      clockedSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
      clockedOn: clockedOn.get(line.id) ?? [],
      parts: waitingParts(line),
      forecast: null,
      late: false,
    }));
    const efficiencies = this.efficiencies(now);
    let forecastsAvailable = true;
    const forecast = (queue: DispatchLine[], efficiency: number | null) => {
      const forecasts = forecastTechnicianQueue({
        lines: queue.map((l) => ({
          id: l.id,
          // Time already clocked counts as progress at the tech's own pace.
          remainingBookHours: Math.max(0, l.bookHours - (l.clockedSeconds / 3600) * (efficiency ?? 1)),
          promisedAt: l.promisedAt,
          notBefore: l.parts?.expectedAt ?? null,
        })),
        efficiency,
        openingHours: settings.openingHours,
        timeZone: settings.timeZone,
        now,
      });
      if (!forecasts) forecastsAvailable = false;
      for (const f of forecasts ?? [])
        queue.find((l) => l.id === f.id)!.forecast = {
          startAt: f.startAt.toISOString(),
          finishAt: f.finishAt.toISOString(),
          late: f.late,
        };
      return forecasts;
    };

    const lanes: DispatchLane[] = technicians.map((tech) => {
      const own = lines.filter((l) => l.technicianId === tech.id).sort(byUrgency);
      const efficiency = efficiencies.byTechnician.get(tech.id) ?? null;
      const forecasts = forecast(own.filter(forecastable), efficiency ?? efficiencies.shop);
      const state = this.floor.stateOf(tech.id, now);
      const status =
        !state || state.status === 'off'
          ? 'off'
          : state.status === 'on-break'
            ? 'on-break'
            : state.openJobLineIds.length
              ? 'on-job'
              : 'idle';
      return {
        technician: { id: tech.id, name: tech.name, skillLevel: tech.skillLevel, status },
        efficiency,
        lines: own,
        finishAt: forecasts?.at(-1)?.finishAt.toISOString() ?? null,
      };
    });

    // A line whose technician has left the floor (deactivated, or another role now) waits here to be reassigned.
    const onFloor = new Set(technicians.map((tech) => tech.id));
    const queue = lines
      .filter((l) => l.technicianId === null || !onFloor.has(l.technicianId))
      .sort(byUrgency);
    // A waiting line is late already if even starting it now, at the shop's pace, misses its promise.
    for (const line of queue) if (forecastable(line)) forecast([line], efficiencies.shop);
    for (const line of lines) line.late = isLineLate(line, line.forecast, now);
    const late = lines.filter((l) => l.late);
    this.lastLate = {
      floor: this.floor.version,
      efficiencies,
      at: now.getTime(),
      lines: late,
    };

    return {
      serverTime: now.toISOString(),
      queue,
      lanes,
      bays: this.board.current().bays.map(({ id, name, state, repairOrder }) => ({
        id,
        name,
        state,
        repairOrderId: repairOrder?.id ?? null,
      })),
      lateCount: late.length,
      forecastNote: forecastsAvailable ? null : NO_OPENING_HOURS,
    };
  }

  /**
   * Flagged ÷ clocked hours over the last four weeks, per technician with enough clocked time to mean
   * something, and for the whole shop; cached for a few minutes.
   */
  private efficiencies(now: Date): Efficiencies {
    const steps = this.countEfficiencies(now);
    let step = steps.next();
    while (!step.done) step = steps.next();
    return step.value;
  }

  /** Fills the cache of efficiencies when it is stale, one step a turn of the event loop. */
  private refreshEfficiencies(now: Date): Promise<void> {
    this.refreshing ??= this.countInSteps(now).finally(() => (this.refreshing = null));
    return this.refreshing;
  }

  private async countInSteps(now: Date): Promise<void> {
    const steps = this.countEfficiencies(now);
    while (!steps.next().done) {
      await nextTurn();
      if (this.stopped) return;
    }
  }

  /** The efficiencies from the cache, or counted afresh in steps (a step yields before its reads). */
  private *countEfficiencies(now: Date): Generator<void, Efficiencies> {
    // A technician's own efficiency drives forecasts only after the shop's minimum of clocked hours.
    const minimumHours = this.shop.settings(now).minimumClockedHoursForEfficiency;
    const cached = this.efficiencyCache;
    if (cached && cached.minimumHours === minimumHours && now.getTime() - cached.at < EFFICIENCY_CACHE_MS)
      return cached.values;
    const from = new Date(now.getTime() - FOUR_WEEKS_MS);
    yield;
    const done = this.db
      .select({ id: jobLines.id, bookHours: jobLines.bookHours, technicianId: jobLines.technicianId })
      .from(jobLines)
      .where(
        and(
          lineIsDone,
          gte(jobLines.completedAt, from),
          // A line done without clocked time counts only once signed off (it once showed 2,819 %).
          or(isNull(jobLines.signOff), ne(jobLines.signOff, 'awaiting')),
        ),
      )
      .all();
    const flagged = new Map<number, number>();
    for (let first = 0; first < done.length; first += DONE_LINES_PER_STEP) {
      yield;
      const lines = done.slice(first, first + DONE_LINES_PER_STEP);
      const lineSeconds = this.labour.lineSeconds(
        lines.map((l) => l.id),
        now,
      );
      for (const line of lines) {
        const shares = shareFlaggedHours(
          line.bookHours,
          lineSeconds.get(line.id)?.byTechnician ?? new Map(),
          line.technicianId,
        );
        for (const [techId, hours] of shares) flagged.set(techId, (flagged.get(techId) ?? 0) + hours);
      }
    }
    let shopFlagged = 0;
    let shopClocked = 0;
    const byTechnician = new Map<number, number | null>();
    for (const { id } of this.floor.technicians()) {
      yield;
      const clocked = this.labour.ledgerSince(id, from, now).within(from, now).clockedSeconds / 3600;
      shopFlagged += flagged.get(id) ?? 0;
      shopClocked += clocked;
      byTechnician.set(id, efficiencyOf(flagged.get(id) ?? 0, clocked, minimumHours));
    }
    const shop = efficiencyOf(shopFlagged, shopClocked, minimumHours);
    const values = { byTechnician, shop };
    this.efficiencyCache = { at: now.getTime(), minimumHours, values };
    this.storeEfficiencies(this.efficiencyCache);
    return values;
  }

  private storeEfficiencies({
    at,
    minimumHours,
    values,
  }: NonNullable<DispatchService['efficiencyCache']>): void {
    const row = {
      countedAt: new Date(at),
      minimumHours,
      shop: values.shop,
      byTechnician: [...values.byTechnician],
    };
    this.db
      .insert(storedEfficiencies)
      .values({ id: 1, ...row })
      .onConflictDoUpdate({ target: storedEfficiencies.id, set: row })
      .run();
  }

  /** The efficiencies counted before the server started, standing as fresh for its first minute. */
  private storedEfficiencies(now: number): DispatchService['efficiencyCache'] {
    const row = this.db.select().from(storedEfficiencies).get();
    if (!row) return null;
    return {
      at: now - EFFICIENCY_CACHE_MS + STORED_EFFICIENCIES_SERVE_MS,
      minimumHours: row.minimumHours,
      values: { byTechnician: new Map(row.byTechnician), shop: row.shop },
    };
  }
}
