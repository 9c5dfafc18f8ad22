import { describe, expect, it } from 'vitest';
import type { KnownVehicle, OpeningHours } from '@baytime/shared';
import {
  PROMISE_PASSED,
  bookHoursTotal,
  clockText,
  differsFromReturning,
  emptyDraft,
  formKey,
  lineFromOperation,
  matchOperations,
  parseHours,
  parseWhole,
  promiseChoices,
  toRepairOrder,
  vinFacts,
  vinNeedsReason,
  withReturningCustomer,
  type IntakeDraft,
} from './intake-form';

const ZONE = 'America/Chicago';
const WEEKDAY = { open: '07:30', close: '18:00' };
/** Sunday first: closed Sunday, weekdays 7:30–18:00, Saturday mornings. */
const HOURS: OpeningHours = [
  null,
  WEEKDAY,
  WEEKDAY,
  WEEKDAY,
  WEEKDAY,
  WEEKDAY,
  { open: '08:00', close: '13:00' },
];
// 49 CFR 565.15 worked example, widely quoted: check digit X, 10th character K.
const VALID_VIN = '1M8GDM9AXKP042788';

function filled(overrides: Partial<IntakeDraft> = {}): IntakeDraft {
  const draft = emptyDraft();
  return {
    ...draft,
    customer: { name: 'Harriet Quenby', phone: '', email: '' },
    vehicle: {
      vin: VALID_VIN,
      year: '2019',
      make: 'Halvard',
      model: 'Tessel',
      plate: '',
      odometer: '84,210',
    },
    concern: 'Warning light on the dash',
    lines: [{ key: 'a', title: 'Diagnose engine warning light', bookHours: '1', skillLevel: '' }],
    ...overrides,
  };
}

describe(vinFacts.name, () => {
  const now = new Date('2026-06-01T12:00:00Z');
  it('accepts a VIN whose check digit matches and reads its model year', () => {
    expect(vinFacts(VALID_VIN.toLowerCase(), now)).toMatchObject({ state: 'valid', year: 2019 });
  });
  it('takes a VIN pasted in groups with spaces and dashes', () => {
    expect(vinFacts(' 1M8 GDM9A-XKP 042788 ', now)).toMatchObject({ state: 'valid', year: 2019 });
  });
  it('names the check digit it expected', () => {
    const wrong = `${VALID_VIN.slice(0, 8)}5${VALID_VIN.slice(9)}`;
    expect(vinFacts(wrong, now)).toMatchObject({
      state: 'invalid',
      message: 'Check digit should be X, not 5',
    });
  });
  it('counts characters while typing and refuses I, O and Q at once', () => {
    expect(vinFacts('1M8GD', now)).toMatchObject({ state: 'partial', message: '5 of 17 characters' });
    expect(vinFacts('1M8GO', now)).toMatchObject({ state: 'invalid', message: 'VINs never use I, O or Q' });
    expect(vinFacts('', now).state).toBe('empty');
    expect(vinFacts(`${VALID_VIN}1`, now).state).toBe('invalid');
  });
});

describe(parseHours.name, () => {
  it('reads decimals with a point or a comma', () => {
    expect(parseHours('1.5')).toBe(1.5);
    expect(parseHours('0,3')).toBe(0.3);
    expect(parseHours('.5')).toBe(0.5);
    expect(parseHours('1h')).toBeNull();
    expect(parseHours('')).toBeNull();
  });
});

describe(parseWhole.name, () => {
  it('reads whole numbers with separators', () => {
    expect(parseWhole('150,273')).toBe(150273);
    expect(parseWhole('84 210')).toBe(84210);
    expect(parseWhole('12.5')).toBeNull();
  });
});

describe(bookHoursTotal.name, () => {
  it('adds the lines it can read', () => {
    const lines = [
      { key: 'a', title: '', bookHours: '1.5', skillLevel: '' },
      { key: 'b', title: '', bookHours: '0.7', skillLevel: '' },
      { key: 'c', title: '', bookHours: 'x', skillLevel: '' },
    ];
    expect(bookHoursTotal(lines)).toBeCloseTo(2.2);
  });
});

