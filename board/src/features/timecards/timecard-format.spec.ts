import { describe, expect, it } from 'vitest';
import {
  clockValue,
  dayValue,
  formatClock,
  formatDay,
  formatDayClock,
  formatHours,
  auditText,
} from './timecard-format';

describe('timecard formats', () => {
  it('writes durations as decimal hours', () => {
    expect(formatHours(30_900)).toBe('8.58 h');
  });

  it('writes instants in the shop time zone, not the computer’s', () => {
    expect(formatClock('2026-11-30T13:25:00Z', 'America/Chicago')).toBe('7:25 am');
    expect(formatDayClock('2026-11-30T13:25:00Z', 'America/Chicago')).toBe('Mon, Nov 30, 7:25 am');
    expect(clockValue('2026-11-30T04:05:00Z', 'America/Chicago')).toBe('22:05');
    expect(dayValue('2026-11-30T04:05:00Z', 'America/Chicago')).toBe('2026-11-29');
  });

  it('writes a local day as given', () => {
    expect(formatDay('2026-11-30')).toBe('Mon, Nov 30');
  });
});

describe(auditText.name, () => {
  it('says what a correction did and why', () => {
    expect(
      auditText(
        {
          action: 'correct',
          detail: {
            supersedes: 'x',
            kind: 'shift-in',
            at: '2026-11-30T13:20:00Z',
            reason: 'Forgot to badge',
          },
        },
        'America/Chicago',
      ),
    ).toEqual({
      action: 'Replaced a punch',
      detail: 'Shift start at Mon, Nov 30, 7:20 am: “Forgot to badge”',
    });
  });

  it('says a punch was taken out of the count, in the words the card uses', () => {
    expect(
      auditText(
        { action: 'void', detail: { kind: 'job-on', at: '2026-11-30T16:58:00Z', reason: 'Wrong line' } },
        'America/Chicago',
      ),
    ).toEqual({
      action: 'Took a punch out of the count',
      detail: 'Clock on at Mon, Nov 30, 10:58 am: “Wrong line”',
    });
  });

  it('copes with an action it does not know and no detail', () => {
    expect(auditText({ action: 'bulk-import', detail: null }, 'UTC')).toEqual({
      action: 'bulk import',
      detail: '',
    });
  });
});
