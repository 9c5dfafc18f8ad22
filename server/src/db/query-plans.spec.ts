import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RepairOrderPage } from '@baytime/shared';
import { queryPlan, statementsDuring, type RanStatement } from '../test-support/statements.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';
import { DB, SQLITE, type Db, type Sqlite } from './database.js';
import { UnitOfWork } from './unit-of-work.js';

/**
 * The hot reads use their indexes: the plans of the statements the server really runs for the floor,
 * the office lists and intake. A plan line "SCAN <table>" with no index is a read of every row.
 */
describe('query plans', () => {
  let sut: TestApp;
  let sqlite: Sqlite;
  let ran: RanStatement[];
  const planOf = (what: string, pattern: RegExp) => {
    const statement = ran.find(({ sql }) => pattern.test(sql));
    if (!statement) throw new Error(`No statement for ${what} ran`);
    return queryPlan(sqlite, statement);
  };

  beforeAll(async () => {
    sut = await startTestApp();
    sqlite = sut.app.get<Sqlite>(SQLITE);
    const owner = await sut.signIn(DEMO.owner);
    const get = async (path: string) =>
      (await sut.http().get(path).auth(owner, { type: 'bearer' }).expect(200)).body as RepairOrderPage;
    ran = await statementsDuring(sqlite, async () => {
      // The floor model reads the open lines once at start-up: build one afresh to see its reads.
      const app = sut.app;
      new FloorService(
        app.get<Db>(DB),
        app.get(UnitOfWork),
        app.get(ShopService),
        app.get(LiveService),
      ).load();
      await get('/api/dispatch');
      const first = await get('/api/repair-orders?status=closed&limit=2');
      await get(`/api/repair-orders?status=closed&limit=2&cursor=${first.nextCursor}`);
      await get('/api/repair-orders?q=farrow');
      // A third of the demo vehicles are Corvanes: a page of one is nearest walking the ROs newest first.
      await get('/api/repair-orders?q=7CV&limit=1');
      // The clocked time of lines, with a statement prepared afresh to see it.
      const lines = (await get('/api/repair-orders?limit=5')).items.flatMap((ro) =>
        ro.lines.map((l) => l.id),
      );
      new LabourService(app.get<Db>(DB), app.get(ShopService)).lineSeconds(lines, new Date());
      await get('/api/reports/labour');
      const [ro] = (await get('/api/repair-orders?limit=1')).items;
      await get(`/api/vehicles?vin=${ro!.vin}`);
      const technician = (await sut.badge('1044')).accessToken;
      await sut.http().get('/api/me/day').auth(technician, { type: 'bearer' }).expect(200);
      await sut.http().get('/api/timecards').auth(technician, { type: 'bearer' }).expect(200);
    });
  });
  afterAll(() => sut.close());

  it('open lines read the partial index of lines not done', () => {
    const plan = planOf(
      'open lines',
      /from "job_lines" .*where \("job_lines"\."status" <> \? and "job_lines"\."status" <> \?\)$/,
    );
    expect(plan).toContain('SCAN job_lines USING INDEX job_lines_open_idx');
    expect(plan).not.toContain('SCAN job_lines');
  });

  it('a technician’s punches over a time range', () => {
    expect(
      planOf('punches by technician', /where \("punches"\."technician_id" = \? and "punches"\."at" >= \?/),
    ).toContainEqual(
      expect.stringMatching(
        /^SEARCH punches USING INDEX punches_technician_id_at_idx \(technician_id=\? AND at>\?( AND at<\?)?\)$/,
      ),
    );
  });

  it('the floor’s window of a technician’s punches starts at their last shift-out, found by index', () => {
    expect(
      planOf('the last shift-out', /"punches"\."at" < \? and not punches\.voids and not exists/),
    ).toEqual(
      expect.arrayContaining([
        'SEARCH punches USING INDEX punches_technician_id_at_idx (technician_id=? AND at<?)',
        'SEARCH correction USING COVERING INDEX punches_supersedes_idx (supersedes=?)',
      ]),
    );
  });

  it('a report finds who was still on shift before its weeks through the technician index', () => {
    const plan = planOf('who was on shift', /shift\.kind in \('shift-in', 'shift-out'\)/);
    expect(plan).toEqual(
      expect.arrayContaining([
        'SEARCH shift USING INDEX punches_technician_id_at_idx (technician_id=? AND at<?)',
        'SEARCH correction USING COVERING INDEX punches_supersedes_idx (supersedes=?)',
      ]),
    );
  });

  it('the punches on given job lines', () => {
    expect(planOf('punches by job line', /from "punches" where "punches"\."job_line_id" in/)).toContainEqual(
      expect.stringMatching(
        /^SEARCH punches USING (COVERING )?INDEX punches_job_line_id_at_idx \(job_line_id=\?\)$/,
      ),
    );
  });

  it('repair orders by status, newest first, page after page, with no sort', () => {
    for (const pattern of [
      /where "repair_orders"\."status" = \? order by/,
      /"repair_orders"\."status" = \? and \("repair_orders"\."created_at", "repair_orders"\."id"\) < \(\?, \?\)/,
    ]) {
      const plan = planOf('repair orders by status', pattern);
      expect(plan[0]).toMatch(
        /^SEARCH repair_orders USING INDEX repair_orders_status_created_at_idx \(status=\?/,
      );
      expect(plan.join('\n')).not.toMatch(/TEMP B-TREE/);
    }
  });

  it('the repair-order search goes through the full-text index', () => {
    const plan = planOf('the repair-order search', /MATCH \?\) order by/);
    // "M": the MATCH constraint is handed to FTS5, which answers it from its index.
    expect(plan).toContainEqual(expect.stringMatching(/^SCAN repair_orders_search VIRTUAL TABLE INDEX 0:M/));
    expect(plan).toContain('SEARCH repair_orders USING INTEGER PRIMARY KEY (rowid=?)');
    expect(plan).not.toContain('SCAN repair_orders');
  });

  it('a search that matches many ROs walks them newest first, with no sort', () => {
    const plan = planOf('the wide repair-order search', /\+"repair_orders"\."id" IN .* order by/);
    expect(plan[0]).toMatch(/^SCAN repair_orders USING INDEX repair_orders_created_at_idx/);
    expect(plan.join('\n')).not.toMatch(/TEMP B-TREE FOR ORDER BY/);
  });

  it('the clocked time of lines reads only the shifts around their punches, through indexes', () => {
    const windows = planOf('windows around lines', /json_group_array\(distinct job_line_id\)/);
    expect(windows).toEqual(
      expect.arrayContaining([
        'SEARCH punches USING INDEX punches_job_line_id_at_idx (job_line_id=?)',
        'SEARCH shift_out USING INDEX punches_technician_id_at_idx (technician_id=? AND at<?)',
        'SEARCH correction USING COVERING INDEX punches_supersedes_idx (supersedes=?)',
      ]),
    );
    const inWindows = planOf('punches in the windows', /with recursive/);
    expect(inWindows).toEqual(
      expect.arrayContaining([
        'SEARCH punches USING INTEGER PRIMARY KEY (rowid=?)',
        'SEARCH punch USING COVERING INDEX punches_technician_id_at_idx (technician_id=? AND at>? AND at<?)',
        'SEARCH corrected USING INTEGER PRIMARY KEY (rowid=?)',
        'SEARCH correction USING INDEX punches_supersedes_idx (supersedes=?)',
      ]),
    );
    // Kept lines: the punches added since the last look, and any timed after it.
    expect(planOf('punches since the last look', /where punch\.rowid > \? or punch\.at > \?/)).toEqual(
      expect.arrayContaining([
        'SEARCH punch USING INTEGER PRIMARY KEY (rowid>?)',
        'SEARCH punch USING INDEX punches_at_idx (at>?)',
      ]),
    );
    expect([...windows, ...inWindows].join('\n')).not.toMatch(
      /SCAN (punches|punch|shift_out|corrected|correction)\b/,
    );
  });

  it('the reports read a week’s punches by time, each looked up among the corrections', () => {
    expect(planOf('punches of weeks', /"at" < \? and not exists \(select 1 from punches correction/)).toEqual(
      [
        'SEARCH punches USING INDEX punches_at_idx (at>? AND at<?)',
        'CORRELATED SCALAR SUBQUERY 1',
        'SEARCH correction USING COVERING INDEX punches_supersedes_idx (supersedes=?)',
      ],
    );
  });

  it('a technician’s week reads who shares their finished lines, and those technicians’ punches, by index', () => {
    expect(
      planOf('who clocked on lines', /select distinct "job_line_id", "technician_id" from "punches"/)[0],
    ).toBe('SEARCH punches USING INDEX punches_job_line_id_at_idx (job_line_id=?)');
    expect(planOf('punches of technicians', /"technician_id" in \(select value from json_each/)).toEqual(
      expect.arrayContaining([
        'SEARCH punches USING INDEX punches_technician_id_at_idx (technician_id=? AND at>? AND at<?)',
        'SEARCH correction USING COVERING INDEX punches_supersedes_idx (supersedes=?)',
      ]),
    );
  });

  it('the reports notice what changed past weeks from the rows added since they last looked', () => {
    expect(planOf('new punches', /where punch\.rowid > \? or punch\.at > \?/)).toEqual([
      'MULTI-INDEX OR',
      'INDEX 1',
      'SEARCH punch USING INTEGER PRIMARY KEY (rowid>?)',
      'INDEX 2',
      'SEARCH punch USING INDEX punches_at_idx (at>?)',
      'SEARCH corrected USING INDEX sqlite_autoindex_punches_1 (id=?) LEFT-JOIN',
    ]);
    expect(planOf('finished lines changed', /from finished_line_changes where seq > \?/)).toEqual(
      expect.arrayContaining(['SEARCH finished_line_changes USING INTEGER PRIMARY KEY (rowid>?)']),
    );
  });

  it('bay utilisation reads the lines not done and the lines done lately, each through its index', () => {
    const firstJobOn = [
      'CORRELATED SCALAR SUBQUERY 1',
      'SEARCH punches USING INDEX punches_job_line_id_at_idx (job_line_id=?)',
    ];
    expect(
      planOf('lines not done in bays', /"status" <> \? and \+"job_lines"\."bay_id" is not null/),
    ).toEqual(['SCAN job_lines USING INDEX job_lines_open_idx', ...firstJobOn]);
    expect(planOf('lines done in bays', /\+"job_lines"\."status" = 'done'/)).toEqual([
      'SEARCH job_lines USING INDEX job_lines_completed_at_idx (completed_at>?)',
      ...firstJobOn,
    ]);
  });

  it('a technician’s lines done today are found by the time they were finished', () => {
    expect(
      planOf('lines done today', /"job_lines"\."completed_by" = \? or "job_lines"\."technician_id" = \?/),
    ).toEqual(['SEARCH job_lines USING INDEX job_lines_completed_at_idx (completed_at>?)']);
  });

  it('a vehicle by its VIN, and its last visit', () => {
    expect(planOf('vehicle by VIN', /where "vehicles"\."vin" = \?/)).toContain(
      'SEARCH vehicles USING INDEX vehicles_vin_idx (vin=?)',
    );
    expect(planOf('last visit', /where "repair_orders"\."vehicle_id" = \?/)[0]).toBe(
      'SEARCH repair_orders USING INDEX repair_orders_vehicle_id_created_at_idx (vehicle_id=?)',
    );
  });
});
