import {
  Inject,
  Injectable,
  type OnApplicationBootstrap,
  type OnModuleDestroy,
  type OnModuleInit,
} from '@nestjs/common';
import { debounceTime, interval, merge, type Subscription } from 'rxjs';
import { and, asc, eq, gte, ne } from 'drizzle-orm';
import {
  forecastTechnicianQueue,
  shareFlaggedHours,
  technicianState,
  type DispatchBoard,
  type DispatchLane,
  type DispatchLine,
} from '@baytime/shared';
import { BoardService, describeVehicle } from '../board/board.service.js';
import { DB, type Db } from '../db/database.js';
import { jobLines, repairOrders, users, vehicles } from '../db/schema/index.js';
import { LabourService } from '../labour/labour.service.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';

const FOUR_WEEKS_MS = 28 * 24 * 3600_000;
const LATE_COUNT_SETTLE_MS = 1500;
const EFFICIENCY_CACHE_MS = 5 * 60_000;
const PRIORITY_RANK = { urgent: 0, high: 1, normal: 2, low: 3 } as const;

const byUrgency = (a: DispatchLine, b: DispatchLine) =>
  b.clockedOn.length - a.clockedOn.length ||
  PRIORITY_RANK[a.priority] - PRIORITY_RANK[b.priority] ||
  (a.promisedAt ?? '9').localeCompare(b.promisedAt ?? '9') ||
  a.queuedAt.localeCompare(b.queuedAt);

/** The foreman's view: the unassigned queue, a lane per technician with forecast finish times. */
@Injectable()
export class DispatchService implements OnModuleInit, OnApplicationBootstrap, OnModuleDestroy {
  private subscription: Subscription | null = null;
  private efficiencyCache: { at: number; values: Map<number, number | null> } | null = null;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly labour: LabourService,
    private readonly shop: ShopService,
    private readonly board: BoardService,
    private readonly live: LiveService,
  ) {}

  /** Keeps the wall's count of late lines: shortly after the floor changes, and each minute as time runs. */
  onModuleInit(): void {
    this.subscription = merge(
      this.live.floorChanged$.pipe(debounceTime(LATE_COUNT_SETTLE_MS)),
      interval(60_000),
    ).subscribe(() => this.board.setLateLines(this.view().lateCount));
  }

  /** Once the shop's data is in place (after first-run seeding), the wall gets its first count. */
  onApplicationBootstrap(): void {
    this.board.setLateLines(this.view().lateCount);
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
  }

  view(now = new Date()): DispatchBoard {
    const settings = this.shop.settings();
    const technicians = this.db
      .select()
      .from(users)
      .where(and(eq(users.role, 'technician'), eq(users.active, true)))
      .orderBy(asc(users.name))
      .all();
    const rows = this.db
      .select({ line: jobLines, number: repairOrders.number, vehicle: vehicles })
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .where(ne(jobLines.status, 'done'))
      .all();
    const seconds = this.labour.lineSeconds(
      rows.map(({ line }) => line.id),
      now,
    );
    const states = new Map(
      technicians.map((t) => [t.id, technicianState(this.labour.currentLedger(t.id, now))]),
    );
    const lines: DispatchLine[] = rows.map(({ line, number, vehicle }) => ({
      id: line.id,
      repairOrderId: line.repairOrderId,
      repairOrderNumber: number,
      vehicle: describeVehicle(vehicle),
      lineNo: line.lineNo,
      title: line.title,
      bookHours: line.bookHours,
      skillLevel: line.skillLevel,
      status: line.status,
      holdReason: line.holdReason,
      priority: line.priority,
      technicianId: line.technicianId,
      bayId: line.bayId,
      promisedAt: line.promisedAt?.toISOString() ?? null,
      queuedAt: line.queuedAt.toISOString(),
      clockedSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
      clockedOn: technicians
        .filter((t) => states.get(t.id)?.openJobLineIds.includes(line.id))
        .map((t) => t.id),
      forecast: null,
    }));
    const efficiencies = this.efficiencies(
      technicians.map((t) => t.id),
      now,
    );

    const lanes: DispatchLane[] = technicians.map((tech) => {
      const own = lines.filter((l) => l.technicianId === tech.id).sort(byUrgency);
      const efficiency = efficiencies.get(tech.id) ?? null;
      const workable = own.filter((l) => l.status !== 'held');
      const forecasts = forecastTechnicianQueue({
        lines: workable.map((l) => ({
          id: l.id,
          // Time already clocked counts as progress at the tech's own pace.
          remainingBookHours: Math.max(0, l.bookHours - (l.clockedSeconds / 3600) * (efficiency ?? 1)),
          promisedAt: l.promisedAt,
        })),
        efficiency,
        openingHours: settings.openingHours,
        timeZone: settings.timeZone,
        now,
      });
      for (const f of forecasts) {
        const line = own.find((l) => l.id === f.id)!;
        line.forecast = {
          startAt: f.startAt.toISOString(),
          finishAt: f.finishAt.toISOString(),
          late: f.late,
        };
      }
      const state = states.get(tech.id);
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
        finishAt: forecasts.at(-1)?.finishAt.toISOString() ?? null,
      };
    });

    return {
      serverTime: now.toISOString(),
      queue: lines.filter((l) => l.technicianId === null).sort(byUrgency),
      lanes,
      bays: this.board.current().bays.map(({ id, name, state }) => ({ id, name, state })),
      lateCount: lines.filter((l) => l.forecast?.late).length,
    };
  }

  /** Flagged ÷ clocked hours per technician over the last four weeks, cached for a few minutes. */
  private efficiencies(technicianIds: number[], now: Date): Map<number, number | null> {
    if (this.efficiencyCache && now.getTime() - this.efficiencyCache.at < EFFICIENCY_CACHE_MS)
      return this.efficiencyCache.values;
    const from = new Date(now.getTime() - FOUR_WEEKS_MS);
    const done = this.db
      .select()
      .from(jobLines)
      .where(and(eq(jobLines.status, 'done'), gte(jobLines.completedAt, from)))
      .all();
    const lineSeconds = this.labour.lineSeconds(
      done.map((l) => l.id),
      now,
    );
    const flagged = new Map<number, number>();
    for (const line of done) {
      const shares = shareFlaggedHours(
        line.bookHours,
        lineSeconds.get(line.id)?.byTechnician ?? new Map(),
        line.technicianId,
      );
      for (const [techId, hours] of shares) flagged.set(techId, (flagged.get(techId) ?? 0) + hours);
    }
    const values = new Map(
      technicianIds.map((id) => {
        const clocked =
          this.labour.ledgerOf(id, new Date(from.getTime() - 36 * 3600_000), now).within(from, now)
            .clockedSeconds / 3600;
        return [id, clocked > 0 ? (flagged.get(id) ?? 0) / clocked : null] as const;
      }),
    );
    this.efficiencyCache = { at: now.getTime(), values };
    return values;
  }
}
