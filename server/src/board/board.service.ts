import { Injectable, Logger, type OnModuleDestroy, type OnModuleInit } from '@nestjs/common';
import type { Subscription } from 'rxjs';
import {
  shortName,
  type BayState,
  type BoardBay,
  type BoardPerson,
  type BoardQueueItem,
  type BoardSnapshot,
  type BoardTimer,
  type Ledger,
  type TechnicianState,
} from '@baytime/shared';
import { keepServing } from '../common/keep-serving.js';
import { sameJson } from '../common/same-json.js';
import {
  FloorService,
  type FloorBay,
  type FloorLine,
  type FloorTechnician,
  type FloorTimer,
} from '../floor/floor.service.js';
import { timerEstimate } from '../timers/timer-view.js';
import { waitingParts } from '../work/parts-hold.dto.js';
import { LiveService } from '../live/live.service.js';
import { ScreensService } from '../screens/screens.service.js';
import { ShopService } from '../shop/shop.service.js';

const PRIORITY_RANK = { urgent: 0, high: 1, normal: 2, low: 3 } as const;
/** How long a snapshot is handed out again while nothing was published: a restart's reconnect storm. */
const SNAPSHOT_REUSE_MS = 250;

/** The line a bay tile shows: someone on it first, then a held one, then the next in priority. */
function leadLine(
  lines: readonly FloorLine[],
  clockedOn: ReadonlyMap<number, number[]>,
): FloorLine | undefined {
  let lead: FloorLine | undefined;
  for (const line of lines) if (!lead || leadsBefore(line, lead, clockedOn)) lead = line;
  return lead;
}

// Not a closure inside leadLine: the bundle names each function it creates, on every call.
function leadsBefore(a: FloorLine, b: FloorLine, clockedOn: ReadonlyMap<number, number[]>): boolean {
  return (
    (Number(clockedOn.has(b.id)) - Number(clockedOn.has(a.id)) ||
      Number(b.status === 'held') - Number(a.status === 'held') ||
      PRIORITY_RANK[a.priority] - PRIORITY_RANK[b.priority] ||
      a.id - b.id) < 0
  );
}

/** Adds `value` to the list under `key`. */
function addTo<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

/** Short names of technicians as the model holds them: a name changes only with a new record. */
const shortNames = new WeakMap<FloorTechnician, string>();
function shortNameOf(tech: FloorTechnician): string {
  let name = shortNames.get(tech);
  if (name === undefined) shortNames.set(tech, (name = shortName(tech.name)));
  return name;
}

/** What every tile of one snapshot is worked out from. */
interface TileFloor {
  clockedOn: ReadonlyMap<number, number[]>;
  seconds: ReadonlyMap<number, number>;
  timer: FloorTimer | undefined;
  technicians: readonly FloorTechnician[];
  now: Date;
}

/** A bay's last tile and what it was worked out from, but for the clock. */
interface LastTile {
  bay: FloorBay;
  line: FloorLine | undefined;
  working: boolean;
  technicians: readonly FloorTechnician[];
  onLine: readonly number[];
  tile: BoardBay;
}

/** A person's last entry and what it was worked out from, with the state it is kept under. */
interface LastPerson {
  tech: FloorTechnician;
  line: FloorLine | undefined;
  bayName: string | null;
  person: BoardPerson;
}

const NO_LINES: readonly FloorLine[] = [];
const NO_IDS: readonly number[] = [];

function sameIds(a: readonly number[], b: readonly number[]): boolean {
  return a.length === b.length && a.every((id, i) => id === b[i]);
}

