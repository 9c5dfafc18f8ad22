import { describe, expect, it } from 'vitest';
import type { MyDay, MyJobLine } from '@baytime/shared';
import { clockAction, lineStatusWord } from './line-actions';
import { projectDay } from './project-day';
import { statusText } from './status-text';

const line = (id: number, changes: Partial<MyJobLine> = {}): MyJobLine => ({
  id,
  repairOrderNumber: '4521',
  vehicle: '2019 Corvane Denvo',
  title: 'Replace front struts',
  lineNo: id,
  bookHours: 2,
  mySeconds: 0,
  allSeconds: 0,
  status: 'queued',
  holdReason: null,
  priority: 'normal',
  bayName: null,
  clockedOn: false,
  concern: 'Knock over bumps',
  parts: null,
  ...changes,
});

const day = (lines: MyJobLine[], shift: MyDay['shift']['status'] = 'on-shift'): MyDay => ({
  serverTime: '2026-03-10T15:00:00.000Z',
  technician: { id: 7, name: 'Rhea Mollander' },
  shift: { status: shift, since: '2026-03-10T13:00:00.000Z', breakKind: null },
  openJobLineIds: lines.filter((l) => l.clockedOn).map((l) => l.id),
  lines,
  doneToday: 0,
  finalChecks: [],
  answeredFindings: [],
  idleSignOutSeconds: 60,
  maxConcurrentJobs: 1,
});

describe(lineStatusWord.name, () => {
  it('says a working line this technician is not clocked on is off their clock', () => {
    expect(lineStatusWord({ status: 'working', holdReason: null, clockedOn: true })).toBe('Working');
    expect(lineStatusWord({ status: 'working', holdReason: null, clockedOn: false })).toBe(
      'Working · not clocked on',
    );
    expect(lineStatusWord({ status: 'held', holdReason: 'parts', clockedOn: false })).toBe('Held: Parts');
  });
});

describe(clockAction.name, () => {
  it('offers to clock back on with Resume when the technician can work the line now (bug 9)', () => {
    const held = line(1, { status: 'held', holdReason: 'parts' });
    const view = projectDay(day([held]), [], 0);
    expect(clockAction(view, view.lines[0]!, 1)).toEqual({ kind: 'resume', clockOn: true });
    const busy = projectDay(day([held, line(2, { status: 'working', clockedOn: true })]), [], 0);
    expect(clockAction(busy, busy.lines[0]!, 1)).toEqual({ kind: 'resume', clockOn: false });
    const onBreak = projectDay(day([held], 'on-break'), [], 0);
    expect(clockAction(onBreak, onBreak.lines[0]!, 1)).toEqual({ kind: 'resume', clockOn: false });
  });
});

describe(statusText.name, () => {
  // 2026-03-10 is a Tuesday; Chicago is on CDT (UTC−5) from March 8, 2026.
  const now = Date.parse('2026-03-10T15:00:00.000Z');
  it('says since when the technician has been on shift, with the day when it began on an earlier one', () => {
    const today = projectDay(day([line(1)]), [], now);
    expect(statusText(today, now, 'America/Chicago').headline).toBe('On shift since 8:00 am · not on a job');
    const leftOpen = projectDay(
      {
        ...day([line(1)]),
        shift: { status: 'on-shift', since: '2026-03-06T13:30:00.000Z', breakKind: null },
      },
      [],
      now,
    );
    expect(statusText(leftOpen, now, 'America/Chicago').headline).toBe(
      'On shift since Fri, Mar 6, 7:30 am · not on a job',
    );
  });
});
