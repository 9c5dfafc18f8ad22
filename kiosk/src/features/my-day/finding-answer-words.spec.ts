import { describe, expect, it } from 'vitest';
import type { MyAnsweredFinding, MyJobLine } from '@baytime/shared';
import {
  answerNotices,
  findingAnswerNotice,
  linesAnswered,
  linesUnexplained,
  mergeAnswers,
  NOTICE_NOTE_MAX,
  shortNote,
} from './finding-answer-words';

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

function answered(findingId: number, changes: Partial<MyAnsweredFinding> = {}): MyAnsweredFinding {
  return {
    findingId,
    jobLineId: 2,
    note: 'Torn boot on the inner tie rod end',
    answer: 'approved',
    answeredAt: '2026-03-10T14:00:00.000Z',
    ...changes,
  };
}

describe('mergeAnswers', () => {
  it('shows an answer once when it was both listed and heard live, and the list wins', () => {
    const listed = [answered(7, { answer: 'declined', answeredAt: '2026-03-10T14:05:00.000Z' })];
    const heard = [answered(7, { answeredAt: '2026-03-10T14:09:00.000Z' }), answered(8)];
    expect(mergeAnswers(listed, heard)).toEqual([listed[0], heard[1]]);
  });

  it('puts the newest answer first', () => {
    const older = answered(3, { answeredAt: '2026-03-10T09:00:00.000Z' });
    const newer = answered(4, { answeredAt: '2026-03-10T11:00:00.000Z' });
    expect(mergeAnswers([older], [newer]).map((a) => a.findingId)).toEqual([4, 3]);
    expect(mergeAnswers([older, newer], []).map((a) => a.findingId)).toEqual([4, 3]);
  });
});

describe('answerNotices', () => {
  it('says each answer with the live notice’s words, skipping dismissed ones and lines no longer on the day', () => {
    const answers = [
      answered(7),
      answered(8, { answer: 'declined', note: 'Coolant seeping at the water pump' }),
      answered(9, { jobLineId: 5 }),
    ];
    expect(answerNotices([line(2), line(3)], answers, new Set([8]))).toEqual([
      { findingId: 7, text: findingAnswerNotice(line(2), 'approved', 'Torn boot on the inner tie rod end') },
    ]);
    expect(answerNotices([line(2)], answers, new Set()).map((n) => n.text)).toEqual([
      'Customer approved “Torn boot on the inner tie rod end” on RO 7319 line 2: it is added to the RO, and this line is back in your queue.',
      'Customer declined “Coolant seeping at the water pump” on RO 7319 line 2: carry on with the rest of the line.',
    ]);
  });
});

describe('linesUnexplained', () => {
  it('keeps only the lines back from approval that no answer explains', () => {
    expect(linesUnexplained([line(2), line(3)], [answered(7)]).map((l) => l.id)).toEqual([3]);
  });
});
