import { Inject, Injectable } from '@nestjs/common';
import { eq, sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import {
  makeVin,
  repairOrderStatus,
  shopDayKey,
  shopLocalInstant,
  type HoldReason,
  type Priority,
} from '@baytime/shared';
import { hashSecret } from '../auth/passwords.js';
import { countRows, DB, type Db } from '../db/database.js';
import {
  bays,
  customers,
  holdPresets,
  jobLines,
  operations,
  payRates,
  partsHolds,
  punches,
  repairOrders,
  shopSettings,
  timers,
  users,
  vehicles,
  type BAY_PHASES,
} from '../db/schema/index.js';
import { DEFAULT_SHOP, FIRST_RULES_FROM } from '../shop/shop.service.js';
import { repairOrderSnapshot } from '../work/repair-order-snapshot.js';

/** Every name, vehicle and number here is invented for the demo. */
const SHOP = {
  ...DEFAULT_SHOP,
  name: 'Marlow Creek Auto Care',
  timeZone: 'America/Chicago',
  // 555-0100 to 555-0199 are set aside for fiction in the North American numbering plan.
  phone: '+16085550100',
  labourRateCents: 135_00,
  taxNote: 'Sales tax is added on the final invoice.',
};
/** The demo's repair orders are numbered on from here. */
const FIRST_RO_NUMBER = 4400;
export const DEMO_PASSWORD = 'baytime-demo';
export const DEMO_PIN = '4321';

const OFFICE = [
  { name: 'Rosa Pellman', role: 'owner', email: 'owner@marlowcreek.test' },
  { name: 'Theo Varga', role: 'foreman', email: 'foreman@marlowcreek.test' },
  { name: 'Nell Ashby', role: 'advisor', email: 'advisor@marlowcreek.test' },
] as const;

/** `pace`: book hours flagged per hour clocked, so the reports show a spread of efficiency. */
const TECHNICIANS = [
  {
    name: 'Dana Okafor',
    badge: '1041',
    skillLevel: 4,
    flatRateCents: 3200,
    hourlyRateCents: 1800,
    pace: 1.3,
  },
  {
    name: 'Luis Brennan',
    badge: '1042',
    skillLevel: 3,
    flatRateCents: 2800,
    hourlyRateCents: 1600,
    pace: 1.15,
  },
  {
    name: 'Priya Castell',
    badge: '1043',
    skillLevel: 3,
    flatRateCents: 2700,
    hourlyRateCents: 1600,
    pace: 1.05,
  },
  {
    name: 'Marcus Lindqvist',
    badge: '1044',
    skillLevel: 2,
    flatRateCents: 2400,
    hourlyRateCents: 1500,
    pace: 0.95,
  },
  {
    name: 'Jo Whitfield',
    badge: '1045',
    skillLevel: 2,
    flatRateCents: 2300,
    hourlyRateCents: 1500,
    pace: 1.0,
  },
  { name: 'Sam Ortega', badge: '1046', skillLevel: 1, flatRateCents: 1900, hourlyRateCents: 1400, pace: 0.8 },
];

const BAYS = [
  { name: 'Bay 1', kind: 'two-post' },
  { name: 'Bay 2', kind: 'two-post' },
  { name: 'Bay 3', kind: 'two-post' },
  { name: 'Bay 4', kind: 'two-post' },
  { name: 'Bay 5', kind: 'four-post' },
  { name: 'Bay 6', kind: 'two-post' },
  { name: 'Bay 7', kind: 'alignment' },
  { name: 'Bay 8', kind: 'flat' },
] as const;

const CUSTOMERS = [
  'Harriet Quenby',
  'Abel Moncrief',
  'Lena Dovecote',
  'Ravi Tallis',
  'Greta Sorrell',
  'Owen Fairlie',
  'Mina Calloway',
  'Jules Pemberton',
  'Tomas Arkwright',
  'Ida Wrenfield',
];

/** Invented makes and models; VIN prefixes are 8 characters, the model-year code is added per car. */
const MODELS = [
  { make: 'Corvane', model: 'Altrix', vinPrefix: '7CV4AL2E' },
  { make: 'Corvane', model: 'Denvo', vinPrefix: '7CV2DN5F' },
  { make: 'Halvard', model: 'Tessel', vinPrefix: '7HV3TS1K' },
  { make: 'Halvard', model: 'Morrow', vinPrefix: '7HV5MR7B' },
  { make: 'Quillan', model: 'Pavo', vinPrefix: '7KL1PV3C' },
  { make: 'Ambrey', model: 'Lunda', vinPrefix: '7AB6LD9H' },
];
const YEAR_CODES: Record<number, string> = {
  2016: 'G',
  2017: 'H',
  2018: 'J',
  2019: 'K',
  2020: 'L',
  2021: 'M',
  2022: 'N',
  2023: 'P',
};

const HOLD_PRESETS = [
  { name: 'Sealant cure', durationSeconds: 30 * 60 },
  { name: 'Vacuum hold', durationSeconds: 15 * 60 },
  { name: 'Thread locker set', durationSeconds: 10 * 60 },
  { name: 'Penetrating oil soak', durationSeconds: 20 * 60 },
];

/** The shop's own operations menu: title, default book hours, skill level needed (invented figures). */
const MENU: [string, number, number][] = [
  ['Oil and filter change', 0.5, 1],
  ['Tire rotation and balance', 0.7, 1],
  ['Front brake pads and rotors', 1.8, 2],
  ['Automatic transmission fluid and filter service', 1.5, 3],
  ['Coolant flush and fill', 1.1, 2],
  ['Four-wheel alignment', 1.0, 3],
  ['Replace serpentine belt', 0.9, 2],
  ['Battery and charging system test', 0.5, 1],
  ['Diagnose engine warning light', 1.0, 4],
  ['Replace front struts', 2.6, 3],
  ['Replace water pump', 3.2, 4],
  ['Air conditioning performance check', 0.8, 3],
];

const OPERATIONS = [
  'Oil and filter change',
  'Front brake pads and rotors',
  'Automatic transmission fluid and filter service',
  'Coolant flush and fill',
  'Four-wheel alignment',
  'Replace serpentine belt',
  'Battery and charging system test',
  'Diagnose engine warning light',
  'Replace front struts',
  'Replace spark plugs',
  'Replace water pump',
  'Tire rotation and balance',
  'Replace rear wheel bearing',
  'Air conditioning performance check',
  'Replace thermostat and housing',
  'Replace outer tie rod ends',
];

/** What the customer told the advisor for each operation of the demo (invented wording). */
export const DEMO_CONCERNS: Record<string, string> = {
  'Oil and filter change': 'Due for an oil change by the reminder sticker',
  'Front brake pads and rotors': 'Squeal and a pulsing pedal when braking',
  'Automatic transmission fluid and filter service': 'Service due at this mileage by the owner’s manual',
  'Coolant flush and fill': 'Coolant in the overflow tank looks brown',
  'Four-wheel alignment': 'Pulls to the right on a straight road',
  'Replace serpentine belt': 'Squeal from the engine on cold starts',
  'Battery and charging system test': 'Slow to crank on cold mornings',
  'Diagnose engine warning light': 'Engine warning light came on at highway speed',
  'Replace front struts': 'Bouncy ride and a clunk over bumps',
  'Replace spark plugs': 'Rough idle and a stumble when pulling away',
  'Replace water pump': 'Coolant drips under the front of the engine',
  'Tire rotation and balance': 'Steering wheel shakes at highway speed',
  'Replace rear wheel bearing': 'Hum from the rear that rises with speed',
  'Air conditioning performance check': 'Air from the vents is not cold',
  'Replace thermostat and housing': 'Temperature gauge reads high in traffic',
  'Replace outer tie rod ends': 'Loose steering and uneven wear on the front tires',
  'Reseal oil pan': 'Oil spots on the driveway overnight',
};

/** What the customer said about a line of the demo: its own words, or the title of the work. */
const concernOf = (title: string) => DEMO_CONCERNS[title] ?? title;

/** A small seeded generator, so every demo database is the same. */
function seededRandom(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const MINUTE = 60_000;
const round1 = (hours: number) => Math.max(0.2, Math.round(hours * 10) / 10);

interface LinePlan {
  title: string;
  bookHours: number;
  status?: 'queued' | 'working' | 'held' | 'done';
  technicianId?: number | null;
  bayId?: number | null;
  priority?: Priority;
  holdReason?: HoldReason;
  heldAt?: Date;
  completedAt?: Date;
  queuedAt?: Date;
}

@Injectable()
export class DemoShopSeeder {
  private readonly random = seededRandom(4417);
  private rosWritten = 0;
  private vehicleSerial = 100_000;

  constructor(@Inject(DB) private readonly db: Db) {}

  isEmpty(): boolean {
    return countRows(this.db, users) === 0 && countRows(this.db, bays) === 0;
  }

  async seed(now = new Date()): Promise<void> {
    const passwordHash = await hashSecret(DEMO_PASSWORD);
    const pinHash = await hashSecret(DEMO_PIN);
    this.db.transaction(() => {
      this.db
        .insert(shopSettings)
        .values({ ...SHOP, id: 1, updatedAt: now })
        .run();
      const createdAt = new Date(now.getTime() - 30 * 24 * 3600_000);
      const office = OFFICE.map(
        (person) =>
          this.db
            .insert(users)
            .values({ ...person, passwordHash, createdAt })
            .returning()
            .get().id,
      );
      const techIds = TECHNICIANS.map(({ pace: _pace, flatRateCents, hourlyRateCents, ...tech }) => {
        const id = this.db
          .insert(users)
          .values({ ...tech, role: 'technician', pinHash, createdAt })
          .returning()
          .get().id;
        this.db
          .insert(payRates)
          .values({
            userId: id,
            effectiveFrom: FIRST_RULES_FROM,
            payType: 'flat-rate',
            flatRateCents,
            hourlyRateCents,
            guaranteeCents: 0,
            overtimeExempt: false,
            recordedAt: createdAt,
          })
          .run();
        return id;
      });
      const bayIds = BAYS.map(
        (bay, position) =>
          this.db
            .insert(bays)
            .values({ ...bay, position, phaseSince: now })
            .returning()
            .get().id,
      );
      for (const preset of HOLD_PRESETS) this.db.insert(holdPresets).values(preset).run();
      for (const [title, defaultBookHours, skillLevel] of MENU)
        this.db.insert(operations).values({ title, defaultBookHours, skillLevel }).run();
      const advisorId = office[2]!;
      this.seedPastWeek(now, techIds, bayIds, advisorId);
      this.seedToday(now, techIds, bayIds, advisorId);
      this.numberInOrderWritten();
    });
  }

  /**
   * A shop numbers its repair orders as it writes them. The days above are written technician by
   * technician, so the numbers are given afterwards, in the order of the time each RO was written.
   */
  private numberInOrderWritten(): void {
    this.db.run(sql`
      update ${repairOrders} set number = cast(${FIRST_RO_NUMBER} + written.place as integer)
      from (select id, row_number() over (order by created_at, id) as place from ${repairOrders}) as written
      where written.id = ${repairOrders}.id`);
  }

  /** The ten working days before today, so last week is complete in the reports: full shifts, a meal break, four jobs each, all done. */
  private seedPastWeek(now: Date, techIds: number[], bayIds: number[], advisorId: number): void {
    const days = this.pastWorkdays(now, 10);
    for (const day of days) {
      techIds.forEach((technicianId, t) => {
        const pace = TECHNICIANS[t]!.pace;
        const at = (time: string, offsetMinutes = 0) =>
          new Date(shopLocalInstant(day, time, SHOP.timeZone).getTime() + offsetMinutes * MINUTE);
        const stagger = t * 3;
        const punch = (
          kind: (typeof punches.$inferInsert)['kind'],
          when: Date,
          extra: Partial<typeof punches.$inferInsert> = {},
        ) => this.punch(technicianId, kind, when, extra);
        punch('shift-in', at('07:25', stagger));
        const blocks: [string, string][] = [
          ['07:35', '10:05'],
          ['10:10', '12:00'],
          ['12:35', '14:40'],
          ['14:45', '16:20'],
        ];
        for (const [i, [from, to]] of blocks.entries()) {
          const start = at(from, stagger + Math.floor(this.random() * 10));
          const end = at(to, stagger - Math.floor(this.random() * 10));
          const clockedHours = (end.getTime() - start.getTime()) / 3600_000;
          const ro = this.repairOrder(advisorId, start, true, [
            {
              title: this.pick(OPERATIONS),
              bookHours: round1(clockedHours * pace * (0.85 + this.random() * 0.3)),
              status: 'done',
              technicianId,
              bayId: bayIds[(t + i) % bayIds.length]!,
              completedAt: end,
              queuedAt: new Date(start.getTime() - 40 * MINUTE),
            },
          ]);
          punch('job-on', start, { jobLineId: ro.lineIds[0]! });
          punch('job-off', end, { jobLineId: ro.lineIds[0]! });
          if (i === 1) {
            punch('break-start', at('12:02', stagger), { breakKind: 'meal' });
            punch('break-end', at('12:32', stagger));
          }
        }
        punch('shift-out', at('16:30', stagger));
      });
    }
  }

  /** The floor right now: every bay state on show, people working, on break and idle, a queue. */
  private seedToday(now: Date, techIds: number[], bayIds: number[], advisorId: number): void {
    const ago = (minutes: number) => new Date(now.getTime() - minutes * MINUTE);
    const [dana, luis, priya, marcus, jo, sam] = techIds as [number, number, number, number, number, number];
    const bay = (n: number) => bayIds[n - 1]!;
    techIds.forEach((id, i) => this.punch(id, 'shift-in', ago(170 - i * 4)));

    const working = (
      technicianId: number,
      bayNo: number,
      title: string,
      bookHours: number,
      onFor: number,
    ) => {
      const ro = this.repairOrder(advisorId, ago(200), false, [
        { title, bookHours, status: 'working', technicianId, bayId: bay(bayNo), queuedAt: ago(190) },
      ]);
      this.punch(technicianId, 'job-on', ago(onFor), { jobLineId: ro.lineIds[0]! });
      this.setBay(bay(bayNo), 'staged', ro.id, ago(onFor));
    };
    working(dana, 1, 'Automatic transmission fluid and filter service', 1.5, 50);
    working(luis, 2, 'Replace thermostat and housing', 1.2, 95);

    const held = this.repairOrder(advisorId, ago(230), false, [
      {
        title: 'Replace rear wheel bearing',
        bookHours: 1.8,
        status: 'held',
        technicianId: priya,
        bayId: bay(3),
        holdReason: 'parts',
        heldAt: ago(55),
        queuedAt: ago(220),
      },
    ]);
    this.punch(priya, 'job-on', ago(150), { jobLineId: held.lineIds[0]! });
    this.punch(priya, 'job-off', ago(55), { jobLineId: held.lineIds[0]! });
    this.db
      .insert(partsHolds)
      .values({
        jobLineId: held.lineIds[0]!,
        part: 'Rear hub bearing assembly',
        state: 'back-ordered',
        supplier: 'Tallow Ridge Parts Supply',
        expectedAt: new Date(now.getTime() + 150 * MINUTE),
        createdAt: ago(55),
        updatedAt: ago(40),
      })
      .run();
    this.punch(priya, 'break-start', ago(20), { breakKind: 'meal' });
    this.setBay(bay(3), 'staged', held.id, ago(150));

    const cured = this.repairOrder(advisorId, ago(240), false, [
      {
        title: 'Reseal oil pan',
        bookHours: 2.1,
        status: 'working',
        technicianId: marcus,
        bayId: bay(4),
        queuedAt: ago(235),
      },
    ]);
    this.punch(marcus, 'job-on', ago(140), { jobLineId: cured.lineIds[0]! });
    this.punch(marcus, 'job-off', ago(9), { jobLineId: cured.lineIds[0]! });
    this.db
      .insert(timers)
      .values({
        bayId: bay(4),
        jobLineId: cured.lineIds[0]!,
        kind: 'set-time',
        durationSeconds: 30 * 60,
        label: 'Sealant cure',
        startedAt: ago(8),
        startedBy: marcus,
      })
      .run();
    this.setBay(bay(4), 'staged', cured.id, ago(140));

    const checked = this.repairOrder(advisorId, ago(260), false, [
      {
        title: 'Four-wheel alignment',
        bookHours: 1.0,
        status: 'done',
        technicianId: jo,
        bayId: bay(5),
        completedAt: ago(12),
        queuedAt: ago(250),
      },
    ]);
    this.punch(jo, 'job-on', ago(80), { jobLineId: checked.lineIds[0]! });
    this.punch(jo, 'job-off', ago(12), { jobLineId: checked.lineIds[0]! });
    this.setBay(bay(5), 'check', checked.id, ago(12));

    const ready = this.repairOrder(advisorId, ago(300), false, [
      {
        title: 'Oil and filter change',
        bookHours: 0.5,
        status: 'done',
        technicianId: sam,
        bayId: bay(6),
        completedAt: ago(70),
        queuedAt: ago(290),
      },
      {
        title: 'Tire rotation and balance',
        bookHours: 0.7,
        status: 'done',
        technicianId: sam,
        bayId: bay(6),
        completedAt: ago(35),
        queuedAt: ago(290),
      },
    ]);
    this.punch(sam, 'job-on', ago(130), { jobLineId: ready.lineIds[0]! });
    this.punch(sam, 'job-off', ago(70), { jobLineId: ready.lineIds[0]! });
    this.punch(sam, 'job-on', ago(70), { jobLineId: ready.lineIds[1]! });
    this.punch(sam, 'job-off', ago(35), { jobLineId: ready.lineIds[1]! });
    this.setBay(bay(6), 'ready', ready.id, ago(35));

    const staged = this.repairOrder(advisorId, ago(60), false, [
      {
        title: 'Replace front struts',
        bookHours: 2.6,
        status: 'queued',
        technicianId: sam,
        bayId: bay(7),
        priority: 'high',
        queuedAt: ago(45),
      },
      {
        title: 'Four-wheel alignment',
        bookHours: 1.0,
        status: 'queued',
        technicianId: jo,
        bayId: bay(7),
        queuedAt: ago(45),
      },
    ]);
    this.setBay(bay(7), 'staged', staged.id, ago(40));

    this.repairOrder(advisorId, ago(50), false, [
      { title: 'Diagnose engine warning light', bookHours: 1.0, priority: 'high', queuedAt: ago(48) },
      { title: 'Battery and charging system test', bookHours: 0.5, queuedAt: ago(48) },
    ]);
    this.repairOrder(advisorId, ago(25), false, [
      { title: 'Coolant flush and fill', bookHours: 1.1, queuedAt: ago(24) },
    ]);
  }

  private repairOrder(
    advisorId: number,
    createdAt: Date,
    /** Picked up already; otherwise the RO's status follows its lines. */
    closed: boolean,
    lines: LinePlan[],
  ): { id: number; lineIds: number[] } {
    const model = this.pick(MODELS);
    const year = 2016 + Math.floor(this.random() * 8);
    const name = this.pick(CUSTOMERS);
    const customer = this.db
      .insert(customers)
      .values({
        name,
        phone: `+1608555${String(101 + Math.floor(this.random() * 99)).padStart(4, '0')}`,
        // example.test never delivers anywhere: demo mail lands in the local test mailbox.
        email: `${name.toLowerCase().replace(/\s+/g, '.')}@example.test`,
        createdAt,
      })
      .returning()
      .get();
    const odometer = 20_000 + Math.floor(this.random() * 140_000);
    const vin = makeVin(`${model.vinPrefix}${YEAR_CODES[year]}M${++this.vehicleSerial}`);
    const vehicle = this.db
      .insert(vehicles)
      .values({
        customerId: customer.id,
        vin,
        year,
        make: model.make,
        model: model.model,
        plate: null,
        lastOdometer: odometer,
      })
      .returning()
      .get();
    const ro = this.db
      .insert(repairOrders)
      .values({
        // Numbered once all are written (numberInOrderWritten).
        number: `unnumbered ${++this.rosWritten}`,
        customerId: customer.id,
        vehicleId: vehicle.id,
        ...repairOrderSnapshot(customer, vehicle),
        advisorId,
        concern: lines.map((line) => concernOf(line.title)).join('; '),
        odometer,
        status: closed
          ? 'closed'
          : repairOrderStatus(
              lines.map((line) => ({ status: line.status ?? 'queued' })),
              null,
            ),
        promisedAt: this.promiseFor(createdAt),
        createdAt,
        closedAt: closed ? lines.at(-1)?.completedAt : null,
      })
      .returning()
      .get();
    const lineIds = lines.map(
      (line, i) =>
        this.db
          .insert(jobLines)
          .values({
            ...line,
            concern: concernOf(line.title),
            ...(line.status === 'done' && {
              completedBy: line.technicianId ?? null,
              correction: `${line.title} done to the maker's procedure`,
            }),
            repairOrderId: ro.id,
            lineNo: i + 1,
            queuedAt: line.queuedAt ?? createdAt,
            promisedAt: ro.promisedAt,
            updatedAt: createdAt,
          })
          .returning()
          .get().id,
    );
    return { id: ro.id, lineIds };
  }

  private punch(
    technicianId: number,
    kind: (typeof punches.$inferInsert)['kind'],
    at: Date,
    extra: Partial<typeof punches.$inferInsert> = {},
  ): void {
    this.db
      .insert(punches)
      .values({
        id: randomUUID(),
        technicianId,
        kind,
        at,
        recordedAt: at,
        recordedBy: technicianId,
        ...extra,
      })
      .run();
  }

  private setBay(id: number, phase: (typeof BAY_PHASES)[number], repairOrderId: number, since: Date): void {
    this.db.update(bays).set({ phase, repairOrderId, phaseSince: since }).where(eq(bays.id, id)).run();
  }

  /** Customers are promised the car at closing time, today if there are two hours left, else tomorrow. */
  private promiseFor(createdAt: Date): Date {
    const earliest = new Date(createdAt.getTime() + 2 * 3600_000);
    const close = shopLocalInstant(shopDayKey(earliest, SHOP.timeZone), '17:30', SHOP.timeZone);
    return close >= earliest
      ? close
      : shopLocalInstant(
          shopDayKey(new Date(close.getTime() + 24 * 3600_000), SHOP.timeZone),
          '17:30',
          SHOP.timeZone,
        );
  }

  private pastWorkdays(now: Date, count: number): string[] {
    const today = shopDayKey(now, SHOP.timeZone);
    const noon = shopLocalInstant(today, '12:00', SHOP.timeZone).getTime();
    const days: string[] = [];
    for (let back = 1; days.length < count; back++) {
      const day = shopDayKey(new Date(noon - back * 24 * 3600_000), SHOP.timeZone);
      const weekday = new Date(`${day}T12:00:00Z`).getUTCDay();
      if (weekday !== 0 && weekday !== 6) days.unshift(day);
    }
    return days;
  }

  private pick<T>(list: readonly T[]): T {
    return list[Math.floor(this.random() * list.length)]!;
  }
}
