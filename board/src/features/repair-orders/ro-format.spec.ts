import { describe, expect, it } from 'vitest';
import { formatDateTime, formatOdometer, formatOverUnder, groupVin, lineLabel } from './ro-format';

describe(formatDateTime.name, () => {
  it('shows the moment in the shop zone', () => {
    // 06:09 UTC on the 2nd is 12:09 AM on the 2nd in Chicago (CST, UTC−6).
    expect(formatDateTime('2026-12-02T06:09:00.000Z', 'America/Chicago')).toBe('Wed, Dec 2, 12:09 am');
    expect(formatDateTime('2026-12-02T05:09:00.000Z', 'America/Chicago')).toBe('Tue, Dec 1, 11:09 pm');
  });
});

describe(formatOverUnder.name, () => {
  it('says how far clocked time is from book', () => {
    expect(formatOverUnder(5400 + 720, 1.5)).toBe('+0.2 h over');
    expect(formatOverUnder(3600 - 1200, 1)).toBe('0.33 h under');
    expect(formatOverUnder(3630, 1)).toBe('on book');
  });
  it('says what is left on a line still open, and over as over', () => {
    expect(formatOverUnder(3600 - 1200, 1, false)).toBe('0.33 h left');
    expect(formatOverUnder(3600 + 1200, 1, false)).toBe('+0.33 h over');
  });
});

describe(formatOdometer.name, () => {
  it('uses the shop units', () => {
    expect(formatOdometer(150273, 'us')).toBe('150,273 mi');
    expect(formatOdometer(241842, 'metric')).toBe('241,842 km');
  });
});

describe(groupVin.name, () => {
  it('groups a 17-character VIN and leaves anything else alone', () => {
    expect(groupVin('1M8GDM9AXKP042788')).toBe('1M8 GDM9AX KP 042788');
    expect(groupVin('ABC')).toBe('ABC');
  });
});

describe(lineLabel.name, () => {
  it('opens a line’s label with a capital', () => {
    expect(lineLabel({ lineNo: 1, title: 'Front brake pads and rotors' })).toBe(
      'Line 1 · Front brake pads and rotors',
    );
  });
});
