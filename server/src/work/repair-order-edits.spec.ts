import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import {
  formatDayClockTime,
  makeVin,
  type BoardSnapshot,
  type FindingDto,
  type JobLineDto,
  type MyDay,
  type RepairOrderHistoryEntry,
  type RepairOrderSummary,
  type SignInAnswer,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrdersService } from './repair-orders.service.js';

const HOUR = 3600_000;
/** A moment as the demo shop, in Chicago, reads its clocks. */
const shopTime = (iso: string) => formatDayClockTime(iso, 'America/Chicago', '12h');

describe(`${RepairOrdersService.name} after the fact`, () => {
  let sut: TestApp;
  let advisor: string;
  let foreman: string;
  let owner: string;
  let tech: SignInAnswer;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
    put: (path: string, body: object) => sut.http().put(path).auth(token, { type: 'bearer' }).send(body),
    delete: (path: string) => sut.http().delete(path).auth(token, { type: 'bearer' }),
  });
  const audits = (entity: string, entityId: number) =>
    sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, entity), eq(auditLog.entityId, String(entityId))))
      .all();
  const ro = async (id: number) =>
    (await as(advisor).get(`/api/repair-orders/${id}`).expect(200)).body as RepairOrderSummary;
  const history = async (id: number) =>
    (await as(advisor).get(`/api/repair-orders/${id}/history`).expect(200)).body as RepairOrderHistoryEntry[];
  const write = async (
    lines = [{ title: 'Replace brake pads', bookHours: 1.5 }],
    {
      vin = '1M8GDM9AXKP042788',
      customer = { name: 'Orla Penhallow', phone: '(608) 555-0142', email: 'orla@example.test' },
    }: { vin?: string; customer?: { name: string; phone?: string; email?: string } } = {},
  ) =>
    (
      await as(advisor)
        .post('/api/repair-orders', {
          customer,
          vehicle: {
            vin,
            year: 1989,
            make: 'Tarrow',
            model: 'Kestrel',
            odometer: 50_000,
          },
          concern: 'Grinding when braking',
          promisedAt: new Date(Date.now() + 48 * HOUR).toISOString(),
          lines,
        })
        .expect(201)
    ).body as RepairOrderSummary;

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
    owner = await sut.signIn(DEMO.owner);
    tech = await sut.badge('1045');
  });
  afterAll(() => sut.close());

  it('gives each line the concern from intake, its own or the RO’s', async () => {
    const written = await write([
      { title: 'Replace brake pads', bookHours: 1.5 },
      { title: 'Check the horn', bookHours: 0.2, concern: 'Horn is weak' } as never,
    ]);
    expect(written.lines.map((line) => line.concern)).toEqual(['Grinding when braking', 'Horn is weak']);
  });

  it('edits the contact, vehicle, promise and concern, audited with what each was', async () => {
    const written = await write();
    const later = new Date(Date.now() + 72 * HOUR).toISOString();
    const { body } = await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, {
        customer: { phone: '(608) 555-0199' },
        vehicle: { plate: 'KX 2210' },
        concern: 'Grinding and a pull to the left',
        promisedAt: later,
      })
      .expect(200);
    expect(body).toMatchObject({
      customerPhone: '+16085550199',
      plate: 'KX 2210',
      concern: 'Grinding and a pull to the left',
      promisedAt: later,
    });
    expect((body as RepairOrderSummary).lines[0]!.promisedAt).toBe(later);
    const [edit] = audits('repair-order', written.id).filter((a) => a.action === 'edit');
    expect(edit!.detail).toMatchObject({
      changes: {
        customerPhone: { from: '+16085550142', to: '+16085550199' },
        vehiclePlate: { from: null, to: 'KX 2210' },
      },
    });
    await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, { promisedAt: new Date(Date.now() - HOUR).toISOString() })
      .expect(400);
    await as(tech.accessToken).patch(`/api/repair-orders/${written.id}`, { concern: 'x' }).expect(403);
  });

  it('adds, reorders and changes lines; a finished RO opens again when a line is added', async () => {
    const written = await write();
    const [first] = written.lines;
    const added = (
      await as(advisor)
        .post(`/api/repair-orders/${written.id}/lines`, { title: 'Flush brake fluid', bookHours: 0.8 })
        .expect(201)
    ).body as JobLineDto;
    expect(added).toMatchObject({ lineNo: 2, status: 'queued', concern: 'Grinding when braking' });
    const reordered = (
      await as(advisor)
        .put(`/api/repair-orders/${written.id}/line-order`, { lineIds: [added.id, first!.id] })
        .expect(200)
    ).body as RepairOrderSummary;
    expect(reordered.lines.map((line) => [line.id, line.lineNo])).toEqual([
      [added.id, 1],
      [first!.id, 2],
    ]);
    await as(advisor)
      .put(`/api/repair-orders/${written.id}/line-order`, { lineIds: [added.id] })
      .expect(400);
    const edited = (
      await as(advisor)
        .patch(`/api/job-lines/${first!.id}/details`, { bookHours: 1.8, title: 'Replace front brake pads' })
        .expect(200)
    ).body as JobLineDto;
    expect(edited).toMatchObject({ bookHours: 1.8, title: 'Replace front brake pads' });
    expect(audits('job-line', first!.id).find((a) => a.action === 'edit')!.detail).toEqual({
      changes: {
        bookHours: { from: 1.5, to: 1.8 },
        title: { from: 'Replace brake pads', to: 'Replace front brake pads' },
      },
    });
    await as(tech.accessToken).patch(`/api/job-lines/${first!.id}/details`, { bookHours: 2 }).expect(403);
  });

  it('deletes a line without time; one with clocked time answers 409 and can only be cancelled with a reason', async () => {
    const written = await write([
      { title: 'Replace brake pads', bookHours: 1.5 },
      { title: 'Written twice by mistake', bookHours: 1.5 },
    ]);
    const [timed, mistake] = written.lines;
    await as(advisor).delete(`/api/job-lines/${mistake!.id}`).expect(204);
    expect((await ro(written.id)).lines.map((line) => line.id)).toEqual([timed!.id]);

    await as(foreman).patch(`/api/job-lines/${timed!.id}`, { technicianId: tech.user.id }).expect(200);
    await as(tech.accessToken)
      .post('/api/punches', { id: randomUUID(), kind: 'job-on', jobLineId: timed!.id })
      .expect(201);
    const refused = await as(advisor).delete(`/api/job-lines/${timed!.id}`).expect(409);
    expect(refused.body.message).toBe('Time was clocked on that line: cancel it with a reason instead');
    await as(advisor).post(`/api/job-lines/${timed!.id}/cancel`, {}).expect(400);
    const cancelled = (
      await as(advisor)
        .post(`/api/job-lines/${timed!.id}/cancel`, { reason: 'Customer had it done elsewhere' })
        .expect(200)
    ).body as JobLineDto;
    expect(cancelled).toMatchObject({ status: 'cancelled', cancelReason: 'Customer had it done elsewhere' });
    const day = (await as(tech.accessToken).get('/api/me/day').expect(200)).body;
    expect(day.openJobLineIds).not.toContain(timed!.id);
    // Nothing is left open: the RO's work is done, and it says so.
    expect((await ro(written.id)).status).toBe('done');
    expect(audits('repair-order', written.id).map((a) => a.action)).toContain('line-removed');
  });

  it('keeps the RO status by its lines everywhere, and closes it at pick-up, freeing the bay live (bug 3)', async () => {
    const written = await write();
    const [line] = written.lines;
    const board = sut.connect(foreman);
    await nextEvent(board, 'board.snapshot');
    const bay = ((await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot).bays.find(
      (b) => b.state === 'free',
    )!;
    await as(foreman)
      .patch(`/api/job-lines/${line!.id}`, { technicianId: tech.user.id, bayId: bay.id })
      .expect(200);
    await as(advisor).post(`/api/repair-orders/${written.id}/close`).expect(409);
    await as(tech.accessToken)
      .post(`/api/job-lines/${line!.id}/done`, {
        next: 'ready',
        cause: 'Pads worn to the wear bar',
        correction: 'Fitted new pads',
      })
      .expect(200);
    expect((await ro(written.id)).status).toBe('done');
    const listed = (await as(advisor).get('/api/repair-orders?status=done&q=Penhallow').expect(200)).body;
    expect(listed.items.map((r: RepairOrderSummary) => r.id)).toContain(written.id);

    const freed = nextEvent(board, 'bay.updated', ({ bay: b }) => b.id === bay.id && b.state === 'free');
    const closed = (await as(advisor).post(`/api/repair-orders/${written.id}/close`).expect(200))
      .body as RepairOrderSummary;
    expect(closed).toMatchObject({ status: 'closed' });
    expect(Date.parse(closed.closedAt!)).toBeGreaterThan(Date.now() - 60_000);
    expect((await freed).bay).toMatchObject({ state: 'free', repairOrder: null });
    await as(advisor).post(`/api/repair-orders/${written.id}/close`).expect(409);
    await as(advisor)
      .post(`/api/repair-orders/${written.id}/lines`, { title: 'More', bookHours: 1 })
      .expect(409);
  });

  it('shows an edited vehicle on the wall and the kiosk at once, in the bays that hold its RO and no other', async () => {
    const inBay = await write(undefined, { vin: makeVin('1M8GDM9AKP042793') });
    const inCheck = await write(undefined, { vin: makeVin('1M8GDM9AKP042794') });
    const board = sut.connect(foreman);
    await nextEvent(board, 'board.snapshot');
    const [working, parked] = [
      (await as(owner).post('/api/bays', { name: 'Bay 31' }).expect(201)).body as { id: number },
      (await as(owner).post('/api/bays', { name: 'Bay 32' }).expect(201)).body as { id: number },
    ];
    await as(foreman)
      .patch(`/api/job-lines/${inBay.lines[0]!.id}`, { technicianId: tech.user.id, bayId: working!.id })
      .expect(200);
    await as(foreman)
      .patch(`/api/job-lines/${inCheck.lines[0]!.id}`, { technicianId: tech.user.id, bayId: parked!.id })
      .expect(200);
    // Done and waiting for the final check: the bay holds the RO with no open line.
    await as(tech.accessToken)
      .post(`/api/job-lines/${inCheck.lines[0]!.id}/done`, {
        next: 'check',
        cause: 'Horn relay stuck open',
        correction: 'Replaced the horn relay',
      })
      .expect(200);
    const published: number[] = [];
    board.on('bay.updated', ({ bay }) => published.push(bay.id));
    const boardBay = async (id: number) =>
      ((await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot).bays.find(
        (b) => b.id === id,
      )!;
    expect(await boardBay(working!.id)).toMatchObject({ vehicle: '1989 Tarrow Kestrel', state: 'staged' });
    expect(await boardBay(parked!.id)).toMatchObject({ vehicle: '1989 Tarrow Kestrel', state: 'check' });

    for (const [order, bay, vehicle] of [
      [inBay, working!, { year: 1991, make: 'Ostrander', model: 'Pelican Crew Cab' }],
      [inCheck, parked!, { make: 'Halvard' }],
    ] as const) {
      published.length = 0;
      const told = nextEvent(board, 'bay.updated', ({ bay: b }) => b.id === bay.id);
      await as(advisor).patch(`/api/repair-orders/${order.id}`, { vehicle }).expect(200);
      const expected = (await ro(order.id)).vehicle;
      expect((await told).bay).toMatchObject({ vehicle: expected, repairOrder: { id: order.id } });
      expect(await boardBay(bay.id)).toMatchObject({ vehicle: expected });
      // The change's messages leave together: no other bay's tile changed.
      await new Promise((resolve) => setTimeout(resolve, 100));
      expect(published).toEqual([bay.id]);
    }
    const day = (await as(tech.accessToken).get('/api/me/day').expect(200)).body as MyDay;
    expect(day.lines.find((l) => l.id === inBay.lines[0]!.id)).toMatchObject({
      vehicle: '1991 Ostrander Pelican Crew Cab',
    });
    expect(day.finalChecks.find((c) => c.bayId === parked!.id)).toMatchObject({
      vehicle: '1989 Halvard Kestrel',
    });
  });

  it('the seeded RO with every line done shows Work done, not Open (bug 3)', async () => {
    const board = (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
    const inCheck = board.bays.find((b) => b.state === 'check')!;
    expect((await ro(inCheck.repairOrder!.id)).status).toBe('done');
  });

  it('writes reassignments, who finished each line, notices and answers into the history (bug 10)', async () => {
    const written = await write();
    const [line] = written.lines;
    const luis = await sut.badge('1042');
    await as(foreman).patch(`/api/job-lines/${line!.id}`, { technicianId: tech.user.id }).expect(200);
    await as(foreman).patch(`/api/job-lines/${line!.id}`, { technicianId: luis.user.id }).expect(200);
    await as(luis.accessToken)
      .post(`/api/job-lines/${line!.id}/done`, {
        next: 'ready',
        cause: 'Pads worn to the wear bar',
        correction: 'Fitted new pads',
      })
      .expect(200);
    await as(advisor).post(`/api/repair-orders/${written.id}/ready-notice`).expect(202);
    const texts = (await history(written.id)).map((entry) => `${entry.actorName}: ${entry.text}`);
    expect(texts).toEqual([
      'Nell Ashby: Repair order written',
      'Theo Varga: Line 1 “Replace brake pads” assigned to Jo W.',
      'Theo Varga: Line 1 “Replace brake pads” reassigned from Jo W. to Luis B.',
      'Luis Brennan: Line 1 “Replace brake pads” done: Fitted new pads',
      'Nell Ashby: Ready notice sent by e-mail to orla@example.test and by text to (608) 555-0142',
    ]);
    const done = (await ro(written.id)).lines[0]!;
    expect(done).toMatchObject({
      completedBy: luis.user.id,
      cause: 'Pads worn to the wear bar',
      correction: 'Fitted new pads',
    });
    await as(owner).get(`/api/repair-orders/${written.id}/history`).expect(200);
    await as(tech.accessToken).get(`/api/repair-orders/${written.id}/history`).expect(403);
  });
  it('tells each edit in words, with what the field was and what it is now', async () => {
    // A vehicle of its own: the odometer it leaves on file is no other test's.
    const written = await write(undefined, { vin: makeVin('1M8GDM9AKP042791') });
    const [line] = written.lines;
    await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, {
        customer: { phone: '(608) 555-0199' },
        vehicle: { model: 'Kestrel GT', odometer: 50_600 },
        concern: 'Grinding and a pull to the left',
      })
      .expect(200);
    const later = new Date(Date.now() + 72 * HOUR).toISOString();
    await as(advisor).patch(`/api/repair-orders/${written.id}`, { promisedAt: later }).expect(200);
    await as(advisor).patch(`/api/repair-orders/${written.id}`, { promisedAt: null }).expect(200);
    await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, {
        concern: 'Grinding and a pull to the left under hard braking,\nworse downhill with a trailer on',
      })
      .expect(200);
    await as(advisor).patch(`/api/job-lines/${line!.id}/details`, { bookHours: 1.8 }).expect(200);
    await as(advisor)
      .patch(`/api/job-lines/${line!.id}/details`, {
        title: 'Replace front brake pads',
        bookHours: 2,
        concern: 'Grinding from the front',
      })
      .expect(200);
    await as(advisor).patch(`/api/job-lines/${line!.id}/details`, { bookHours: 2.2 }).expect(200);
    const texts = (await history(written.id)).map((entry) => entry.text);
    expect(texts).toEqual([
      'Repair order written',
      'Details changed: phone (608) 555-0142 → (608) 555-0199; model Kestrel → Kestrel GT; odometer 50,000 → 50,600; ' +
        'concern “Grinding when braking” → “Grinding and a pull to the left”',
      `Details changed: promise ${shopTime(written.promisedAt!)} → ${shopTime(later)}`,
      `Details changed: promise ${shopTime(later)} → none`,
      // A long concern on one line, cut at a word.
      'Details changed: concern “Grinding and a pull to the left” → ' +
        '“Grinding and a pull to the left under hard braking, worse…”',
      // The line as it was called when the entry was made, not by today's title.
      'Line 1 “Replace brake pads” changed: book time 1.5\u00a0h → 1.8\u00a0h',
      'Line 1 “Replace front brake pads” changed: title “Replace brake pads” → “Replace front brake pads”; ' +
        'book time 1.8\u00a0h → 2.0\u00a0h; concern “Grinding when braking” → “Grinding from the front”',
      'Line 1 “Replace front brake pads” changed: book time 2.0\u00a0h → 2.2\u00a0h',
    ]);
  });

  it('tells sign-offs, parts and cancellations on its lines, and how a customer who takes texts only was asked and told', async () => {
    const written = await write(
      [
        { title: 'Check the horn', bookHours: 0.2 },
        { title: 'Replace brake pads', bookHours: 1.5 },
      ],
      { vin: makeVin('1M8GDM9AKP042790'), customer: { name: 'Cato Merriweather', phone: '(608) 555-0177' } },
    );
    const [horn, brakes] = written.lines;
    const expected = new Date(Date.now() + 30 * HOUR).toISOString();
    const finding = (
      await sut
        .http()
        .post(`/api/job-lines/${horn!.id}/findings`)
        .auth(foreman, { type: 'bearer' })
        .field('note', 'Horn relay clicks, horn silent')
        .field('severity', 'soon')
        .expect(201)
    ).body as FindingDto;
    await as(advisor)
      .patch(`/api/findings/${finding.id}/quote`, {
        customerWording: 'The horn relay has failed and should be replaced',
        bookHours: 0.4,
      })
      .expect(200);
    await as(advisor).post(`/api/findings/${finding.id}/request-approval`).expect(201);
    await as(advisor)
      .post(`/api/findings/${finding.id}/answer`, { answer: 'declined', channel: 'phone' })
      .expect(200);
    await as(foreman).patch(`/api/job-lines/${horn!.id}`, { status: 'done' }).expect(200);
    await as(foreman)
      .post(`/api/job-lines/${horn!.id}/sign-off`, { reason: 'Horn relay swapped at the counter' })
      .expect(200);
    await as(foreman)
      .post(`/api/job-lines/${brakes!.id}/hold`, { reason: 'parts', part: 'Front brake pads' })
      .expect(200);
    await as(advisor)
      .put(`/api/job-lines/${brakes!.id}/parts`, {
        part: 'Front brake pads',
        state: 'ordered',
        supplier: 'Lakeside Parts',
        expectedAt: expected,
      })
      .expect(200);
    await as(advisor).post(`/api/job-lines/${brakes!.id}/parts/received`).expect(200);
    await as(advisor)
      .post(`/api/job-lines/${brakes!.id}/cancel`, { reason: 'Customer had it done elsewhere' })
      .expect(200);
    await as(advisor).post(`/api/repair-orders/${written.id}/ready-notice`).expect(202);
    const texts = (await history(written.id)).map((entry) => `${entry.actorName}: ${entry.text}`);
    expect(texts).toEqual([
      'Nell Ashby: Repair order written',
      'Theo Varga: Finding reported on line 1 “Check the horn”',
      'Nell Ashby: Approval request for the finding on line 1 “Check the horn” sent by text to (608) 555-0177',
      'Nell Ashby: Finding declined',
      'Theo Varga: Line 1 “Check the horn” marked done',
      'Theo Varga: Line 1 “Check the horn” signed off: Horn relay swapped at the counter',
      'Theo Varga: Line 2 “Replace brake pads” held: Parts',
      `Nell Ashby: Line 2 “Replace brake pads” parts recorded: Front brake pads · Ordered · Lakeside Parts · due ${shopTime(expected)}`,
      'Nell Ashby: Line 2 “Replace brake pads” parts received: back in the queue',
      'Nell Ashby: Line 2 “Replace brake pads” cancelled: Customer had it done elsewhere',
      'Nell Ashby: Ready notice sent by text to (608) 555-0177',
    ]);
  });

  describe('refusing an edit of a field someone changed since it was read', () => {
    const writeTwo = () =>
      write(
        [
          { title: 'Inspect front suspension', bookHours: 0.8 },
          { title: 'Replace sway bar links', bookHours: 1.1 },
        ],
        { customer: { name: 'Ysolde Marrick', phone: '(608) 555-0171' } },
      );
    const edits = (entity: string, entityId: number) =>
      audits(entity, entityId).filter((entry) => entry.action === 'edit');

    it('refuses an RO edit of a field someone changed since it was read, storing nothing of it', async () => {
      const written = await writeTwo();
      await as(advisor)
        .patch(`/api/repair-orders/${written.id}`, {
          concern: 'Rattle and a clunk',
          was: { concern: 'Grinding when braking' },
        })
        .expect(200);
      const refused = await as(owner)
        .patch(`/api/repair-orders/${written.id}`, {
          concern: 'Only a rattle',
          vehicle: { plate: 'RM 4410' },
          was: { concern: 'Grinding when braking', vehicle: { plate: written.plate } },
        })
        .expect(409);
      expect(refused.body.message).toBe(
        `Someone else changed the concern of RO ${written.number} since you opened it: reload to see their change`,
      );
      expect(await ro(written.id)).toMatchObject({ concern: 'Rattle and a clunk', plate: written.plate });
      expect(edits('repair-order', written.id)).toHaveLength(1);

      // Another field read at the same time is no conflict; without `was`, as it always was.
      await as(owner)
        .patch(`/api/repair-orders/${written.id}`, {
          vehicle: { plate: 'RM 4410' },
          was: { vehicle: { plate: written.plate } },
        })
        .expect(200);
      const unchecked = (
        await as(owner).patch(`/api/repair-orders/${written.id}`, { concern: 'Only a rattle' }).expect(200)
      ).body as RepairOrderSummary;
      expect(unchecked).toMatchObject({ concern: 'Only a rattle', plate: 'RM 4410' });
    });

    it('compares a phone, an e-mail and a promise as stored, whatever their spelling', async () => {
      const written = await writeTwo();
      const promise = new Date(Date.now() + 72 * HOUR).toISOString();
      await as(advisor)
        .patch(`/api/repair-orders/${written.id}`, {
          customer: { phone: '608-555-0199', email: 'Ysolde@Example.test' },
          promisedAt: promise,
          was: { customer: { phone: '(608) 555-0171', email: null }, promisedAt: written.promisedAt },
        })
        .expect(200);
      // Read back as the office shows them: another spelling of the same phone, e-mail and instant.
      await as(owner)
        .patch(`/api/repair-orders/${written.id}`, {
          concern: 'Rattle over bumps, front left',
          was: {
            customer: { phone: '(608) 555-0199', email: 'ysolde@example.test' },
            promisedAt: promise.replace('Z', '+00:00'),
            concern: 'Grinding when braking',
          },
        })
        .expect(200);
    });

    it('refuses a line edit of a field someone changed since it was read, storing nothing of it', async () => {
      const written = await writeTwo();
      const line = written.lines[0]!;
      await as(advisor)
        .patch(`/api/job-lines/${line.id}/details`, { bookHours: 1.2, was: { bookHours: 0.8 } })
        .expect(200);
      const refused = await as(owner)
        .patch(`/api/job-lines/${line.id}/details`, {
          bookHours: 0.5,
          title: 'Look at the front end',
          was: { bookHours: 0.8, title: 'Inspect front suspension' },
        })
        .expect(409);
      expect(refused.body.message).toBe(
        'Someone else changed the book hours of line 1 since you opened it: reload to see their change',
      );
      expect((await ro(written.id)).lines[0]).toMatchObject({
        bookHours: 1.2,
        title: 'Inspect front suspension',
      });
      expect(edits('job-line', line.id)).toHaveLength(1);

      // Another field read at the same time is no conflict; without `was`, as it always was.
      await as(owner)
        .patch(`/api/job-lines/${line.id}/details`, {
          title: 'Look at the front end',
          was: { title: 'Inspect front suspension' },
        })
        .expect(200);
      const unchecked = (
        await as(owner).patch(`/api/job-lines/${line.id}/details`, { bookHours: 0.5 }).expect(200)
      ).body as JobLineDto;
      expect(unchecked).toMatchObject({ bookHours: 0.5, title: 'Look at the front end' });
    });

    it('takes a line edit read before the foreman assigned the line and its technician clocked on', async () => {
      const written = await writeTwo();
      const line = written.lines[1]!;
      await as(foreman).patch(`/api/job-lines/${line.id}`, { technicianId: tech.user.id }).expect(200);
      // On shift in the demo shop already.
      await as(tech.accessToken)
        .post('/api/punches', { id: randomUUID(), kind: 'job-on', jobLineId: line.id })
        .expect(201);
      const saved = (
        await as(advisor)
          .patch(`/api/job-lines/${line.id}/details`, {
            title: 'Replace both sway bar links',
            was: { title: 'Replace sway bar links' },
          })
          .expect(200)
      ).body as JobLineDto;
      expect(saved).toMatchObject({ title: 'Replace both sway bar links', status: 'working' });
    });
  });
});
