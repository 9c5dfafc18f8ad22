import type { QueryKey } from '@tanstack/react-query';
import type { LiveEventName, MyDay, ServerToClientEvents } from '@baytime/shared';
import { queryKeys } from './query-keys';

type Payload<E extends LiveEventName> = Parameters<ServerToClientEvents[E]>[0];

/** Who the tablet is for when an event comes: the technician signed in (or none), and their lines. */
export interface KioskContext {
  technicianId: number | null;
  myLineIds: ReadonlySet<number>;
}

/** The ids of the lines on the technician's day as last fetched. */
export function myLineIdsOf(day: MyDay | undefined): ReadonlySet<number> {
  return new Set(day?.lines.map((line) => line.id) ?? []);
}

const mine = (context: KioskContext, technicianId: number | null, lineId: number | null) =>
  (context.technicianId !== null && technicianId === context.technicianId) ||
  (lineId !== null && context.myLineIds.has(lineId));

/**
 * What each live event makes stale on the kiosk: only what concerns the technician signed in, and
 * the shop's running timers, which chime on the tablet of whoever started them even when nobody is
 * signed in.
 */
export const LIVE_QUERIES: {
  [E in LiveEventName]: (payload: Payload<E>, context: KioskContext) => readonly QueryKey[];
} = {
  // Sent on every (re)connect: anything may have been missed.
  'board.snapshot': () => [queryKeys.myDay.all(), queryKeys.timers()],
  'bay.updated': () => [],
  'floor.updated': () => [queryKeys.bays()],
  'punch.recorded': ({ punch }, context) =>
    mine(context, punch.technicianId, punch.jobLineId)
      ? [queryKeys.myDay.all(), queryKeys.timecards.of(punch.technicianId)]
      : [],
  'job-line.updated': ({ jobLine }, context) =>
    mine(context, jobLine.technicianId, jobLine.id) ? [queryKeys.myDay.all()] : [],
  'timer.updated': () => [queryKeys.timers()],
  'finding.created': () => [],
  'finding.answered': () => [],
  // An edit may rename the vehicle or move the promise on a line of the day: the event names only the RO.
  'repair-order.updated': (_, context) => (context.technicianId !== null ? [queryKeys.myDay.all()] : []),
  // The split rule, the idle sign-out and the jobs-at-once limit come with the day and the shop.
  'shop.updated': () => [queryKeys.shop(), queryKeys.myDay.all()],
  'session.ended': () => [],
};
