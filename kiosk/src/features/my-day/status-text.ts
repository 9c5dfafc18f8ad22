import { PERSON_STATUS_WORDS, PUNCH_WORDS, repairOrderLineWords } from '@baytime/shared';
import { durationWords, formatHours, sinceTime } from '@/lib/format';
import { lineSeconds, type ConcurrentSplit, type DayView } from './project-day';

export interface StatusText {
  headline: string;
  detail: string;
}

/** The status line in words: "On shift since 7:02 am · on RO 4417 line 2 for 0.63 h". */
export function statusText(
  view: DayView,
  now: number,
  timeZone?: string,
  split?: ConcurrentSplit,
): StatusText {
  const { shift } = view;
  if (shift.status === 'off') {
    return {
      headline: PERSON_STATUS_WORDS.off,
      detail: `Tap ${PUNCH_WORDS['shift-in']} when you begin work.`,
    };
  }
  if (shift.status === 'on-break') {
    const since = shift.since ?? new Date(now).toISOString();
    return {
      headline: `On a ${shift.breakKind === 'rest' ? 'rest' : 'meal'} break since ${sinceTime(since, now, timeZone)}`,
      detail: `Break so far ${durationWords((now - Date.parse(since)) / 1000)}`,
    };
  }
  const since = view.shiftStartedAt ?? shift.since;
  const head = since
    ? `${PERSON_STATUS_WORDS['on-shift']} since ${sinceTime(since, now, timeZone)}`
    : PERSON_STATUS_WORDS['on-shift'];
  const running = view.lines.filter((line) => line.clockedOn);
  if (running.length === 0) {
    return {
      headline: `${head} · not on a job`,
      detail: view.lines.some((l) => l.status !== 'done')
        ? 'Pick a line below and tap Clock on.'
        : 'No lines assigned to you yet: ask the foreman.',
    };
  }
  const parts = running.map(
    (line) =>
      `${repairOrderLineWords(line.repairOrderNumber, line.lineNo)} for ${formatHours(lineSeconds(view, line, now, split).mine)}`,
  );
  return {
    headline: `${head} · on ${parts.join(' and ')}`,
    detail: running.length > 1 ? `Your time is shared between ${running.length} lines.` : running[0]!.title,
  };
}
