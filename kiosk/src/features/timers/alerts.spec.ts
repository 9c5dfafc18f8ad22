// @vitest-environment node
import { describe, expect, it } from 'vitest';
import type { TimerDto } from '@baytime/shared';
import {
  ANNOUNCED_KEEP_MS,
  RECENT_FINISH_MS,
  alertTitle,
  decideAlerts,
  emptyMemory,
  liveAlerts,
  parseAnnounced,
  serializeAnnounced,
} from './alerts';
import { recentlySignedIn, withSignIn } from '@/lib/signed-in-here';

const T0 = Date.parse('2026-03-10T15:00:00.000Z');
const DANA = new Map([[7, 'Dana Kim']]);
const iso = (ms: number) => new Date(T0 + ms).toISOString();

function timer(id: number, changes: Partial<TimerDto> = {}): TimerDto {
  return {
    id,
    kind: 'warm-up',
    jobLineId: 10 + id,
    lineTechnicianId: 7,
    bayId: id,
    label: null,
    targetC: 80,
    ambientC: null,
    durationSeconds: null,
    startedAt: iso(-600_000),
    startedBy: 7,
    reachedAt: null,
    endedAt: null,
    readings: [],
    estimate: {
      status: 'estimating',
      etaAt: iso(300_000),
      secondsLeft: 300,
      method: 'newton',
      confidence: 'medium',
    },
    ...changes,
  };
}

const reached = (id: number, atMs: number, changes: Partial<TimerDto> = {}) =>
  timer(id, {
    ...changes,
    reachedAt: iso(atMs),
    estimate: { status: 'reached', etaAt: iso(atMs), secondsLeft: 0, method: null, confidence: 'high' },
  });

describe(decideAlerts.name, () => {
  it('chimes once for a timer it saw running that has now reached its target', () => {
    const first = decideAlerts([timer(1)], emptyMemory(), { now: T0, fetchedAt: T0, watching: DANA });
    expect(first.alerts).toEqual([]);
    expect(first.memory.seenRunning.has(1)).toBe(true);

    const later = T0 + 10 * 60_000;
    const second = decideAlerts([reached(1, 9 * 60_000)], first.memory, {
      now: later,
      fetchedAt: later,
      watching: DANA,
    });
    expect(second.alerts).toHaveLength(1);
    expect(second.alerts[0]).toMatchObject({ timerId: 1, bayId: 1, kind: 'warm-up' });

    const third = decideAlerts([reached(1, 9 * 60_000)], second.memory, {
      now: later + 1000,
      fetchedAt: later,
      watching: DANA,
    });
    expect(third.alerts).toEqual([]);
  });

  it('on a fresh start, chimes for a recent finish but stays quiet about an old one', () => {
    const recent = reached(1, -RECENT_FINISH_MS + 1000);
    const old = reached(2, -RECENT_FINISH_MS - 1000);
    const decision = decideAlerts([recent, old], emptyMemory(), { now: T0, fetchedAt: T0, watching: DANA });
    expect(decision.alerts.map((a) => a.timerId)).toEqual([1]);
    // The old one is remembered as handled: it never chimes later either.
    expect(decision.memory.announced.has(2)).toBe(true);
    expect(
      decideAlerts([old], decision.memory, { now: T0 + 1000, fetchedAt: T0, watching: DANA }).alerts,
    ).toEqual([]);
  });

  it('chimes when a set time counts down to zero on the tablet, before the server says so', () => {
    const running = timer(3, {
      kind: 'set-time',
      targetC: null,
      durationSeconds: 600,
      estimate: {
        status: 'running',
        etaAt: iso(60_000),
        secondsLeft: 60,
        method: 'fixed',
        confidence: 'high',
      },
    });
    const before = decideAlerts([running], emptyMemory(), {
      now: T0 + 59_000,
      fetchedAt: T0,
      watching: DANA,
    });
    expect(before.alerts).toEqual([]);
    const after = decideAlerts([running], before.memory, {
      now: T0 + 60_000,
      fetchedAt: T0,
      watching: DANA,
    });
    expect(after.alerts.map((a) => a.timerId)).toEqual([3]);
    expect(after.alerts[0]!.finishedAt).toBe(T0 + 60_000);
  });

  it('never chimes for a stopped timer', () => {
    const seen = decideAlerts([timer(4)], emptyMemory(), { now: T0, fetchedAt: T0, watching: DANA });
    const stopped = { ...reached(4, 1000), endedAt: iso(2000) };
    expect(
      decideAlerts([stopped], seen.memory, { now: T0 + 3000, fetchedAt: T0 + 3000, watching: DANA }).alerts,
    ).toEqual([]);
  });

  it('forgets announced timers after a day', () => {
    const memory = { seenRunning: new Set<number>(), announced: new Map([[5, T0]]) };
    const next = decideAlerts([], memory, {
      now: T0 + ANNOUNCED_KEEP_MS + 1,
      fetchedAt: T0,
      watching: DANA,
    });
    expect(next.memory.announced.size).toBe(0);
  });
});

