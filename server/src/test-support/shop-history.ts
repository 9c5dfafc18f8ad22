import { makeVin, type BreakKind, type PunchKind } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { customers, jobLines, repairOrders, vehicles } from '../db/schema/index.js';
import { repairOrderSnapshot } from '../work/repair-order-snapshot.js';
import type { TestApp } from './test-app.js';

export type ShopHistory = ReturnType<typeof shopHistory>;

/**
 * Writes a shop's past for a test: technicians and back-dated punches through the API (the owner's missed
 * punches), finished lines through the foreman's route, and the repair orders straight into the database.
 */
export function shopHistory(sut: TestApp, tokens: { owner: string; foreman: string }) {
  const db = sut.app.get<Db>(DB);
  let serial = 0;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object) => sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  return {
    as,
    technician: async (name: string, badge: string, flatRateCents: number, hourlyRateCents: number) =>
      (
        await as(tokens.owner)
          .post('/api/users', {
            name,
            role: 'technician',
            badge,
            pin: '4321',
            flatRateCents,
            hourlyRateCents,
          })
          .expect(201)
      ).body.id as number,
    /** A missed punch added by the owner: the only way to record times this far back. */
    punch: (
      technicianId: number,
      kind: PunchKind,
      when: Date,
      jobLineId?: number,
      breakKind: BreakKind = 'meal',
    ) =>
      as(tokens.owner)
        .post('/api/timecards/corrections', {
          technicianId,
          kind,
          at: when.toISOString(),
          reason: 'From the paper timesheet',
          ...(jobLineId ? { jobLineId } : {}),
          ...(kind === 'break-start' ? { breakKind } : {}),
        })
        .expect((response) => {
          if (response.status !== 201)
            throw new Error(`${kind} at ${when.toISOString()}: ${JSON.stringify(response.body)}`);
        }),
    /**
     * A shift spent on one line of its own, written half an hour before: on shift and clocked on from `from`,
     * off at `to`, when the line is finished. The line's id.
     */
    async workedLine(technicianId: number, title: string, bookHours: number, from: Date, to: Date) {
      const line = this.line(title, bookHours, technicianId, new Date(from.getTime() - 30 * 60_000));
      await this.punch(technicianId, 'shift-in', from);
      await this.punch(technicianId, 'job-on', from, line);
      await this.punch(technicianId, 'job-off', to, line);
      await this.punch(technicianId, 'shift-out', to);
      await this.finish(line, to);
      return line;
    },
    finish: (jobLineId: number, when: Date) =>
      as(tokens.foreman)
        .patch(`/api/job-lines/${jobLineId}`, { completedAt: when.toISOString() })
        .expect(200),
    /** A repair order with one line, straight into the database. */
    line: (title: string, bookHours: number, technicianId: number, queuedAt: Date, bayId?: number) => {
      const n = ++serial;
      const customer = db
        .insert(customers)
        .values({ name: `Test customer ${n}`, createdAt: queuedAt })
        .returning()
        .get();
      const vehicle = db
        .insert(vehicles)
        .values({
          customerId: customer.id,
          vin: makeVin(`7RP9TS4DLM${String(500_000 + n)}`),
          year: 2020,
          make: 'Corvane',
          model: 'Altrix',
        })
        .returning()
        .get();
      const ro = db
        .insert(repairOrders)
        .values({
          number: `T${900 + n}`,
          customerId: customer.id,
          vehicleId: vehicle.id,
          ...repairOrderSnapshot(customer, vehicle),
          concern: title,
          odometer: 40_000,
          createdAt: queuedAt,
        })
        .returning()
        .get();
      return db
        .insert(jobLines)
        .values({
          repairOrderId: ro.id,
          lineNo: 1,
          title,
          bookHours,
          technicianId,
          bayId: bayId ?? null,
          queuedAt,
          updatedAt: queuedAt,
        })
        .returning()
        .get().id;
    },
  };
}
