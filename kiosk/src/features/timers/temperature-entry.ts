import { fromCelsius, temperatureUnit, toCelsius, type TimerKind, type UnitSystem } from '@baytime/shared';

/** What the keypad sends: a digit, the point, the minus (a sign flip), delete, clear. */
export type EntryKey =
  '0' | '1' | '2' | '3' | '4' | '5' | '6' | '7' | '8' | '9' | '.' | '-' | 'back' | 'clear';

export interface EntryRules {
  minus: boolean;
  decimals: 0 | 1;
  maxIntegerDigits: number;
}

/** Temperatures: a sign, three digits (572 °F is the top), one decimal. */
export const TEMPERATURE_ENTRY: EntryRules = { minus: true, decimals: 1, maxIntegerDigits: 3 };
/** Minutes for a set time: whole minutes up to 48 hours. */
export const MINUTES_ENTRY: EntryRules = { minus: false, decimals: 0, maxIntegerDigits: 4 };

/** The schema's limits, in °C. */
export const TEMPERATURE_MIN_C = -40;
export const TEMPERATURE_MAX_C = 300;
export const HOLD_MAX_MINUTES = 48 * 60;

/** The text on the display after one key. Keys that make no sense here change nothing. */
export function editEntry(text: string, key: EntryKey, rules: EntryRules): string {
  const negative = text.startsWith('-');
  const body = negative ? text.slice(1) : text;
  const [whole = '', fraction] = body.split('.');
  switch (key) {
    case 'clear':
      return '';
    case 'back':
      return text.slice(0, -1);
    case '-':
      if (!rules.minus) return text;
      return negative ? body : `-${body}`;
    case '.':
      if (rules.decimals === 0 || fraction !== undefined) return text;
      return `${negative ? '-' : ''}${whole || '0'}.`;
    default:
      if (fraction !== undefined) return fraction.length < rules.decimals ? text + key : text;
      if (whole === '0') return `${negative ? '-' : ''}${key}`;
      return whole.length < rules.maxIntegerDigits ? text + key : text;
  }
}

/** The number on the display, or null while it is empty or only a sign. */
export function parseEntry(text: string): number | null {
  if (!/^-?\d+(\.\d*)?$/.test(text)) return null;
  const value = Number(text);
  return Number.isFinite(value) ? (Object.is(value, -0) ? 0 : value) : null;
}

/** "−40 °F": the minus sign a reader expects, the unit of the shop. */
export function showTemperature(celsius: number, units: UnitSystem): string {
  const value = fromCelsius(celsius, units);
  const rounded = Math.round(value * 10) / 10;
  const text = (Object.is(rounded, -0) ? 0 : rounded).toLocaleString('en-US', {
    maximumFractionDigits: 1,
    useGrouping: false,
  });
  return `${text.replace('-', '−')} ${temperatureUnit(units)}`;
}

export type Reading<T> = { ok: true; value: T } | { ok: false; message: string };

/** A temperature typed in the shop's unit, as exact °C for the API. */
export function readTemperature(text: string, units: UnitSystem, what = 'a temperature'): Reading<number> {
  const value = parseEntry(text);
  if (value === null) return { ok: false, message: `Type ${what}` };
  const celsius = toCelsius(value, units);
  // Compare in the shop's unit, so "572 °F" passes though 572 °F is 299.99… °C in floating point.
  const min = fromCelsius(TEMPERATURE_MIN_C, units);
  const max = fromCelsius(TEMPERATURE_MAX_C, units);
  if (value < min - 1e-9)
    return { ok: false, message: `Below ${showTemperature(TEMPERATURE_MIN_C, units)}: check the number` };
  if (value > max + 1e-9)
    return { ok: false, message: `Above ${showTemperature(TEMPERATURE_MAX_C, units)}: check the number` };
  return { ok: true, value: Math.min(TEMPERATURE_MAX_C, Math.max(TEMPERATURE_MIN_C, celsius)) };
}

/** A target and an optional level-off temperature that a timer could ever reach. */
export function checkTimerTemperatures(
  kind: Exclude<TimerKind, 'set-time'>,
  targetC: number,
  ambientC: number | null,
): string | null {
  if (ambientC === null) return null;
  if (kind === 'warm-up' && ambientC <= targetC)
    return 'For a warm-up, where it levels off must be above the target, or it never gets there';
  if (kind === 'cool-down' && ambientC >= targetC)
    return 'For a cool-down, the room temperature must be below the target, or it never gets there';
  return null;
}

/** Minutes for a set time, as seconds for the API. */
export function readMinutes(text: string): Reading<number> {
  const value = parseEntry(text);
  if (value === null) return { ok: false, message: 'Type the minutes' };
  if (value < 1) return { ok: false, message: 'At least 1 minute' };
  if (value > HOLD_MAX_MINUTES) return { ok: false, message: 'At most 48 hours (2880 minutes)' };
  return { ok: true, value: Math.round(value * 60) };
}