/** What every screen shows of the floor at one instant, read from the in-memory floor model. */
@Injectable()
export class BoardService implements OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger(BoardService.name);
  /** What the screens were last told; every change is diffed against it. */
  private published: BoardSnapshot | null = null;
  /** Counted by dispatch from its forecasts; the board only carries the number. */
  private lateLines = 0;
  private subscription: Subscription | null = null;
  private latest: { snapshot: BoardSnapshot; at: number } | null = null;
  private readonly tiles = new Map<number, LastTile>();
  private readonly personsByState = new WeakMap<TechnicianState, LastPerson>();
  private names: { technicians: readonly FloorTechnician[]; byId: Map<number, string> } | null = null;

  constructor(
    private readonly floor: FloorService,
    private readonly shop: ShopService,
    private readonly live: LiveService,
    private readonly screens: ScreensService,
  ) {}

  onModuleInit(): void {
    // What the screens were last told; every change is diffed against it, the first one included.
    this.published = this.snapshot(this.live.seq);
    this.subscription = this.live.floorChanged$.subscribe(() =>
      keepServing(this.logger, 'Publishing floor changes', () => this.publishChanges()),
    );
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
  }

  /**
   * The floor now, for a screen that connects or asks. The same snapshot serves every screen that asks
   * within a quarter second while no message went out (its `seq` still true), so a thousand sockets
   * reconnecting after a restart cost a few snapshots, not a thousand.
   */
  current(now = Date.now()): BoardSnapshot {
    const latest = this.latest;
    if (latest && latest.snapshot.seq === this.live.seq && now - latest.at < SNAPSHOT_REUSE_MS)
      return latest.snapshot;
    const snapshot = this.snapshot(this.live.seq, new Date(now));
    this.latest = { snapshot, at: now };
    return snapshot;
  }

  /**
   * Sends what changed since the last publication: a message per changed or new bay, then one for
   * people, queue, late count and the bays' order (which also drops a retired bay from the wall).
   */
  publishChanges(now = new Date()): void {
    const after = this.snapshot(this.live.seq, now);
    const before = this.published ?? after;
    const baysBefore = new Map(before.bays.map((bay) => [bay.id, bay]));
    for (const bay of after.bays) {
      const old = baysBefore.get(bay.id);
      if (!old || !sameBay(old, bay)) this.live.publish('bay.updated', { bay }, { to: 'floor' });
    }
    if (!sameFloor(before, after)) {
      const { people, queue, lateLines, kioskQueues } = after;
      const bayIds = after.bays.map((bay) => bay.id);
      this.live.publish('floor.updated', { people, queue, lateLines, bayIds, kioskQueues }, { to: 'floor' });
    }
    this.published = after;
  }

  snapshot(seq: number, now = new Date()): BoardSnapshot {
    const settings = this.shop.settings();
    const openLines = this.floor.openLines();
    const technicians = this.floor.technicians();
    const clockedOn = this.floor.clockedOnLines(now);
    const seconds = this.floor.lineTotals(now);
    const runningTimers = this.floor.runningTimers();

    const linesByBay = new Map<number, FloorLine[]>();
    for (const line of openLines) if (line.bayId !== null) addTo(linesByBay, line.bayId, line);

    const boardBays = this.floor.bays().map((bay) => {
      const inBay = linesByBay.get(bay.id) ?? NO_LINES;
      const timer = runningTimers.find((t) => t.bayId === bay.id);
      return this.tile(bay, inBay, { clockedOn, seconds, timer, technicians, now });
    });

    const bayNames = new Map(boardBays.map((bay) => [bay.id, bay.name]));
    const people: BoardPerson[] = [];
    for (const tech of technicians) {
      const state = this.floor.stateOf(tech.id, now);
      if (!state || state.status === 'off' || !state.since) continue;
      const line = this.floor.openLine(state.openJobLineIds[0] ?? -1);
      const bayName = line?.bayId ? (bayNames.get(line.bayId) ?? null) : null;
      people.push(this.person(tech, state, line, bayName, now));
    }

    const queue: BoardQueueItem[] = openLines
      .filter((line) => line.technicianId === null && line.status === 'queued')
      .sort(
        (a, b) =>
          PRIORITY_RANK[a.priority] - PRIORITY_RANK[b.priority] ||
          a.queuedAt.getTime() - b.queuedAt.getTime(),
      )
      .map((line) => ({
        jobLineId: line.id,
        repairOrderNumber: line.repairOrderNumber,
        title: line.title,
        priority: line.priority,
        waitingSince: line.queuedAt.toISOString(),
      }));

    return {
      seq,
      serverTime: now.toISOString(),
      shop: { name: settings.name, timeZone: settings.timeZone, clockFormat: settings.clockFormat },
      bays: boardBays,
      people,
      queue,
      lateLines: this.lateLines,
      kioskQueues: this.screens.kioskQueues(),
    };
  }

  /**
   * A bay's tile. A change touches a bay or two: the others keep the tile they had, so they cost
   * neither a new object nor a deep comparison when the change is published.
   */
  private tile(bay: FloorBay, inBay: readonly FloorLine[], floor: TileFloor): BoardBay {
    const { clockedOn, timer, technicians, now } = floor;
    const line = leadLine(inBay, clockedOn);
    const onLine = line ? (clockedOn.get(line.id) ?? NO_IDS) : NO_IDS;
    const working = inBay.some((l) => clockedOn.has(l.id));
    const clockedSeconds = Math.round(line ? (floor.seconds.get(line.id) ?? 0) : 0);
    const last = this.tiles.get(bay.id);
    // A running timer's estimate moves with the clock: such a tile is worked out every time, never kept.
    if (
      last &&
      !timer &&
      last.bay === bay &&
      last.line === line &&
      last.working === working &&
      last.technicians === technicians &&
      sameIds(last.onLine, onLine)
    ) {
      if (last.tile.clockedSeconds !== clockedSeconds) last.tile = { ...last.tile, clockedSeconds };
      return last.tile;
    }
    const names = this.namesOf(technicians);
    const assigned = line?.technicianId ? [line.technicianId] : [];
    const techIds = [...new Set([...onLine, ...assigned])];
    const state: BayState = timer
      ? 'timer'
      : working
        ? 'working'
        : line?.status === 'held'
          ? 'held'
          : line && bay.phase === 'free'
            ? 'staged'
            : bay.phase;
    const ro = line
      ? { id: line.repairOrderId, number: line.repairOrderNumber, vehicle: line.vehicle }
      : bay.parked;
    const tile: BoardBay = {
      id: bay.id,
      name: bay.name,
      state,
      holdReason: state === 'held' ? (line?.holdReason ?? null) : null,
      heldSince: state === 'held' ? (line?.heldAt?.toISOString() ?? null) : null,
      partsDueAt: state === 'held' && line ? (waitingParts(line)?.expectedAt ?? null) : null,
      vehicle: ro?.vehicle ?? null,
      repairOrder: ro ? { id: ro.id, number: ro.number } : null,
      jobLine: line ? { id: line.id, lineNo: line.lineNo, title: line.title, status: line.status } : null,
      // Someone no longer on the floor (deactivated) is not shown: the line waits for another technician.
      technicians: techIds.flatMap((id) => {
        const name = names.get(id);
        return name === undefined ? [] : [{ id, name }];
      }),
      clockedSeconds,
      bookSeconds: Math.round((line?.bookHours ?? 0) * 3600),
      clockRunning: line ? clockedOn.has(line.id) : false,
      timer: timer ? boardTimer(timer, now) : null,
    };
    if (timer) this.tiles.delete(bay.id);
    else this.tiles.set(bay.id, { bay, line, working, technicians, onLine, tile });
    return tile;
  }

  /** A person on shift; the same as last time while their punches, line and bay stay the same. */
  private person(
    tech: FloorTechnician,
    state: TechnicianState,
    line: FloorLine | undefined,
    bayName: string | null,
    now: Date,
  ): BoardPerson {
    // The floor builds a new state each time the technician's punches change.
    const last = this.personsByState.get(state);
    if (last && last.tech === tech && last.line === line && last.bayName === bayName) return last.person;
    const person: BoardPerson = {
      id: tech.id,
      name: shortNameOf(tech),
      status: state.status === 'on-break' ? 'on-break' : line ? 'on-job' : 'idle',
      since: personSince(this.floor.ledgerOf(tech.id, now), state, line?.id).toISOString(),
      bayName,
      jobLineTitle: line?.title ?? null,
    };
    this.personsByState.set(state, { tech, line, bayName, person });
    return person;
  }

  /** Short names by technician id, worked out again only when the floor reads its technicians again. */
  private namesOf(technicians: readonly FloorTechnician[]): ReadonlyMap<number, string> {
    if (this.names?.technicians !== technicians)
      this.names = {
        technicians,
        byId: new Map(technicians.map((tech) => [tech.id, shortNameOf(tech)])),
      };
    return this.names.byId;
  }

  setLateLines(count: number): void {
    if (count === this.lateLines) return;
    this.lateLines = count;
    this.live.changed();
  }
}

