import { describe, expect, it } from 'vitest';
import type { DispatchBoard, DispatchLane, DispatchLine } from '@baytime/shared';
import {
  applyMove,
  byUrgency,
  confirmQuestion,
  dragAnnouncements,
  joinNames,
  moveRefusal,
  needsConfirm,
  dropId,
  laneLoad,
  patchFor,
  planMove,
  skillWarning,
  sortQueue,
  targetFromDropId,
} from './dispatch-model';

let nextId = 1;
function line(overrides: Partial<DispatchLine> = {}): DispatchLine {
  const id = overrides.id ?? nextId++;
  return {
    id,
    repairOrderId: 100 + id,
    repairOrderNumber: String(4500 + id),
    vehicle: '2019 Corvane Altrix',
    lineNo: 1,
    title: `Line ${id}`,
    bookHours: 1,
    skillLevel: 1,
    status: 'queued',
    holdReason: null,
    priority: 'normal',
    technicianId: null,
    bayId: null,
    promisedAt: null,
    concern: 'Customer asks for a look',
    late: false,
    queuedAt: '2026-03-02T14:00:00.000Z',
    clockedSeconds: 0,
    clockedOn: [],
    parts: null,
    forecast: null,
    ...overrides,
  };
}

function lane(id: number, name: string, skillLevel: number, lines: DispatchLine[] = []): DispatchLane {
  return {
    technician: { id, name, skillLevel, status: 'idle' },
    efficiency: 1,
    lines,
    finishAt: null,
  };
}

function board(queue: DispatchLine[], lanes: DispatchLane[]): DispatchBoard {
  return {
    serverTime: '2026-03-02T15:00:00.000Z',
    queue,
    lanes,
    bays: [
      { id: 1, name: 'Bay 1', state: 'working', repairOrderId: 101 },
      { id: 2, name: 'Bay 2', state: 'free', repairOrderId: null },
    ],
    lateCount: 0,
    forecastNote: null,
  };
}

describe(byUrgency.name, () => {
  it('puts a line someone is clocked on first, then priority, promise and wait', () => {
    const onIt = line({ id: 1, clockedOn: [7], priority: 'low' });
    const urgent = line({ id: 2, priority: 'urgent' });
    const promisedSoon = line({ id: 3, promisedAt: '2026-03-02T16:00:00.000Z' });
    const promisedLater = line({ id: 4, promisedAt: '2026-03-02T20:00:00.000Z' });
    const noPromiseOld = line({ id: 5, queuedAt: '2026-03-01T10:00:00.000Z' });
    const noPromiseNew = line({ id: 6, queuedAt: '2026-03-02T10:00:00.000Z' });
    const sorted = [noPromiseNew, promisedLater, noPromiseOld, urgent, promisedSoon, onIt].sort(byUrgency);
    expect(sorted.map((l) => l.id)).toEqual([1, 2, 3, 4, 5, 6]);
  });
});

describe(sortQueue.name, () => {
  it('does not change the list it is given', () => {
    const list = [line({ id: 11, priority: 'low' }), line({ id: 12, priority: 'high' })];
    expect(sortQueue(list).map((l) => l.id)).toEqual([12, 11]);
    expect(list.map((l) => l.id)).toEqual([11, 12]);
  });
});

describe(skillWarning.name, () => {
  it('warns with first name and both levels when the line needs more skill', () => {
    expect(skillWarning({ skillLevel: 4 }, lane(3, 'Sam Ortega', 1))).toBe('Needs level 4; Sam is level 1');
  });
  it('says nothing when the technician is skilled enough', () => {
    expect(skillWarning({ skillLevel: 3 }, lane(3, 'Dana Okafor', 3))).toBeNull();
  });
});

describe(patchFor.name, () => {
  it('is null when the target changes nothing', () => {
    const assigned = line({ technicianId: 3, bayId: 1, priority: 'high' });
    expect(patchFor(assigned, { kind: 'technician', technicianId: 3 })).toBeNull();
    expect(patchFor(assigned, { kind: 'bay', bayId: 1 })).toBeNull();
    expect(patchFor(assigned, { kind: 'priority', priority: 'high' })).toBeNull();
    expect(patchFor(line(), { kind: 'queue' })).toBeNull();
  });
  it('unassigns for the queue and clears the bay for "no bay"', () => {
    const assigned = line({ technicianId: 3, bayId: 1 });
    expect(patchFor(assigned, { kind: 'queue' })).toEqual({ technicianId: null });
    expect(patchFor(assigned, { kind: 'bay', bayId: null })).toEqual({ bayId: null });
  });
});

