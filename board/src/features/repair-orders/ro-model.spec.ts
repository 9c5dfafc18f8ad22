import { describe, expect, it } from 'vitest';
import type { DispatchBoard, DispatchLine } from '@baytime/shared';
import type { RepairOrderSummary } from './api/get-repair-orders';
import {
  DEFAULT_FILTERS,
  advisorChoices,
  bookTotal,
  changedFields,
  keepEditsOnReload,
  readFields,
  linesDone,
  filtersFromParams,
  filtersToParams,
  listQuery,
  pageRange,
  lineNotes,
  lineRows,
  lineStatusText,
} from './ro-model';

type RoLine = RepairOrderSummary['lines'][number];

function jobLine(overrides: Partial<RoLine> = {}): RoLine {
  return {
    clockedSeconds: 0,
    parts: null,
    late: false,
    completedBy: null,
    concern: 'Customer asks for a thermostat',
    cause: null,
    correction: null,
    cancelReason: null,
    id: 1,
    repairOrderId: 1,
    lineNo: 1,
    title: 'Replace thermostat and housing',
    bookHours: 1.2,
    skillLevel: 2,
    status: 'queued',
    holdReason: null,
    priority: 'normal',
    technicianId: null,
    bayId: null,
    promisedAt: null,
    completedAt: null,
    ...overrides,
  };
}

function ro(overrides: Partial<RepairOrderSummary> = {}): RepairOrderSummary {
  return {
    id: 1,
    number: '4521',
    customerName: 'Harriet Quenby',
    customerPhone: null,
    customerEmail: null,
    plate: null,
    advisorId: null,
    advisorName: null,
    vehicle: '2019 Halvard Tessel',
    vehicleYear: 2019,
    vehicleMake: 'Halvard',
    vehicleModel: 'Tessel',
    vin: '7HV3TS1K5KM100121',
    odometer: 81234,
    concern: 'Warning light on',
    status: 'open',
    externalRef: null,
    promisedAt: null,
    createdAt: '2026-12-01T15:00:00.000Z',
    closedAt: null,
    late: false,
    lines: [jobLine()],
    ...overrides,
  };
}

function dispatchLine(overrides: Partial<DispatchLine>): DispatchLine {
  return {
    ...jobLine(),
    repairOrderNumber: '4521',
    vehicle: '2019 Halvard Tessel',
    queuedAt: '2026-12-01T15:00:00.000Z',
    clockedSeconds: 0,
    clockedOn: [],
    parts: null,
    forecast: null,
    ...overrides,
  };
}

function dispatch(lines: DispatchLine[]): DispatchBoard {
  return {
    serverTime: '2026-12-01T20:00:00.000Z',
    queue: [],
    lanes: [
      {
        technician: { id: 4, name: 'Dana Okafor', skillLevel: 4, status: 'on-job' },
        efficiency: 1.2,
        lines,
        finishAt: null,
      },
    ],
    bays: [{ id: 2, name: 'Bay 2', state: 'working', repairOrderId: 1 }],
    lateCount: 0,
    forecastNote: null,
  };
}

describe(listQuery.name, () => {
  it('asks the server for the filters on the page, and the page', () => {
    expect(listQuery(DEFAULT_FILTERS, { limit: 50 })).toBe('limit=50&status=open');
    expect(
      listQuery(
        { status: 'all', advisor: '3', promisedToday: true, late: true, search: '  wendell farrow ' },
        { limit: 50, cursor: 'MTcwMC4xMg' },
      ),
    ).toBe('limit=50&q=wendell+farrow&advisorId=3&promised=today&late=true&cursor=MTcwMC4xMg');
  });
});

describe(pageRange.name, () => {
  it('counts from one across pages', () => {
    expect(pageRange(0, 50, 50, 240)).toBe('1–50 of 240');
    expect(pageRange(4, 50, 40, 240)).toBe('201–240 of 240');
    expect(pageRange(20, 50, 50, 10_000)).toBe('1,001–1,050 of 10,000');
    expect(pageRange(0, 50, 0, 0)).toBe('No repair orders');
  });
});

