import { describe, expect, it } from 'vitest';
import { punchWords, whoWords } from './offline-punch-words';

describe(punchWords.name, () => {
  it('names the punch and the kind of break', () => {
    expect(punchWords({ kind: 'shift-in', breakKind: null })).toBe('Shift start');
    expect(punchWords({ kind: 'break-start', breakKind: 'rest' })).toBe('Break start · rest');
  });
});

describe(whoWords.name, () => {
  it('says who tapped it, as far as the server could tell', () => {
    expect(whoWords({ technicianName: 'Jo Whitfield', badge: '1045' })).toBe('Jo Whitfield');
    expect(whoWords({ technicianName: null, badge: '9999' })).toBe('Badge 9999 (no technician)');
    expect(whoWords({ technicianName: null, badge: null })).toBe('Unreadable badge');
  });
});
