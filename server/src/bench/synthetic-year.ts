import type { Database } from 'better-sqlite3';
import { randomUUID } from 'node:crypto';
import { makeVin, shopDayKey, shopLocalInstant, type BreakKind, type PunchKind } from '@baytime/shared';
import { hashSecret } from '../auth/passwords.js';
import { openDatabase } from '../db/database.js';
import { DEFAULT_SHOP, FIRST_RULES_FROM } from '../shop/shop.service.js';

/*
 * A busy shop's history for the bench, written straight into SQLite with prepared statements in one
 * transaction. Every name, vehicle, plate and number is invented; the figures only need to look like a
 * working shop (shifts with breaks, three to five job lines a day per technician, returning vehicles),
 * not to match any source.
 */

const SHOP = { ...DEFAULT_SHOP, name: 'Ridgeway Hollow Motor Works' };
const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;

const FIRST_NAMES = (
  'Avery Bram Cleo Dario Edie Fenn Greer Hollis Ines Jory Kit Lark Milo Nadia Orrin Pia Quinn Rhett ' +
  'Sable Tamsin Ulla Vance Wynn Xavi Yara Zeke Arlo Bette Cass Dov'
).split(' ');
const LAST_NAMES = (
  'Ashgrove Brackley Corriveau Dunmore Elstow Farrant Gillow Hathersage Inchbold Jellicoe Kettleby ' +
  'Lowther Marchbank Nettleford Oakhurst Pendry Quarrell Rushworth Stainforth Thackeray Upwood Varley ' +
  'Wetherall Yelland'
).split(' ');
/** Invented makes and models with 8-character VIN prefixes, as in the demo shop. */
const MODELS = [
  { make: 'Corvane', model: 'Altrix', vinPrefix: '7CV4AL2E' },
  { make: 'Corvane', model: 'Denvo', vinPrefix: '7CV2DN5F' },
  { make: 'Halvard', model: 'Tessel', vinPrefix: '7HV3TS1K' },
  { make: 'Halvard', model: 'Morrow', vinPrefix: '7HV5MR7B' },
  { make: 'Quillan', model: 'Pavo', vinPrefix: '7KL1PV3C' },
  { make: 'Ambrey', model: 'Lunda', vinPrefix: '7AB6LD9H' },
  { make: 'Ambrey', model: 'Sorel', vinPrefix: '7AB3SR4D' },
];
/** Model-year codes (VIN position 10) for 2014–2025. */
const YEAR_CODES = 'EFGHJKLMNPRS';
const JOBS = [
  'Oil and filter change',
  'Tire rotation and balance',
  'Front brake pads and rotors',
  'Rear brake shoes and drums',
  'Automatic transmission fluid and filter service',
  'Coolant flush and fill',
  'Four-wheel alignment',
  'Replace serpentine belt',
  'Battery and charging system test',
  'Diagnose engine warning light',
  'Replace front struts',
  'Replace water pump',
  'Air conditioning performance check',
  'Replace spark plugs',
  'Replace rear wheel bearing',
  'Replace thermostat and housing',
  'Replace outer tie rod ends',
  'Reseal oil pan',
];
const CONCERNS = [
  'Scheduled service',
  'Noise from the front when braking',
  'Warning light on the dash',
  'Pulls to the right',
  'Air conditioning blows warm',
  'Vibration at highway speed',
  'Hard to start in the morning',
];
const BAY_KINDS = ['two-post', 'two-post', 'two-post', 'four-post', 'two-post', 'alignment', 'flat'];

export type FloorState = 'on-job' | 'on-break' | 'idle';

/** A technician on shift when the bench starts, with the line they punch on during the load. */
export interface ShiftNow {
  technicianId: number;
  jobLineId: number;
  state: FloorState;
}

export interface SeededShop {
  ownerId: number;
  technicianIds: number[];
  screenIds: number[];
  onShift: ShiftNow[];
  /** A customer surname to search the repair orders for. */
  searchTerm: string;
  /** From the first punch to now. */
  historyYears: number;
  counts: Record<'repairOrders' | 'jobLines' | 'punches' | 'customers', number>;
}