describe(filtersFromParams.name, () => {
  it('round-trips through the address and falls back to defaults', () => {
    const filters = {
      status: 'all',
      advisor: '3',
      promisedToday: true,
      late: true,
      search: 'tessel',
    } as const;
    expect(filtersFromParams(filtersToParams(filters))).toEqual(filters);
    expect(filtersFromParams(new URLSearchParams('status=bogus'))).toEqual(DEFAULT_FILTERS);
    expect(filtersToParams(DEFAULT_FILTERS).toString()).toBe('');
  });
});

describe(advisorChoices.name, () => {
  it('lists the people who write ROs, by name, or only "Mine" when the people cannot be read', () => {
    const people = [
      { id: 3, name: 'Nell Ashby', role: 'advisor', active: true },
      { id: 1, name: 'Rosa Pellman', role: 'owner', active: true },
      { id: 7, name: 'Dana Okafor', role: 'technician', active: true },
      { id: 9, name: 'Abel Moncrief', role: 'advisor', active: false },
    ] as const;
    expect(advisorChoices(people, { id: 3 })).toEqual([
      { id: '3', name: 'Nell Ashby' },
      { id: '1', name: 'Rosa Pellman' },
    ]);
    expect(advisorChoices(undefined, { id: 3 })).toEqual([{ id: '3', name: 'Mine' }]);
  });
});

describe(lineStatusText.name, () => {
  it('gives the hold reason with a held line', () => {
    expect(lineStatusText({ status: 'held', holdReason: 'parts' })).toBe('Held: Parts');
    expect(lineStatusText({ status: 'queued', holdReason: null })).toBe('Queued');
  });
});

describe(lineNotes.name, () => {
  it('shows what a line has on record, each under its label', () => {
    const done = jobLine({ cause: 'Stuck open', correction: 'Fitted a new thermostat' });
    expect(lineNotes(done)).toEqual([
      { label: 'Concern', text: 'Customer asks for a thermostat' },
      { label: 'Cause', text: 'Stuck open' },
      { label: 'Correction', text: 'Fitted a new thermostat' },
    ]);
  });

  it('leaves out a concern the line does not have', () => {
    const added = jobLine({ concern: '', cancelReason: 'Customer had it done elsewhere' });
    expect(lineNotes(added)).toEqual([{ label: 'Cancelled', text: 'Customer had it done elsewhere' }]);
  });
});

describe(lineRows.name, () => {
  it('fills names, clocked time and forecast from the dispatch view', () => {
    const forecast = { startAt: 'a', finishAt: '2026-12-01T22:00:00.000Z', late: false };
    const board = dispatch([dispatchLine({ id: 1, clockedSeconds: 1800, clockedOn: [4], forecast })]);
    const [row] = lineRows(ro({ lines: [jobLine({ technicianId: 4, bayId: 2, status: 'working' })] }), board);
    expect(row).toMatchObject({
      technician: 'Dana Okafor',
      bay: 'Bay 2',
      clockedSeconds: 1800,
      onTheClock: ['Dana Okafor'],
      forecast,
      statusText: 'Working',
    });
  });

  it('uses the time the RO itself reports without a dispatch view, and orders lines by number', () => {
    const lines = [
      jobLine({ id: 2, lineNo: 2, status: 'done', clockedSeconds: 4000 }),
      jobLine({ id: 1, lineNo: 1, technicianId: 99 }),
    ];
    const rows = lineRows(ro({ lines }), undefined);
    expect(rows.map((r) => r.line.lineNo)).toEqual([1, 2]);
    expect(rows[0]).toMatchObject({ technician: 'Technician #99', clockedSeconds: 0 });
    expect(rows[1]?.clockedSeconds).toBe(4000);
  });
});

