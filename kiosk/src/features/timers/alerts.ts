import type { TimerDto, TimerKind } from '@baytime/shared';
import { finishedAt } from './timer-status';

/** A timer that just finished: the kiosk chimes once and shows a banner until someone taps OK. */
export interface TimerAlert {
  timerId: number;
  /** Whose timer it is, so the right person goes. */
  technicianName: string;
  bayId: number | null;
  jobLineId: number;
  kind: TimerKind;
  label: string | null;
  targetC: number | null;
  finishedAt: number;
}

export interface AlertMemory {
  /** Timers this kiosk saw running: when they finish, it always chimes. */
  seenRunning: ReadonlySet<number>;
  /** Timers already announced (or judged too old to announce), with when: never twice. */
  announced: ReadonlyMap<number, number>;
}

export const emptyMemory = (): AlertMemory => ({ seenRunning: new Set(), announced: new Map() });

/**
 * A finish this kiosk did not see coming (it was just switched on, or reloaded) is still news if
 * it happened this recently; older ones would only startle whoever is near the tablet.
 */
export const RECENT_FINISH_MS = 2 * 60_000;
/** Announced ids are remembered this long, then forgotten. */
export const ANNOUNCED_KEEP_MS = 24 * 3600_000;

export interface DecideOptions {
  now: number;
  fetchedAt: number;
  /**
   * Everyone who signed in on this tablet during the shift, by id, with their names: their timers
   * chime here, whoever is signed in now or signed in last.
   */
  watching: ReadonlyMap<number, string>;
}

/** A timer is a technician's when it runs on their line, or they started it on a line nobody has. */
export function timerOwner(timer: Pick<TimerDto, 'lineTechnicianId' | 'startedBy'>): number {
  return timer.lineTechnicianId ?? timer.startedBy;
}

export interface Decision {
  alerts: TimerAlert[];
  memory: AlertMemory;
}

/** Which running timers to chime for now, and what to remember for next time. */
export function decideAlerts(
  timers: readonly TimerDto[],
  memory: AlertMemory,
  options: DecideOptions,
): Decision {
  const { now } = options;
  const seenRunning = new Set<number>();
  const announced = new Map<number, number>();
  for (const [id, at] of memory.announced) if (now - at < ANNOUNCED_KEEP_MS) announced.set(id, at);
  const alerts: TimerAlert[] = [];

  for (const timer of timers) {
    const technicianName = options.watching.get(timerOwner(timer));
    if (timer.endedAt !== null || technicianName === undefined) continue;
    const finished = finishedAt(timer, options);
    if (finished === null) {
      seenRunning.add(timer.id);
      continue;
    }
    if (announced.has(timer.id)) continue;
    announced.set(timer.id, now);
    if (memory.seenRunning.has(timer.id) || now - finished <= RECENT_FINISH_MS)
      alerts.push({
        timerId: timer.id,
        technicianName,
        bayId: timer.bayId,
        jobLineId: timer.jobLineId,
        kind: timer.kind,
        label: timer.label,
        targetC: timer.targetC,
        finishedAt: finished,
      });
  }
  return { alerts, memory: { seenRunning, announced } };
}

/** Alerts still worth showing: the timer has not been stopped (it is still in the running list). */
export function liveAlerts(alerts: readonly TimerAlert[], timers: readonly TimerDto[]): TimerAlert[] {
  const running = new Set(timers.filter((t) => t.endedAt === null).map((t) => t.id));
  return alerts.filter((alert) => running.has(alert.timerId));
}

/** "Luis Ortega · Bay 4: target reached", "Sam Reyes: set time over". */
export function alertTitle(
  alert: Pick<TimerAlert, 'kind' | 'technicianName'>,
  bayName: string | null,
): string {
  const what = alert.kind === 'set-time' ? 'set time over' : 'target reached';
  return `${bayName ? `${alert.technicianName} · ${bayName}` : alert.technicianName}: ${what}`;
}

/** The announced ids as stored, and back: a reload must not chime again. */
export function serializeAnnounced(announced: ReadonlyMap<number, number>): string {
  return JSON.stringify([...announced]);
}

export function parseAnnounced(text: string | null): Map<number, number> {
  try {
    const parsed: unknown = JSON.parse(text ?? '[]');
    if (!Array.isArray(parsed)) return new Map();
    return new Map(
      parsed.filter(
        (pair): pair is [number, number] =>
          Array.isArray(pair) && typeof pair[0] === 'number' && typeof pair[1] === 'number',
      ),
    );
  } catch {
    return new Map();
  }
}
