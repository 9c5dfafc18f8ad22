import { describe, expect, it } from 'vitest';
import type { DispatchBoard, DispatchLine, FindingDto, JobLineDto } from '@baytime/shared';
import type { RepairOrderSummary } from './api/get-repair-orders';
import {
  DEFAULT_FILTERS,
  advisorsOf,
  filterRepairOrders,
  filtersFromParams,
  filtersToParams,
  isLate,
  isPromisedToday,
  lateLineIds,
  lineRows,
  lineStatusText,
  repairOrderHistory,
} from './ro-model';

const ZONE = 'America/Chicago';
const NOW = Date.parse('2026-12-01T20:00:00.000Z'); // Tue 2:00 PM in Chicago

function jobLine(
  overrides: Partial<JobLineDto & { clockedSeconds: number }> = {},
): JobLineDto & { clockedSeconds: number } {
  return {
    clockedSeconds: 0,
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
    vin: '7HV3TS1K5KM100121',
    odometer: 81234,
    concern: 'Warning light on',
    status: 'open',
    promisedAt: null,
    createdAt: '2026-12-01T15:00:00.000Z',
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
    bays: [{ id: 2, name: 'Bay 2', state: 'working' }],
    lateCount: 0,
    forecastNote: null,
  };
}

describe(isPromisedToday.name, () => {
  it('compares shop days, not UTC days', () => {
    // 03:30 UTC on the 2nd is 9:30 PM on the 1st in Chicago: still today.
    expect(isPromisedToday({ promisedAt: '2026-12-02T03:30:00.000Z' }, NOW, ZONE)).toBe(true);
    expect(isPromisedToday({ promisedAt: '2026-12-02T06:30:00.000Z' }, NOW, ZONE)).toBe(false);
    expect(isPromisedToday({ promisedAt: null }, NOW, ZONE)).toBe(false);
  });
});

describe(isLate.name, () => {
  it('is late past the promise or with a line forecast late, and only while open', () => {
    const past = ro({ promisedAt: '2026-12-01T19:00:00.000Z' });
    expect(isLate(past, NOW, new Set())).toBe(true);
    expect(isLate({ ...past, status: 'done' }, NOW, new Set())).toBe(false);
    const future = ro({ promisedAt: '2026-12-01T23:00:00.000Z' });
    expect(isLate(future, NOW, new Set())).toBe(false);
    expect(isLate(future, NOW, new Set([1]))).toBe(true);
  });
});

describe(lateLineIds.name, () => {
  it('collects the lines forecast late', () => {
    const board = dispatch([
      dispatchLine({ id: 7, forecast: { startAt: 'a', finishAt: 'b', late: true } }),
      dispatchLine({ id: 8, forecast: { startAt: 'a', finishAt: 'b', late: false } }),
    ]);
    expect([...lateLineIds(board)]).toEqual([7]);
    expect(lateLineIds(undefined).size).toBe(0);
  });
});

describe(filterRepairOrders.name, () => {
  const list = [
    ro({ id: 1, number: '4521', advisorId: 3, advisorName: 'Nell Ashby' }),
    ro({ id: 2, number: '4522', customerName: 'Abel Moncrief', status: 'done', advisorId: 2 }),
    ro({ id: 3, number: '4523', promisedAt: '2026-12-01T22:00:00.000Z', vin: '7CV4AL2E1KM100123' }),
  ];
  const context = { nowMs: NOW, timeZone: ZONE, lateLines: new Set<number>() };

  it('filters by status, advisor, promise day and search words', () => {
    const ids = (filters: Partial<typeof DEFAULT_FILTERS>) =>
      filterRepairOrders(list, { ...DEFAULT_FILTERS, ...filters }, context).map((r) => r.id);
    expect(ids({ status: 'all' })).toEqual([1, 2, 3]);
    expect(ids({})).toEqual([1, 3]);
    expect(ids({ status: 'all', advisor: '3' })).toEqual([1]);
    expect(ids({ promisedToday: true })).toEqual([3]);
    expect(ids({ status: 'all', search: 'abel 4522' })).toEqual([2]);
    expect(ids({ status: 'all', search: '7cv4al' })).toEqual([3]);
    expect(ids({ late: true })).toEqual([]);
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

describe(advisorsOf.name, () => {
  it('lists each named advisor once, by name', () => {
    const list = [
      ro({ advisorId: 3, advisorName: 'Nell Ashby' }),
      ro({ advisorId: 1, advisorName: 'Rosa Pellman' }),
      ro({ advisorId: 3, advisorName: 'Nell Ashby' }),
      ro({}),
    ];
    expect(advisorsOf(list)).toEqual([
      { id: '3', name: 'Nell Ashby' },
      { id: '1', name: 'Rosa Pellman' },
    ]);
  });
});

describe(lineStatusText.name, () => {
  it('gives the hold reason with a held line', () => {
    expect(lineStatusText({ status: 'held', holdReason: 'parts' })).toBe('Held: Parts');
    expect(lineStatusText({ status: 'queued', holdReason: null })).toBe('Waiting');
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

describe(repairOrderHistory.name, () => {
  it('lists what happened, newest first', () => {
    const finding = {
      lineNo: 1,
      technicianName: 'Dana Okafor',
      createdAt: '2026-12-01T16:00:00.000Z',
      approvalRequestedAt: '2026-12-01T16:10:00.000Z',
      answeredAt: '2026-12-01T17:00:00.000Z',
      answer: 'approved',
      answeredBy: 'Nell Ashby',
    } as FindingDto;
    const history = repairOrderHistory(
      ro({ lines: [jobLine({ status: 'done', completedAt: '2026-12-01T18:00:00.000Z' })] }),
      [finding],
    );
    expect(history.map((entry) => entry.text)).toEqual([
      'L1 Replace thermostat and housing done',
      'Finding on L1 approved by Nell Ashby',
      "Approval for L1's finding e-mailed",
      'Dana Okafor reported a finding on L1',
      'Repair order written',
    ]);
  });
});