describe('changedFields', () => {
  const opened = {
    customer: { name: 'Odile Farrant', phone: '+16085550177', email: null },
    vehicle: { plate: 'KTW 4410', odometer: 52_100 },
    concern: 'Squeal when cold',
  };

  it('sends only what was changed, so a field someone else saved meanwhile is left alone', () => {
    const edited = {
      customer: { name: 'Odile Farrant', phone: '+16085550177', email: null },
      vehicle: { plate: 'KTW 4411', odometer: 52_100 },
      concern: 'Squeal when cold, louder on the left',
    };
    expect(changedFields(opened, edited)).toEqual({
      vehicle: { plate: 'KTW 4411' },
      concern: 'Squeal when cold, louder on the left',
    });
  });

  it('sends a value cleared to null, a number changed, and nothing when nothing changed', () => {
    expect(changedFields(opened, { customer: { phone: null }, vehicle: { odometer: 52_300 } })).toEqual({
      customer: { phone: null },
      vehicle: { odometer: 52_300 },
    });
    expect(changedFields(opened, opened)).toEqual({});
  });

  it('names what each changed field was when the dialog opened, for the server to check', () => {
    const changed = changedFields(opened, { customer: { phone: null }, vehicle: { odometer: 52_300 } });
    expect(readFields(opened, changed)).toEqual({
      customer: { phone: '+16085550177' },
      vehicle: { odometer: 52_100 },
    });
    expect(readFields({ cause: undefined }, { cause: 'Worn pads' })).toEqual({ cause: null });
  });

  it('takes a line: a title change leaves the book hours out', () => {
    const line = { title: 'Rotate tyres', bookHours: 0.3, cause: null };
    expect(changedFields(line, { ...line, title: 'Rotate and balance tyres' })).toEqual({
      title: 'Rotate and balance tyres',
    });
  });
});

describe(keepEditsOnReload.name, () => {
  const opened = {
    customer: { name: 'Odile Farrant', phone: '(608) 555-0177', email: '' },
    vehicle: { plate: 'KTW 4410', odometer: 52_100 },
    concern: 'Squeal when cold',
  };

  it('puts back what the advisor typed where the other person left the field alone', () => {
    const edited = {
      ...opened,
      customer: { ...opened.customer, email: 'odile@example.test' },
      vehicle: { plate: 'KTW 4411', odometer: 52_100 },
      concern: 'Squeal when cold, louder on the left',
    };
    // Someone else changed the phone and the concern meanwhile.
    const fresh = { ...opened, customer: { ...opened.customer, phone: '(608) 555-0190' }, concern: 'Squeal' };
    expect(keepEditsOnReload(opened, edited, fresh)).toEqual({
      values: {
        customer: { name: 'Odile Farrant', phone: '(608) 555-0190', email: 'odile@example.test' },
        vehicle: { plate: 'KTW 4411', odometer: 52_100 },
        concern: 'Squeal',
      },
      kept: ['customer.email', 'vehicle.plate'],
      replaced: [{ path: 'concern', yours: 'Squeal when cold, louder on the left' }],
    });
  });

  it('counts no conflict where both made the same change, and keeps a number or a cleared field', () => {
    const edited = { ...opened, vehicle: { plate: '', odometer: 52_300 }, concern: 'Squeal' };
    const fresh = { ...opened, concern: 'Squeal' };
    expect(keepEditsOnReload(opened, edited, fresh)).toEqual({
      values: { ...opened, vehicle: { plate: '', odometer: 52_300 }, concern: 'Squeal' },
      kept: ['vehicle.plate', 'vehicle.odometer'],
      replaced: [],
    });
    expect(keepEditsOnReload(opened, opened, fresh)).toEqual({ values: fresh, kept: [], replaced: [] });
  });

  it('takes a line: their title wins, the advisor’s book hours stay', () => {
    const line = { title: 'Rotate tyres', bookHours: 0.3, cause: '' };
    const edited = { title: 'Rotate and balance tyres', bookHours: 0.6, cause: '' };
    const fresh = { title: 'Rotate tyres, check pressures', bookHours: 0.3, cause: 'Uneven wear' };
    expect(keepEditsOnReload(line, edited, fresh)).toEqual({
      values: { title: 'Rotate tyres, check pressures', bookHours: 0.6, cause: 'Uneven wear' },
      kept: ['bookHours'],
      replaced: [{ path: 'title', yours: 'Rotate and balance tyres' }],
    });
  });
});

describe('book totals', () => {
  const lines = [
    jobLine({ bookHours: 1.1, status: 'cancelled' }),
    jobLine({ bookHours: 0.8, status: 'done' }),
    jobLine({ bookHours: 0.5, status: 'queued' }),
  ];

  it('leaves a cancelled line out of the book and of the lines to do', () => {
    expect(bookTotal(lines)).toBeCloseTo(1.3);
    expect(linesDone(lines)).toEqual({ done: 1, of: 2 });
    expect(bookTotal([jobLine({ bookHours: 1.1, status: 'cancelled' })])).toBe(0);
  });
});
