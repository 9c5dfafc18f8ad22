import { lineStatusWords, repairOrderLineWords } from '@baytime/shared';
import type { DayLine, DayView } from './project-day';

export type ClockAction =
  | { kind: 'clock-on' }
  | { kind: 'clock-off' }
  | { kind: 'switch'; fromLabel: string }
  /** `clockOn`: the technician can work it now, so resuming clocks them on as well. */
  | { kind: 'resume'; clockOn: boolean }
  | { kind: 'none'; hint: string | null };

export const lineLabel = (line: DayLine) => repairOrderLineWords(line.repairOrderNumber, line.lineNo);

/**
 * A line's state on this technician's card, in the word every screen uses ("Held: Parts"); a line
 * started before, or that someone else is on, says this technician is not on its clock.
 */
export function lineStatusWord(line: Pick<DayLine, 'status' | 'holdReason' | 'clockedOn'>): string {
  const words = lineStatusWords(line);
  return line.status === 'working' && !line.clockedOn ? `${words} · not clocked on` : words;
}

export function clockAction(view: DayView, line: DayLine, maxConcurrentJobs: number): ClockAction {
  if (line.clockedOn) return { kind: 'clock-off' };
  if (line.status === 'done' || line.status === 'cancelled') return { kind: 'none', hint: null };
  const running = view.lines.filter((l) => l.clockedOn);
  if (line.status === 'held')
    return {
      kind: 'resume',
      clockOn: view.shift.status === 'on-shift' && running.length < maxConcurrentJobs,
    };
  if (view.shift.status === 'off') return { kind: 'none', hint: 'Start your shift to clock on' };
  if (view.shift.status === 'on-break') return { kind: 'none', hint: 'End your break to clock on' };
  if (running.length < maxConcurrentJobs) return { kind: 'clock-on' };
  if (maxConcurrentJobs === 1 && running[0]) return { kind: 'switch', fromLabel: lineLabel(running[0]) };
  return { kind: 'none', hint: `You are on ${running.length} lines: clock one off first` };
}
