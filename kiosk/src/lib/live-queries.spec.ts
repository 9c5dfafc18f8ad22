import { describe, expect, it } from 'vitest';
import { LIVE_EVENT_NAMES, type JobLineDto, type LiveEventName, type PunchDto } from '@baytime/shared';
import { LIVE_QUERIES, type KioskContext } from './live-queries';
import { queryKeys } from './query-keys';

// A missing event fails to compile here as well as in the table's own annotation.
const _everyEvent: Record<LiveEventName, unknown> = LIVE_QUERIES;
void _everyEvent;

const dana: KioskContext = { technicianId: 7, myLineIds: new Set([31]) };
const nobody: KioskContext = { technicianId: null, myLineIds: new Set() };

describe('LIVE_QUERIES (kiosk)', () => {
  it('maps every server event, and nothing else', () => {
    expect(Object.keys(LIVE_QUERIES).sort()).toEqual([...LIVE_EVENT_NAMES].sort());
  });

  it("refreshes the day on the technician's own punches and lines only", () => {
    const punch = (technicianId: number, jobLineId: number | null) =>
      ({ technicianId, jobLineId }) as PunchDto;
    expect(LIVE_QUERIES['punch.recorded']({ seq: 1, punch: punch(7, null) }, dana)).toContainEqual(
      queryKeys.myDay.all(),
    );
    // A foreman clocks someone else onto a line on Dana's day: her day changes too.
    expect(LIVE_QUERIES['punch.recorded']({ seq: 1, punch: punch(8, 31) }, dana)).toContainEqual(
      queryKeys.myDay.all(),
    );
    expect(LIVE_QUERIES['punch.recorded']({ seq: 1, punch: punch(8, 40) }, dana)).toEqual([]);
    expect(LIVE_QUERIES['punch.recorded']({ seq: 1, punch: punch(7, null) }, nobody)).toEqual([]);

    const line = (id: number, technicianId: number | null) => ({ id, technicianId }) as JobLineDto;
    expect(LIVE_QUERIES['job-line.updated']({ seq: 1, jobLine: line(50, 7) }, dana)).toEqual([
      queryKeys.myDay.all(),
    ]);
    // Taken away from Dana: still hers until her day is read again.
    expect(LIVE_QUERIES['job-line.updated']({ seq: 1, jobLine: line(31, 8) }, dana)).toEqual([
      queryKeys.myDay.all(),
    ]);
    expect(LIVE_QUERIES['job-line.updated']({ seq: 1, jobLine: line(50, 8) }, dana)).toEqual([]);
  });

  it('reads the day again after a repair order changed, while someone is signed in', () => {
    const edited = { seq: 1, repairOrderId: 12 };
    expect(LIVE_QUERIES['repair-order.updated'](edited, dana)).toEqual([queryKeys.myDay.all()]);
    expect(LIVE_QUERIES['repair-order.updated'](edited, nobody)).toEqual([]);
  });

  it('reads the shop and the day again after a settings save: split rule and idle sign-out', () => {
    const shop = {} as Parameters<(typeof LIVE_QUERIES)['shop.updated']>[0]['shop'];
    expect(LIVE_QUERIES['shop.updated']({ seq: 1, shop }, nobody)).toEqual([
      queryKeys.shop(),
      queryKeys.myDay.all(),
    ]);
  });

  it('refreshes the running timers for the chimes even while nobody is signed in', () => {
    expect(LIVE_QUERIES['timer.updated']({ seq: 1, timerId: 1, bayId: 2 }, nobody)).toEqual([
      queryKeys.timers(),
    ]);
  });
});
