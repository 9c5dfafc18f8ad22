import type { QueryKey } from '@tanstack/react-query';
import type { LiveEventName, ServerToClientEvents } from '@baytime/shared';
import { queryKeys } from './query-keys';

type Payload<E extends LiveEventName> = Parameters<ServerToClientEvents[E]>[0];

/**
 * What each live event makes stale in the office. Only queries on screen load again; the others
 * when they are next shown. The wall keeps its own board from the same events (`board.snapshot`,
 * `bay.updated`, `floor.updated`), and `session.ended` is the link's own business.
 */
export const LIVE_QUERIES: { [E in LiveEventName]: (payload: Payload<E>) => readonly QueryKey[] } = {
  'board.snapshot': () => [],
  'bay.updated': () => [queryKeys.dispatch(), queryKeys.reports.all()],
  // Bays added, retired or reordered come as a new `bayIds`: the admin list follows.
  'floor.updated': () => [queryKeys.dispatch(), queryKeys.bays()],
  'punch.recorded': ({ punch }) => [
    queryKeys.dispatch(),
    queryKeys.timecards.ofTechnician(punch.technicianId),
    queryKeys.reports.all(),
    queryKeys.exceptions.all(),
  ],
  'job-line.updated': ({ jobLine }) => [
    queryKeys.dispatch(),
    queryKeys.repairOrders.all(),
    queryKeys.repairOrder.one(jobLine.repairOrderId),
    queryKeys.repairOrderHistory.one(jobLine.repairOrderId),
    queryKeys.findings.all(),
    queryKeys.reports.all(),
  ],
  'timer.updated': () => [],
  'finding.created': () => [queryKeys.findings.all(), queryKeys.repairOrder.all(), queryKeys.dispatch()],
  'finding.answered': () => [queryKeys.findings.all(), queryKeys.repairOrder.all(), queryKeys.dispatch()],
  'repair-order.updated': ({ repairOrderId }) => [
    queryKeys.repairOrders.all(),
    queryKeys.repairOrder.one(repairOrderId),
    queryKeys.repairOrderHistory.one(repairOrderId),
    queryKeys.findings.all(),
  ],
  'shop.updated': () => [queryKeys.shop()],
  'session.ended': () => [],
};

/** After the link comes back messages may have been missed: everything the table feeds is stale. */
export const RECONNECT_QUERIES: readonly QueryKey[] = [
  queryKeys.dispatch(),
  queryKeys.bays(),
  queryKeys.shop(),
  queryKeys.timecards.all(),
  queryKeys.reports.all(),
  queryKeys.exceptions.all(),
  queryKeys.repairOrders.all(),
  queryKeys.repairOrder.all(),
  queryKeys.repairOrderHistory.all(),
  queryKeys.findings.all(),
];

/** Week sums: a burst of punches refreshes them once in this long, not once per punch. */
const SLOW_ROOTS: Readonly<Record<string, number>> = { [queryKeys.reports.all()[0]]: 20_000 };

export interface RefreshScheduler {
  /** Marks these keys stale after a short settle, so a burst of events costs one refetch each. */
  mark(keys: readonly QueryKey[]): void;
  dispose(): void;
}

export interface RefreshSchedulerOptions {
  invalidate: (key: QueryKey) => void;
  /** A key not to refresh now (a change of its own is in flight and refreshes it when it settles). */
  isHeld?: (key: QueryKey) => boolean;
  settleMs?: number;
  now?: () => number;
}

export function createRefreshScheduler({
  invalidate,
  isHeld = () => false,
  settleMs = 250,
  now = Date.now,
}: RefreshSchedulerOptions): RefreshScheduler {
  /** One batch per lane: the quick one, and one per slow root. */
  const lanes = new Map<string, { keys: Map<string, QueryKey>; timer: ReturnType<typeof setTimeout> }>();
  const lastRun = new Map<string, number>();

  const run = (lane: string) => {
    const batch = lanes.get(lane);
    lanes.delete(lane);
    lastRun.set(lane, now());
    for (const key of batch?.keys.values() ?? []) if (!isHeld(key)) invalidate(key);
  };

  return {
    mark(keys) {
      for (const key of keys) {
        const root = String(key[0]);
        const gap = SLOW_ROOTS[root];
        const lane = gap === undefined ? '' : root;
        let batch = lanes.get(lane);
        if (!batch) {
          const wait =
            gap === undefined ? settleMs : Math.max(settleMs, (lastRun.get(lane) ?? -gap) + gap - now());
          batch = { keys: new Map(), timer: setTimeout(() => run(lane), wait) };
          lanes.set(lane, batch);
        }
        batch.keys.set(JSON.stringify(key), key);
      }
    },
    dispose() {
      for (const { timer } of lanes.values()) clearTimeout(timer);
      lanes.clear();
    },
  };
}
