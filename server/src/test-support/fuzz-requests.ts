import { constants, createPublicKey, publicEncrypt, type JsonWebKey } from 'node:crypto';
import fc, { type Arbitrary } from 'fast-check';
import {
  BAY_KINDS,
  BREAK_KINDS,
  FINDING_SEVERITIES,
  HOLD_REASONS,
  identityText,
  isoWeekOf,
  JOB_LINE_STATUSES,
  makeVin,
  OFFLINE_PUNCH_KINDS,
  OFFLINE_PUNCH_STATUSES,
  PAY_TYPES,
  PRIORITIES,
  PUNCH_KINDS,
  REPAIR_ORDER_STATUSES,
  ROLES,
  TIMER_KINDS,
  type OfflineIdentity,
  type OfflineKeyDto,
} from '@baytime/shared';
import type { Sqlite } from '../db/database.js';
import type { Method } from './routes.js';

/** Kinds of rows a request can name; each pool holds the ids that exist when the request is sent. */
export const POOLS = [
  'user',
  /** Users who are not the fuzz's own callers: editing those would end the callers' sessions. */
  'otherUser',
  'technician',
  'bay',
  'jobLine',
  'repairOrder',
  'timer',
  'finding',
  'operation',
  'holdPreset',
  /** Wall screens other than the fuzz's own. */
  'otherScreen',
  /** Kiosks other than the fuzz's own: revoking that one would end the kiosk caller's token. */
  'otherKiosk',
  'attachment',
  'punch',
  /** Punches held for the foreman's review. */
  'heldPunch',
  /** Punches a kiosk recorded without the server, waiting for the foreman or already decided. */
  'offlinePunch',
  /** Past workweeks ('YYYY-Www'), and those closed or reopened: never the running one. */
  'payWeek',
  'mail',
  'vin',
] as const;
export type PoolName = (typeof POOLS)[number];
export type Pools = Record<PoolName, readonly (number | string)[]>;

/** An id no row has. */
const MISSING_ID = 999_999;

/** A real row, picked when the request is sent: rows come and go as the fuzz runs. */
export class RealId {
  constructor(
    readonly pool: PoolName,
    readonly pick: number,
  ) {}

  in(pools: Pools): number | string {
    const ids = pools[this.pool];
    return ids.length ? ids[this.pick % ids.length]! : MISSING_ID;
  }
}

const LINES_BY_RO_STATUS =
  'select line.id from job_lines line join repair_orders ro on ro.id = line.repair_order_id where ro.status';

/** The fuzz's own callers: the users and devices (a wall screen and a kiosk) whose tokens it sends. */
export interface CallerIds {
  userIds: number[];
  screenIds: number[];
}

/** The ids of every pool, read from the server's database (and its mailbox) now. */
export function readPools(sqlite: Sqlite, callers: CallerIds, mailIds: string[]): Pools {
  const column = (sql: string, ...params: unknown[]) =>
    sqlite.connection
      .prepare(sql)
      .pluck()
      .all(...params) as (number | string)[];
  const users = column('select id from users order by id');
  const otherDevices = (kind: 'wall' | 'kiosk') =>
    column('select id from screens where kind = ? order by id', kind).filter(
      (id) => !callers.screenIds.includes(id as number),
    );
  return {
    user: users,
    otherUser: users.filter((id) => !callers.userIds.includes(id as number)),
    technician: column("select id from users where role = 'technician' order by id"),
    bay: column('select id from bays order by id'),
    // The demo's history is mostly lines of closed ROs, which refuse every change (409): the open ROs'
    // lines, and a few closed ones for the refusals, or a change to a line is hardly ever accepted.
    jobLine: [
      ...column(`${LINES_BY_RO_STATUS} != 'closed' order by line.id desc limit 190`),
      ...column(`${LINES_BY_RO_STATUS} = 'closed' order by line.id desc limit 10`),
    ],
    repairOrder: column('select id from repair_orders order by id desc limit 200'),
    timer: column('select id from timers order by id desc limit 50'),
    finding: column('select id from findings order by id desc limit 50'),
    operation: column('select id from operations order by id'),
    holdPreset: column('select id from hold_presets order by id'),
    otherScreen: otherDevices('wall'),
    otherKiosk: otherDevices('kiosk'),
    attachment: column('select id from attachments order by id desc limit 50'),
    punch: column('select id from punches order by recorded_at desc limit 100'),
    heldPunch: column('select id from held_punches order by recorded_at desc limit 50'),
    offlinePunch: column('select id from offline_punches order by received_at desc limit 50'),
    payWeek: [
      ...new Set([
        ...Array.from({ length: 8 }, (_, i) => isoWeekOf(new Date(Date.now() - (i + 2) * 7 * DAY), 'UTC')),
        ...column('select week from pay_weeks'),
      ]),
    ],
    mail: mailIds,
    vin: column('select vin from vehicles order by id desc limit 100'),
  };
}

