import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { QueryKey } from '@tanstack/react-query';
import { LIVE_EVENT_NAMES, type LiveEventName, type PunchDto } from '@baytime/shared';
import { createRefreshScheduler, LIVE_QUERIES, RECONNECT_QUERIES } from './live-queries';
import { queryKeys } from './query-keys';

// A missing event fails to compile here as well as in the table's own annotation.
const _everyEvent: Record<LiveEventName, unknown> = LIVE_QUERIES;
void _everyEvent;

describe('LIVE_QUERIES', () => {
  it('maps every server event, and nothing else', () => {
    expect(Object.keys(LIVE_QUERIES).sort()).toEqual([...LIVE_EVENT_NAMES].sort());
    for (const event of LIVE_EVENT_NAMES) expect(typeof LIVE_QUERIES[event]).toBe('function');
  });

  it('refreshes the findings lists in other windows when a finding is answered', () => {
    expect(
      LIVE_QUERIES['finding.answered']({
        seq: 1,
        findingId: 4,
        jobLineId: 9,
        note: 'Brake hose cracked',
        answer: 'approved',
        channel: 'phone',
      }),
    ).toContainEqual(queryKeys.findings.all());
  });

  it('refreshes the bays list when bays are added, retired or reordered', () => {
    const keys = LIVE_QUERIES['floor.updated']({
      seq: 1,
      people: [],
      queue: [],
      lateLines: 0,
      bayIds: [3, 1, 2],
      kioskQueues: [],
    });
    expect(keys).toContainEqual(queryKeys.bays());
  });

  it('refreshes the shop settings when they are saved elsewhere', () => {
    const shop = {} as Parameters<(typeof LIVE_QUERIES)['shop.updated']>[0]['shop'];
    expect(LIVE_QUERIES['shop.updated']({ seq: 1, shop })).toEqual([queryKeys.shop()]);
  });

  it("refreshes only the punching technician's timecards", () => {
    const punch = { technicianId: 7 } as PunchDto;
    const keys = LIVE_QUERIES['punch.recorded']({ seq: 1, punch });
    expect(keys).toContainEqual(['timecards', 7]);
    expect(keys).not.toContainEqual(queryKeys.timecards.all());
  });

  it('refreshes every list the table feeds after a reconnect', () => {
    const fed = new Set<string>();
    for (const event of LIVE_EVENT_NAMES)
      for (const key of (LIVE_QUERIES[event] as (payload: never) => readonly QueryKey[])(
        samplePayload(event) as never,
      ))
        fed.add(String(key[0]));
    expect([...fed].sort()).toEqual(RECONNECT_QUERIES.map((key) => String(key[0])).sort());
  });
});

function samplePayload(event: LiveEventName): unknown {
  return {
    seq: 1,
    punch: { technicianId: 1 },
    jobLine: { repairOrderId: 1 },
    repairOrderId: 1,
    findingId: 1,
    event,
  };
}

describe(createRefreshScheduler.name, () => {
  beforeEach(() => {
    vi.useFakeTimers();
  });
  afterEach(() => {
    vi.useRealTimers();
  });

  it('refreshes each key once for a burst of events', () => {
    const invalidate = vi.fn();
    const scheduler = createRefreshScheduler({ invalidate, now: Date.now });
    for (let i = 0; i < 5; i++) scheduler.mark([queryKeys.dispatch(), queryKeys.findings.all()]);
    expect(invalidate).not.toHaveBeenCalled();
    vi.advanceTimersByTime(250);
    expect(invalidate.mock.calls).toEqual([[queryKeys.dispatch()], [queryKeys.findings.all()]]);
  });

  it('leaves a held key alone', () => {
    const invalidate = vi.fn();
    const scheduler = createRefreshScheduler({
      invalidate,
      isHeld: (key) => key[0] === 'dispatch',
      now: Date.now,
    });
    scheduler.mark([queryKeys.dispatch(), queryKeys.bays()]);
    vi.advanceTimersByTime(250);
    expect(invalidate.mock.calls).toEqual([[queryKeys.bays()]]);
  });

  it('refreshes week reports at most once in 20 s however many punches come', () => {
    const invalidate = vi.fn();
    const scheduler = createRefreshScheduler({ invalidate, now: Date.now });
    scheduler.mark([queryKeys.reports.all()]);
    vi.advanceTimersByTime(250);
    expect(invalidate).toHaveBeenCalledTimes(1);
    scheduler.mark([queryKeys.reports.all()]);
    scheduler.mark([queryKeys.reports.all()]);
    vi.advanceTimersByTime(19_000);
    expect(invalidate).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(1_000);
    expect(invalidate).toHaveBeenCalledTimes(2);
  });

  it('drops what is pending when disposed', () => {
    const invalidate = vi.fn();
    const scheduler = createRefreshScheduler({ invalidate, now: Date.now });
    scheduler.mark([queryKeys.dispatch()]);
    scheduler.dispose();
    vi.advanceTimersByTime(1_000);
    expect(invalidate).not.toHaveBeenCalled();
  });
});
