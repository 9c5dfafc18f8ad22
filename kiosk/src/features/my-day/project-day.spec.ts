// @vitest-environment node
import { describe, expect, it } from 'vitest';
import type { MyDay, MyJobLine } from '@baytime/shared';
import { lineSeconds, projectDay, type PendingPunch } from './project-day';

const T0 = Date.parse('2026-03-10T13:00:00.000Z');
const iso = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();

function line(id: number, changes: Partial<MyJobLine> = {}): MyJobLine {
  return {
    id,
    repairOrderNumber: `77${id}`,
    vehicle: '2019 Corvane Denvo',
    title: 'Replace front struts',
    lineNo: 1,
    bookHours: 2,
    mySeconds: 0,
    allSeconds: 0,
    status: 'queued',
    holdReason: null,
    priority: 'normal',
    bayName: null,
    clockedOn: false,
    concern: 'Customer asks for new struts',
    parts: null,
    ...changes,
  };
}

function day(changes: Partial<MyDay> = {}): MyDay {
  return {
    serverTime: iso(0),
    technician: { id: 7, name: 'Rhea Mollander' },
    shift: { status: 'on-shift', since: iso(-120), breakKind: null },
    openJobLineIds: [],
    lines: [line(1), line(2)],
    doneToday: 0,
    finalChecks: [],
    answeredFindings: [],
    idleSignOutSeconds: 60,
    maxConcurrentJobs: 1,
    ...changes,
  };
}

describe(projectDay.name, () => {
  it('shows the server day as it is when nothing is on its way', () => {
    const view = projectDay(day(), [], T0);
    expect(view.shift).toEqual({ status: 'on-shift', since: iso(-120), breakKind: null });
    expect(view.shiftPending).toBe(false);
    expect(view.lines.every((l) => !l.pending && l.runningSince === null)).toBe(true);
  });

  it('lays a pending clock-on over the line at once, running from the tap', () => {
    const punches: PendingPunch[] = [{ kind: 'job-on', jobLineId: 2, at: iso(1) }];
    const view = projectDay(day(), punches, T0);
    const two = view.lines.find((l) => l.id === 2)!;
    expect(two).toMatchObject({
      clockedOn: true,
      status: 'working',
      pending: true,
      runningSince: T0 + 60_000,
    });
    expect(lineSeconds(view, two, T0 + 11 * 60_000).mine).toBe(600);
  });

  it('stops every running line on a break and keeps the shift start for after it', () => {
    const running = day({
      openJobLineIds: [1],
      lines: [line(1, { clockedOn: true, status: 'working', mySeconds: 600, allSeconds: 900 }), line(2)],
    });
    const onBreak = projectDay(running, [{ kind: 'break-start', breakKind: 'rest', at: iso(5) }], T0);
    expect(onBreak.shift).toEqual({ status: 'on-break', since: iso(5), breakKind: 'rest' });
    expect(onBreak.lines[0]).toMatchObject({ clockedOn: false, mySeconds: 900, allSeconds: 1200 });

    const back = projectDay(
      running,
      [
        { kind: 'break-start', breakKind: 'rest', at: iso(5) },
        { kind: 'break-end', at: iso(15) },
      ],
      T0,
    );
    expect(back.shift).toEqual({ status: 'on-shift', since: iso(-120), breakKind: null });
  });

  it('ignores a punch the server already counted, so a late refetch never doubles it', () => {
    const alreadyOn = day({ shift: { status: 'on-shift', since: iso(-1), breakKind: null } });
    const view = projectDay(alreadyOn, [{ kind: 'shift-in', at: iso(-1) }], T0);
    expect(view.shift.since).toBe(iso(-1));
    expect(view.shiftPending).toBe(false);
  });

  it('applies punches in time order whatever order they arrive in', () => {
    const off = day({ shift: { status: 'off', since: null, breakKind: null } });
    const view = projectDay(
      off,
      [
        { kind: 'job-on', jobLineId: 1, at: iso(2) },
        { kind: 'shift-in', at: iso(1) },
      ],
      T0,
    );
    expect(view.shift.status).toBe('on-shift');
    expect(view.lines[0]!.clockedOn).toBe(true);
  });

  it('splits a running minute between lines when the shop splits evenly, not when it counts in full', () => {
    const two = day({
      maxConcurrentJobs: 2,
      openJobLineIds: [1, 2],
      lines: [line(1, { clockedOn: true }), line(2, { clockedOn: true })],
    });
    const even = projectDay(two, [], T0, 'even');
    expect(lineSeconds(even, even.lines[0]!, T0 + 120_000, 'even').mine).toBe(60);
    const full = projectDay(two, [], T0, 'full');
    expect(lineSeconds(full, full.lines[0]!, T0 + 120_000, 'full').mine).toBe(120);
  });
});