/** Filled in when sent: the id of the server's key for offline punches. */
export class OfflineKeyId {}

/** Filled in when sent: a badge and PIN bound to one punch, sealed to the server's key as a kiosk seals them. */
export class SealedIdentity {
  constructor(readonly identity: OfflineIdentity) {}
}

/** The server's key for offline punches, as a paired kiosk reads it from `GET /api/kiosks/me/offline-key`. */
export interface OfflineKey {
  keyId: string;
  /** RSA-OAEP with SHA-256, in base64, as the kiosk's `sealIdentity`. */
  seal: (text: string) => string;
}

export function offlineKey({ keyId, publicKey }: OfflineKeyDto): OfflineKey {
  const key = createPublicKey({ key: publicKey as JsonWebKey, format: 'jwk' });
  const padding = constants.RSA_PKCS1_OAEP_PADDING;
  return {
    keyId,
    seal: (text) => publicEncrypt({ key, padding, oaepHash: 'sha256' }, Buffer.from(text)).toString('base64'),
  };
}

/**
 * JSON with every RealId replaced by an id that exists now, and every offline key id and sealed
 * identity filled in with `key`.
 */
export function toJson(value: unknown, pools: Pools, key?: OfflineKey): string {
  return JSON.stringify(value ?? null, (_key, item: unknown) => {
    if (item instanceof RealId) return item.in(pools);
    if (!(item instanceof OfflineKeyId || item instanceof SealedIdentity)) return item;
    if (!key) throw new Error('An offline punch is sealed with the key the kiosk caller reads');
    return item instanceof OfflineKeyId ? key.keyId : key.seal(identityText(item.identity));
  });
}

const real = (pool: PoolName): Arbitrary<RealId> =>
  fc.nat({ max: 10_000 }).map((pick) => new RealId(pool, pick));
/** In a body: mostly a real row, sometimes one that does not exist (every reference is checked first). */
const ref = (pool: PoolName): Arbitrary<RealId | number> =>
  fc.oneof({ weight: 9, arbitrary: real(pool) }, { weight: 1, arbitrary: fc.constant(MISSING_ID) });

/** Values that trip parsers and checks: edges of numbers, dates and text, hidden characters, wrong types. */
const NASTY = [
  null,
  true,
  0,
  -1,
  1.5,
  1e-300,
  1e308,
  -1e308,
  2 ** 31,
  2 ** 53 + 1,
  '',
  ' ',
  '0x10',
  '1e3',
  'NaN',
  'Infinity',
  '-0',
  '\u0000',
  'Bay\u202e 1',
  '\u200b',
  '<script>alert(1)</script>',
  "'; drop table punches; --",
  'x'.repeat(5000),
  [],
  {},
  [1, 2],
  { $gt: '' },
  '2026-02-30T08:00:00Z',
  '1999-12-31T23:59:59Z',
  '2099-01-01T00:00:00Z',
  '2026-03-08T02:30:00-06:00',
  '2026-W53',
  '25:00',
  '../../etc/passwd',
];
const nasty: Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom(...NASTY) },
  { weight: 1, arbitrary: fc.anything({ maxDepth: 2 }) },
);

/** Mostly the given values, now and then (one time in `odds + 1`) a nasty one in their place. */
const loose = <T>(arbitrary: Arbitrary<T>, odds = 8): Arbitrary<unknown> =>
  fc.oneof({ weight: odds, arbitrary }, { weight: 1, arbitrary: nasty });

/**
 * A body shaped like the route's schema: mostly the fields it takes with values near the valid ones,
 * sometimes a required field missing, an unknown field added, or the whole body junk. A field is
 * nasty one time in nine, or rarer in a body of many fields, so that at most about a third of the
 * bodies hold a nasty value whatever their size: one in nine for each of the shop's 22 settings left
 * hardly one body in ten free of them, and a run could end with none of its shop changes accepted.
 */
function body(fields: Record<string, Arbitrary<unknown>>, required: string[] = []): Arbitrary<unknown> {
  const odds = Math.max(8, 2 * Object.keys(fields).length);
  const looseFields = Object.fromEntries(
    Object.entries(fields).map(([key, field]) => [key, loose(field, odds)]),
  );
  return fc.oneof(
    { weight: 10, arbitrary: fc.record(looseFields, { requiredKeys: required }) },
    { weight: 1, arbitrary: fc.record(looseFields, { requiredKeys: [] }) },
    {
      weight: 1,
      arbitrary: fc
        .tuple(fc.record(looseFields, { requiredKeys: required }), fc.string({ maxLength: 12 }), nasty)
        .map(([value, key, extra]) => ({ ...value, [key || 'extra']: extra })),
    },
    { weight: 1, arbitrary: nasty },
  );
}

