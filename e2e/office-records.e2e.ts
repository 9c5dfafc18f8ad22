import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFinished } from 'vitest';
import {
  shopDayKey,
  shopLocalInstant,
  workweekOf,
  type Page as ListPage,
  type RepairOrderSummary,
  type ShopSettings,
  type Timecard,
  type TimecardPunch,
} from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

const HOUR = 3600;

describe('office records: a punch taken out, an RO edit that met another', () => {
  let server: RunningServer;
  let owner: Api;
  let foreman: Api;
  /** The foreman at the office, in a browser of this test's own (each holds one sign-in). */
  const foremanPage = async (): Promise<Page> => {
    const desk = await openBrowser({ width: 1600, height: 1000 });
    onTestFinished(() => desk.close());
    const page = await desk.newPage();
    await signInAtOffice(page, server, 'foreman@marlowcreek.test');
    return page;
  };
  beforeAll(async () => {
    server = await startServer();
    owner = await apiAs(server, 'owner@marlowcreek.test');
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await server?.stop();
  });

  it('takes a wrong clock-on out of the count with the clock-off it leaves stranded, and On jobs falls by its time', async () => {
    const shop = await owner<ShopSettings>('GET', '/shop');
    const zone = shop.timeZone;
    // Yesterday in the shop's zone: every punch is in the past, and demo lines written days before exist.
    const day = shopDayKey(new Date(Date.now() - 24 * HOUR * 1000), zone);
    const at = (time: string) => shopLocalInstant(day, time, zone).toISOString();
    const week = workweekOf(shopLocalInstant(day, '12:00', zone), shop);

    // Two demo lines from ROs written before that day began (a line can't be clocked before it exists).
    const dayStart = shopLocalInstant(day, '00:00', zone).getTime();
    const lines: RepairOrderSummary['lines'] = [];
    for (let cursor: string | null = null, pages = 0; lines.length < 2 && pages < 10; pages++) {
      const ros: ListPage<RepairOrderSummary> = await owner(
        'GET',
        `/repair-orders?status=closed&limit=50${cursor ? `&cursor=${cursor}` : ''}`,
      );
      for (const ro of ros.items)
        if (Date.parse(ro.createdAt) < dayStart && lines.length < 2) lines.push(ro.lines[0]!);
      cursor = ros.nextCursor;
      if (!cursor) break;
    }
    expect(lines).toHaveLength(2);
    const [line1, line2] = lines;

    // A technician of our own, with a short morning entered as missed punches:
    // shift 08:00–12:00, line 1 09:00–10:15 (1.25 h), line 2 10:30–11:00 (0.5 h).
    const tech = await owner<{ id: number; name: string }>('POST', '/users', {
      name: 'Ottoline Brisk',
      role: 'technician',
      badge: '90817',
      pin: '4321',
    });
    const punches: [string, string, number?][] = [
      ['shift-in', '08:00'],
      ['job-on', '09:00', line1!.id],
      ['job-off', '10:15', line1!.id],
      ['job-on', '10:30', line2!.id],
      ['job-off', '11:00', line2!.id],
      ['shift-out', '12:00'],
    ];
    for (const [kind, time, jobLineId] of punches)
      await foreman('POST', '/timecards/corrections', {
        technicianId: tech.id,
        kind,
        at: at(time),
        ...(jobLineId ? { jobLineId } : {}),
        reason: 'Paper timesheet entered',
      });

    const cardPath = `/timecards?technicianId=${tech.id}&week=${week}`;
    const before = await foreman<Timecard>('GET', cardPath);
    const counted = before.punches.filter((p) => !p.voids && p.supersededBy === null);
    const find = (kind: string, jobLineId: number) =>
      counted.find((p) => p.kind === kind && p.jobLineId === jobLineId)!;
    const wrongOn = find('job-on', line1!.id);
    const strandedOff = find('job-off', line1!.id);
    const seconds = (p: TimecardPunch, q: TimecardPunch) => (Date.parse(q.at) - Date.parse(p.at)) / 1000;
    // Worked out by hand from the punches as read: line 1 ran from its clock-on to its clock-off.
    const line1Seconds = seconds(wrongOn, strandedOff);
    const line2Seconds = seconds(find('job-on', line2!.id), find('job-off', line2!.id));
    expect(line1Seconds).toBe(1.25 * HOUR);
    expect(line2Seconds).toBe(0.5 * HOUR);
    expect(before.totals.clockedSeconds).toBe(line1Seconds + line2Seconds);
    expect(before.totals.attendanceSeconds).toBe(4 * HOUR);

    const page = await foremanPage();
    await page.goto(`${server.url}/timecards?technician=${tech.id}&week=${week}`);
    const total = (label: string) =>
      // The figure's card: its label, then the hours.
      page.getByText(label, { exact: true }).first().locator('..');
    // 1.25 h + 0.5 h on jobs.
    await expect.poll(() => total('On jobs').textContent()).toMatch(/^On jobs1\.75\s*h$/);

    const punchTable = page.getByRole('table', { name: /^Punches on / });
    // A row by its time cell: the notes on every row carry the time each punch was entered.
    const rowAt = (time: RegExp) =>
      punchTable.getByRole('row').filter({ has: page.getByRole('cell', { name: time }) });
    const onRow = rowAt(/^0?9:00( am)?$/);
    await onRow.getByRole('button', { name: /^Correct clock on at 0?9:00/ }).click();
    const dialog = page.getByRole('dialog', { name: 'Correct a punch' });
    await dialog.getByRole('radio', { name: 'Take it out: it should never have been punched' }).check();
    await dialog.getByLabel('Reason').fill('Tapped the wrong line');
    await dialog.getByRole('button', { name: 'Take punch out' }).click();
    // The clock-off at 10:15 has no clock-on left: the preview names it, and the button says so.
    await dialog.getByText(/saving it takes them out of the count/).waitFor();
    await dialog
      .getByRole('listitem')
      .filter({ hasText: /clock.off at .*10:15/i })
      .waitFor();
    await dialog.getByRole('button', { name: 'Save and take 1 punch out' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByText('Clock on taken out of the count. It stays on the card, struck through.').waitFor();

    // On the page: struck through, marked taken out, with the reason; the stranded clock-off too.
    await onRow.getByText('taken out', { exact: true }).waitFor();
    await onRow.getByText(/Taken out of the count by .*: “Tapped the wrong line”/).waitFor();
    const timeCell = onRow.getByRole('cell').first();
    expect(await timeCell.evaluate((el) => getComputedStyle(el).textDecorationLine)).toBe('line-through');
    const offRow = rowAt(/^10:15( am)?$/);
    await offRow.getByText('taken out', { exact: true }).waitFor();
    // On jobs fell by line 1's 1.25 h to line 2's 0.5 h; attendance is as it was.
    await expect.poll(() => total('On jobs').textContent()).toMatch(/^On jobs0\.5\s*h$/);
    expect(await total('Attendance').textContent()).toMatch(/^Attendance4\.0\s*h$/);
    const audit = page.getByRole('table', { name: 'Changes to this card' });
    await audit
      .getByRole('row')
      .filter({ hasText: 'Took a punch out of the count' })
      .filter({ hasText: /Clock on at .*0?9:00.*: “Tapped the wrong line”/ })
      .waitFor();
    // The clock-off it stranded is taken out with it, on record with the same reason.
    await audit
      .getByRole('row')
      .filter({ hasText: 'Took a punch out of the count' })
      .filter({ hasText: /Clock off at .*10:15.*Tapped the wrong line/ })
      .waitFor();
    await page.screenshot({ path: screenshotPath('office-records-punch-taken-out'), fullPage: true });

    // Through the API: both punches out of the count, the totals down by line 1's time, the void audited.
    const after = await foreman<Timecard>('GET', cardPath);
    expect(after.totals.clockedSeconds).toBe(before.totals.clockedSeconds - line1Seconds);
    expect(after.totals.clockedSeconds).toBe(0.5 * HOUR);
    expect(after.totals.attendanceSeconds).toBe(before.totals.attendanceSeconds);
    const byId = new Map(after.punches.map((p) => [p.id, p]));
    // Each is superseded by a voiding row of its own, which names it and keeps the reason.
    const voidingOf = (id: string) => after.punches.find((p) => p.voids && p.supersedes === id);
    expect(voidingOf(wrongOn.id)).toMatchObject({ voids: true, reason: 'Tapped the wrong line' });
    expect(voidingOf(strandedOff.id)).toMatchObject({ voids: true, supersedes: strandedOff.id });
    expect(byId.get(wrongOn.id)!.supersededBy).toBe(voidingOf(wrongOn.id)!.id);
    expect(byId.get(strandedOff.id)!.supersededBy).toBe(voidingOf(strandedOff.id)!.id);
    expect(after.jobs.map((job) => job.jobLineId)).toEqual([line2!.id]);
    expect(after.audit).toEqual(
      expect.arrayContaining([
        expect.objectContaining({
          action: 'void',
          detail: expect.objectContaining({ kind: 'job-on', reason: 'Tapped the wrong line' }),
        }),
      ]),
    );
  });

  it('an RO edit that met another person’s concern: warned, reloaded with their words and my plate, then saved', async () => {
    // 49 CFR 565.15 worked example: check digit X.
    const ro = await owner<RepairOrderSummary>('POST', '/repair-orders', {
      customer: { name: 'Wendeline Osgar' },
      vehicle: { vin: '1M8GDM9AXKP042788', year: 2019, make: 'Tarrow', model: 'Kestrel', odometer: 51_300 },
      concern: 'Squeal from the rear on cold starts',
      lines: [{ title: 'Inspect rear brakes', bookHours: 0.5 }],
    });
    const theirConcern = 'Squeal from the rear on cold starts; customer adds a clunk over bumps';
    const myConcern = 'Squeal from the rear, worst in the morning';
    const myPlate = 'KXR 4821';

    const page = await foremanPage();
    await page.goto(`${server.url}/repair-orders/${ro.id}`);
    await page.getByRole('button', { name: 'Edit details' }).click();
    const edit = page.getByRole('dialog', { name: `Edit RO ${ro.number}` });
    await edit.getByLabel('Concern').waitFor();

    // The owner changes the concern while the dialog is open.
    await owner('PATCH', `/repair-orders/${ro.id}`, { concern: theirConcern });

    await edit.getByLabel('Concern').fill(myConcern);
    await edit.getByLabel('Plate').fill(myPlate);
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit
      .getByText(
        `Someone else changed the concern of RO ${ro.number} since you opened it: reload to see their change`,
      )
      .waitFor();
    // Nothing of mine was saved.
    expect(await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`)).toMatchObject({
      concern: theirConcern,
      plate: null,
    });

    await edit.getByRole('button', { name: 'Reload' }).click();
    await edit.getByText(`Concern now shows their change; you had typed “${myConcern}”.`).waitFor();
    await edit
      .getByText('Their change is in the form and your other changes are back: save to keep them.')
      .waitFor();
    expect(await edit.getByLabel('Concern').inputValue()).toBe(theirConcern);
    expect(await edit.getByLabel('Plate').inputValue()).toBe(myPlate);
    expect(await edit.getByRole('button', { name: 'Reload' }).count()).toBe(0);
    await page.screenshot({ path: screenshotPath('office-records-ro-reloaded') });

    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit.waitFor({ state: 'detached' });
    expect(await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`)).toMatchObject({
      concern: theirConcern,
      plate: myPlate,
    });
  });
});
