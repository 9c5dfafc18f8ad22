import { HttpException } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { HOLD_REASONS, PUNCH_KINDS, type BoardSnapshot } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { BaysService } from '../bays/bays.service.js';
import { BoardService } from '../board/board.service.js';
import { DB, type Db } from '../db/database.js';
import { users } from '../db/schema/index.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { LiveService } from '../live/live.service.js';
import { PunchesService } from '../punches/punches.service.js';
import { ScreensService } from '../screens/screens.service.js';
import { ShopService } from '../shop/shop.service.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { CorrectionsService } from '../timecards/corrections.service.js';
import { TimersService } from '../timers/timers.service.js';
import { UsersService } from '../users/users.service.js';
import { JobLinesService } from '../work/job-lines.service.js';
import { RepairOrdersService } from '../work/repair-orders.service.js';
import { FloorService } from './floor.service.js';

/** A use case picked at random; the numbers choose a technician, line, bay or punch at run time. */
const command = fc.oneof(
  {
    weight: 6,
    arbitrary: fc.record({
      type: fc.constant('punch' as const),
      tech: fc.nat(),
      kind: fc.constantFrom(...PUNCH_KINDS),
      line: fc.nat(),
      rest: fc.boolean(),
      minutesAgo: fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 600 })),
    }),
  },
  {
    weight: 2,
    arbitrary: fc.record({
      type: fc.constant('assign' as const),
      line: fc.nat(),
      tech: fc.option(fc.nat()),
      bay: fc.option(fc.nat()),
    }),
  },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('hold' as const),
      line: fc.nat(),
      reason: fc.constantFrom(...HOLD_REASONS),
    }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('resume' as const), line: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('finish' as const), line: fc.nat() }) },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('correct' as const),
      tech: fc.nat(),
      punch: fc.nat(),
      minutesEarlier: fc.integer({ min: 1, max: 90 }),
    }),
  },
  {
    weight: 1,
    arbitrary: fc.record({ type: fc.constant('void' as const), tech: fc.nat(), punch: fc.nat() }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('timer' as const), line: fc.nat(), bay: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('stop-timer' as const), timer: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('release-bay' as const), bay: fc.nat() }) },
  {
    weight: 1,
    arbitrary: fc.record({ type: fc.constant('new-ro' as const), hours: fc.integer({ min: 1, max: 40 }) }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('toggle-split' as const) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('toggle-tech' as const), tech: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('cancel-line' as const), line: fc.nat() }) },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('edit-line' as const),
      line: fc.nat(),
      hours: fc.integer({ min: 1, max: 40 }),
    }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('final-check' as const), bay: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('close-ro' as const), ro: fc.nat() }) },
  {
    weight: 1,
    arbitrary: fc.record({
      type: fc.constant('edit-ro' as const),
      ro: fc.nat(),
      vehicle: fc.record(
        {
          year: fc.integer({ min: 1985, max: 2024 }),
          make: fc.constantFrom('Tarrow', 'Ostrander', 'Halvard'),
          model: fc.constantFrom('Kestrel', 'Pelican Crew Cab', 'Wren'),
        },
        { requiredKeys: [] },
      ),
      promiseHours: fc.option(fc.integer({ min: 1, max: 96 })),
    }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant('reorder-bays' as const), seed: fc.nat() }) },
);
type Command = typeof command extends fc.Arbitrary<infer C> ? C : never;