describe('whose timers chime here', () => {
  const luis = new Map([[7, 'Luis Ortega']]);
  const luisAndSam = new Map([
    [7, 'Luis Ortega'],
    [8, 'Sam Reyes'],
  ]);
  const options = { now: T0, fetchedAt: T0 };

  it('chimes for everyone who signed in here, with their names, whoever signed in last', () => {
    const luisTimer = reached(1, 0, { lineTechnicianId: 7 });
    const samTimer = reached(2, 0, { lineTechnicianId: 8 });
    const alerts = decideAlerts([luisTimer, samTimer], emptyMemory(), {
      ...options,
      watching: luisAndSam,
    }).alerts;
    expect(alerts.map((a) => [a.timerId, a.technicianName])).toEqual([
      [1, 'Luis Ortega'],
      [2, 'Sam Reyes'],
    ]);
  });

  it('a set time left by Luis chimes after Sam signed in and out on the same tablet', () => {
    const start = T0 - 60_000;
    const signedIn = withSignIn(
      withSignIn([], { id: 7, name: 'Luis Ortega' }, start),
      { id: 8, name: 'Sam Reyes' },
      T0 - 30_000,
    );
    const setTime = timer(4, {
      kind: 'set-time',
      targetC: null,
      durationSeconds: 60,
      startedAt: iso(-60_000),
      estimate: { status: 'running', etaAt: iso(0), secondsLeft: 60, method: 'fixed', confidence: 'high' },
    });
    const seen = decideAlerts([setTime], emptyMemory(), {
      now: start,
      fetchedAt: start,
      watching: recentlySignedIn(signedIn, start),
    });
    const done = decideAlerts([setTime], seen.memory, {
      now: T0,
      fetchedAt: start,
      watching: recentlySignedIn(signedIn, T0),
    });
    expect(done.alerts).toMatchObject([{ timerId: 4, technicianName: 'Luis Ortega', kind: 'set-time' }]);
  });

  it("a timer is the line's technician's, else whoever started it; nobody else's chimes here", () => {
    const onLuisLine = reached(1, 0, { lineTechnicianId: 7, startedBy: 9 });
    const onAnotherLine = reached(2, 0, { lineTechnicianId: 9, startedBy: 7 });
    const startedOnNobodysLine = reached(3, 0, { lineTechnicianId: null, startedBy: 7 });
    expect(
      decideAlerts([onLuisLine, onAnotherLine, startedOnNobodysLine], emptyMemory(), {
        ...options,
        watching: luis,
      }).alerts.map((a) => a.timerId),
    ).toEqual([1, 3]);
    expect(decideAlerts([onLuisLine], emptyMemory(), { ...options, watching: new Map() }).alerts).toEqual([]);
  });
});

describe(liveAlerts.name, () => {
  it('drops the banner of a timer someone stopped', () => {
    const decision = decideAlerts([reached(1, 0), reached(2, 0)], emptyMemory(), {
      now: T0,
      fetchedAt: T0,
      watching: DANA,
    });
    expect(liveAlerts(decision.alerts, [reached(2, 0)]).map((a) => a.timerId)).toEqual([2]);
  });
});

describe(alertTitle.name, () => {
  it('names whose timer it is, the bay and what happened', () => {
    const luis = { technicianName: 'Luis Ortega' };
    expect(alertTitle({ ...luis, kind: 'warm-up' }, 'Bay 4')).toBe('Luis Ortega · Bay 4: target reached');
    expect(alertTitle({ ...luis, kind: 'set-time' }, 'Bay 2')).toBe('Luis Ortega · Bay 2: set time over');
    expect(alertTitle({ ...luis, kind: 'cool-down' }, null)).toBe('Luis Ortega: target reached');
  });
});

describe(parseAnnounced.name, () => {
  it('reads back what was stored and ignores anything else', () => {
    const map = new Map([
      [1, T0],
      [2, T0 + 5],
    ]);
    expect(parseAnnounced(serializeAnnounced(map))).toEqual(map);
    expect(parseAnnounced('not json')).toEqual(new Map());
    expect(parseAnnounced('[["x", 1], [3, 4]]')).toEqual(new Map([[3, 4]]));
  });
});
