import { describe, expect, it } from 'vitest';
import type { MyJobLine } from '@baytime/shared';
import { findingAnswerNotice, linesAnswered, NOTICE_NOTE_MAX, shortNote } from './finding-answer-words';

function line(id: number, changes: Partial<MyJobLine> = {}): MyJobLine {
  return {
    id,
    repairOrderNumber: '7319',
    vehicle: '2017 Larkspur Vesta',
    title: 'Front brake pads',
    lineNo: id,
    bookHours: 1.2,
    mySeconds: 0,
    allSeconds: 0,
    status: 'queued',
    holdReason: null,
    priority: 'normal',
    bayName: 'Bay 4',
    clockedOn: false,
    concern: 'Squeal when braking',
    parts: null,
    ...changes,
  };
}

const waiting = { status: 'held', holdReason: 'approval' } as const;

describe('linesAnswered', () => {
  it('finds the line that went from held for approval to queued', () => {
    const answered = linesAnswered([line(2, waiting), line(3)], [line(2), line(3)]);
    expect(answered.map((l) => l.id)).toEqual([2]);
  });

  it('ignores a line still waiting, one held for parts, and one that was never held', () => {
    const before = [line(2, waiting), line(3, { status: 'held', holdReason: 'parts' }), line(4)];
    const after = [line(2, waiting), line(3), line(4, { status: 'working' })];
    expect(linesAnswered(before, after)).toEqual([]);
  });
});

describe('findingAnswerNotice', () => {
  it('says what the customer answered, and where', () => {
    expect(findingAnswerNotice(line(2), 'approved')).toBe(
      'Customer approved the extra work on RO 7319 line 2: it is added to the RO, and this line is back in your queue.',
    );
    expect(findingAnswerNotice(line(2), 'declined')).toBe(
      'Customer declined the extra work on RO 7319 line 2: carry on with the rest of the line.',
    );
    expect(findingAnswerNotice(line(2), null)).toBe(
      'Customer answered on RO 7319 line 2: this line is back in your queue.',
    );
  });

  it('names the finding answered by its note when the tablet knows it', () => {
    expect(findingAnswerNotice(line(2), 'approved', 'Torn boot on the\ninner tie rod end')).toBe(
      'Customer approved “Torn boot on the inner tie rod end” on RO 7319 line 2: it is added to the RO, and this line is back in your queue.',
    );
    expect(findingAnswerNotice(line(2), 'declined', 'Coolant seeping at the water pump')).toBe(
      'Customer declined “Coolant seeping at the water pump” on RO 7319 line 2: carry on with the rest of the line.',
    );
  });
});

describe('shortNote', () => {
  it('keeps a short note whole, on one line', () => {
    expect(shortNote('  Rear wiper\n blade split  ')).toBe('Rear wiper blade split');
  });

  it('cuts a long note at a word, with an ellipsis, within the limit', () => {
    const note =
      'Both rear brake hoses cracked along their length, and the left caliper slide pin is seized in its bore';
    const short = shortNote(note);
    expect(short).toBe('Both rear brake hoses cracked along their length, and the…');
    expect(short.length).toBeLessThanOrEqual(NOTICE_NOTE_MAX);
    expect(shortNote('Oil leak, rear main seal, pan gasket', 20)).toBe('Oil leak, rear main…');
  });

  it('cuts one very long word where it stands', () => {
    expect(shortNote('x'.repeat(80), 10)).toBe(`${'x'.repeat(9)}…`);
  });
});
