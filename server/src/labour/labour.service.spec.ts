import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import { buildLedger, type PunchKind } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { jobLines, punches, users } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { LabourService, toPunchDto } from './labour.service.js';

const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;
const LINES = 4;

/** What an arbitrary draws. */
type ArbitraryValue<A> = A extends fc.Arbitrary<infer T> ? T : never;

/**
 * A shift of at most 8 × 2 hours and one minute, starting at any minute of a UTC day (so some run past
 * midnight), its shift-out sometimes at the instant of its last punch.
 */
const shift = fc.record({
  worked: fc.boolean(),
  startMinute: fc.integer({ min: 0, max: 24 * 60 - 1 }),
  steps: fc.array(
    fc.record({
      kind: fc.constantFrom<PunchKind>('job-on', 'job-off', 'break-start', 'break-end'),
      line: fc.nat({ max: LINES - 1 }),
      afterMinutes: fc.integer({ min: 1, max: 120 }),
    }),
    { maxLength: 8 },
  ),
  outAfterMinutes: fc.integer({ min: 0, max: 60 }),
});
/**
 * A later row that moves a punch by up to three hours, or voids it; never a shift-out voided, which could
 * leave a shift open for longer than any ledger of the service looks back.
 */
const correction = fc.record({
  of: fc.nat(),
  byMinutes: fc.integer({ min: -180, max: 180 }),
  voids: fc.boolean(),
});
const history = fc.record({
  technicians: fc.array(
    fc.record({ shifts: fc.array(shift, { minLength: 1, maxLength: 10 }), lastStillOpen: fc.boolean() }),
    { minLength: 2, maxLength: 2 },
  ),
  corrections: fc.array(correction, { maxLength: 6 }),
});
/** What comes in after the lines were counted once: late shifts on any of the days, and corrections. */
const later = fc.record({
  shifts: fc.array(fc.record({ technician: fc.nat({ max: 1 }), day: fc.nat({ max: 9 }), shift }), {
    maxLength: 3,
  }),
  corrections: fc.array(correction, { maxLength: 4 }),
});

