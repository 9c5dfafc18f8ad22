import { randomUUID } from 'node:crypto';
import { hashSecret } from '../auth/passwords.js';
import type { Db } from '../db/database.js';
import {
  bays,
  customers,
  jobLines,
  payRates,
  punches,
  repairOrders,
  shopSettings,
  users,
  vehicles,
} from '../db/schema/index.js';
import { DEFAULT_SHOP } from '../shop/shop.service.js';

const DAY_MS = 24 * 3600_000;
const HOUR_MS = 3600_000;

/**
 * A year of weekday shifts for `technicians` techs: four jobs a day with a meal break, each job a
 * done line on its own RO. Numbers are invented for measuring speed, not for any check.
 */
export async function seedSyntheticYear(
  db: Db,
  { technicians, idleTechnicians = 0, days }: { technicians: number; idleTechnicians?: number; days: number },
  now = new Date(),
): Promise<{ technicianIds: number[]; idleTechnicianIds: number[] }> {
  const pinHash = await hashSecret('4321');
  const createdAt = new Date(now.getTime() - (days + 1) * DAY_MS);
  db.insert(shopSettings)
    .values({ ...DEFAULT_SHOP, id: 1, name: 'Bench shop', updatedAt: now })
    .onConflictDoNothing()
    .run();
  const bayId = db.insert(bays).values({ name: 'Bench bay', phaseSince: now }).returning().get().id;
  const customerId = db.insert(customers).values({ name: 'Bench customer', createdAt }).returning().get().id;
  const vehicleId = db
    .insert(vehicles)
    .values({ customerId, vin: '1M8GDM9AXKP042788', year: 2019, make: 'Bench', model: 'Car' })
    .returning()
    .get().id;
  const technicianIds: number[] = [];
  const idleTechnicianIds: number[] = [];
  let roNumber = 100_000;
  db.transaction((tx) => {
    for (let t = 0; t < technicians; t++) {
      const id = tx
        .insert(users)
        .values({
          name: `Bench Tech ${t + 1}`,
          role: 'technician',
          badge: String(50_000 + t),
          pinHash,
          createdAt,
        })
        .returning()
        .get().id;
      tx.insert(payRates)
        .values({
          userId: id,
          effectiveFrom: '2000-01-01',
          payType: 'flat-rate',
          flatRateCents: 2500,
          hourlyRateCents: 1500,
          guaranteeCents: 0,
          overtimeExempt: false,
          recordedAt: createdAt,
        })
        .run();
      technicianIds.push(id);
    }
    for (let t = 0; t < idleTechnicians; t++) {
      const id = tx
        .insert(users)
        .values({
          name: `Kiosk Tech ${t + 1}`,
          role: 'technician',
          badge: String(60_000 + t),
          pinHash,
          createdAt,
        })
        .returning()
        .get().id;
      idleTechnicianIds.push(id);
    }
    const midnight = Math.floor(now.getTime() / DAY_MS) * DAY_MS;
    for (let d = days; d >= 1; d--) {
      const dayStart = midnight - d * DAY_MS;
      const weekday = new Date(dayStart).getUTCDay();
      if (weekday === 0 || weekday === 6) continue;
      for (const technicianId of technicianIds) {
        const at = (hours: number) => new Date(dayStart + hours * HOUR_MS);
        const punch = (
          kind: (typeof punches.$inferInsert)['kind'],
          when: Date,
          extra: Partial<typeof punches.$inferInsert> = {},
        ) =>
          tx
            .insert(punches)
            .values({
              id: randomUUID(),
              technicianId,
              kind,
              at: when,
              recordedAt: when,
              recordedBy: technicianId,
              ...extra,
            })
            .run();
        punch('shift-in', at(13));
        for (const [from, to] of [
          [13.2, 15.5],
          [15.6, 17.9],
          [18.5, 20.5],
          [20.6, 21.9],
        ] as const) {
          const roId = tx
            .insert(repairOrders)
            .values({
              number: String(++roNumber),
              customerId,
              vehicleId,
              concern: 'Bench',
              odometer: 1000,
              status: 'closed',
              createdAt: at(from),
            })
            .returning()
            .get().id;
          const lineId = tx
            .insert(jobLines)
            .values({
              repairOrderId: roId,
              lineNo: 1,
              title: 'Bench job',
              bookHours: (to - from) * 1.1,
              status: 'done',
              technicianId,
              bayId,
              queuedAt: at(from),
              completedAt: at(to),
              updatedAt: at(to),
            })
            .returning()
            .get().id;
          punch('job-on', at(from), { jobLineId: lineId });
          punch('job-off', at(to), { jobLineId: lineId });
          if (to === 17.9) {
            punch('break-start', at(18), { breakKind: 'meal' });
            punch('break-end', at(18.5));
          }
        }
        punch('shift-out', at(22));
      }
    }
  });
  return { technicianIds, idleTechnicianIds };
}
