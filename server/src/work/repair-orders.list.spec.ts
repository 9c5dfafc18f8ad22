import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { eq } from 'drizzle-orm';
import { repairOrderListQuerySchema, type RepairOrderPage } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { customers, jobLines, repairOrders, users, vehicles } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrdersService } from './repair-orders.service.js';

const MINUTE = 60_000;

describe(`${RepairOrdersService.name} list`, () => {
  let sut: TestApp;
  let db: Db;
  let advisor: string;
  let vehicleId: number;
  let customerId: number;
  let foremanId: number;
  const base = Date.UTC(2030, 0, 7, 15, 0);
  const page = async (query: string) =>
    (await sut.http().get(`/api/repair-orders?${query}`).auth(advisor, { type: 'bearer' }).expect(200))
      .body as RepairOrderPage;

  /** An RO straight into the table, with one queued line. */
  const insert = (
    number: string,
    values: Partial<typeof repairOrders.$inferInsert> = {},
    vehicle = vehicleId,
  ): number => {
    const id = db
      .insert(repairOrders)
      .values({
        number,
        customerId,
        vehicleId: vehicle,
        customerName: 'Pagewright Holm',
        vehicleYear: 2019,
        vehicleMake: 'Halvard',
        vehicleModel: 'Morrow',
        concern: 'Service',
        odometer: 1000,
        createdAt: new Date(base),
        ...values,
      })
      .returning()
      .get().id;
    db.insert(jobLines)
      .values({
        repairOrderId: id,
        lineNo: 1,
        title: 'Inspect',
        bookHours: 0.5,
        queuedAt: new Date(base),
        updatedAt: new Date(base),
      })
      .run();
    return id;
  };

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    advisor = await sut.signIn(DEMO.advisor);
    customerId = db
      .insert(customers)
      .values({ name: 'Pagewright Holm', createdAt: new Date(base) })
      .returning()
      .get().id;
    vehicleId = db
      .insert(vehicles)
      .values({ customerId, vin: 'PAGE0000000000001', year: 2019, make: 'Halvard', model: 'Morrow' })
      .returning()
      .get().id;
    foremanId = db.select().from(users).where(eq(users.email, DEMO.foreman)).get()!.id;
    // 105 ROs a minute apart, except that the 5th and 6th oldest were written in the same minute.
    for (let i = 0; i < 105; i++)
      insert(String(880_000 + i), { createdAt: new Date(base + (i === 5 ? 4 : i) * MINUTE) });
  });
  afterAll(() => sut.close());

  it('answers at most 100 a page, newest first, and the cursor walks the rest without loss or repeat', async () => {
    const first = await page('q=Pagewright&limit=1000');
    expect(first.total).toBe(105);
    expect(first.items).toHaveLength(100);
    expect(first.items[0]!.number).toBe('880104');
    // Newest first: 880104 down to 880005; 880004 and 880005 share a minute, the later-written one first.
    expect(first.items.at(-1)!.number).toBe('880005');
    expect(first.nextCursor).toEqual(expect.any(String));

    // An RO written meanwhile shows on a new first page, not on the next one.
    insert('880999', { createdAt: new Date(base + 200 * MINUTE) });
    const second = await page(`q=Pagewright&limit=100&cursor=${first.nextCursor}`);
    expect(second.items.map((ro) => ro.number)).toEqual(['880004', '880003', '880002', '880001', '880000']);
    expect(second.nextCursor).toBeNull();
    expect(second.total).toBe(106);
  });

  it('takes 50 when no limit is given', async () => {
    const { items, total } = await page('q=Pagewright');
    expect(items).toHaveLength(50);
    expect(total).toBe(106);
  });

  it('refuses a limit or cursor that is not one, at the field', async () => {
    for (const query of ['limit=0', 'limit=0x10', 'limit=-5', 'limit=1.5', 'cursor=abc', 'cursor=%2F%2F'])
      expect(
        (await sut.http().get(`/api/repair-orders?${query}`).auth(advisor, { type: 'bearer' }).expect(400))
          .body.issues[0].path,
        query,
      ).toEqual([query.split('=')[0]]);
  });

  it('counts clocked time for the lines on the page only', async () => {
    const lineSeconds = vi.spyOn(sut.app.get(LabourService), 'lineSeconds');
    try {
      const { items } = await page('q=Pagewright&limit=3');
      expect(lineSeconds).toHaveBeenCalledTimes(1);
      const asked = lineSeconds.mock.calls[0]![0];
      expect(asked).toHaveLength(3);
      expect(new Set(asked)).toEqual(new Set(items.flatMap((ro) => ro.lines.map((line) => line.id))));
    } finally {
      lineSeconds.mockRestore();
    }
  });

  describe('search', () => {
    let quillon: number;
    let marisol: number;
    beforeAll(() => {
      const other = db
        .insert(vehicles)
        .values({ customerId, vin: 'JT4RN5ZZ9K0418827', year: 2018, make: 'Brightwell', model: 'Tern' })
        .returning()
        .get().id;
      quillon = insert(
        '98001',
        { customerName: 'Quillon Atterby', customerPhone: '(555) 013-7731', vehiclePlate: 'QX 4471' },
        other,
      );
      marisol = insert('98002', { customerName: 'Marisol Atterby', customerPhone: '555-0199' });
    });

    it.each([
      ['98001', 'the RO number'],
      ['quillon', 'part of the name, in any case'],
      ['quillon atterby', 'every word'],
      ['013-7731', 'the phone as written'],
      ['5550137731', 'the phone as bare digits'],
      ['qx 4471', 'the plate, with a word shorter than three letters'],
      ['418827', 'the last six of the VIN'],
    ])('finds an RO by %s (%s)', async (q) => {
      const { items, total } = await page(`q=${encodeURIComponent(q)}`);
      expect(items.map((ro) => ro.id)).toEqual([quillon]);
      expect(total).toBe(1);
    });

    it('finds every RO that matches, newest first', async () => {
      const { items } = await page('q=atterby');
      expect(items.map((ro) => ro.id)).toEqual([marisol, quillon]);
    });

    it('takes search syntax and quotes as plain text', async () => {
      for (const q of ['"Atterby', 'NEAR(x* "', 'atterby OR', '100%', '_'])
        expect((await page(`q=${encodeURIComponent(q)}`)).items, q).toEqual([]);
    });
  });

  describe('filters', () => {
    const onlyMarked = async (query: string) =>
      (await page(`q=Filterling&${query}`)).items.map((ro) => ro.number).sort();
    beforeAll(() => {
      const now = Date.now();
      const mark = { customerName: 'Filterling Ives' };
      insert('97001', { ...mark, status: 'open', promisedAt: new Date(now - 60 * MINUTE) });
      insert('97002', { ...mark, status: 'done', promisedAt: new Date(now - 60 * MINUTE) });
      insert('97003', {
        ...mark,
        status: 'open',
        // Far enough that half an hour started now makes it, whatever the shop's hours.
        promisedAt: new Date(now + 3 * 24 * 60 * MINUTE),
        advisorId: foremanId,
      });
      insert('97004', { ...mark, status: 'closed', promisedAt: null, advisorId: foremanId });
      // Each line carries its RO's promise; the lines of the finished and the closed RO are done.
      for (const ro of db
        .select()
        .from(repairOrders)
        .where(eq(repairOrders.customerName, mark.customerName))
        .all())
        db.update(jobLines)
          .set({ promisedAt: ro.promisedAt, status: ro.status === 'open' ? 'queued' : 'done' })
          .where(eq(jobLines.repairOrderId, ro.id))
          .run();
      sut.app.get(FloorService).load();
    });

    it('by status', async () => {
      expect(await onlyMarked('status=open')).toEqual(['97001', '97003']);
      expect(await onlyMarked('status=closed')).toEqual(['97004']);
    });

    it('by advisor', async () => {
      expect(await onlyMarked(`advisorId=${foremanId}`)).toEqual(['97003', '97004']);
    });

    it('late: an open line whose promise has passed, as dispatch counts it', async () => {
      expect(await onlyMarked('late=true')).toEqual(['97001']);
      expect(await onlyMarked('late=false')).toEqual(['97001', '97002', '97003', '97004']);
    });

    it('promised today: the shop day, on the day the clocks go forward too', () => {
      // America/Chicago (the demo shop's zone): daylight time begins Sunday 9 March 2031 at 2:00, the
      // second Sunday of March (US Energy Policy Act of 2005, section 110). That day runs from
      // 06:00 UTC (midnight CST, UTC−6) to 05:00 UTC on the 10th (midnight CDT, UTC−5): 23 hours.
      const at = (iso: string) => ({ customerName: 'Dayline Orr', promisedAt: new Date(iso) });
      insert('96001', at('2031-03-09T05:59:00Z'));
      insert('96002', at('2031-03-09T06:00:00Z'));
      insert('96003', at('2031-03-10T04:59:00Z'));
      insert('96004', at('2031-03-10T05:00:00Z'));
      const { items } = sut.app
        .get(RepairOrdersService)
        .list(
          repairOrderListQuerySchema.parse({ q: 'Dayline', promised: 'today' }),
          new Date('2031-03-09T18:00:00Z'),
        );
      expect(items.map((ro) => ro.number)).toEqual(['96003', '96002'].sort().reverse());
    });
  });
});