describe(planMove.name, () => {
  it('names who will be clocked off and warns about skill without refusing', () => {
    const working = line({ id: 21, technicianId: 3, clockedOn: [3], skillLevel: 4, status: 'working' });
    const sut = board([], [lane(3, 'Dana Okafor', 4, [working]), lane(9, 'Sam Ortega', 1)]);
    const plan = planMove(sut, 21, { kind: 'technician', technicianId: 9 });
    expect(plan?.patch).toEqual({ technicianId: 9 });
    expect(plan?.clocksOff).toEqual(['Dana']);
    expect(plan?.skillWarning).toBe('Needs level 4; Sam is level 1');
    expect(plan?.summary).toContain('moved to Sam Ortega');
  });

  it('refuses a bay that holds another repair order, in the server’s words, rather than asking', () => {
    const waiting = line({ id: 22 });
    const other = line({ id: 23, technicianId: 3, bayId: 1 });
    const sut = board([waiting], [lane(3, 'Dana Okafor', 4, [other])]);
    const taken = planMove(sut, 22, { kind: 'bay', bayId: 1 })!;
    expect(taken.bayTaken).toBe('Bay 1');
    expect(moveRefusal(taken)).toBe(
      "Bay 1 holds another repair order's vehicle until it leaves: pick another bay, or release Bay 1 first",
    );
    expect(needsConfirm(taken)).toBe(false);
    expect(moveRefusal(planMove(sut, 22, { kind: 'bay', bayId: 2 })!)).toBeNull();
  });

  it('does not ask when the bay already holds the same repair order', () => {
    const first = line({ id: 24, repairOrderId: 50, technicianId: 3, bayId: 1 });
    const second = line({ id: 25, repairOrderId: 50 });
    const sut = board([second], [lane(3, 'Dana Okafor', 4, [first])]);
    expect(planMove(sut, 25, { kind: 'bay', bayId: 1 })?.bayTaken).toBeNull();
  });

  it('changing the bay or priority of a line someone is on clocks nobody off', () => {
    const working = line({ id: 26, technicianId: 3, clockedOn: [3] });
    const sut = board([], [lane(3, 'Dana Okafor', 4, [working])]);
    expect(planMove(sut, 26, { kind: 'bay', bayId: 2 })?.clocksOff).toEqual([]);
    expect(planMove(sut, 26, { kind: 'priority', priority: 'urgent' })?.clocksOff).toEqual([]);
  });

  it('is null for an unknown line or a move that changes nothing', () => {
    const sut = board([line({ id: 27 })], []);
    expect(planMove(sut, 999, { kind: 'queue' })).toBeNull();
    expect(planMove(sut, 27, { kind: 'queue' })).toBeNull();
  });
});

describe(applyMove.name, () => {
  it('moves a queued line into a lane in urgency order and leaves the others alone', () => {
    const waiting = line({ id: 31, priority: 'urgent' });
    const existing = line({ id: 32, technicianId: 3 });
    const untouched = lane(4, 'Luis Brennan', 3, [line({ id: 33, technicianId: 4 })]);
    const before = board([waiting], [lane(3, 'Dana Okafor', 4, [existing]), untouched]);
    const after = applyMove(before, 31, { technicianId: 3 });
    expect(after.queue).toEqual([]);
    expect(after.lanes[0]?.lines.map((l) => l.id)).toEqual([31, 32]);
    expect(after.lanes[0]?.lines[0]?.technicianId).toBe(3);
    expect(after.lanes[1]).toBe(untouched);
    expect(before.queue).toHaveLength(1);
  });

  it('unassigning puts the line back in the queue, off the clock and without a forecast', () => {
    const working = line({
      id: 34,
      technicianId: 3,
      clockedOn: [3],
      forecast: { startAt: 'x', finishAt: 'y', late: false },
    });
    const after = applyMove(board([], [lane(3, 'Dana Okafor', 4, [working])]), 34, { technicianId: null });
    expect(after.lanes[0]?.lines).toEqual([]);
    expect(after.queue[0]).toMatchObject({ id: 34, technicianId: null, clockedOn: [], forecast: null });
  });

  it('keeps the forecast when only the bay changes', () => {
    const forecast = { startAt: 'x', finishAt: 'y', late: true };
    const assigned = line({ id: 35, technicianId: 3, forecast });
    const after = applyMove(board([], [lane(3, 'Dana Okafor', 4, [assigned])]), 35, { bayId: 2 });
    expect(after.lanes[0]?.lines[0]).toMatchObject({ id: 35, bayId: 2, forecast });
  });

  it('keeps a line whose technician has no lane in the queue when its bay changes', () => {
    const orphaned = line({ id: 36, technicianId: 9, status: 'working' });
    const after = applyMove(board([orphaned], [lane(3, 'Dana Okafor', 4)]), 36, { bayId: 2 });
    expect(after.queue).toEqual([{ ...orphaned, bayId: 2 }]);
    expect(after.lanes[0]?.lines).toEqual([]);
  });

  it('returns the same board for an unknown line', () => {
    const before = board([], []);
    expect(applyMove(before, 999, { technicianId: 3 })).toBe(before);
  });
});

