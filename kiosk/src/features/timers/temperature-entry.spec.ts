// @vitest-environment node
import { describe, expect, it } from 'vitest';
import {
  MINUTES_ENTRY,
  TEMPERATURE_ENTRY,
  checkTimerTemperatures,
  editEntry,
  parseEntry,
  readMinutes,
  readTemperature,
  showTemperature,
  type EntryKey,
} from './temperature-entry';

const type = (keys: EntryKey[], rules = TEMPERATURE_ENTRY) =>
  keys.reduce((text, key) => editEntry(text, key, rules), '');

describe(editEntry.name, () => {
  it('types digits, one point and one decimal', () => {
    expect(type(['1', '7', '5', '.', '5'])).toBe('175.5');
    expect(type(['1', '7', '5', '.', '5', '5'])).toBe('175.5');
    expect(type(['8', '.', '.', '2'])).toBe('8.2');
  });

  it('flips the sign with the minus key wherever the digits are', () => {
    expect(type(['1', '2', '-'])).toBe('-12');
    expect(type(['-', '1', '2'])).toBe('-12');
    expect(type(['-', '1', '2', '-'])).toBe('12');
  });

  it('starts a bare point as 0. and replaces a lone leading zero', () => {
    expect(type(['.', '5'])).toBe('0.5');
    expect(type(['-', '.', '5'])).toBe('-0.5');
    expect(type(['0', '7'])).toBe('7');
  });

  it('stops at three whole digits for a temperature', () => {
    expect(type(['5', '7', '2', '9'])).toBe('572');
  });

  it('deletes and clears', () => {
    expect(type(['1', '7', '5', 'back'])).toBe('17');
    expect(type(['1', '7', 'clear'])).toBe('');
  });

  it('takes no sign and no point for minutes', () => {
    expect(type(['-', '1', '.', '5'], MINUTES_ENTRY)).toBe('15');
  });
});

describe(parseEntry.name, () => {
  it('reads numbers and leaves an empty or sign-only display unread', () => {
    expect(parseEntry('175.5')).toBe(175.5);
    expect(parseEntry('-12')).toBe(-12);
    expect(parseEntry('80.')).toBe(80);
    expect(parseEntry('-0')).toBe(0);
    expect(parseEntry('')).toBeNull();
    expect(parseEntry('-')).toBeNull();
  });
});

describe(readTemperature.name, () => {
  // NIST SP 811 (B.9): t/°C = (t/°F − 32)/1.8 — exact, no rounding on the way to the API.
  it('converts Fahrenheit to Celsius exactly', () => {
    const read = readTemperature('176', 'us');
    expect(read).toEqual({ ok: true, value: 80 });
    const half = readTemperature('175.5', 'us');
    expect(half.ok && half.value).toBeCloseTo((175.5 - 32) / 1.8, 12);
    expect(readTemperature('-40', 'us')).toEqual({ ok: true, value: -40 });
  });

  it('passes Celsius through', () => {
    expect(readTemperature('82.5', 'metric')).toEqual({ ok: true, value: 82.5 });
  });

  it('accepts the edges of the range in either unit', () => {
    expect(readTemperature('572', 'us')).toEqual({ ok: true, value: 300 });
    expect(readTemperature('300', 'metric')).toEqual({ ok: true, value: 300 });
  });

  it('refuses what is out of range, in the shop’s unit', () => {
    expect(readTemperature('573', 'us')).toEqual({ ok: false, message: 'Above 572 °F: check the number' });
    expect(readTemperature('-41', 'metric')).toEqual({
      ok: false,
      message: 'Below −40 °C: check the number',
    });
    expect(readTemperature('', 'us', 'the target')).toEqual({ ok: false, message: 'Type the target' });
  });
});

describe(showTemperature.name, () => {
  it('shows the shop’s unit with a real minus sign and at most one decimal', () => {
    expect(showTemperature(80, 'us')).toBe('176 °F');
    expect(showTemperature((175.5 - 32) / 1.8, 'us')).toBe('175.5 °F');
    expect(showTemperature(-12.26, 'metric')).toBe('−12.3 °C');
  });
});

describe(checkTimerTemperatures.name, () => {
  it('wants the level-off above the target for a warm-up and below it for a cool-down', () => {
    expect(checkTimerTemperatures('warm-up', 80, null)).toBeNull();
    expect(checkTimerTemperatures('warm-up', 80, 95)).toBeNull();
    expect(checkTimerTemperatures('warm-up', 80, 70)).toMatch(/above the target/);
    expect(checkTimerTemperatures('cool-down', 40, 21)).toBeNull();
    expect(checkTimerTemperatures('cool-down', 40, 45)).toMatch(/below the target/);
  });
});

describe(readMinutes.name, () => {
  it('turns minutes into seconds within 1 minute and 48 hours', () => {
    expect(readMinutes('30')).toEqual({ ok: true, value: 1800 });
    expect(readMinutes('0')).toEqual({ ok: false, message: 'At least 1 minute' });
    expect(readMinutes('2881').ok).toBe(false);
    expect(readMinutes('')).toEqual({ ok: false, message: 'Type the minutes' });
  });
});