describe(toRepairOrder.name, () => {
  // Tuesday 1 December 2026, 6:00 AM in Chicago.
  const NOW = new Date('2026-12-01T12:00:00Z');

  it('builds the body the server takes', () => {
    const { body, errors } = toRepairOrder(
      filled({ promisedDate: '2026-12-02', promisedTime: '17:30' }),
      ZONE,
      {},
      NOW,
    );
    expect(errors).toEqual({});
    expect(body).toMatchObject({
      customer: { name: 'Harriet Quenby' },
      vehicle: { vin: VALID_VIN, year: 2019, odometer: 84210 },
      // 5:30 PM in Chicago on 2 December (CST, UTC−6).
      promisedAt: '2026-12-02T23:30:00.000Z',
      lines: [{ title: 'Diagnose engine warning light', bookHours: 1 }],
    });
    expect(body?.customer.email).toBeUndefined();
  });

  it('puts each problem at its field', () => {
    const draft = filled({
      customer: { name: '', phone: '', email: 'not-mail' },
      vehicle: { vin: 'ABC', year: '19x', make: '', model: 'Tessel', plate: '', odometer: '' },
      concern: '',
      promisedDate: '2026-12-02',
      lines: [{ key: 'a', title: '', bookHours: 'one', skillLevel: '' }],
    });
    const { body, errors } = toRepairOrder(draft, ZONE, {}, NOW);
    expect(body).toBeNull();
    expect(errors).toMatchObject({
      'customer.name': 'Enter the customer’s name',
      'customer.email': 'Not an e-mail address',
      'vehicle.vin': 'A VIN has 17 characters',
      'vehicle.year': 'A year, like 2019',
      'vehicle.make': 'Enter the make',
      'vehicle.odometer': 'Enter the odometer reading',
      concern: 'Say what the customer asked for',
      promised: 'Pick a time too',
      'lines.0.title': 'Give the line a title',
      'lines.0.bookHours': 'Hours, like 1.5',
    });
  });

  it('checks the model year against the VIN', () => {
    const { errors } = toRepairOrder(
      filled({ vehicle: { ...filled().vehicle, year: '2020' } }),
      ZONE,
      {},
      NOW,
    );
    expect(errors['vehicle.year']).toMatch(/means model year 2019/);
  });

  it('needs at least one line, and sends a reason for a lower odometer when given', () => {
    expect(toRepairOrder(filled({ lines: [] }), ZONE, {}, NOW).errors.lines).toBe(
      'Add at least one job line',
    );
    expect(
      toRepairOrder(filled(), ZONE, { odometer: 'Cluster replaced' }, NOW).body?.odometerOverrideReason,
    ).toBe('Cluster replaced');
    expect(toRepairOrder(filled(), ZONE, { odometer: 'x' }, NOW).errors.odometerOverrideReason).toBe(
      'Say why, in a few words',
    );
  });

  it('refuses a promised time that has already passed', () => {
    // 5:30 PM on 2 December in Chicago is 23:30 UTC (CST, UTC−6).
    const promised = filled({ promisedDate: '2026-12-02', promisedTime: '17:30' });
    expect(toRepairOrder(promised, ZONE, {}, new Date('2026-12-02T23:31:00Z'))).toEqual({
      body: null,
      errors: { promised: PROMISE_PASSED },
    });
    expect(toRepairOrder(promised, ZONE, {}, new Date('2026-12-02T23:29:00Z')).errors).toEqual({});
  });

  it('sends a VIN outside the rules with the reason given for it', () => {
    const wrongCheck = filled({ vehicle: { ...filled().vehicle, vin: '1M8GDM9A4KP042788' } });
    expect(toRepairOrder(wrongCheck, ZONE, {}, NOW).errors['vehicle.vin']).toBe(
      'Check digit should be X, not 4',
    );
    expect(toRepairOrder(wrongCheck, ZONE, { vin: 'Imported' }, NOW).body).toMatchObject({
      vehicle: { vin: '1M8GDM9A4KP042788' },
      vinOverrideReason: 'Imported',
    });
  });
});

describe(vinNeedsReason.name, () => {
  const NOW = new Date('2026-12-01T12:00:00Z');
  const withVehicle = (vin: string, year: string) => filled({ vehicle: { ...filled().vehicle, vin, year } });

  it('is true when only a check digit, the length or a pre-1981 year is wrong', () => {
    // Position 9 of the 49 CFR 565.15 worked example changed from X to 4.
    expect(vinNeedsReason(withVehicle('1M8GDM9A4KP042788', '2019'), ZONE, NOW)).toBe(true);
    // An invented 13-character serial of a 1977 vehicle.
    expect(vinNeedsReason(withVehicle('7Y37J5G123456', '1977'), ZONE, NOW)).toBe(true);
  });

  it('is false for a good VIN and for text that is no VIN at all', () => {
    expect(vinNeedsReason(filled(), ZONE, NOW)).toBe(false);
    expect(vinNeedsReason(withVehicle('AB*12', '2019'), ZONE, NOW)).toBe(false);
    expect(vinNeedsReason(withVehicle('', '2019'), ZONE, NOW)).toBe(false);
  });
});