describe(LabourService.name, () => {
  let sut: TestApp;
  let db: Db;
  let labour: LabourService;
  let shop: ShopService;
  let ownerId: number;
  let repairOrderId: number;
  let serial = 0;

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    labour = sut.app.get(LabourService);
    shop = sut.app.get(ShopService);
    ownerId = db.select().from(users).where(eq(users.role, 'owner')).get()!.id;
    repairOrderId = db.select({ id: jobLines.repairOrderId }).from(jobLines).limit(1).get()!.id;
  });
  afterAll(() => sut.close());

  const newTechnician = (now: Date) =>
    db
      .insert(users)
      .values({ name: `Tech ${++serial}`, role: 'technician', createdAt: now })
      .returning()
      .get().id;
  const newLine = (now: Date) =>
    db
      .insert(jobLines)
      .values({
        repairOrderId,
        lineNo: 1000 + ++serial,
        title: 'Replace wiper blades',
        bookHours: 1,
        queuedAt: now,
        updatedAt: now,
      })
      .returning()
      .get().id;

  // Each run has technicians and lines of its own: punches are only ever added, as in the shop.
  it('counts a line worked in a shift left open for more than a day and a half', () => {
    const now = new Date(Math.floor(Date.now() / MINUTE) * MINUTE);
    const technicianId = newTechnician(now);
    const line = newLine(now);
    const punch = (kind: PunchKind, hoursAgo: number, jobLineId: number | null = null) => ({
      id: randomUUID(),
      technicianId,
      kind,
      jobLineId,
      at: new Date(now.getTime() - hoursAgo * 60 * MINUTE),
      recordedAt: now,
      recordedBy: ownerId,
    });
    // No shift-out since the shift-in 40 hours ago: the hour on the line still counts.
    db.insert(punches)
      .values([punch('shift-in', 40), punch('job-on', 2, line), punch('job-off', 1, line)])
      .run();
    expect(new LabourService(db, shop).lineSeconds([line], now).get(line)!.total).toBe(3600);
  });

  it('counts each line’s clocked time as a ledger of the technicians’ whole history does, and again after punches come in late', () => {
    const now = new Date(Math.floor(Date.now() / MINUTE) * MINUTE);
    const settings = shop.settings(now);
    fc.assert(
      fc.property(history, later, ({ technicians, corrections }, late) => {
        const techs = technicians.map(() => newTechnician(now));
        const lineIds = Array.from({ length: LINES }, () => newLine(now));
        const written: (typeof punches.$inferInsert)[] = [];
        const write = (technicianId: number, kind: PunchKind, at: number, line: number | null = null) =>
          written.push({
            id: randomUUID(),
            technicianId,
            kind,
            jobLineId: line === null ? null : lineIds[line]!,
            breakKind: kind === 'break-start' ? 'meal' : null,
            at: new Date(at),
            recordedAt: now,
            recordedBy: ownerId,
          });
        // Day by day up to yesterday; a shift starts no later than 17 hours before now.
        const firstDay = Math.floor(now.getTime() / DAY) - 10;
        const writeShift = (
          technicianId: number,
          day: number,
          { worked, startMinute, steps, outAfterMinutes }: ArbitraryValue<typeof shift>,
          stillOpen = false,
        ) => {
          if (!worked) return;
          let at = Math.min((firstDay + day) * DAY + startMinute * MINUTE, now.getTime() - 17 * 60 * MINUTE);
          write(technicianId, 'shift-in', at);
          for (const step of steps) {
            at += step.afterMinutes * MINUTE;
            write(technicianId, step.kind, at, step.kind.startsWith('job') ? step.line : null);
          }
          if (!stillOpen) write(technicianId, 'shift-out', at + outAfterMinutes * MINUTE);
        };
        const superseded = new Set<string>();
        const correct = (
          all: readonly ArbitraryValue<typeof correction>[],
          candidates: readonly (typeof punches.$inferInsert)[],
        ) => {
          for (const { of, byMinutes, voids } of all) {
            const punch = candidates[of % candidates.length];
            if (!punch || superseded.has(punch.id!) || (voids && punch.kind === 'shift-out')) continue;
            superseded.add(punch.id!);
            const at = voids
              ? punch.at
              : new Date(Math.min(punch.at.getTime() + byMinutes * MINUTE, now.getTime()));
            written.push({ ...punch, id: randomUUID(), at, supersedes: punch.id, voids });
          }
        };
        const save = () => {
          if (written.length) db.insert(punches).values(written).run();
          written.length = 0;
        };
        const whole = (line: number) =>
          techs
            .map((id) =>
              buildLedger(
                db.select().from(punches).where(eq(punches.technicianId, id)).all().map(toPunchDto),
                now,
                settings,
              ),
            )
            .reduce((sum, ledger) => sum + (ledger.totals.jobSeconds[line] ?? 0), 0);

        technicians.forEach(({ shifts, lastStillOpen }, t) =>
          shifts.forEach((one, day) =>
            writeShift(techs[t]!, day + 10 - shifts.length, one, lastStillOpen && day === shifts.length - 1),
          ),
        );
        correct(corrections, [...written]);
        save();
        const together = labour.lineSeconds(lineIds, now);
        for (const line of lineIds) {
          expect(together.get(line)!.total).toBeCloseTo(whole(line), 6);
          // Counted alone, by a service that has kept nothing, a line has the same time.
          expect(new LabourService(db, shop).lineSeconds([line], now).get(line)!.total).toBeCloseTo(
            whole(line),
            6,
          );
        }

        for (const { technician, day, shift: one } of late.shifts) writeShift(techs[technician]!, day, one);
        const saved = db.select().from(punches).where(inArray(punches.technicianId, techs)).all();
        correct(late.corrections, [...saved, ...written]);
        save();
        // What was kept answers as counting afresh does, after late punches and as time goes by.
        const afresh = (until: Date) => new LabourService(db, shop).lineSeconds(lineIds, until);
        for (const until of [now, new Date(now.getTime() + 10 * MINUTE)]) {
          const [kept, counted] = [labour.lineSeconds(lineIds, until), afresh(until)];
          for (const line of lineIds) expect(kept.get(line)!.total).toBeCloseTo(counted.get(line)!.total, 6);
        }
      }),
      { numRuns: 40 },
    );
  });

  /** A technician's punches on one line, by day and hour before midnight today (UTC). */
  function shiftsOnALine() {
    const now = new Date(Math.floor(Date.now() / DAY) * DAY);
    const [technicianId, lineId] = [newTechnician(now), newLine(now)];
    const at = (daysAgo: number, hour: number) => new Date(now.getTime() - daysAgo * DAY + hour * 3600_000);
    const punch = (kind: PunchKind, when: Date, supersedes: string | null = null) => {
      const id = randomUUID();
      db.insert(punches)
        .values({
          id,
          technicianId,
          kind,
          jobLineId: kind.startsWith('job') ? lineId : null,
          breakKind: kind === 'break-start' ? 'meal' : null,
          at: when,
          recordedAt: now,
          recordedBy: ownerId,
          supersedes,
        })
        .run();
      return id;
    };
    const clocked = () => labour.lineSeconds([lineId], now).get(lineId)!.total;
    return { at, punch, clocked, technicianId };
  }

  // A break closes the jobs open at its start: 09:00–09:30 on the line, then nothing until the job-off.
  it('counts a line again when a punch of its shift is moved to another day', () => {
    const { at, punch, clocked } = shiftsOnALine();
    punch('shift-in', at(5, 8));
    punch('job-on', at(5, 9));
    const breakStart = punch('break-start', at(5, 9.5));
    punch('break-end', at(5, 10));
    punch('job-off', at(5, 11));
    punch('shift-out', at(5, 12));
    expect(clocked()).toBe(1800);
    // The break was two days later: the job ran 09:00–11:00.
    punch('break-start', at(3, 9.5), breakStart);
    expect(clocked()).toBe(7200);
  });

  // Two lines on at once for two hours: the even split gives each an hour. A change to the full split later
  // counts time from then on; the two hours already worked stay as they were counted.
  it('keeps time counted under the split rule of its moment when the rule changes', () => {
    const { at, punch, clocked, technicianId } = shiftsOnALine();
    const owner = { id: ownerId, name: 'Owner', role: 'owner' as const };
    const { concurrentSplit, maxConcurrentJobs } = shop.settings();
    try {
      shop.update({ concurrentSplit: 'even', maxConcurrentJobs: 2 }, owner);
      const otherLine = newLine(at(5, 0));
      punch('shift-in', at(5, 8));
      punch('job-on', at(5, 9));
      db.insert(punches)
        .values(
          (['job-on', 'job-off'] as const).map((kind, i) => ({
            id: randomUUID(),
            technicianId,
            kind,
            jobLineId: otherLine,
            at: at(5, 9 + 2 * i),
            recordedAt: at(0, 0),
            recordedBy: ownerId,
          })),
        )
        .run();
      punch('job-off', at(5, 11));
      punch('shift-out', at(5, 12));
      expect(clocked()).toBe(3600);
      shop.update({ concurrentSplit: 'full' }, owner);
      expect(clocked()).toBe(3600);
    } finally {
      shop.update({ concurrentSplit, maxConcurrentJobs }, owner);
    }
  });

  it('keeps nothing it counted inside a transaction that was rolled back', () => {
    const { at, punch, clocked } = shiftsOnALine();
    punch('shift-in', at(5, 8));
    punch('job-on', at(5, 9));
    punch('job-off', at(5, 11));
    punch('shift-out', at(5, 12));
    expect(clocked()).toBe(7200);
    expect(() =>
      db.transaction(() => {
        punch('break-start', at(5, 10));
        expect(clocked()).toBe(3600);
        throw new Error('Rolled back');
      }),
    ).toThrow('Rolled back');
    // The next punch, on another day, takes the row the rollback gave back.
    punch('shift-in', at(1, 8));
    expect(clocked()).toBe(7200);
  });
});
