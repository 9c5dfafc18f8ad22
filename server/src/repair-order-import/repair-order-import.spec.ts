import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  makeVin,
  type BoardSnapshot,
  repairOrderImportTemplate,
  RO_IMPORT_COLUMNS,
  type RepairOrderImportResult,
  type RepairOrderSummary,
} from '@baytime/shared';
import { countRows, DB, type Db } from '../db/database.js';
import { jobLines, repairOrders } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrderImportService } from './repair-order-import.service.js';

const HEADER = RO_IMPORT_COLUMNS.join(',');
const VIN_A = makeVin('2HGFE2F5M1234567');
const VIN_B = makeVin('4T1BK1EBN7654321');

/** Two ROs: A with two lines, B with one. */
function twoRos(bookHoursOfB = '1.2', vinOfB = VIN_B): string {
  return [
    HEADER,
    `IMP-A,Tamsin Oakridge,608-555-0111,,${VIN_A},2021,Corvane,Ridgeback,,30500,"Noise over bumps, front left",,Inspect front suspension,0.9`,
    `IMP-A,,,,,,,,,,,,Replace sway bar links,1.1`,
    `IMP-B,Ilse Varga,,ilse@example.test,${vinOfB},2022,Halvard,Tessel,QRT 88,12000,Oil change due,,Oil and filter service,${bookHoursOfB}`,
  ].join('\n');
}

describe(RepairOrderImportService.name, () => {
  let sut: TestApp;
  let db: Db;
  let advisor: string;

  const send = async (path: string, csv: string, status = 200) =>
    (await sut.http().post(path).auth(advisor, { type: 'bearer' }).send({ csv }).expect(status))
      .body as RepairOrderImportResult;
  const stored = () => ({ ros: countRows(db, repairOrders), lines: countRows(db, jobLines) });

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    advisor = await sut.signIn(DEMO.advisor);
  });
  afterAll(() => sut.close());

  it('previews a file without saving anything, with each error at its row and column', async () => {
    const before = stored();
    const preview = await send('/api/repair-order-imports/preview', twoRos('lots', 'NOTAVIN'));
    expect(stored()).toEqual(before);
    expect(preview.saved).toBe(false);
    expect(preview.repairOrders.map((ro) => [ro.externalRef, ro.outcome, ro.rows, ro.lines])).toEqual([
      ['IMP-A', 'new', [2, 3], 2],
      ['IMP-B', 'refused', [4], 1],
    ]);
    expect(preview.repairOrders[0]).toMatchObject({ repairOrderId: null, number: null, bookHours: 2 });
    expect(preview.repairOrders[1]!.errors).toEqual([
      { row: 4, column: 'book_hours', message: 'Write a plain number, like 2.5' },
    ]);
    const badVin = await send('/api/repair-order-imports/preview', twoRos('1.2', 'NOTAVIN'));
    expect(badVin.repairOrders[1]!.errors.map((e) => [e.row, e.column])).toEqual([[4, 'vin']]);
  });

  it('finds in the preview what only the save would refuse: an odometer below the last visit', async () => {
    const vin = makeVin('5YJ3E1EAPF000001');
    const visit = (ref: string, odometer: number) =>
      [
        HEADER,
        `${ref},Bram Keel,,,${vin},2023,Halvard,Morrow,,${odometer},Check engine light,,Diagnose,1`,
      ].join('\n');
    await send('/api/repair-order-imports', visit('IMP-ODO-1', 52_000), 201);
    const csv = visit('IMP-ODO-2', 10);
    const preview = await send('/api/repair-order-imports/preview', csv);
    expect(preview.repairOrders[0]!.outcome).toBe('refused');
    expect(preview.repairOrders[0]!.errors[0]).toMatchObject({ row: 2, column: 'odometer' });
  });

  it('saves the good ROs with their lines and nothing of an RO with a bad row', async () => {
    const before = stored();
    const result = await send('/api/repair-order-imports', twoRos('-3'), 201);
    expect(result.repairOrders.map((ro) => [ro.externalRef, ro.outcome])).toEqual([
      ['IMP-A', 'new'],
      ['IMP-B', 'refused'],
    ]);
    expect(result.repairOrders[1]!.errors).toEqual([
      { row: 4, column: 'book_hours', message: 'Book hours is at least 0.1' },
    ]);
    expect(stored()).toEqual({ ros: before.ros + 1, lines: before.lines + 2 });
    const a = (
      await sut
        .http()
        .get(`/api/repair-orders/${result.repairOrders[0]!.repairOrderId}`)
        .auth(advisor, { type: 'bearer' })
    ).body as RepairOrderSummary;
    expect(a).toMatchObject({ externalRef: 'IMP-A', customerName: 'Tamsin Oakridge', vin: VIN_A });
    expect(a.lines.map((line) => [line.title, line.bookHours])).toEqual([
      ['Inspect front suspension', 0.9],
      ['Replace sway bar links', 1.1],
    ]);

    const again = await send('/api/repair-order-imports', twoRos(), 201);
    expect(again.repairOrders.map((ro) => [ro.externalRef, ro.outcome])).toEqual([
      ['IMP-A', 'known'],
      ['IMP-B', 'new'],
    ]);
    expect(stored()).toEqual({ ros: before.ros + 2, lines: before.lines + 3 });
  });

  it('puts the new lines on the floor', async () => {
    const csv = [
      HEADER,
      `IMP-FLOOR,Nell Draycott,,,${makeVin('1FTEW1EPMKA11111')},2021,Corvane,Hauler,,8000,Tyres,,Rotate tyres,0.5`,
    ].join('\n');
    const result = await send('/api/repair-order-imports', csv, 201);
    const foreman = await sut.signIn(DEMO.foreman);
    const board = await sut.http().get('/api/board').auth(foreman, { type: 'bearer' }).expect(200);
    const queued = (board.body as BoardSnapshot).queue;
    expect(queued.map((line) => line.repairOrderNumber)).toContain(result.repairOrders[0]!.number);
  });

  it('reports a file it cannot read at the row, and a missing column', async () => {
    const broken = await send('/api/repair-order-imports/preview', `${HEADER}\nIMP-Q,"unclosed,quote`);
    expect(broken.fileErrors).toHaveLength(1);
    expect(broken.fileErrors[0]!.message).toMatch(/^The file is not valid CSV: /);
    const missing = await send('/api/repair-order-imports/preview', 'ro_ref,customer_name\nX,Y');
    expect(missing.fileErrors.map((e) => e.column)).toEqual([
      'vin',
      'year',
      'make',
      'model',
      'odometer',
      'concern',
      'line_title',
      'book_hours',
    ]);
    expect(missing.repairOrders).toEqual([]);
  });

  it('reads its own template', async () => {
    const preview = await send('/api/repair-order-imports/preview', repairOrderImportTemplate());
    expect(preview.fileErrors).toEqual([]);
    expect(preview.repairOrders.map((ro) => [ro.externalRef, ro.outcome, ro.lines])).toEqual([
      ['EXT-1001', 'new', 2],
    ]);
  });
});
