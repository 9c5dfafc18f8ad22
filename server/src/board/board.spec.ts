import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import type { BoardSnapshot } from '@baytime/shared';
import { BoardService } from './board.service.js';

describe(BoardService.name, () => {
  let sut: TestApp;
  beforeAll(async () => {
    sut = await startTestApp();
  });
  afterAll(() => sut.close());

  it('hands a snapshot out again only while nothing was published: a change shows at once', async () => {
    const board = sut.app.get(BoardService);
    // Jo is idle on shift in the demo shop.
    const jo = await sut.badge('1045');
    const status = (at: number) =>
      board.current(at).people.find((person) => person.id === jo.user.id)?.status;
    const at = Date.now();
    const before = board.current(at);
    expect(board.current(at + 1)).toBe(before);
    expect(status(at + 1)).toBe('idle');

    await sut.punch(jo.accessToken, { kind: 'break-start', breakKind: 'rest' }).expect(201);
    expect(board.current(at + 2).seq).toBeGreaterThan(before.seq);
    expect(status(at + 2)).toBe('on-break');
  });

  it('keeps the tiles and people a change did not touch, so publishing it compares next to nothing', async () => {
    const board = sut.app.get(BoardService);
    // Jo is on shift and on no job in the demo shop: a break of hers touches no bay and no one else.
    const jo = await sut.badge('1045');
    const before = board.snapshot(0, new Date());
    const status = (snapshot: BoardSnapshot) =>
      snapshot.people.find((person) => person.id === jo.user.id)?.status;
    const wasOnBreak = status(before) === 'on-break';
    await sut
      .punch(jo.accessToken, wasOnBreak ? { kind: 'break-end' } : { kind: 'break-start', breakKind: 'rest' })
      .expect(201);
    const after = board.snapshot(0, new Date(Date.now() + 1));

    const others = (snapshot: BoardSnapshot) => snapshot.people.filter((person) => person.id !== jo.user.id);
    expect(status(after)).toBe(wasOnBreak ? 'idle' : 'on-break');
    others(after).forEach((person, i) => expect(person).toBe(others(before)[i]));
    // A running clock's seconds move on, and so does a running timer's estimate; the rest stays as it was.
    after.bays.forEach((bay, i) => {
      if (bay.timer) return;
      if (!bay.clockRunning) expect(bay).toBe(before.bays[i]);
      else expect(bay.jobLine).toBe(before.bays[i]!.jobLine);
    });
  });

  it('clears a timer from its bay once it is stopped', async () => {
    const board = sut.app.get(BoardService);
    const timed = board.snapshot(0, new Date()).bays.find((bay) => bay.timer);
    // The demo shop's sealant cure runs in Bay 4.
    expect(timed).toMatchObject({ name: 'Bay 4', state: 'timer', timer: { kind: 'set-time' } });
    const owner = await sut.signIn(DEMO.owner);
    await sut.http().post(`/api/timers/${timed!.timer!.id}/stop`).auth(owner, { type: 'bearer' }).expect(200);
    const after = board.snapshot(0, new Date()).bays.find((bay) => bay.id === timed!.id);
    expect(after?.timer).toBeNull();
    // Its line is still there: worked on if someone is clocked on it, else staged in the free bay.
    expect(after).toMatchObject({
      jobLine: timed!.jobLine,
      state: timed!.clockRunning ? 'working' : 'staged',
    });
  });

  it('shows an idle technician as idle since the last break or job ended, not since the shift began', async () => {
    const board = sut.app.get(BoardService);
    // Sam is idle on shift in the demo shop too.
    const sam = await sut.badge('1046');
    const punch = async (kind: 'break-start' | 'break-end') => {
      const response = await sut
        .punch(sam.accessToken, { kind, ...(kind === 'break-start' ? { breakKind: 'rest' } : {}) })
        .expect(201);
      return (response.body as { at: string }).at;
    };
    const person = () => board.current(Date.now() + 1_000).people.find((p) => p.id === sam.user.id);
    expect(person()?.status).toBe('idle');
    const breakStarted = await punch('break-start');
    expect(person()).toMatchObject({ status: 'on-break', since: breakStarted });
    const breakEnded = await punch('break-end');
    expect(person()).toMatchObject({ status: 'idle', since: breakEnded });
  });

  it('names on a bay tile only technicians still on the floor', async () => {
    const board = sut.app.get(BoardService);
    const owner = await sut.signIn(DEMO.owner);
    // Sam's line is staged in Bay 7 in the demo shop, and Sam is on shift.
    const sam = await sut.badge('1046');
    const bay7 = () => board.snapshot(0, new Date()).bays.find((bay) => bay.name === 'Bay 7')!;
    expect(bay7().technicians).toEqual([{ id: sam.user.id, name: 'Sam O.' }]);
    await sut.punch(sam.accessToken, { kind: 'shift-out' }).expect(201);
    await sut
      .http()
      .patch(`/api/users/${sam.user.id}`)
      .auth(owner, { type: 'bearer' })
      .send({ active: false })
      .expect(200);
    expect(bay7()).toMatchObject({ state: 'staged', technicians: [] });
  });
});
