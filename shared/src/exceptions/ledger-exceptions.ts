import { ledgerRulesAt, type Ledger, type LedgerSettings } from '../ledger/ledger.js';
import type { ShopSettings } from '../shop/shop.schema.js';
import type { ExceptionKind } from './exceptions.schema.js';
import { durationWords, formatDayClockTime } from '../time/format.js';

/** 29 CFR 785.18: rest periods of short duration, about 5 to 20 minutes, are hours worked. */
export const LONGEST_REST_MINUTES = 20;
/** A meal still open this long is treated as left open. */
const OPEN_MEAL_LIMIT_MS = 2 * 3600_000;

export interface LedgerException {
  kind: ExceptionKind;
  key: string;
  at: Date;
  text: string;
}

export type ExceptionSettings = Pick<ShopSettings, 'timeZone' | 'longShiftHours'> &
  Partial<Pick<ShopSettings, 'clockFormat'>> &
  LedgerSettings;

/**
 * The exceptions one technician's ledger shows for intervals that begin in [from, to): open shifts past the
 * shop's limit, breaks never ended or still open, rests over 20 minutes and meals under the minimum.
 */
export function ledgerExceptions(
  ledger: Pick<Ledger, 'shifts' | 'breaks'>,
  from: Date,
  to: Date,
  now: Date,
  settings: ExceptionSettings,
): LedgerException[] {
  const when = (instant: Date) =>
    formatDayClockTime(instant, settings.timeZone, settings.clockFormat ?? '12h');
  const inWindow = (instant: Date) => instant >= from && instant < to;
  const found: LedgerException[] = [];
  for (const shift of ledger.shifts)
    if (
      shift.open &&
      inWindow(shift.from) &&
      now.getTime() - shift.from.getTime() > settings.longShiftHours * 3600_000
    )
      found.push({
        kind: 'open-shift',
        key: `open-shift:${shift.startPunchId}`,
        at: shift.from,
        text: `On shift since ${when(shift.from)} with no shift-out (over ${settings.longShiftHours} h): add the shift-out`,
      });
  for (const pause of ledger.breaks) {
    if (!inWindow(pause.from)) continue;
    const length = pause.to.getTime() - pause.from.getTime();
    const words =
      pause.declared === 'meal' ? 'Meal break' : pause.declared === 'rest' ? 'Rest break' : 'Break';
    const key = (kind: ExceptionKind) => `${kind}:${pause.startPunchId}`;
    if (pause.endedBy === 'shift-out')
      found.push({
        kind: 'open-break',
        key: key('open-break'),
        at: pause.from,
        text: `${words} from ${when(pause.from)} was never ended: the shift-out closed it after ${durationWords(length / 1000)}`,
      });
    else if (
      pause.open &&
      length > (pause.kind === 'meal' ? OPEN_MEAL_LIMIT_MS : LONGEST_REST_MINUTES * 60_000)
    )
      found.push({
        kind: 'open-break',
        key: key('open-break'),
        at: pause.from,
        text: `${words} from ${when(pause.from)} is still open after ${durationWords(length / 1000)}`,
      });
    else if (!pause.open && pause.declared === 'meal' && pause.kind === 'rest')
      found.push({
        kind: 'short-meal',
        key: key('short-meal'),
        at: pause.from,
        text: `Meal break at ${when(pause.from)} lasted ${durationWords(length / 1000)}, under the shop's ${ledgerRulesAt(settings, pause.from.getTime()).minimumMealMinutes}-minute minimum: counted as paid rest`,
      });
    else if (!pause.open && pause.kind === 'rest' && length > LONGEST_REST_MINUTES * 60_000)
      found.push({
        kind: 'long-rest',
        key: key('long-rest'),
        at: pause.from,
        text: `${words} at ${when(pause.from)} lasted ${durationWords(length / 1000)}, over ${LONGEST_REST_MINUTES} min: counted as paid; correct it if it was a meal`,
      });
  }
  return found.sort((a, b) => a.at.getTime() - b.at.getTime());
}