describe(FloorService.name, () => {
  let app: TestApp;
  let floor: FloorService;
  let owner: Principal;
  let roCount = 0;

  beforeAll(async () => {
    app = await startTestApp();
    floor = app.app.get(FloorService);
    const row = app.app
      .get<Db>(DB)
      .select()
      .from(users)
      .where(eq(users.email, 'owner@marlowcreek.test'))
      .get()!;
    owner = { id: row.id, name: row.name, role: 'owner' };
  });
  afterAll(() => app.close());

  const pick = <T>(list: readonly T[], n: number): T | undefined => list[n % Math.max(1, list.length)];

  function allTechnicians(): Principal[] {
    return app.app
      .get<Db>(DB)
      .select()
      .from(users)
      .where(eq(users.role, 'technician'))
      .all()
      .map((u) => ({ id: u.id, name: u.name, role: 'technician' }));
  }

  /** Runs one use case the way its controller would; a refusal (4xx) is part of the game, anything else fails. */
  function run(cmd: Command): void {
    const now = new Date();
    const techs = floor.technicians();
    const lines = floor.openLines();
    const bays = floor.bays();
    const line = 'line' in cmd ? pick(lines, cmd.line) : undefined;
    try {
      switch (cmd.type) {
        case 'punch': {
          const tech = pick(techs, cmd.tech);
          if (!tech) return;
          app.app.get(PunchesService).record(
            {
              id: randomUUID(),
              kind: cmd.kind,
              jobLineId: cmd.kind === 'job-on' || cmd.kind === 'job-off' ? line?.id : undefined,
              breakKind: cmd.kind === 'break-start' ? (cmd.rest ? 'rest' : 'meal') : undefined,
              at: new Date(now.getTime() - cmd.minutesAgo * 60_000).toISOString(),
              technicianId: tech.id,
            },
            owner,
            now,
          );
          return;
        }
        case 'assign': {
          if (!line) return;
          const tech = cmd.tech === null ? null : (pick(techs, cmd.tech)?.id ?? null);
          const bay = cmd.bay === null ? null : (pick(bays, cmd.bay)?.id ?? null);
          app.app.get(JobLinesService).patch(line.id, { technicianId: tech, bayId: bay }, owner, now);
          return;
        }
        case 'hold':
          if (line) app.app.get(JobLinesService).hold(line.id, { reason: cmd.reason }, owner, now);
          return;
        case 'resume':
          if (line) app.app.get(JobLinesService).resume(line.id, owner, now);
          return;
        case 'finish':
          if (line) app.app.get(JobLinesService).finish(line.id, { next: 'check' }, owner, now);
          return;
        case 'correct': {
          const tech = pick(techs, cmd.tech);
          const punch = tech && pick(floor.punchesOf(tech.id), cmd.punch);
          if (!tech || !punch) return;
          app.app.get(CorrectionsService).correct(
            {
              punchId: punch.id,
              technicianId: tech.id,
              kind: punch.kind,
              at: new Date(Date.parse(punch.at) - cmd.minutesEarlier * 60_000).toISOString(),
              jobLineId: punch.jobLineId ?? undefined,
              breakKind: punch.breakKind ?? undefined,
              reason: 'Property test correction',
            },
            owner,
            now,
          );
          return;
        }
        case 'void': {
          const tech = pick(techs, cmd.tech);
          const punch = tech && pick(floor.punchesOf(tech.id), cmd.punch);
          if (!tech || !punch) return;
          const corrections = app.app.get(CorrectionsService);
          const body = { punchId: punch.id, technicianId: tech.id, reason: 'Property test void' };
          const { displaces } = corrections.previewVoid(body, now);
          corrections.void({ ...body, displaces: displaces.map((each) => each.id) }, owner, now);
          return;
        }
        case 'timer': {
          const bay = pick(bays, cmd.bay);
          if (!line || !bay) return;
          app.app
            .get(TimersService)
            .start({ jobLineId: line.id, bayId: bay.id, kind: 'set-time', durationSeconds: 600 }, owner, now);
          return;
        }
        case 'stop-timer': {
          const timer = pick(floor.runningTimers(), cmd.timer);
          if (timer) app.app.get(TimersService).stop(timer.id, owner, now);
          return;
        }
        case 'release-bay': {
          const bay = pick(bays, cmd.bay);
          if (bay) app.app.get(BaysService).release(bay.id, owner);
          return;
        }
        case 'new-ro':
          roCount++;
          app.app.get(RepairOrdersService).create(
            {
              customer: { name: `Property Customer ${roCount}` },
              vehicle: {
                vin: '1M8GDM9AXKP042788',
                year: 1989,
                make: 'Tarrow',
                model: 'Kestrel',
                odometer: 1000 + roCount,
              },
              concern: 'Property test',
              lines: [{ title: 'Inspect', bookHours: cmd.hours / 10 }],
            },
            owner,
            now,
          );
          return;
        case 'toggle-split': {
          const shop = app.app.get(ShopService);
          shop.update(
            { concurrentSplit: shop.settings().concurrentSplit === 'even' ? 'full' : 'even' },
            owner,
          );
          return;
        }
        case 'cancel-line':
          if (line) app.app.get(JobLinesService).cancel(line.id, { reason: 'Property test' }, owner, now);
          return;
        case 'edit-line':
          if (line)
            app.app
              .get(JobLinesService)
              .editDetails(line.id, { bookHours: cmd.hours / 10, title: `Edited ${cmd.hours}` }, owner, now);
          return;
        case 'final-check': {
          const bay = pick(
            bays.filter((b) => b.phase === 'check'),
            cmd.bay,
          );
          if (bay) app.app.get(BaysService).finalCheck(bay.id, {}, owner, now);
          return;
        }
        case 'close-ro': {
          const parked = pick(
            bays.filter((b) => b.parked),
            cmd.ro,
          );
          if (parked) app.app.get(RepairOrdersService).close(parked.parked!.id, owner, now);
          return;
        }
        case 'edit-ro': {
          // An RO on the floor: one with an open line, or parked in a bay.
          const ids = [
            ...new Set([
              ...lines.map((l) => l.repairOrderId),
              ...bays.flatMap((b) => (b.parked ? [b.parked.id] : [])),
            ]),
          ].sort((a, b) => a - b);
          const id = pick(ids, cmd.ro);
          if (id === undefined) return;
          app.app.get(RepairOrdersService).edit(
            id,
            {
              vehicle: cmd.vehicle,
              ...(cmd.promiseHours !== null && {
                promisedAt: new Date(now.getTime() + cmd.promiseHours * 3600_000).toISOString(),
              }),
            },
            owner,
            now,
          );
          return;
        }
        case 'reorder-bays': {
          const ids = bays.map((b) => b.id);
          const shift = cmd.seed % Math.max(1, ids.length);
          app.app.get(BaysService).reorder({ bayIds: [...ids.slice(shift), ...ids.slice(0, shift)] }, owner);
          return;
        }
        case 'toggle-tech': {
          const tech = pick(allTechnicians(), cmd.tech);
          if (!tech) return;
          const active = techs.some((t) => t.id === tech.id);
          // Refused for a technician on shift: the update is async, so that comes as a rejection.
          app.app.get(UsersService).update(tech.id, { active: !active }, owner).catch(refusedOnly);
          return;
        }
      }
    } catch (error) {
      refusedOnly(error);
    }
  }

  function refusedOnly(error: unknown): void {
    if (!(error instanceof HttpException) || error.getStatus() >= 500) throw error;
  }

  /** The same instant seen by the model that took every change in, and by one built from the database. */
  function both(now: Date): [BoardSnapshot, BoardSnapshot] {
    const shop = app.app.get(ShopService);
    const live = app.app.get(LiveService);
    const fresh = new FloorService(app.app.get<Db>(DB), app.app.get(UnitOfWork), shop, live);
    fresh.load(now);
    const screens = app.app.get(ScreensService);
    return [
      app.app.get(BoardService).snapshot(0, now),
      new BoardService(fresh, shop, live, screens).snapshot(0, now),
    ];
  }

  function comparable(snapshot: BoardSnapshot) {
    return {
      bays: snapshot.bays.map((bay) => ({ ...bay, clockedSeconds: 0 })),
      clocked: snapshot.bays.map((bay) => bay.clockedSeconds),
      people: snapshot.people,
      queue: snapshot.queue,
    };
  }

  it('agrees with a full rebuild from the database after any sequence of use cases', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(command, { minLength: 20, maxLength: 120 }), async (commands) => {
        for (const cmd of commands) {
          run(cmd);
          // As in the server, each change is published before the next one, so what the board keeps
          // from one publication to the next is tested too. Deactivations also land here: they hash a
          // password-free update asynchronously.
          await new Promise((resolve) => setImmediate(resolve));
        }
        const [incremental, rebuilt] = both(new Date());
        const [a, b] = [comparable(incremental), comparable(rebuilt)];
        expect(a.bays).toEqual(b.bays);
        expect(a.people).toEqual(b.people);
        expect(a.queue).toEqual(b.queue);
        // Rounded from sums taken in another order: at most a second apart.
        a.clocked.forEach((seconds, i) => expect(Math.abs(seconds - b.clocked[i]!)).toBeLessThanOrEqual(1));
      }),
      { numRuns: 12 },
    );
  }, 180_000);

  // Common practice, no source: a technician forgets to clock out on Friday morning and is back on Monday,
  // over 72 hours later. Their shift is still open in the timecard, so it is open on the floor too.
  it('keeps a shift left open for days open, from start-up and after later punches', async () => {
    const created = await app.app
      .get(UsersService)
      .create({ name: 'Wren Halloway', role: 'technician', badge: '7301', pin: '4321' }, owner);
    const wren: Principal = { id: created.id, name: created.name, role: 'technician' };
    const punches = app.app.get(PunchesService);
    const now = new Date();
    const friday = new Date(now.getTime() - 80 * 3600_000);
    punches.record({ id: randomUUID(), kind: 'shift-in', technicianId: wren.id }, owner, friday);

    floor.load(now);
    expect(floor.stateOf(wren.id, now)).toMatchObject({ status: 'on-shift', since: friday });
    expect(() => punches.record({ id: randomUUID(), kind: 'shift-in' }, wren, now)).toThrow(
      'You are already on shift',
    );
    punches.record({ id: randomUUID(), kind: 'break-start', breakKind: 'rest' }, wren, now);
    await new Promise((resolve) => setImmediate(resolve));
    const later = new Date(now.getTime() + 60_000);
    expect(floor.stateOf(wren.id, later)).toMatchObject({ status: 'on-break' });
    expect(floor.ledgerOf(wren.id, later)?.shifts[0]?.from).toEqual(friday);
  });
});