function boardTimer(timer: FloorTimer, now: Date): BoardTimer {
  const estimate = timerEstimate(timer, timer.readings, now);
  return {
    id: timer.id,
    kind: timer.kind,
    startedAt: timer.startedAt.toISOString(),
    targetC: timer.targetC,
    lastReadingC: timer.readings.at(-1)?.tempC ?? null,
    endsAt: timer.kind === 'set-time' ? estimate.etaAt : null,
    etaAt: timer.kind === 'set-time' ? null : estimate.etaAt,
    reached: timer.reachedAt !== null,
    note: timer.label,
    status: estimate.status,
    confidence: estimate.confidence,
  };
}

/** On a job: since clocking on it. Idle: since the last job or break ended, or the shift began. */
function personSince(ledger: Ledger | null, state: TechnicianState, jobLineId: number | undefined): Date {
  const since = state.since ?? new Date(0);
  if (state.status !== 'on-shift' || !ledger) return since;
  // Open intervals close the ledger's lists.
  const open = ledger.jobs.findLast((job) => job.open && job.jobLineId === jobLineId);
  if (open) return open.from;
  return new Date(Math.max(since.getTime(), lastEnded(ledger)));
}

/** Ends of the last job and break that really ended, by ledger: the floor builds one per change of punches. */
const lastEndings = new WeakMap<Ledger, number>();
function lastEnded(ledger: Ledger): number {
  let latest = lastEndings.get(ledger);
  if (latest === undefined) {
    // An open interval's end is just when its ledger was built.
    latest = -Infinity;
    for (const intervals of [ledger.jobs, ledger.breaks])
      for (const interval of intervals) if (!interval.open) latest = Math.max(latest, interval.to.getTime());
    lastEndings.set(ledger, latest);
  }
  return latest;
}

/** Clocked seconds tick on the screens by themselves; only a jump is news. */
function sameBay(before: BoardBay, after: BoardBay): boolean {
  return (
    sameJson(before, after, TICKING) &&
    (before.clockRunning || Math.abs(before.clockedSeconds - after.clockedSeconds) < 1)
  );
}
const TICKING: ReadonlySet<keyof BoardBay> = new Set(['clockedSeconds']);

/** People, queue, late count, kiosk queues and the bays' order. */
function sameFloor(before: BoardSnapshot, after: BoardSnapshot): boolean {
  return (
    before.lateLines === after.lateLines &&
    before.bays.length === after.bays.length &&
    before.bays.every((bay, i) => bay.id === after.bays[i]!.id) &&
    sameJson(before.people, after.people) &&
    sameJson(before.queue, after.queue) &&
    sameJson(before.kioskQueues, after.kioskQueues)
  );
}
