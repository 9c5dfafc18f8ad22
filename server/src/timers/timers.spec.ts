import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { BoardSnapshot, DispatchBoard, MyDay, SignInAnswer, TimerDto } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ROLE_REFUSAL } from '../common/guards/auth.guard.js';
import { TimersService } from './timers.service.js';

describe(TimersService.name, () => {
  describe('temperature timers and hold presets', () => {
    let sut: TestApp;
    let dana: SignInAnswer;
    const post = (path: string, body: object = {}, token = dana.accessToken) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body);
    const board = async (app = sut) =>
      (
        await app
          .http()
          .get('/api/board')
          .auth(await app.signIn(DEMO.foreman), { type: 'bearer' })
          .expect(200)
      ).body as BoardSnapshot;

    beforeAll(async () => {
      sut = await startTestApp();
      dana = await sut.badge('1041');
    });
    afterAll(() => sut.close());

    it('refuses a warm-up without a target or without the safety checks confirmed', async () => {
      const line = (
        (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' })).body as MyDay
      ).lines[0]!;
      const { body } = await post('/api/timers', { jobLineId: line.id, kind: 'warm-up' }).expect(400);
      expect(body.issues.map((i: { path: string[] }) => i.path[0]).sort()).toEqual([
        'cautionAcknowledged',
        'targetC',
      ]);
    });

    it('refuses a warm-up on a line in no bay, where the wall would not show the running engine', async () => {
      const foreman = await sut.signIn(DEMO.foreman);
      const dispatch = await sut.http().get('/api/dispatch').auth(foreman, { type: 'bearer' }).expect(200);
      const waiting = (dispatch.body as DispatchBoard).queue.find((line) => line.bayId === null)!;
      await sut
        .http()
        .patch(`/api/job-lines/${waiting.id}`)
        .auth(foreman, { type: 'bearer' })
        .send({ technicianId: dana.user.id })
        .expect(200);
      const refused = await post('/api/timers', {
        jobLineId: waiting.id,
        kind: 'warm-up',
        targetC: 45,
        cautionAcknowledged: true,
      }).expect(409);
      expect(refused.body.message).toBe(
        'Put the line in a bay first: the wall shows a running engine by its bay',
      );
      const elsewhere = (await board()).bays.find((bay) => bay.timer === null)!;
      const inABay = await post('/api/timers', {
        jobLineId: waiting.id,
        bayId: elsewhere.id,
        kind: 'set-time',
        durationSeconds: 600,
      }).expect(409);
      expect(inABay.body.message).toBe(
        `That line is in no bay yet: put it in ${elsewhere.name} first, then start its timer`,
      );
      const held = await post('/api/timers', {
        jobLineId: waiting.id,
        kind: 'set-time',
        durationSeconds: 600,
      });
      expect(held.status).toBe(201);
      await post(`/api/timers/${(held.body as TimerDto).id}/stop`).expect(200);
      await sut
        .http()
        .patch(`/api/job-lines/${waiting.id}`)
        .auth(foreman, { type: 'bearer' })
        .send({ technicianId: null })
        .expect(200);
    });

    it("refuses a timer in another car's bay, which the wall would show instead of that bay's own state", async () => {
      const line = (
        (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' })).body as MyDay
      ).lines.find((each) => each.bayName !== null)!;
      const before = await board();
      const otherCars = before.bays.find((bay) => bay.name !== line.bayName && bay.timer === null)!;
      for (const timer of [
        { kind: 'set-time', durationSeconds: 600 },
        { kind: 'warm-up', targetC: 45, cautionAcknowledged: true },
      ]) {
        const refused = await post('/api/timers', { jobLineId: line.id, bayId: otherCars.id, ...timer });
        expect(refused.status).toBe(409);
        expect(refused.body.message).toBe(`That line is in ${line.bayName}: start its timer there`);
      }
      expect((await board()).bays.find((bay) => bay.id === otherCars.id)).toMatchObject({
        state: otherCars.state,
        timer: null,
      });
    });

    it('runs a warm-up: readings give an ETA on the wall, which survives a restart, and 45 °C reaches it', async () => {
      const line = (
        (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' })).body as MyDay
      ).lines[0]!;
      const started = (
        await post('/api/timers', {
          jobLineId: line.id,
          kind: 'warm-up',
          targetC: 45,
          cautionAcknowledged: true,
        }).expect(201)
      ).body as TimerDto;
      expect(started.estimate.status).toBe('not-enough-readings');
      const beforeStart = Date.now() - 5 * 60_000;
      // Common practice, no published source: transmission fluid set at about 45 °C; from 30 °C a running
      // engine gets there in a few minutes. 30 °C then 36 °C a minute later should give a near ETA.
      await post(`/api/timers/${started.id}/readings`, {
        tempC: 30,
        at: new Date(beforeStart).toISOString(),
      }).expect(400);
      const wallSocket = sut.connect(await sut.signIn(DEMO.owner));
      await nextEvent(wallSocket, 'board.snapshot');
      const heard = nextEvent(wallSocket, 'timer.updated', (e) => e.timerId === started.id);
      await post(`/api/timers/${started.id}/readings`, { tempC: 30 }).expect(200);
      await heard;
      await new Promise((r) => setTimeout(r, 1100));
      const second = (await post(`/api/timers/${started.id}/readings`, { tempC: 36 }).expect(200))
        .body as TimerDto;
      expect(second.estimate.status).toBe('estimating');
      expect(second.estimate.secondsLeft).toBeGreaterThan(0);

      const bay = (await board()).bays.find((b) => b.timer?.id === started.id)!;
      expect(bay).toMatchObject({
        state: 'timer',
        timer: { kind: 'warm-up', targetC: 45, lastReadingC: 36, reached: false },
      });
      // The ETA lies ahead of the 36 °C reading: the engine is still warming towards 45 °C.
      expect(Date.parse(bay.timer!.etaAt!)).toBeGreaterThan(Date.parse(second.readings.at(-1)!.at));

      const dataDir = sut.config.dataDir;
      await sut.app.close();
      const restarted = await startTestApp({ BAYTIME_DATA_DIR: dataDir });
      try {
        const after = (await board(restarted)).bays.find((b) => b.timer?.id === started.id)!;
        expect(after.timer).toMatchObject({ etaAt: bay.timer!.etaAt, lastReadingC: 36 });
        const token = (await restarted.badge('1041')).accessToken;
        const reached = (
          await restarted
            .http()
            .post(`/api/timers/${started.id}/readings`)
            .auth(token, { type: 'bearer' })
            .send({ tempC: 45 })
            .expect(200)
        ).body as TimerDto;
        expect(reached.estimate.status).toBe('reached');
        expect((await board(restarted)).bays.find((b) => b.timer?.id === started.id)!.timer!.reached).toBe(
          true,
        );
      } finally {
        await restarted.close();
        sut = await startTestApp();
        dana = await sut.badge('1041');
      }
    });

    it('keeps the owner’s named hold presets', async () => {
      const owner = await sut.signIn(DEMO.owner);
      const { body } = await post(
        '/api/hold-presets',
        { name: 'Sealant cure', durationSeconds: 1800 },
        owner,
      ).expect(201);
      const list = await sut
        .http()
        .get('/api/hold-presets')
        .auth(dana.accessToken, { type: 'bearer' })
        .expect(200);
      expect(list.body).toContainEqual(body);
      await post('/api/hold-presets', { name: 'x', durationSeconds: 1800 }).expect(403);
    });
  });

  describe('set times, on the app’s own ticker', () => {
    const SECOND = 1000;
    // Fake setInterval and Date before the app starts, so its ticker runs on a clock the test moves;
    // HTTP and sockets keep real timers. A whole second, so the ticks fall on whole seconds.
    const start = Math.ceil(Date.now() / SECOND) * SECOND;
    let sut: TestApp;
    beforeAll(async () => {
      vi.useFakeTimers({ toFake: ['setInterval', 'clearInterval', 'Date'], now: start });
      sut = await startTestApp();
    });
    afterAll(async () => {
      await sut.close();
      vi.useRealTimers();
    });

    it('marks a hold reached when its time is up, at the next tick, and tells the screens', async () => {
      const jo = await sut.badge('1045');
      const line = (
        (await sut.http().get('/api/me/day').auth(jo.accessToken, { type: 'bearer' })).body as MyDay
      ).lines[0]!;
      const socket = sut.connect(jo.accessToken);
      await nextEvent(socket, 'board.snapshot');
      const heard: { timerId: number; bayId: number | null; seq: number }[] = [];
      socket.on('timer.updated', (event) => heard.push(event));
      const read = async (id: number) =>
        (await sut.http().get(`/api/timers`).auth(jo.accessToken, { type: 'bearer' }).expect(200)).body.find(
          (timer: TimerDto) => timer.id === id,
        ) as TimerDto;

      // Started 0.4 s after a tick: its 10 s are up at 10.4 s, between the ticks at 10 s and 11 s.
      vi.advanceTimersByTime(400);
      const timer = (
        await sut
          .http()
          .post('/api/timers')
          .auth(jo.accessToken, { type: 'bearer' })
          .send({ jobLineId: line.id, kind: 'set-time', durationSeconds: 10, label: 'Vacuum hold' })
          .expect(201)
      ).body as TimerDto;
      expect(timer).toMatchObject({ startedAt: new Date(start + 400).toISOString(), reachedAt: null });
      expect(timer.estimate).toMatchObject({ status: 'running', method: 'fixed', secondsLeft: 10 });
      await sut
        .http()
        .post('/api/timers')
        .auth(jo.accessToken, { type: 'bearer' })
        .send({ jobLineId: line.id, kind: 'set-time', durationSeconds: 60 })
        .expect(409);
      // The start is announced too: wait for it, then count only what the ticker says.
      while (!heard.some((event) => event.timerId === timer.id)) await new Promise((r) => setTimeout(r, 20));
      heard.length = 0;

      vi.advanceTimersByTime(9_600);
      expect((await read(timer.id)).reachedAt).toBeNull();

      const announced = nextEvent(socket, 'timer.updated', (event) => event.timerId === timer.id);
      vi.advanceTimersByTime(SECOND);
      expect(await announced).toMatchObject({ timerId: timer.id, bayId: timer.bayId });
      // Reached when the wait ended, not when the tick noticed it.
      expect(await read(timer.id)).toMatchObject({
        reachedAt: new Date(start + 10_400).toISOString(),
        endedAt: null,
        estimate: { status: 'done', secondsLeft: 0 },
      });
      expect(heard.filter((event) => event.timerId === timer.id)).toHaveLength(1);
    });
  });

  describe("on a kiosk tablet's own token, with nobody signed in there", () => {
    let sut: TestApp;
    let kiosk: string;
    let jo: SignInAnswer;
    beforeAll(async () => {
      sut = await startTestApp();
      const owner = await sut.signIn(DEMO.owner);
      const { body: pairing } = await sut
        .http()
        .post('/api/kiosks')
        .auth(owner, { type: 'bearer' })
        .send({ name: 'Kiosk by bay 3' })
        .expect(201);
      kiosk = (await sut.http().post('/api/auth/kiosks/pair').send({ code: pairing.code }).expect(200)).body
        .accessToken;
      jo = await sut.badge('1045');
    });
    afterAll(() => sut.close());

    const as = (token: string) => ({
      get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
      post: (path: string, body: object = {}) =>
        sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    });

    it('reads the running timers with whose line and which bay, and hears each change live', async () => {
      const socket = sut.connect(kiosk);
      await nextEvent(socket, 'board.snapshot');
      const line = ((await as(jo.accessToken).get('/api/me/day').expect(200)).body as MyDay).lines[0]!;
      const started = nextEvent(socket, 'timer.updated');
      const timer = (
        await as(jo.accessToken)
          .post('/api/timers', {
            jobLineId: line.id,
            kind: 'set-time',
            durationSeconds: 600,
            label: 'ATF level',
          })
          .expect(201)
      ).body as TimerDto;
      expect(await started).toMatchObject({ timerId: timer.id, bayId: timer.bayId });

      // What a banner says: the timer, the bay it runs in, and whose line it is.
      const running = (await as(kiosk).get('/api/timers').expect(200)).body as TimerDto[];
      expect(running.find((each) => each.id === timer.id)).toMatchObject({
        label: 'ATF level',
        bayId: expect.any(Number),
        lineTechnicianId: jo.user.id,
        endedAt: null,
      });
      const bays = (await as(kiosk).get('/api/bays').expect(200)).body as { id: number; name: string }[];
      expect(bays.find((bay) => bay.id === timer.bayId)?.name).toBe(line.bayName);

      const stopped = nextEvent(socket, 'timer.updated', (event) => event.timerId === timer.id);
      await as(jo.accessToken).post(`/api/timers/${timer.id}/stop`).expect(200);
      await stopped;
      const after = (await as(kiosk).get('/api/timers').expect(200)).body as TimerDto[];
      expect(after.map((each) => each.id)).not.toContain(timer.id);
    });

    it('cannot start a timer, read into one or stop one: the tablet only listens', async () => {
      const sam = await sut.badge('1046');
      const line = ((await as(sam.accessToken).get('/api/me/day').expect(200)).body as MyDay).lines[0]!;
      const body = { jobLineId: line.id, kind: 'set-time', durationSeconds: 600 };
      const refused = await as(kiosk).post('/api/timers', body).expect(403);
      expect(refused.body.message).toBe(ROLE_REFUSAL);
      const started = await as(sam.accessToken).post('/api/timers', body);
      expect(started.status, started.body.message).toBe(201);
      const timer = started.body as TimerDto;
      await as(kiosk).post(`/api/timers/${timer.id}/stop`).expect(403);
      await as(kiosk).post(`/api/timers/${timer.id}/readings`, { tempC: 40 }).expect(403);
      const running = (await as(kiosk).get('/api/timers').expect(200)).body as TimerDto[];
      expect(running.find((each) => each.id === timer.id)?.endedAt).toBeNull();
    });
  });
});