describe(formKey.name, () => {
  it('maps the promised time to its two inputs', () => {
    expect(formKey('promisedAt')).toBe('promised');
    expect(formKey('vehicle.odometer')).toBe('vehicle.odometer');
  });
});

describe(promiseChoices.name, () => {
  it('offers closing time today while the shop is open, then the next open day', () => {
    // Friday 2026-12-04 10:00 in Chicago.
    const choices = promiseChoices(HOURS, ZONE, new Date('2026-12-04T16:00:00Z'));
    expect(choices).toEqual([
      { label: 'Today at close, 6:00 PM', date: '2026-12-04', time: '18:00' },
      { label: 'Tomorrow at close, 1:00 PM', date: '2026-12-05', time: '13:00' },
    ]);
  });
  it('skips today after closing and closed days', () => {
    // Saturday 2026-12-05 15:00 in Chicago: closed at 13:00, shut on Sunday.
    const choices = promiseChoices(HOURS, ZONE, new Date('2026-12-05T21:00:00Z'));
    expect(choices.map((c) => c.date)).toEqual(['2026-12-07', '2026-12-08']);
    expect(choices[0]?.label).toBe('Monday at close, 6:00 PM');
  });
});

describe(clockText.name, () => {
  it('writes a 24-hour time the 12-hour way', () => {
    expect(clockText('17:30')).toBe('5:30 PM');
    expect(clockText('00:05')).toBe('12:05 AM');
    expect(clockText('12:00')).toBe('12:00 PM');
  });
});

describe(withReturningCustomer.name, () => {
  const known: KnownVehicle = {
    id: 7,
    vin: VALID_VIN,
    year: 2019,
    make: 'Halvard',
    model: 'Morrow',
    plate: '7KX 221',
    lastOdometer: 61_200,
    customer: { id: 3, name: 'Wendell Farrow', phone: '+16085550142', email: 'wendell@example.test' },
    lastVisit: { repairOrderId: 9, number: '4450', date: '2026-06-01T15:00:00.000Z', odometer: 61_200 },
  };

  it('copies the name, phone (as a person reads it), e-mail and vehicle, and leaves the odometer to be read', () => {
    const draft = filled({
      customer: { name: '', phone: '', email: '' },
      vehicle: { vin: VALID_VIN, year: '', make: '', model: '', plate: '', odometer: '64,950' },
    });
    const copied = withReturningCustomer(draft, known);
    expect(copied.customer).toEqual({
      name: 'Wendell Farrow',
      phone: '(608) 555-0142',
      email: 'wendell@example.test',
    });
    expect(copied.vehicle).toEqual({
      vin: VALID_VIN,
      year: '2019',
      make: 'Halvard',
      model: 'Morrow',
      plate: '7KX 221',
      odometer: '64,950',
    });
    expect(differsFromReturning(draft, known)).toBe(true);
    expect(differsFromReturning(copied, known)).toBe(false);
  });

  it('leaves empty what the shop does not have', () => {
    const bare = { ...known, plate: null, customer: { ...known.customer, phone: null, email: null } };
    const copied = withReturningCustomer(filled(), bare);
    expect(copied.customer).toEqual({ name: 'Wendell Farrow', phone: '', email: '' });
    expect(copied.vehicle.plate).toBe('');
  });
});

describe(matchOperations.name, () => {
  const menu = [
    { id: 1, title: 'Front brake pads and rotors', defaultBookHours: 1.8, skillLevel: 2, active: true },
    { id: 2, title: 'Rear brake pads', defaultBookHours: 1.2, skillLevel: 2, active: true },
    { id: 3, title: 'Coolant flush and fill', defaultBookHours: 1.1, skillLevel: 1, active: true },
  ];
  it('matches every typed word anywhere in the title', () => {
    expect(matchOperations(menu, 'brake front').map((o) => o.id)).toEqual([1]);
    expect(matchOperations(menu, 'PADS').map((o) => o.id)).toEqual([1, 2]);
    expect(matchOperations(menu, '').length).toBe(3);
  });
  it('fills a line with the title, default hours and skill', () => {
    const line = { key: 'a', title: 'bra', bookHours: '', skillLevel: '' };
    expect(lineFromOperation(line, menu[0]!)).toEqual({
      key: 'a',
      title: 'Front brake pads and rotors',
      bookHours: '1.8',
      skillLevel: '2',
    });
  });
});
