// @vitest-environment node
import { describe, expect, it } from 'vitest';
import type { TimerDto } from '@baytime/shared';
import { describeTimer, finishedAt, secondsLeftNow, stillCounting } from './timer-status';

const T0 = Date.parse('2026-03-10T15:00:00.000Z'); // 10:00 in America/Chicago (CDT)
const iso = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();
const clock = { now: T0, fetchedAt: T0, units: 'us' as const, timeZone: 'America/Chicago' };

function warmUp(changes: Partial<TimerDto> = {}): TimerDto {
  return {
    id: 1,
    kind: 'warm-up',
    jobLineId: 5,
    lineTechnicianId: 7,
    bayId: 4,
    label: null,
    targetC: 80,
    ambientC: null,
    durationSeconds: null,
    startedAt: iso(-10),
    startedBy: 7,
    reachedAt: null,
    endedAt: null,
    readings: [],
    estimate: {
      status: 'not-enough-readings',
      etaAt: null,
      secondsLeft: null,
      method: null,
      confidence: 'low',
    },
    ...changes,
  };
}

function setTime(changes: Partial<TimerDto> = {}): TimerDto {
  return warmUp({
    kind: 'set-time',
    targetC: null,
    durationSeconds: 1800,
    label: 'Sealant cure',
    estimate: { status: 'running', etaAt: iso(20), secondsLeft: 1200, method: 'fixed', confidence: 'high' },
    ...changes,
  });
}

describe(describeTimer.name, () => {
  it('asks for readings until there are enough, in the shop’s unit', () => {
    const view = describeTimer(warmUp(), clock);
    expect(view.headline).toBe('Warm-up to 176 °F');
    expect(view.state).toBe('Not enough readings yet');
    expect(view.takesReadings).toBe(true);
    expect(view.lastReading).toBeNull();
    expect(view.progress).toBeNull();
  });

  it('gives time left, the clock time in the shop’s zone, the confidence and the progress', () => {
    const view = describeTimer(
      warmUp({
        readings: [
          { at: iso(-8), tempC: 40 },
          { at: iso(-1), tempC: 60 },
        ],
        estimate: {
          status: 'estimating',
          etaAt: iso(6),
          secondsLeft: 360,
          method: 'newton',
          confidence: 'medium',
        },
      }),
      clock,
    );
    expect(view.state).toBe('About 6 min left');
    expect(view.detail).toBe('Ready about 10:06 am');
    expect(view.confidence).toBe('fair estimate');
    expect(view.lastReading).toBe('Last reading 140 °F at 9:59 am · 2 readings');
    expect(view.progress).toBeCloseTo(0.5, 10);
  });

  it('counts the time left down from when it was fetched, not from the tablet’s clock', () => {
    const timer = warmUp({
      readings: [{ at: iso(-1), tempC: 60 }],
      estimate: {
        status: 'estimating',
        etaAt: iso(6),
        secondsLeft: 360,
        method: 'linear',
        confidence: 'low',
      },
    });
    expect(secondsLeftNow(timer, { now: T0 + 60_000, fetchedAt: T0 })).toBe(300);
    expect(describeTimer(timer, { ...clock, now: T0 + 330_000 }).state).toBe('Less than a minute left');
    expect(describeTimer(timer, { ...clock, now: T0 + 400_000 }).state).toBe('Due about now: log a reading');
  });

  it('says why there is no time left when readings go the wrong way or level off short', () => {
    const away = describeTimer(warmUp({ estimate: { ...warmUp().estimate, status: 'moving-away' } }), clock);
    expect(away.state).toBe('Readings are moving away from the target');
    expect(away.tone).toBe('warn');
    const short = describeTimer(
      warmUp({ estimate: { ...warmUp().estimate, status: 'beyond-asymptote' } }),
      clock,
    );
    expect(short.state).toBe('Target is beyond where the readings level off');
    expect(short.confidence).toBeNull();
  });

  it('shows a reached target with the time it was reached', () => {
    const view = describeTimer(
      warmUp({ reachedAt: iso(-2), estimate: { ...warmUp().estimate, status: 'reached' } }),
      clock,
    );
    expect(view).toMatchObject({
      state: 'Target reached at 9:58 am',
      tone: 'done',
      finished: true,
      progress: 1,
    });
    expect(view.takesReadings).toBe(false);
  });

  it('counts a set time down and says when it ends', () => {
    const view = describeTimer(setTime(), { ...clock, now: T0 + 5_000 });
    expect(view.headline).toBe('Sealant cure · 30 min');
    expect(view.state).toBe('19:55 left');
    expect(view.detail).toBe('Ends 10:20 am');
    expect(view.progress).toBeCloseTo(1 - 1195 / 1800, 10);
  });

  it('calls a set time over once its time is up, even before the server says so', () => {
    const view = describeTimer(setTime(), { ...clock, now: T0 + 1_200_000 });
    expect(view).toMatchObject({ state: 'Time up at 10:20 am', finished: true });
  });
});

describe(finishedAt.name, () => {
  it('is null for a stopped timer or one still running', () => {
    expect(finishedAt(warmUp(), clock)).toBeNull();
    expect(finishedAt(setTime({ endedAt: iso(0), reachedAt: iso(-1) }), clock)).toBeNull();
  });

  it('takes the server’s reachedAt first', () => {
    expect(finishedAt(setTime({ reachedAt: iso(-3) }), clock)).toBe(T0 - 180_000);
  });
});

describe(stillCounting.name, () => {
  it('counts a warm-up short of its target and a set time with time left', () => {
    expect(stillCounting(warmUp(), clock)).toBe(true);
    expect(stillCounting(setTime(), clock)).toBe(true);
  });

  it('no longer counts a timer whose target is reached or whose time is up, nor a stopped one', () => {
    const reached = warmUp({
      reachedAt: iso(-1),
      estimate: { status: 'reached', etaAt: iso(-1), secondsLeft: 0, method: null, confidence: 'high' },
    });
    expect(stillCounting(reached, clock)).toBe(false);
    // Over on the tablet's own count, before the server says so.
    expect(stillCounting(setTime(), { now: T0 + 1200_000, fetchedAt: T0 })).toBe(false);
    expect(stillCounting(setTime({ endedAt: iso(-1) }), clock)).toBe(false);
  });
});