/**
 * `years` of weekdays for `technicians` technicians before today, then the floor right now: most of
 * them on shift (on a job, on a break or between jobs), cars waiting for a check or ready, held lines,
 * a queue, a timer, and 20 paired wall screens.
 */
export async function seedBusyShop(
  file: string,
  { technicians = 40, years = 3 }: { technicians?: number; years?: number } = {},
  now = new Date(),
): Promise<SeededShop> {
  const secrets = { pinHash: await hashSecret('4321'), passwordHash: await hashSecret('bench-password') };
  const { connection } = openDatabase(file);
  // A throwaway database written once: no rollback journal, no reference checks (the rows are written
  // consistent), the whole file in the page cache; the server opens it in WAL mode as always.
  connection.pragma('journal_mode = OFF');
  connection.pragma('foreign_keys = OFF');
  connection.pragma('cache_size = -512000');
  // Indexes are built once at the end from sorted rows, not kept up to date row by row.
  const indexes = connection
    .prepare(`select name, sql from sqlite_master where type = 'index' and sql is not null`)
    .all() as { name: string; sql: string }[];
  try {
    return connection.transaction(() => {
      for (const { name } of indexes) connection.exec(`drop index "${name}"`);
      const writer = new ShopWriter(connection, secrets, now, technicians);
      const start = now.getTime() - years * 365.25 * DAY;
      for (const day of weekdaysBefore(now, start)) writer.historyDay(day);
      const shop = writer.floorNow();
      for (const { sql } of indexes) connection.exec(sql);
      const { first } = connection.prepare('select min(at) as first from punches').get() as { first: number };
      return { ...shop, historyYears: (now.getTime() - first) / (365.25 * DAY) };
    })();
  } finally {
    connection.pragma('journal_mode = WAL');
    connection.close();
  }
}

/** Local days ('YYYY-MM-DD') from `from` to yesterday, Monday to Friday. */
function* weekdaysBefore(now: Date, from: number): Generator<string> {
  const today = shopDayKey(now, SHOP.timeZone);
  const firstNoon = shopLocalInstant(shopDayKey(new Date(from), SHOP.timeZone), '12:00', SHOP.timeZone);
  for (let noon = firstNoon.getTime(); ; noon += DAY) {
    const day = shopDayKey(new Date(noon), SHOP.timeZone);
    if (day >= today) return;
    const weekday = new Date(`${day}T12:00:00Z`).getUTCDay();
    if (weekday !== 0 && weekday !== 6) yield day;
  }
}

