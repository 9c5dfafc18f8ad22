import { estimateTemperatureEta, holdTimer, type TimerDto, type TimerEstimateDto } from '@baytime/shared';
import type { timerReadings, timers } from '../db/schema/index.js';

type TimerRow = typeof timers.$inferSelect;
type ReadingRow = Pick<typeof timerReadings.$inferSelect, 'at' | 'tempC'>;

/** Everything a screen shows of a timer is computed from its stored start, target and readings. */
export function timerEstimate(timer: TimerRow, readings: ReadingRow[], now: Date): TimerEstimateDto {
  if (timer.kind === 'set-time') {
    const hold = holdTimer(timer.startedAt, timer.durationSeconds ?? 0, now);
    return {
      status: hold.done ? 'done' : 'running',
      etaAt: hold.endsAt.toISOString(),
      secondsLeft: Math.round(hold.secondsLeft),
      method: 'fixed',
      confidence: 'high',
    };
  }
  if (timer.reachedAt)
    return {
      status: 'reached',
      etaAt: timer.reachedAt.toISOString(),
      secondsLeft: 0,
      method: null,
      confidence: 'high',
    };
  const eta = estimateTemperatureEta({
    readings,
    targetC: timer.targetC ?? 0,
    ambientC: timer.ambientC,
    kind: timer.kind,
    now,
  });
  return {
    status: eta.status,
    etaAt: eta.etaAt?.toISOString() ?? null,
    secondsLeft: eta.secondsLeft === null ? null : Math.round(eta.secondsLeft),
    method: eta.method,
    confidence: eta.confidence,
  };
}

export function toTimerDto(
  timer: TimerRow,
  readings: ReadingRow[],
  now: Date,
  lineTechnicianId: number | null,
): TimerDto {
  return {
    id: timer.id,
    kind: timer.kind,
    jobLineId: timer.jobLineId,
    lineTechnicianId,
    bayId: timer.bayId,
    label: timer.label,
    targetC: timer.targetC,
    ambientC: timer.ambientC,
    durationSeconds: timer.durationSeconds,
    startedAt: timer.startedAt.toISOString(),
    startedBy: timer.startedBy,
    reachedAt: timer.reachedAt?.toISOString() ?? null,
    endedAt: timer.endedAt?.toISOString() ?? null,
    readings: readings.map((r) => ({ at: r.at.toISOString(), tempC: r.tempC })),
    estimate: timerEstimate(timer, readings, now),
  };
}

/** Has a reading reached the target, in the timer's direction? */
export function reachesTarget(timer: Pick<TimerRow, 'kind' | 'targetC'>, tempC: number): boolean {
  if (timer.targetC === null || timer.kind === 'set-time') return false;
  return timer.kind === 'warm-up' ? tempC >= timer.targetC : tempC <= timer.targetC;
}
