import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  BoardSnapshot,
  DispatchBoard,
  MailboxEntry,
  Page,
  RepairOrderHistoryEntry,
  RepairOrderSummary,
} from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, signInAtKiosk, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

// 49 CFR 565.15 worked example: check digit X; model year code K.
const VIN = '1M8GDM9AXKP042788';
const TITLE = 'Replace front brake pads and rotors';

describe('the whole visit, from intake to pick-up', () => {
  let server: RunningServer;
  let office: BrowserContext;
  let foremanDesk: BrowserContext;
  let kiosks: BrowserContext;
  let owner: Api;
  beforeAll(async () => {
    server = await startServer();
    office = await openBrowser({ width: 1600, height: 1000 });
    foremanDesk = await openBrowser({ width: 1600, height: 1000 });
    kiosks = await openBrowser();
    owner = await apiAs(server, 'owner@marlowcreek.test');
  });
  afterAll(async () => {
    await office?.close();
    await foremanDesk?.close();
    await kiosks?.close();
    await server?.stop();
  });

  it('intake, dispatch, clock on, Done with cause and correction, final check, ready notice and pick-up, live on the wall', async () => {
    const wall = await office.newPage();
    await wall.setViewportSize({ width: 1920, height: 1080 });
    await openWall(wall, server);
    const bay8 = bayTile(wall, 'Bay 8');
    const bayShows = (word: RegExp) => expect.poll(() => bay8.textContent(), { timeout: 3000 }).toMatch(word);
    await bayShows(/free/i);

    // Intake.
    const advisor = await office.newPage();
    await signInAtOffice(advisor, server, 'advisor@marlowcreek.test');
    await advisor.goto(`${server.url}/repair-orders/new`);
    await advisor.getByLabel('Name').fill('Imogen Starke');
    await advisor.getByLabel('Phone').fill('(608) 555-0177');
    await advisor.getByLabel('E-mail').fill('imogen@example.test');
    await advisor.getByLabel('VIN').fill(VIN);
    await advisor.getByLabel('Make').fill('Tarrow');
    await advisor.getByLabel(/^Model\s*\*?$/).fill('Kestrel');
    await advisor.getByLabel(/Odometer/).fill('88100');
    await advisor.getByLabel('What the customer asked for').fill('Grinding from the front when braking');
    const line1 = advisor.getByRole('group', { name: 'Line 1' });
    await line1.getByPlaceholder(/Search the menu/).fill(TITLE);
    await line1.getByLabel('Book hours').fill('1.5');
    await advisor.getByRole('button', { name: 'Write repair order' }).click();
    await advisor.waitForURL(/\/repair-orders\/\d+$/);
    const roId = Number(new URL(advisor.url()).pathname.split('/').pop());
    const ro = await owner<RepairOrderSummary>('GET', `/repair-orders/${roId}`);

    // A line added by mistake: Delete asks first, Escape keeps the line, the confirm takes it off the RO.
    await advisor.getByRole('button', { name: 'Add a job line' }).click();
    const adding = advisor.getByRole('dialog');
    await adding.getByRole('textbox', { name: 'Job' }).fill('Replace wiper blades');
    await adding.getByLabel('Book hours').fill('0.3');
    await adding.getByRole('button', { name: 'Add line' }).click();
    await adding.waitFor({ state: 'detached' });
    const extra = advisor.getByRole('row', { name: /Replace wiper blades/ });
    const deleting = advisor.getByRole('dialog', { name: 'Delete line 2 “Replace wiper blades”?' });
    await extra.getByRole('button', { name: 'Delete…' }).click();
    await deleting.getByText(/It has no clocked time, so it leaves the RO/).waitFor();
    await expect
      .poll(() => advisor.evaluate(() => !!document.activeElement?.closest('[role="dialog"]')))
      .toBe(true);
    await advisor.keyboard.press('Escape');
    await deleting.waitFor({ state: 'detached' });
    expect(await extra.count()).toBe(1);
    await extra.getByRole('button', { name: 'Delete…' }).click();
    await deleting.getByRole('button', { name: 'Delete the line' }).click();
    await extra.waitFor({ state: 'detached' });

    // Dispatch: Bay 8 and Jo, from the foreman's Move menu.
    const foreman = await foremanDesk.newPage();
    await signInAtOffice(foreman, server, 'foreman@marlowcreek.test');
    await foreman.goto(`${server.url}/dispatch`);
    const menuFor = new RegExp(`Move line 1, .*RO ${ro.number}`);
    await foreman.getByRole('button', { name: menuFor }).first().click();
    await foreman.getByRole('menuitem', { name: 'Bay' }).click();
    await foreman.getByRole('menuitemradio', { name: /^Bay 8/ }).click();
    await bayShows(/staged/i);
    await foreman.getByRole('button', { name: menuFor }).first().click();
    await foreman.getByRole('menuitemradio', { name: /Jo Whitfield/ }).click();

    // Jo clocks on at the kiosk, then marks it done with cause and correction.
    const jo = await kiosks.newPage();
    await signInAtKiosk(jo, server, '1045');
    const card = jo.locator('li', { hasText: TITLE });
    await card.getByText('Concern: Grinding from the front when braking').waitFor();
    await card.getByRole('button', { name: /^Clock on/ }).click();
    await bayShows(/working/i);
    await card.getByRole('button', { name: 'Done' }).click();
    await jo.getByLabel('Cause: what you found').fill('Pads worn to the backing plate, rotors scored');
    await jo.getByLabel('Correction: what you did').fill('Fitted new pads and rotors, road tested');
    await jo.screenshot({ path: screenshotPath('visit-kiosk-done') });
    await jo.getByRole('button', { name: /Final QC next/ }).click();
    await bayShows(/final qc/i);

    // The final check, on the kiosk.
    await jo.getByRole('button', { name: /Final QC done: Bay 8/ }).click();
    await bayShows(/ready/i);
    await wall.screenshot({ path: screenshotPath('visit-wall-ready') });

    // The ready notice, from the RO page, reaches the local SMTP server.
    await advisor.getByRole('button', { name: 'Tell the customer: vehicle ready' }).click();
    await advisor
      .getByText('Ready notice sent by e-mail to imogen@example.test and by text to (608) 555-0177.')
      .waitFor();
    await expect
      .poll(
        async () =>
          (await owner<Page<MailboxEntry>>('GET', '/mailbox')).items.find((m) =>
            m.subject.includes(`is ready (RO ${ro.number})`),
          ),
        { timeout: 20_000 },
      )
      .toMatchObject({ to: ['imogen@example.test'] });

    // A reading corrected below the vehicle's highest is saved once the advisor says why, as at intake.
    await advisor.getByRole('button', { name: 'Edit details' }).click();
    const edit = advisor.getByRole('dialog');
    // Someone changes the phone while this dialog is open: saving the reading keeps their change.
    await owner('PATCH', `/repair-orders/${roId}`, { customer: { phone: '(608) 555-0113' } });
    await edit.getByLabel('Odometer').fill('8810');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit
      .getByText(
        'Lower than the highest reading on record (88,100): check it, or give a reason to save anyway',
      )
      .waitFor();
    await edit.getByLabel('Reading is right? Say why it is lower').fill('An extra digit was typed at intake');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit.waitFor({ state: 'detached' });

    // Pick-up closes the RO and frees the bay; a closed RO's details and lines stay as they are.
    await expect
      .poll(() => advisor.getByRole('button', { name: 'Edit', exact: true }).count())
      .toBeGreaterThan(0);
    await advisor.getByRole('button', { name: 'Vehicle picked up: close the RO' }).click();
    const closing = advisor.getByRole('dialog', { name: `Close RO ${ro.number} as picked up?` });
    await closing.getByText(/its lines can no longer be worked or changed; Bay 8 is free/).waitFor();
    await closing.getByRole('button', { name: 'Close the RO' }).click();
    await advisor.getByText('Picked up: this repair order is closed.').waitFor();
    expect(await advisor.getByRole('button', { name: 'Edit details' }).count()).toBe(0);
    expect(await advisor.getByRole('button', { name: 'Edit', exact: true }).count()).toBe(0);
    await bayShows(/free/i);
    await advisor.screenshot({ path: screenshotPath('visit-ro-closed') });

    const closed = await owner<RepairOrderSummary>('GET', `/repair-orders/${roId}`);
    expect(closed).toMatchObject({
      status: 'closed',
      odometer: 8810,
      customerPhone: '+16085550113',
      lines: [
        {
          status: 'done',
          concern: 'Grinding from the front when braking',
          cause: 'Pads worn to the backing plate, rotors scored',
          correction: 'Fitted new pads and rotors, road tested',
        },
      ],
    });
    const history = await owner<RepairOrderHistoryEntry[]>('GET', `/repair-orders/${roId}/history`);
    expect(history.map((entry) => entry.text)).toEqual(
      expect.arrayContaining([
        `Line 1 “${TITLE}” moved to Bay 8`,
        `Line 1 “${TITLE}” assigned to Jo W.`,
        `Line 1 “${TITLE}” done: Fitted new pads and rotors, road tested`,
        'Final QC recorded in Bay 8',
        'Ready notice sent by e-mail to imogen@example.test and by text to (608) 555-0177',
        'Vehicle picked up: repair order closed',
      ]),
    );
    const board = await owner<BoardSnapshot>('GET', '/board');
    expect(board.bays.find((b) => b.name === 'Bay 8')).toMatchObject({ state: 'free', repairOrder: null });
    const dispatch = await owner<DispatchBoard>('GET', '/dispatch');
    expect(dispatch.bays.find((b) => b.name === 'Bay 8')!.state).toBe('free');
  });
});