describe(targetFromDropId.name, () => {
  it('reads the ids the drop targets use', () => {
    expect(targetFromDropId(dropId.queue)).toEqual({ kind: 'queue' });
    expect(targetFromDropId(dropId.lane(12))).toEqual({ kind: 'technician', technicianId: 12 });
    expect(targetFromDropId(dropId.bay(3))).toEqual({ kind: 'bay', bayId: 3 });
  });
  it('is null for anything else', () => {
    expect(targetFromDropId(null)).toBeNull();
    expect(targetFromDropId('lane:x')).toBeNull();
    expect(targetFromDropId(4)).toBeNull();
  });
});

describe(laneLoad.name, () => {
  it('counts lines and their book hours', () => {
    const sut = lane(3, 'Dana Okafor', 4, [line({ bookHours: 1.5 }), line({ bookHours: 0.7 })]);
    expect(laneLoad(sut)).toEqual({ lines: 2, bookHours: 2.2 });
  });
});

describe(confirmQuestion.name, () => {
  const working = line({ id: 41, technicianId: 3, clockedOn: [3, 4], status: 'working' });
  const sut = board(
    [],
    [lane(3, 'Dana Okafor', 4, [working]), lane(4, 'Luis Brennan', 3), lane(9, 'Sam Ortega', 1)],
  );

  it('names everyone who will be clocked off', () => {
    const plan = planMove(sut, 41, { kind: 'technician', technicianId: 9 })!;
    expect(needsConfirm(plan)).toBe(true);
    expect(confirmQuestion(plan)).toEqual({
      title: 'Move a line someone is working on?',
      text: 'Dana and Luis are clocked on this line. Move it and clock Dana and Luis off?',
      action: 'Move and clock Dana and Luis off',
    });
  });

  it('does not ask for a plain move', () => {
    const plan = planMove(board([line({ id: 43 })], [lane(9, 'Sam Ortega', 1)]), 43, {
      kind: 'technician',
      technicianId: 9,
    })!;
    expect(needsConfirm(plan)).toBe(false);
  });
});

describe(joinNames.name, () => {
  it('joins names the way a sentence does', () => {
    expect(joinNames([])).toBe('');
    expect(joinNames(['Dana'])).toBe('Dana');
    expect(joinNames(['Dana', 'Luis', 'Sam'])).toBe('Dana, Luis and Sam');
  });
});

describe(dragAnnouncements.name, () => {
  const brakes = line({ id: 253, lineNo: 2, repairOrderNumber: '4645', title: 'Brake pads' });
  const shop = board([brakes], [lane(7, 'Dana Ortega', 2)]);
  const said = dragAnnouncements(shop);
  const active = { id: 'line:253', data: { current: { lineId: 253 } } };

  it('names the line and the place in the shop’s words, never the drag ids', () => {
    expect(said.onDragStart({ active })).toBe('Picked up Line 2 of RO 4645, Brake pads.');
    expect(said.onDragOver({ active, over: { id: dropId.bay(2) } })).toBe(
      'Line 2 of RO 4645, Brake pads, over Bay 2.',
    );
    expect(said.onDragOver({ active, over: { id: dropId.lane(7) } })).toBe(
      'Line 2 of RO 4645, Brake pads, over Dana Ortega.',
    );
    expect(said.onDragEnd({ active, over: { id: dropId.queue } })).toBe(
      'Line 2 of RO 4645, Brake pads dropped on the waiting queue.',
    );
    expect(said.onDragEnd({ active, over: null })).toBe(
      'Line 2 of RO 4645, Brake pads put back where it was.',
    );
    expect(said.onDragCancel({ active, over: null })).toBe(
      'Moving Line 2 of RO 4645, Brake pads cancelled: it stays where it was.',
    );
    for (const text of [said.onDragStart({ active }), said.onDragOver({ active, over: { id: 'bay:2' } })])
      expect(text).not.toMatch(/line:|bay:|lane:/);
  });
});