const now = Date.now();
/** An ISO instant within the span around now, in ms. */
const instant = (fromMs: number, toMs: number) =>
  fc.integer({ min: fromMs, max: toMs }).map((offset) => new Date(now + offset).toISOString());
const HOUR = 3600_000;
const DAY = 24 * HOUR;
const text = (maxLength: number, examples: string[]) =>
  fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...examples) },
    { weight: 1, arbitrary: fc.string({ minLength: 1, maxLength }) },
  );
const email = fc.oneof(
  fc
    .tuple(fc.stringMatching(/^[a-z]{1,12}$/), fc.stringMatching(/^[a-z]{1,12}$/))
    .map(([name, host]) => `${name}@${host}.test`),
  fc.constantFrom('owner@marlowcreek.test', 'advisor@marlowcreek.test'),
);
/**
 * A phone number as typed: mostly one the server takes (empty leaves it out), sometimes one without its
 * area code or text that is no number, which it refuses.
 */
const phone = fc.oneof(
  { weight: 3, arbitrary: fc.constantFrom('(608) 555-0142', '608.555.0142', '+44 20 7946 0958', '') },
  { weight: 1, arbitrary: text(30, ['555-0142']) },
);
const digits = (min: number, max: number) =>
  fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: min, maxLength: max });
/**
 * Book hours: mostly 0.1 to 99.9, now and then an edge on either side. A repair order holds up to three
 * lines: with the edges (half of them out of range) as likely as the rest, one in three was refused.
 */
const hours = fc.oneof(
  { weight: 3, arbitrary: fc.integer({ min: 1, max: 999 }).map((tenths) => tenths / 10) },
  { weight: 1, arbitrary: fc.constantFrom(0.05, 100, 0.1, 99.9) },
);
const cents = fc.integer({ min: 0, max: 100_000 });
const hhmm = fc
  .tuple(fc.integer({ min: 0, max: 23 }), fc.constantFrom(0, 15, 30, 45, 59))
  .map(([h, m]) => `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`);
const openingHours = fc.oneof(
  fc.array(fc.option(fc.record({ open: hhmm, close: hhmm }), { nil: null }), { minLength: 7, maxLength: 7 }),
  fc.constantFrom(
    Array(7).fill(null),
    Array(7).fill({ open: '22:00', close: '06:00' }),
    Array(7).fill({ open: '08:00', close: '08:00' }),
    [null, ...Array(5).fill({ open: '07:30', close: '17:30' }), null],
  ),
);
const isoWeek = fc.oneof(
  fc
    .tuple(fc.integer({ min: 1999, max: 2101 }), fc.integer({ min: 0, max: 54 }))
    .map(([year, week]) => `${year}-W${String(week).padStart(2, '0')}`),
  fc.constantFrom('2026-W53', '2027-W53', '2026-W10', '2026-W44', '2026-w01', '2026W01', ''),
);
const vin = fc.oneof(
  fc
    .string({ unit: fc.constantFrom(...'ABCDEFGHJKLMNPRSTUVWXYZ0123456789'), minLength: 16, maxLength: 16 })
    .map(makeVin),
  real('vin'),
  fc.constantFrom('1M8GDM9AXKP042788', '1M8GDM9A4KP042788', '7Y37J5G123456'),
);
const page = { limit: digits(1, 4), cursor: fc.string({ maxLength: 20 }) };
/** A day ('YYYY-MM-DD') within the span around today, in days, or one that is not a day. */
const localDate = fc.oneof(
  { weight: 6, arbitrary: instant(-60 * DAY, 30 * DAY).map((at) => at.slice(0, 10)) },
  { weight: 1, arbitrary: fc.constantFrom('2026-02-30', '2026-13-01', '26-01-01', '1999-12-31') },
);

const reason = text(500, ['Checked with the technician', 'Paper timesheet matches']);

/** An offline punch as a kiosk records it; some too far ahead of the server's clock. */
const offlinePunch = {
  id: fc.uuid(),
  kind: fc.constantFrom(...OFFLINE_PUNCH_KINDS),
  at: instant(-3 * DAY, 5 * 60_000),
  breakKind: fc.constantFrom(...BREAK_KINDS),
};
/** A badge and PIN as typed at a kiosk: mostly a demo technician's with the demo PIN. */
const typed = {
  badge: fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom('1041', '1042', '1043', '1044', '1045', '1046') },
    { weight: 1, arbitrary: digits(3, 8) },
  ),
  pin: fc.oneof({ weight: 3, arbitrary: fc.constant('4321') }, { weight: 1, arbitrary: digits(4, 8) }),
  /** Now and then the identity is bound to another punch than the one it comes with. */
  boundTo: fc.oneof({ weight: 7, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: fc.uuid() }),
};

