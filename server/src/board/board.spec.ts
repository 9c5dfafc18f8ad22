import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
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
});
