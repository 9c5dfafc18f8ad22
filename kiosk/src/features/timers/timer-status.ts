import { TIMER_CONFIDENCE_WORDS, TIMER_KIND_LABELS, type TimerDto, type UnitSystem } from '@baytime/shared';
import { clockTime, countdown, durationWords } from '@/lib/format';
import { showTemperature } from './temperature-entry';

export interface TimerClock {
  /** The tablet's time now, ms. */
  now: number;
  /** When the tablet received this timer: `secondsLeft` counts from then, whatever the clocks say. */
  fetchedAt: number;
  units: UnitSystem;
  timeZone?: string;
}

export type TimerTone = 'running' | 'warn' | 'done';

export interface TimerView {
  /** "Warm-up to 175 °F", "Sealant cure · 30 min". */
  headline: string;
  /** The big line: "About 6 min left", "12:34 left", "Target reached at 3:58". */
  state: string;
  /** A quieter line under it: "Ready about 3:58", "Ends 4:05". */
  detail: string | null;
  /** How far to trust the time left, quietly: "rough estimate". */
  confidence: string | null;
  /** "Last reading 150 °F at 3:42 · 3 readings". */
  lastReading: string | null;
  /** 0 to 1, or null when there is nothing to measure it by yet. */
  progress: number | null;
  tone: TimerTone;
  finished: boolean;
  /** Readings still help: a warm-up or cool-down not yet at its target. */
  takesReadings: boolean;
}

/** Seconds left now, counted down from what the server said when the timer was fetched. */
export function secondsLeftNow(timer: TimerDto, clock: Pick<TimerClock, 'now' | 'fetchedAt'>): number | null {
  const left = timer.estimate.secondsLeft;
  if (left === null) return null;
  return Math.max(0, left - (clock.now - clock.fetchedAt) / 1000);
}

/** The moment the timer finished (target reached, set time over), or null while it runs. */
export function finishedAt(timer: TimerDto, clock: Pick<TimerClock, 'now' | 'fetchedAt'>): number | null {
  if (timer.endedAt !== null) return null;
  if (timer.reachedAt !== null) return Date.parse(timer.reachedAt);
  const { status, etaAt, secondsLeft } = timer.estimate;
  if (status === 'reached' || status === 'done')
    return etaAt ? Date.parse(etaAt) : clock.fetchedAt + (secondsLeft ?? 0) * 1000;
  if (timer.kind === 'set-time' && secondsLeft !== null) {
    const end = clock.fetchedAt + secondsLeft * 1000;
    return end <= clock.now ? end : null;
  }
  return null;
}

/**
 * Not stopped, and its target not reached nor its time up: nobody need come back for it yet. A
 * finished timer only waits for someone to clear it.
 */
export function stillCounting(timer: TimerDto, clock: Pick<TimerClock, 'now' | 'fetchedAt'>): boolean {
  return timer.endedAt === null && finishedAt(timer, clock) === null;
}

function lastReadingOf(timer: TimerDto) {
  const sorted = [...timer.readings].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  return { first: sorted[0] ?? null, last: sorted.at(-1) ?? null, count: sorted.length };
}

export function timerHeadline(timer: TimerDto, units: UnitSystem): string {
  if (timer.kind === 'set-time') {
    const length = durationWords(timer.durationSeconds ?? 0);
    return `${timer.label ?? TIMER_KIND_LABELS['set-time']} · ${length}`;
  }
  const word = TIMER_KIND_LABELS[timer.kind];
  return timer.targetC === null ? word : `${word} to ${showTemperature(timer.targetC, units)}`;
}

/** Everything the timer panel on a line card says, in words. */
export function describeTimer(timer: TimerDto, clock: TimerClock): TimerView {
  const { units, timeZone } = clock;
  const headline = timerHeadline(timer, units);
  const ended = finishedAt(timer, clock);
  const at = (ms: number | string) => clockTime(ms, timeZone);

  if (timer.kind === 'set-time') {
    const duration = timer.durationSeconds ?? 0;
    const left = secondsLeftNow(timer, clock) ?? 0;
    const progress = duration > 0 ? Math.min(1, Math.max(0, (duration - left) / duration)) : 1;
    if (ended !== null)
      return {
        headline,
        state: `Time up at ${at(ended)}`,
        detail: null,
        confidence: null,
        lastReading: null,
        progress: 1,
        tone: 'done',
        finished: true,
        takesReadings: false,
      };
    return {
      headline,
      state: `${countdown(left)} left`,
      detail: timer.estimate.etaAt ? `Ends ${at(timer.estimate.etaAt)}` : null,
      confidence: null,
      lastReading: null,
      progress,
      tone: 'running',
      finished: false,
      takesReadings: false,
    };
  }

  const { first, last, count } = lastReadingOf(timer);
  const lastReading = last
    ? `Last reading ${showTemperature(last.tempC, units)} at ${at(last.at)} · ${count === 1 ? '1 reading' : `${count} readings`}`
    : null;
  let progress: number | null = null;
  if (first && last && timer.targetC !== null) {
    const span = timer.targetC - first.tempC;
    progress = span === 0 ? 1 : Math.min(1, Math.max(0, (last.tempC - first.tempC) / span));
  }

  if (ended !== null)
    return {
      headline,
      state: `Target reached at ${at(ended)}`,
      detail: null,
      confidence: null,
      lastReading,
      progress: 1,
      tone: 'done',
      finished: true,
      takesReadings: false,
    };

  const base = { headline, lastReading, progress, finished: false, takesReadings: true } as const;
  switch (timer.estimate.status) {
    case 'not-enough-readings':
      return {
        ...base,
        state: 'Not enough readings yet',
        detail:
          count === 0
            ? 'Log the first reading now, then one every few minutes.'
            : 'Log another reading in a few minutes.',
        confidence: null,
        tone: 'running',
      };
    case 'moving-away':
      return {
        ...base,
        state: 'Readings are moving away from the target',
        detail: 'Check the readings and the target.',
        confidence: null,
        tone: 'warn',
      };
    case 'beyond-asymptote':
      return {
        ...base,
        state: 'Target is beyond where the readings level off',
        detail: 'At this rate it may never get there. Check the target.',
        confidence: null,
        tone: 'warn',
      };
    default: {
      const left = secondsLeftNow(timer, clock);
      const eta = timer.estimate.etaAt;
      if (left === null)
        return {
          ...base,
          state: 'Working out the time left',
          detail: null,
          confidence: null,
          tone: 'running',
        };
      return {
        ...base,
        state:
          left <= 0
            ? 'Due about now: log a reading'
            : left < 60
              ? 'Less than a minute left'
              : `About ${durationWords(left)} left`,
        detail: eta ? `Ready about ${at(eta)}` : null,
        confidence: TIMER_CONFIDENCE_WORDS[timer.estimate.confidence],
        tone: 'running',
      };
    }
  }
}