/** A small seeded generator: every run seeds the same shop, relative to its own `now`. */
function seededRandom(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface Segment {
  on: number;
  off: number;
}
interface Line {
  technicianId: number | null;
  bayId: number | null;
  title: string;
  status: 'queued' | 'working' | 'held' | 'done';
  /** When the technician was clocked on it. */
  segments: Segment[];
  id?: number;
  holdReason?: 'parts' | 'approval';
  heldAt?: number;
}
interface Punch {
  technicianId: number;
  kind: PunchKind;
  at: number;
  line?: Line;
  breakKind?: BreakKind;
}
interface Vehicle {
  id: number;
  customerId: number;
  odometer: number;
  /** The customer and vehicle as a repair order copies them. */
  details: Record<string, Value>;
}
type Value = string | number | null;

class ShopWriter {
  private readonly random = seededRandom(2718);
  private readonly statements = new Map<string, ReturnType<Database['prepare']>>();
  private readonly columns = new Map<string, Set<string>>();
  private readonly counts = { repairOrders: 0, jobLines: 0, punches: 0, customers: 0 };
  private readonly fleet: Vehicle[] = [];
  private readonly ownerId: number;
  private readonly advisorIds: number[];
  private readonly technicianIds: number[];
  /** Book hours flagged per hour clocked, by technician, so efficiency spreads as in a real shop. */
  private readonly pace = new Map<number, number>();
  /** One bay per technician. */
  private readonly bayIds: number[];
  private readonly screenIds: number[];
  private roNumber = 10_000;
  private vehicleSerial = 100_000;

  constructor(
    private readonly connection: Database,
    private readonly secrets: { pinHash: string; passwordHash: string },
    private readonly now: Date,
    technicians: number,
  ) {
    const at = now.getTime();
    this.row('shop_settings', {
      id: 1,
      name: SHOP.name,
      time_zone: SHOP.timeZone,
      workweek_start_day: SHOP.workweekStartDay,
      workweek_start_hour: SHOP.workweekStartHour,
      units: SHOP.units,
      max_concurrent_jobs: SHOP.maxConcurrentJobs,
      concurrent_split: SHOP.concurrentSplit,
      opening_hours: JSON.stringify(SHOP.openingHours),
      kiosk_idle_seconds: SHOP.kioskIdleSeconds,
      updated_at: at,
    });
    this.row('pay_rules', {
      effective_from: FIRST_RULES_FROM,
      overtime_rules: SHOP.overtimeRules,
      minimum_wage_cents: SHOP.minimumWageCents,
      local_minimum_wage_cents: SHOP.localMinimumWageCents,
      pay_non_productive_separately: SHOP.payNonProductiveSeparately ? 1 : 0,
      recorded_at: at,
    });
    this.ownerId = this.office('Marguerite Oakhurst', 'owner', 'owner@ridgeway-hollow.test');
    this.office('Tobin Farrant', 'foreman', 'foreman@ridgeway-hollow.test');
    this.advisorIds = ['Elsa Pendry', 'Ruben Gillow', 'Noor Varley'].map((name, i) =>
      this.office(name, 'advisor', `advisor${i + 1}@ridgeway-hollow.test`),
    );
    this.technicianIds = Array.from({ length: technicians }, (_, t) => {
      const skill = 1 + (t % 4);
      const id = this.row('users', {
        name: `${FIRST_NAMES[t % FIRST_NAMES.length]} ${LAST_NAMES[(t * 7) % LAST_NAMES.length]}`,
        role: 'technician',
        badge: String(2001 + t),
        pin_hash: secrets.pinHash,
        skill_level: skill,
        created_at: at - 4 * 365 * DAY,
      });
      this.row('pay_rates', {
        user_id: id,
        effective_from: FIRST_RULES_FROM,
        pay_type: 'flat-rate',
        flat_rate_cents: 1800 + skill * 400,
        hourly_rate_cents: 1400 + skill * 150,
        guarantee_cents: 0,
        overtime_exempt: 0,
        recorded_at: at,
      });
      this.pace.set(id, 0.8 + skill * 0.1 + this.between(-0.05, 0.05));
      return id;
    });
    this.bayIds = this.technicianIds.map((_, b) =>
      this.row('bays', {
        name: `Bay ${b + 1}`,
        kind: BAY_KINDS[b % BAY_KINDS.length]!,
        position: b,
        phase_since: at,
      }),
    );
    this.screenIds = Array.from({ length: 20 }, (_, s) =>
      this.row('screens', {
        name: `Wall ${s + 1}`,
        paired_at: at - DAY,
        last_seen_at: at - DAY,
        created_at: at - DAY,
      }),
    );
  }

  /** One weekday: each technician present clocks a shift with breaks and jobs back to back. */
  historyDay(day: string): void {
    const seven = shopLocalInstant(day, '07:00', SHOP.timeZone).getTime();
    const at = (minutes: number) => seven + Math.round(minutes) * MINUTE;
    const punches: Punch[] = [];
    this.technicianIds.forEach((technicianId, t) => {
      if (this.random() < 0.07) return; // leave, training, sick
      const shiftIn = at(this.between(-20, 5));
      const shiftOut = at(this.between(570, 600));
      const meal = { from: at(this.between(290, 320)), kind: 'meal' as const, minutes: 30 };
      const rest = { from: at(this.between(140, 160)), kind: 'rest' as const, minutes: 15 };
      const breaks = this.random() < 0.5 ? [rest, meal] : [meal];
      punches.push(
        { technicianId, kind: 'shift-in', at: shiftIn },
        { technicianId, kind: 'shift-out', at: shiftOut },
      );
      // Time free for jobs: the shift less the breaks, with a minute's margin around each.
      const free: Segment[] = [];
      let cursor = shiftIn + this.between(3, 12) * MINUTE;
      for (const { from, kind, minutes } of breaks) {
        const to = from + minutes * MINUTE;
        punches.push(
          { technicianId, kind: 'break-start', at: from, breakKind: kind },
          { technicianId, kind: 'break-end', at: to },
        );
        free.push({ on: cursor, off: from - MINUTE });
        cursor = to + MINUTE;
      }
      free.push({ on: cursor, off: shiftOut - 5 * MINUTE });
      const lines = this.jobsAcross(free, technicianId, this.bayIds[t]!, punches);
      // A technician's consecutive jobs go on one repair order, one to four lines each.
      for (let i = 0; i < lines.length;) {
        const group = lines.slice(i, i + 1 + Math.floor(this.random() * 4));
        i += group.length;
        const first = group[0]!.segments[0]!.on;
        const last = group.at(-1)!.segments.at(-1)!.off;
        this.repairOrder(group, {
          status: 'closed',
          createdAt: first - this.between(15, 75) * MINUTE,
          promisedAt: at(630),
          closedAt: last + this.between(30, 150) * MINUTE,
        });
      }
    });
    this.punches(punches);
  }

  /** Jobs one after another across the free time; a job that meets a break resumes after it. */
  private jobsAcross(free: Segment[], technicianId: number, bayId: number, punches: Punch[]): Line[] {
    const lines: Line[] = [];
    let line: Line | null = null;
    let left = 0;
    for (const segment of free) {
      let on = segment.on;
      while (on < segment.off - 5 * MINUTE) {
        if (!line) {
          line = { technicianId, bayId, title: this.pick(JOBS), status: 'done', segments: [] };
          left = this.between(45, 240) * MINUTE;
          lines.push(line);
        }
        const off = Math.min(on + left, segment.off);
        line.segments.push({ on, off });
        punches.push(
          { technicianId, kind: 'job-on', at: on, line },
          { technicianId, kind: 'job-off', at: off, line },
        );
        left -= off - on;
        if (left > MINUTE) on = off;
        else {
          line = null;
          on = off + this.between(3, 15) * MINUTE;
        }
      }
    }
    return lines;
  }

  /**
   * The floor right now: 20 technicians on a job, 4 on a break, 8 between jobs, the rest off; cars
   * waiting for a check or ready in their bays, held lines, a queue and a hold timer running.
   */
  floorNow(): Omit<SeededShop, 'historyYears'> {
    const ago = (minutes: number) => this.now.getTime() - Math.round(minutes) * MINUTE;
    const promisedAt = this.now.getTime() + this.between(60, 240) * MINUTE;
    const states: FloorState[] = ['on-job', 'on-break', 'idle'].flatMap((state, i) =>
      Array<FloorState>([20, 4, 8][i]!).fill(state as FloorState),
    );
    const punches: Punch[] = [];
    const onShift = states.map((state, t): ShiftNow => {
      const technicianId = this.technicianIds[t]!;
      const bayId = this.bayIds[t]!;
      const shiftIn = ago(this.between(160, 230));
      punches.push({ technicianId, kind: 'shift-in', at: shiftIn });
      // This morning's job, on a repair order that is done and waits for its customer.
      const earlier: Line = { technicianId, bayId, title: this.pick(JOBS), status: 'done', segments: [] };
      earlier.segments.push({ on: shiftIn + 5 * MINUTE, off: ago(this.between(110, 140)) });
      this.repairOrder([earlier], { status: 'done', createdAt: shiftIn - 30 * MINUTE, promisedAt });
      punches.push(
        { technicianId, kind: 'job-on', at: earlier.segments[0]!.on, line: earlier },
        { technicianId, kind: 'job-off', at: earlier.segments[0]!.off, line: earlier },
      );
      // The line they are on now (or start next), with a second line of the same repair order queued.
      const current: Line = {
        technicianId,
        bayId,
        title: this.pick(JOBS),
        status: state === 'idle' ? 'queued' : 'working',
        segments:
          state === 'idle' ? [] : [{ on: ago(this.between(60, 100)), off: ago(this.between(20, 30)) }],
      };
      const next: Line = { technicianId, bayId, title: this.pick(JOBS), status: 'queued', segments: [] };
      this.repairOrder([current, next], {
        status: 'open',
        createdAt: ago(this.between(120, 200)),
        promisedAt,
      });
      const segment = current.segments[0];
      if (segment) punches.push({ technicianId, kind: 'job-on', at: segment.on, line: current });
      if (segment && state === 'on-break')
        punches.push(
          { technicianId, kind: 'job-off', at: segment.off, line: current },
          { technicianId, kind: 'break-start', at: ago(8), breakKind: 'rest' },
        );
      return { technicianId, jobLineId: current.id!, state };
    });
    this.punches(punches);

    // The bays of the technicians off today: two cars waiting for a check, two ready, four held lines.
    this.technicianIds.slice(states.length).forEach((technicianId, i) => {
      const bayId = this.bayIds[states.length + i]!;
      const line: Line = { technicianId, bayId, title: this.pick(JOBS), status: 'done', segments: [] };
      if (i < 4) {
        const roId = this.repairOrder([line], { status: 'done', createdAt: ago(300), promisedAt });
        this.connection
          .prepare('update bays set phase = ?, phase_since = ?, repair_order_id = ? where id = ?')
          .run(i < 2 ? 'check' : 'ready', ago(20), roId, bayId);
      } else
        this.repairOrder(
          [{ ...line, status: 'held', holdReason: i % 2 ? 'parts' : 'approval', heldAt: ago(90) }],
          {
            status: 'open',
            createdAt: ago(400),
            promisedAt,
          },
        );
    });
    // The queue: lines written up this morning that nobody has taken yet.
    for (let r = 0; r < 7; r++) {
      const queued = (): Line => ({
        technicianId: null,
        bayId: null,
        title: this.pick(JOBS),
        status: 'queued',
        segments: [],
      });
      this.repairOrder([queued(), queued()], {
        status: 'open',
        createdAt: ago(this.between(10, 150)),
        promisedAt,
      });
    }
    this.row('timers', {
      bay_id: this.bayIds[0]!,
      job_line_id: onShift[0]!.jobLineId,
      kind: 'set-time',
      duration_seconds: 30 * 60,
      label: 'Sealant cure',
      started_at: ago(8),
      started_by: this.technicianIds[0]!,
    });
    const lastOdometer = this.connection.prepare('update vehicles set last_odometer = ? where id = ?');
    for (const vehicle of this.fleet) lastOdometer.run(vehicle.odometer, vehicle.id);
    return {
      ownerId: this.ownerId,
      technicianIds: this.technicianIds,
      screenIds: this.screenIds,
      onShift,
      searchTerm: LAST_NAMES[3]!,
      counts: this.counts,
    };
  }

  /** Writes the repair order and its lines (setting each line's id); answers the order's id. */
  private repairOrder(
    lines: Line[],
    ro: { status: 'open' | 'done' | 'closed'; createdAt: number; promisedAt: number; closedAt?: number },
  ): number {
    const vehicle = this.visitingVehicle(ro.createdAt);
    vehicle.odometer += Math.round(this.between(2_000, 14_000));
    const roId = this.row('repair_orders', {
      ...vehicle.details,
      number: String(++this.roNumber),
      customer_id: vehicle.customerId,
      vehicle_id: vehicle.id,
      advisor_id: this.pick(this.advisorIds),
      concern: this.pick(CONCERNS),
      odometer: vehicle.odometer,
      status: ro.status,
      promised_at: ro.promisedAt,
      created_at: ro.createdAt,
      closed_at: ro.closedAt ?? null,
    });
    this.counts.repairOrders++;
    lines.forEach((line, i) => {
      const clockedHours = line.segments.reduce((sum, s) => sum + s.off - s.on, 0) / (60 * MINUTE);
      const pace = line.technicianId ? this.pace.get(line.technicianId)! : 1;
      const completedAt = line.status === 'done' ? (line.segments.at(-1)?.off ?? ro.createdAt) : null;
      line.id = this.row('job_lines', {
        repair_order_id: roId,
        line_no: i + 1,
        title: line.title,
        book_hours: Math.max(
          0.2,
          Math.round(Math.max(clockedHours, 0.5) * pace * this.between(8, 12.5)) / 10,
        ),
        skill_level: 1 + (i % 3),
        status: line.status,
        hold_reason: line.holdReason ?? null,
        held_at: line.heldAt ?? null,
        priority: this.random() < 0.1 ? 'high' : 'normal',
        technician_id: line.technicianId,
        bay_id: line.bayId,
        promised_at: ro.promisedAt,
        queued_at: ro.createdAt,
        completed_at: completedAt,
        updated_at: completedAt ?? ro.createdAt,
      });
      this.counts.jobLines++;
    });
    return roId;
  }

  /** Most visits are returning vehicles. */
  private visitingVehicle(at: number): Vehicle {
    if (this.fleet.length > 200 && this.random() < 0.6) return this.pick(this.fleet);
    const name = `${this.pick(FIRST_NAMES)} ${this.pick(LAST_NAMES)}`;
    const customer = {
      name,
      phone: `555-01${String(Math.floor(this.random() * 100)).padStart(2, '0')}`,
      email: `${name.toLowerCase().replace(' ', '.')}.${this.counts.customers}@example.test`,
    };
    const customerId = this.row('customers', { ...customer, created_at: at });
    this.counts.customers++;
    const model = this.pick(MODELS);
    const year = Math.floor(this.random() * YEAR_CODES.length);
    const serial = ++this.vehicleSerial;
    const letter = (n: number) => String.fromCharCode(65 + (n % 26));
    const car = {
      year: 2014 + year,
      make: model.make,
      model: model.model,
      plate: `${letter(serial)}${letter(serial >> 5)}K-${serial % 10_000}`,
    };
    const vehicle: Vehicle = {
      id: this.row('vehicles', {
        ...car,
        customer_id: customerId,
        vin: makeVin(`${model.vinPrefix}${YEAR_CODES[year]}M${serial}`),
      }),
      customerId,
      odometer: Math.round(this.between(5_000, 90_000)),
      details: {
        customer_name: customer.name,
        customer_phone: customer.phone,
        customer_email: customer.email,
        vehicle_year: car.year,
        vehicle_make: car.make,
        vehicle_model: car.model,
        vehicle_plate: car.plate,
      },
    };
    this.fleet.push(vehicle);
    return vehicle;
  }

  private punches(list: Punch[]): void {
    for (const punch of list.sort((a, b) => a.at - b.at))
      this.row('punches', {
        id: randomUUID(),
        technician_id: punch.technicianId,
        kind: punch.kind,
        job_line_id: punch.line?.id ?? null,
        break_kind: punch.breakKind ?? null,
        at: punch.at,
        recorded_at: punch.at,
        recorded_by: punch.technicianId,
      });
    this.counts.punches += list.length;
  }

  private office(name: string, role: string, email: string): number {
    return this.row('users', {
      name,
      role,
      email,
      password_hash: this.secrets.passwordHash,
      created_at: this.now.getTime() - 4 * 365 * DAY,
    });
  }

  /**
   * Inserts one row through a statement prepared once per table and set of columns; answers its id.
   * A value for a column this database does not have is left out (a repair order's copy of the
   * customer and vehicle comes with the office's search).
   */
  private row(table: string, values: Record<string, Value>): number {
    let columns = this.columns.get(table);
    if (!columns) {
      const info = this.connection.pragma(`table_info(${table})`) as { name: string }[];
      columns = new Set(info.map((column) => column.name));
      this.columns.set(table, columns);
    }
    const names = Object.keys(values).filter((name) => columns.has(name));
    const key = `${table}(${names.join()})`;
    let statement = this.statements.get(key);
    if (!statement) {
      statement = this.connection.prepare(
        `insert into ${table} (${names.join(', ')}) values (${names.map((c) => `@${c}`).join(', ')})`,
      );
      this.statements.set(key, statement);
    }
    const bound: Record<string, Value> = {};
    for (const name of names) bound[name] = values[name]!;
    return Number(statement.run(bound).lastInsertRowid);
  }

  private pick<T>(list: readonly T[]): T {
    return list[Math.floor(this.random() * list.length)]!;
  }

  private between(low: number, high: number): number {
    return low + this.random() * (high - low);
  }
}