const supersedingCorrection = {
  punchId: ref('punch'),
  technicianId: ref('technician'),
  kind: fc.constantFrom(...PUNCH_KINDS),
  at: instant(-20 * DAY, 0),
  jobLineId: ref('jobLine'),
  reason: text(500, ['Tapped the wrong line']),
};

/** What the fuzz sends to one route: the pool its `:id` names, and its query and body. */
export interface RouteFuzz {
  id?: PoolName;
  query?: Arbitrary<Record<string, unknown>>;
  body?: Arbitrary<unknown>;
}

const query = (fields: Record<string, Arbitrary<unknown>>) =>
  fc.record(Object.fromEntries(Object.entries(fields).map(([key, field]) => [key, loose(field)])), {
    requiredKeys: [],
  });

const SHOP_FIELDS = {
  name: text(80, ['Marlow Creek Auto Care']),
  timeZone: fc.constantFrom(
    'America/Chicago',
    'America/Los_Angeles',
    'America/St_Johns',
    'Pacific/Chatham',
    'Pacific/Kiritimati',
    'Asia/Kathmandu',
    'Australia/Lord_Howe',
    'Etc/GMT+12',
    'UTC',
    'Nowhere/Atlantis',
  ),
  workweekStartDay: fc.integer({ min: 0, max: 6 }),
  workweekStartHour: fc.integer({ min: 0, max: 23 }),
  units: fc.constantFrom('metric', 'us'),
  clockFormat: fc.constantFrom('12h', '24h'),
  maxConcurrentJobs: fc.integer({ min: 1, max: 4 }),
  concurrentSplit: fc.constantFrom('even', 'full'),
  minimumWageCents: fc.integer({ min: 725, max: 10_000 }),
  overtimeRules: fc.constantFrom('federal', 'california'),
  openingHours,
  kioskIdleSeconds: fc.integer({ min: 15, max: 600 }),
  payNonProductiveSeparately: fc.boolean(),
  techniciansTakeUnassigned: fc.boolean(),
  localMinimumWageCents: fc.oneof(fc.integer({ min: 725, max: 10_000 }), fc.constant(null)),
  minimumMealMinutes: fc.integer({ min: 10, max: 60 }),
  longShiftHours: fc.integer({ min: 8, max: 24 }),
  minimumClockedMinutesForDone: fc.integer({ min: 0, max: 120 }),
  minimumClockedHoursForEfficiency: fc.integer({ min: 0, max: 200 }),
  apportionSpanningLines: fc.boolean(),
  kioskShowsPay: fc.boolean(),
  payRulesFrom: localDate,
};
/** The settings that say which hours fall in which pay week. */
const WEEK_FIELDS = ['timeZone', 'workweekStartDay', 'workweekStartHour'];

/** A wall screen's or kiosk's pairing code, as typed. */
const pairing: RouteFuzz = { body: body({ code: text(8, ['ABC123', 'abc123', 'ZZZZZZ']) }, ['code']) };

