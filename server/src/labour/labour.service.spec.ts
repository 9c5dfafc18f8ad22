import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { asc, eq, inArray } from 'drizzle-orm';
import { buildLedger, type PunchKind } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { jobLines, punches, users } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { LabourService, toPunchDto } from './labour.service.js';

const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;
const LINES = 4;

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

describe(LabourService.name, () => {
  let sut: TestApp;
  let db: Db;
  let labour: LabourService;
  let shop: ShopService;
  let technicianIds: number[];
  let lineIds: number[];
  let ownerId: number;

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    labour = sut.app.get(LabourService);
    shop = sut.app.get(ShopService);
    const people = db.select().from(users).orderBy(asc(users.id)).all();
    ownerId = people.find((user) => user.role === 'owner')!.id;
    technicianIds = people.filter((user) => user.role === 'technician').map((user) => user.id);
    lineIds = db
      .select({ id: jobLines.id })
      .from(jobLines)
      .orderBy(asc(jobLines.id))
      .limit(LINES)
      .all()
      .map((line) => line.id);
  });
  afterAll(() => sut.close());

  it('counts each line’s clocked time as a ledger of the technicians’ whole history does', () => {
    const now = new Date(Math.floor(Date.now() / MINUTE) * MINUTE);
    fc.assert(
      fc.property(history, ({ technicians, corrections }) => {
        const techs = technicianIds.slice(0, technicians.length);
        db.delete(punches).where(inArray(punches.technicianId, techs)).run();
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
        technicians.forEach(({ shifts, lastStillOpen }, t) => {
          // Day by day up to yesterday; the last shift starts less than a day before now.
          const firstDay = Math.floor(now.getTime() / DAY) - shifts.length;
          shifts.forEach(({ worked, startMinute, steps, outAfterMinutes }, day) => {
            if (!worked) return;
            let at = Math.min(
              (firstDay + day) * DAY + startMinute * MINUTE,
              now.getTime() - 17 * 60 * MINUTE,
            );
            write(techs[t]!, 'shift-in', at);
            for (const step of steps) {
              at += step.afterMinutes * MINUTE;
              write(techs[t]!, step.kind, at, step.kind.startsWith('job') ? step.line : null);
            }
            if (!(lastStillOpen && day === shifts.length - 1))
              write(techs[t]!, 'shift-out', at + outAfterMinutes * MINUTE);
          });
        });
        const superseded = new Set<string>();
        for (const { of, byMinutes, voids } of corrections) {
          const punch = written[of % written.length];
          if (!punch || superseded.has(punch.id!) || (voids && punch.kind === 'shift-out')) continue;
          superseded.add(punch.id!);
          const at = voids
            ? punch.at
            : new Date(Math.min(punch.at.getTime() + byMinutes * MINUTE, now.getTime()));
          written.push({ ...punch, id: randomUUID(), at, supersedes: punch.id, voids });
        }
        if (written.length) db.insert(punches).values(written).run();

        const settings = shop.settings(now);
        const everything = techs.map((id) =>
          buildLedger(
            db.select().from(punches).where(eq(punches.technicianId, id)).all().map(toPunchDto),
            now,
            settings,
          ),
        );
        const whole = (line: number) =>
          everything.reduce((sum, ledger) => sum + (ledger.totals.jobSeconds[line] ?? 0), 0);
        const together = labour.lineSeconds(lineIds, now);
        for (const line of lineIds) {
          expect(together.get(line)!.total).toBeCloseTo(whole(line), 6);
          expect(labour.lineSeconds([line], now).get(line)!.total).toBeCloseTo(whole(line), 6);
        }
      }),
      { numRuns: 40 },
    );
  });
});
