import { describe, expect, it } from 'vitest';
import type { MyJobLine } from '@baytime/shared';
import { partsInNotices, partsWaitText } from './parts-words';

const ZONE = 'America/Chicago';
// Tue 3 Mar 2026 09:00 CST (UTC−6).
const NOW = Date.parse('2026-03-03T15:00:00Z');
const line = (patch: Partial<MyJobLine>): MyJobLine => ({
  id: 1,
  repairOrderNumber: '4417',
  vehicle: '2019 Corvane Denvo',
  title: 'Replace tie rod end',
  lineNo: 2,
  bookHours: 1.2,
  mySeconds: 0,
  allSeconds: 0,
  status: 'held',
  holdReason: 'parts',
  priority: 'normal',
  bayName: 'Bay 2',
  clockedOn: false,
  concern: 'Clunk from the front end',
  parts: { part: 'tie rod end', state: 'ordered', supplier: null, expectedAt: null, receivedAt: null },
  ...patch,
});

describe(partsWaitText.name, () => {
  it('names the part and when it is due, in shop time, then says late', () => {
    expect(partsWaitText(line({}), NOW, ZONE)).toBe('Waiting for tie rod end');
    const due = line({
      parts: {
        part: null,
        state: 'ordered',
        supplier: null,
        expectedAt: '2026-03-03T20:30:00Z',
        receivedAt: null,
      },
    });
    expect(partsWaitText(due, NOW, ZONE)).toBe('Waiting for parts · due 2:30 pm');
    expect(partsWaitText(due, Date.parse('2026-03-03T20:30:00Z'), ZONE)).toBe('Waiting for parts · late');
    expect(partsWaitText(line({ holdReason: 'tooling' }), NOW, ZONE)).toBeNull();
  });
});

describe(partsInNotices.name, () => {
  it('tells of parts received on a line back in the queue, until it is started again', () => {
    const received = {
      part: 'tie rod end',
      state: 'ordered' as const,
      supplier: null,
      expectedAt: null,
      receivedAt: '2026-03-03T14:00:00Z',
    };
    expect(partsInNotices([line({ status: 'queued', holdReason: null, parts: received })])).toEqual([
      'Parts are in for RO 4417 line 2 (tie rod end): it is back in your queue.',
    ]);
    expect(partsInNotices([line({ status: 'working', holdReason: null, parts: received })])).toEqual([]);
    expect(partsInNotices([line({})])).toEqual([]);
  });
});