/** Keyed by method and route path as Express lists it. Routes not listed here get ids and bodies of junk. */
export const ROUTE_FUZZ: Record<string, RouteFuzz> = {
  'post /api/auth/login': {
    body: body(
      {
        email: fc.oneof(
          fc.constantFrom('owner@marlowcreek.test', 'foreman@marlowcreek.test', 'nobody@example.test'),
          email,
        ),
        password: fc.oneof(fc.constant('baytime-demo'), fc.string({ maxLength: 30 })),
      },
      ['email', 'password'],
    ),
  },
  'post /api/auth/badge': {
    body: body(
      {
        badge: fc.oneof(fc.constantFrom('1041', '1042', '1046'), digits(3, 8)),
        pin: fc.oneof(fc.constant('4321'), digits(4, 8)),
      },
      ['badge', 'pin'],
    ),
  },
  'post /api/auth/screens/pair': pairing,
  'post /api/auth/kiosks/pair': pairing,
  'post /api/auth/renew': { body: fc.constant({}) },
  'post /api/users': {
    body: body(
      {
        name: text(80, ['Ada Newhire', 'Li Wei', 'María José Núñez']),
        role: fc.constantFrom(...ROLES),
        email: email,
        password: fc.string({ minLength: 10, maxLength: 20 }),
        badge: fc.oneof(digits(3, 8), fc.constant('1041')),
        pin: digits(4, 8),
        skillLevel: fc.integer({ min: 1, max: 5 }),
        flatRateCents: cents,
        hourlyRateCents: cents,
        overtimeExempt: fc.boolean(),
        payType: fc.constantFrom(...PAY_TYPES),
        guaranteeCents: cents,
        effectiveFrom: localDate,
      },
      ['name', 'role'],
    ),
  },
  'patch /api/users/:id': {
    id: 'otherUser',
    // A new password or PIN is hashed slowly on purpose: those come one time in eight.
    body: fc.oneof(
      {
        weight: 7,
        arbitrary: body({
          name: text(80, ['Renamed Person']),
          email,
          badge: digits(3, 8),
          skillLevel: fc.integer({ min: 1, max: 5 }),
          flatRateCents: cents,
          hourlyRateCents: cents,
          overtimeExempt: fc.boolean(),
          active: fc.boolean(),
          payType: fc.constantFrom(...PAY_TYPES),
          guaranteeCents: cents,
          effectiveFrom: localDate,
        }),
      },
      {
        weight: 1,
        arbitrary: body({ password: fc.string({ minLength: 10, maxLength: 20 }), pin: digits(4, 8) }),
      },
    ),
  },
  'post /api/bays': {
    body: body({ name: text(24, ['Bay 9', 'Alignment']), kind: fc.constantFrom(...BAY_KINDS) }, ['name']),
  },
  'patch /api/bays/:id': {
    id: 'bay',
    body: body({
      name: text(24, ['Bay 1', 'Bay 2']),
      kind: fc.constantFrom(...BAY_KINDS),
      active: fc.boolean(),
      position: fc.integer({ min: 0, max: 999 }),
    }),
  },
  'post /api/bays/:id/release': { id: 'bay', body: fc.constant({}) },
  'post /api/screens': { body: body({ name: text(60, ['Paint shop TV']) }, ['name']) },
  'delete /api/screens/:id': { id: 'otherScreen' },
  'post /api/kiosks': { body: body({ name: text(60, ['Kiosk by the door']) }, ['name']) },
  'delete /api/kiosks/:id': { id: 'otherKiosk' },
  'post /api/kiosks/me/queue': {
    body: body(
      {
        waiting: fc.integer({ min: 0, max: 500 }),
        oldestQueuedAt: fc.option(instant(-7 * DAY, 0), { nil: null }),
      },
      ['waiting', 'oldestQueuedAt'],
    ),
  },
  'post /api/kiosks/me/offline-punches': {
    // Mostly a tablet's upload, the badge and PIN sealed to the server's key; then anything.
    body: fc.oneof(
      {
        weight: 3,
        arbitrary: fc
          .record(
            { ...offlinePunch, ...typed },
            { requiredKeys: ['id', 'kind', 'at', 'badge', 'pin', 'boundTo'] },
          )
          .map(({ badge, pin, boundTo, ...punch }) => ({
            ...punch,
            keyId: new OfflineKeyId(),
            identity: new SealedIdentity({
              badge,
              pin,
              id: boundTo ?? punch.id,
              kind: punch.kind,
              at: punch.at,
            }),
          })),
      },
      {
        weight: 1,
        arbitrary: body(
          {
            ...offlinePunch,
            keyId: fc.oneof(fc.constant(new OfflineKeyId()), fc.stringMatching(/^[0-9a-f]{16}$/)),
            identity: fc.base64String({ maxLength: 64 }),
          },
          ['id', 'kind', 'at', 'keyId', 'identity'],
        ),
      },
    ),
  },
  'get /api/offline-punches': {
    query: query({ ...page, status: fc.constantFrom(...OFFLINE_PUNCH_STATUSES) }),
  },
  'post /api/offline-punches/:id/confirm': { id: 'offlinePunch', body: fc.constant({}) },
  'post /api/offline-punches/:id/reject': { id: 'offlinePunch', body: fc.constant({}) },
  'patch /api/shop': {
    // Once the fuzz has closed a pay week, a new time zone or workweek start is refused (409): half the
    // bodies leave those alone, or hardly one request in a hundred would be accepted.
    body: fc.oneof(
      body(SHOP_FIELDS),
      body(Object.fromEntries(Object.entries(SHOP_FIELDS).filter(([key]) => !WEEK_FIELDS.includes(key)))),
    ),
  },
  'post /api/punches/held/:id/accept': { id: 'heldPunch', body: body({ reason }, ['reason']) },
  'post /api/punches/held/:id/reject': { id: 'heldPunch', body: body({ reason }, ['reason']) },
  'post /api/punches': {
    // Shaped like a kiosk's punches (a line only on job punches), so that many are possible.
    body: fc.oneof(
      body(
        {
          id: fc.oneof(fc.uuid(), ref('punch')),
          kind: fc.constantFrom('shift-in', 'shift-out', 'break-start', 'break-end'),
          at: instant(-12 * HOUR, 2 * 60_000),
          breakKind: fc.constantFrom(...BREAK_KINDS),
          technicianId: ref('technician'),
        },
        ['id', 'kind'],
      ),
      body(
        {
          id: fc.oneof(fc.uuid(), ref('punch')),
          kind: fc.constantFrom('job-on', 'job-off'),
          jobLineId: ref('jobLine'),
          at: instant(-12 * HOUR, 2 * 60_000),
          technicianId: ref('technician'),
        },
        ['id', 'kind', 'jobLineId'],
      ),
      body(
        {
          id: fc.uuid(),
          kind: fc.constantFrom(...PUNCH_KINDS),
          jobLineId: ref('jobLine'),
          at: instant(-13 * HOUR, 5 * 60_000),
          breakKind: fc.constantFrom(...BREAK_KINDS),
          technicianId: ref('technician'),
        },
        ['id', 'kind'],
      ),
    ),
  },
  'get /api/repair-orders': {
    query: query({
      ...page,
      status: fc.constantFrom(...REPAIR_ORDER_STATUSES),
      q: text(120, ['Farrow', '555', 'T9', '%', '_']),
      advisorId: ref('user'),
      promised: fc.constant('today'),
      late: fc.constantFrom('true', 'false'),
    }),
  },
  'post /api/repair-orders': {
    body: body(
      {
        customer: loose(
          fc.record(
            {
              name: text(80, ['Wendell Farrow']),
              phone,
              email: email,
            },
            { requiredKeys: ['name'] },
          ),
        ),
        vehicle: loose(
          fc.record(
            {
              vin,
              year: fc.integer({ min: 1981, max: new Date().getFullYear() + 1 }),
              make: text(40, ['Halvard']),
              model: text(60, ['Morrow']),
              plate: text(16, ['7KX 221']),
              odometer: fc.integer({ min: 0, max: 2_000_000 }),
            },
            { requiredKeys: ['vin', 'year', 'make', 'model', 'odometer'] },
          ),
        ),
        concern: text(1000, ['Brakes squeal']),
        promisedAt: instant(HOUR, 40 * DAY),
        lines: fc.array(
          fc.record(
            {
              title: text(120, ['Inspect brakes']),
              bookHours: hours,
              skillLevel: fc.integer({ min: 1, max: 5 }),
            },
            { requiredKeys: ['title', 'bookHours'] },
          ),
          { minLength: 1, maxLength: 3 },
        ),
        odometerOverrideReason: text(10, ['Cluster replaced']),
        vinOverrideReason: text(10, ['Imported']),
      },
      ['customer', 'vehicle', 'concern', 'lines'],
    ),
  },
  'get /api/repair-orders/:id': { id: 'repairOrder' },
  'post /api/repair-orders/:id/ready-notice': { id: 'repairOrder', body: fc.constant({}) },
  'get /api/vehicles': { query: query({ vin }) },
  'get /api/operations': {},
  'post /api/operations': {
    body: body(
      {
        title: text(120, ['Rotate tyres']),
        defaultBookHours: hours,
        skillLevel: fc.integer({ min: 1, max: 5 }),
      },
      ['title', 'defaultBookHours'],
    ),
  },
  'patch /api/operations/:id': {
    id: 'operation',
    body: body({
      title: text(120, ['Rotate tyres']),
      defaultBookHours: hours,
      skillLevel: fc.integer({ min: 1, max: 5 }),
      active: fc.boolean(),
    }),
  },
  'patch /api/job-lines/:id': {
    id: 'jobLine',
    body: body({
      technicianId: fc.oneof(ref('technician'), fc.constant(null)),
      bayId: fc.oneof(ref('bay'), fc.constant(null)),
      priority: fc.constantFrom(...PRIORITIES),
      status: fc.constantFrom(...JOB_LINE_STATUSES),
      holdReason: fc.constantFrom(...HOLD_REASONS),
      completedAt: instant(-30 * DAY, 0),
    }),
  },
  'post /api/job-lines/:id/hold': {
    id: 'jobLine',
    body: body({ reason: fc.constantFrom(...HOLD_REASONS) }, ['reason']),
  },
  'post /api/job-lines/:id/resume': { id: 'jobLine', body: fc.constant({}) },
  'post /api/job-lines/:id/sign-off': { id: 'jobLine', body: body({ reason }, ['reason']) },
  // A technician's Done needs the cause and correction; the foreman's and owner's need neither.
  'post /api/job-lines/:id/done': {
    id: 'jobLine',
    body: body(
      {
        next: fc.constantFrom('check', 'ready'),
        cause: text(1000, ['Pads worn to the wear bar', 'Coolant hose split at the clamp']),
        correction: text(1000, ['Fitted new pads and road tested', 'Replaced the hose and bled the system']),
      },
      ['cause', 'correction'],
    ),
  },
  'post /api/job-lines/:id/findings': {
    id: 'jobLine',
    body: body(
      {
        note: text(2000, ['Front pads at 2 mm']),
        severity: fc.constantFrom(...FINDING_SEVERITIES),
        suggestedHours: fc.oneof(hours, hours.map(String), fc.constant('')),
        holdForApproval: fc.constantFrom('true', 'false', true, ''),
      },
      ['note', 'severity'],
    ),
  },
  'get /api/findings': {
    query: query({
      ...page,
      answer: fc.constantFrom('pending', 'approved', 'declined'),
      repairOrderId: ref('repairOrder'),
    }),
  },
  'post /api/findings/:id/answer': {
    id: 'finding',
    body: fc.oneof(
      body({ answer: fc.constant('approved'), bookHours: hours, title: text(120, ['Replace pads']) }, [
        'answer',
        'bookHours',
      ]),
      body({ answer: fc.constant('declined'), note: text(500, ['Next visit']) }, ['answer']),
    ),
  },
  'post /api/findings/:id/request-approval': { id: 'finding', body: fc.constant({}) },
  'get /api/attachments/:id': { id: 'attachment' },
  'get /api/attachments/:id/preview': {
    id: 'attachment',
    query: query({ size: fc.integer({ min: -1, max: 5000 }) }),
  },
  'get /api/timecards': { query: query({ technicianId: ref('technician'), week: isoWeek }) },
  'post /api/timecards/corrections': {
    // A missed punch added, a punch superseded, and then anything.
    body: fc.oneof(
      body(
        {
          technicianId: ref('technician'),
          kind: fc.constantFrom('shift-in', 'shift-out', 'break-start', 'break-end'),
          at: instant(-20 * DAY, 0),
          breakKind: fc.constantFrom(...BREAK_KINDS),
          reason: text(500, ['From the paper timesheet']),
        },
        ['technicianId', 'kind', 'at', 'reason'],
      ),
      body(supersedingCorrection, ['punchId', 'technicianId', 'kind', 'at', 'reason']),
      body({ ...supersedingCorrection, breakKind: fc.constantFrom(...BREAK_KINDS) }, [
        'technicianId',
        'kind',
        'at',
        'reason',
      ]),
    ),
  },
  'post /api/timecards/voids': {
    query: query({ preview: fc.constantFrom('true', 'false') }),
    body: body(
      {
        punchId: ref('punch'),
        technicianId: ref('technician'),
        reason: text(500, ['Tapped the wrong line']),
        displaces: fc.array(ref('punch'), { maxLength: 3 }),
      },
      ['punchId', 'technicianId', 'reason'],
    ),
  },
  'get /api/reports/labour': {
    query: query({ week: isoWeek, format: fc.constantFrom('json', 'csv', 'pdf') }),
  },
  'get /api/reports/pay': { query: query({ week: isoWeek, format: fc.constantFrom('json', 'csv', 'pdf') }) },
  'get /api/exceptions': { query: query({ week: isoWeek }) },
  'post /api/exceptions/reviews': {
    body: body(
      {
        key: text(120, ['open-shift:00000000-0000-4000-8000-000000000000', 'short-meal:', 'late-punch:1']),
        note: reason,
      },
      ['key', 'note'],
    ),
  },
  'post /api/pay-weeks/:week/close': { id: 'payWeek', body: fc.constant({}) },
  'post /api/pay-weeks/:week/reopen': { id: 'payWeek', body: body({ reason }, ['reason']) },
  'post /api/timers': {
    // Shaped like the kiosk's two forms, a set time and a temperature timer, and then anything.
    body: fc.oneof(
      body(
        {
          jobLineId: ref('jobLine'),
          bayId: ref('bay'),
          kind: fc.constant('set-time'),
          durationSeconds: fc.integer({ min: 10, max: 48 * 3600 }),
          label: text(60, ['Vacuum hold']),
        },
        ['jobLineId', 'kind', 'durationSeconds'],
      ),
      body(
        {
          jobLineId: ref('jobLine'),
          bayId: ref('bay'),
          kind: fc.constantFrom('warm-up', 'cool-down'),
          targetC: fc.double({ min: -40, max: 300, noNaN: true }),
          ambientC: fc.double({ min: -40, max: 300, noNaN: true }),
          label: text(60, ['Transmission fluid']),
          cautionAcknowledged: fc.constant(true),
        },
        ['jobLineId', 'kind', 'targetC', 'cautionAcknowledged'],
      ),
      body(
        {
          jobLineId: ref('jobLine'),
          bayId: ref('bay'),
          kind: fc.constantFrom(...TIMER_KINDS),
          targetC: fc.double({ min: -40, max: 300, noNaN: true }),
          ambientC: fc.double({ min: -40, max: 300, noNaN: true }),
          durationSeconds: fc.integer({ min: 10, max: 48 * 3600 }),
          label: text(60, ['Vacuum hold']),
          cautionAcknowledged: fc.boolean(),
        },
        ['jobLineId', 'kind'],
      ),
    ),
  },
  'post /api/timers/:id/readings': {
    id: 'timer',
    body: body(
      { tempC: fc.double({ min: -40, max: 300, noNaN: true }), at: instant(-2 * HOUR, 2 * 60_000) },
      ['tempC'],
    ),
  },
  'post /api/timers/:id/stop': { id: 'timer', body: fc.constant({}) },
  'post /api/hold-presets': {
    body: body(
      { name: text(60, ['Sealant cure']), durationSeconds: fc.integer({ min: 10, max: 48 * 3600 }) },
      ['name', 'durationSeconds'],
    ),
  },
  'delete /api/hold-presets/:id': { id: 'holdPreset' },
  'get /api/mailbox': { query: query(page) },
  'get /api/mailbox/:id': { id: 'mail' },
};

/** Ids that name nothing, or are not ids at all. */
const badId = fc.oneof(
  fc.integer({ min: 900_000, max: 2 ** 31 }).map(String),
  fc
    .string({ maxLength: 12 })
    // A string of digits may name a real row: those are the integer arbitrary's job, above 900,000.
    .filter((value) => !/^\d+$/.test(value.trim()))
    .map(encodeURIComponent),
  fc.constantFrom(
    '-1',
    '0',
    '1.5',
    '1e3',
    '0x10',
    '%00',
    '..%2F..%2Fetc',
    '00000000-0000-4000-8000-000000000000',
  ),
);

const CONTENT_TYPES = [
  'application/json',
  'text/plain',
  'application/x-www-form-urlencoded',
  'multipart/form-data; boundary=fuzz',
] as const;

/**
 * Who sends a request: a token of each role (two technicians; a paired wall screen and kiosk), none, or
 * one signed with another secret.
 */
export const CALLERS = [
  'owner',
  'foreman',
  'advisor',
  'technician',
  'otherTechnician',
  'display',
  'kiosk',
  'nobody',
  'forged',
] as const;
export type Caller = (typeof CALLERS)[number];

export interface FuzzRequest {
  method: Method;
  /** The Express route path, `:id` not yet filled in. */
  route: string;
  id: RealId | string | null;
  query: Record<string, unknown> | string;
  /** A body to send as JSON, or `{ raw }` text sent as it is. */
  body: unknown;
  contentType: (typeof CONTENT_TYPES)[number];
  caller: Caller;
}

/** Requests to the routes the server serves, callers mostly among the roles each route allows. */
export function fuzzRequests(
  routes: [Method, string][],
  allowed: (method: Method, route: string) => Caller[],
) {
  return fc.constantFrom(...routes).chain(([method, route]) => {
    const fuzz = ROUTE_FUZZ[`${method} ${route}`] ?? {};
    const callers = allowed(method, route);
    return fc.record({
      method: fc.constant(method),
      route: fc.constant(route),
      id: route.includes(':')
        ? fc.oneof({ weight: 6, arbitrary: fuzz.id ? real(fuzz.id) : badId }, { weight: 1, arbitrary: badId })
        : fc.constant(null),
      query: fc.oneof(
        { weight: 8, arbitrary: fuzz.query ?? fc.constant({}) },
        { weight: 1, arbitrary: fc.dictionary(fc.string({ maxLength: 8 }), nasty, { maxKeys: 3 }) },
        {
          weight: 1,
          arbitrary: fc.constantFrom(
            'limit[]=1',
            'cursor[a]=b',
            'week=2026-W01&week=2026-W02',
            'q=%zz',
            'a[b][c][d][e]=1',
          ),
        },
      ),
      body:
        method === 'get'
          ? fc.constant(undefined)
          : fc.oneof(
              { weight: 8, arbitrary: fuzz.body ?? nasty },
              { weight: 1, arbitrary: fc.json().map((json) => ({ raw: `${json}}` })) },
            ),
      contentType: fc.oneof(
        { weight: 12, arbitrary: fc.constant(CONTENT_TYPES[0]) },
        { weight: 1, arbitrary: fc.constantFrom(...CONTENT_TYPES.slice(1)) },
      ),
      caller: fc.oneof(
        { weight: 10, arbitrary: fc.constantFrom(...callers) },
        { weight: 2, arbitrary: fc.constantFrom(...CALLERS) },
      ),
    });
  });
}

export function isRaw(body: unknown): body is { raw: string } {
  return typeof body === 'object' && body !== null && typeof (body as { raw?: unknown }).raw === 'string';
}

/** The request's path and query string, real ids filled in. */
export function target(request: FuzzRequest, pools: Pools): string {
  const id = request.id instanceof RealId ? String(request.id.in(pools)) : request.id;
  // Ids from `badId` come encoded already; real ones are digits or uuids.
  const path = id === null ? request.route : request.route.replace(/:\w+/, id);
  if (typeof request.query === 'string') return `${path}?${request.query}`;
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(request.query)) {
    const text =
      value instanceof RealId
        ? String(value.in(pools))
        : typeof value === 'string'
          ? value
          : toJson(value, pools);
    search.append(key, text);
  }
  const query = search.toString();
  return query ? `${path}?${query}` : path;
}
