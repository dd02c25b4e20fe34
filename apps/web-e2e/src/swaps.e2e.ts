import {
  type AssignmentGridDto,
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  type RosterPeriodDto,
  SOLVING_ROUTES,
} from '@rotaplex/contracts';
import { apiCall, managerPeriod, shiftIdsByCode, staffIdLookup } from './support/api';
import { openBrowser, signIn, unnamedControls, type Session } from './support/browser';
import { linkFromMailbox } from './support/mailbox';

/**
 * Issue 5, item 3: staff A (Robin Tallis) proposes a swap of a published shift in the app, staff B
 * (Priya Wendover) accepts through the link in the e-mail caught by the local mail catcher (no
 * sign-in), and the ward manager approves through the link in their e-mail. The roster then holds
 * the swapped cells. The manager publishes a one-week roster of its own through the API first.
 * Demo ward shift types (invented data): Early 07:00-15:00, Late 14:30-22:30.
 */
const START = '2033-03-07'; // a Monday (no demo unavailability for Robin on Mondays)

describe('swap approved by e-mail', () => {
  let staffA: Session;
  let staffB: Session;
  let manager: Session;
  let admin: Session;
  let managerToken: string;
  let period: RosterPeriodDto;
  let shift: Record<string, string>;
  let robin: string;
  let priya: string;

  beforeAll(async () => {
    const { token, ward, period: created } = await managerPeriod(START);
    managerToken = token;
    period = created;
    shift = await shiftIdsByCode(managerToken, ward.id);
    const id = await staffIdLookup(managerToken, ward.id);
    robin = id('Robin Tallis');
    priya = id('Priya Wendover');
    for (const [staffMemberId, code] of [
      [robin, 'L'],
      [priya, 'E'],
    ]) {
      await apiCall(managerToken, 'PUT', SOLVING_ROUTES.assignmentCell(period.id), {
        staffMemberId,
        date: START,
        shiftTypeId: shift[code],
      });
    }
    const fresh = await apiCall<RosterPeriodDto>(
      managerToken,
      'GET',
      PLANNING_ROUTES.rosterPeriod(period.id),
    );
    await apiCall(managerToken, 'POST', PUBLISHING_ROUTES.publish(period.id), {
      version: fresh.version,
      // A few shifts only: the rest of the week is below minimum cover, acknowledged.
      acknowledgeBelowMinimum: true,
      reason: 'A journey roster with only the shifts it needs',
    });

    staffA = await openBrowser();
    staffB = await openBrowser();
    manager = await openBrowser();
    admin = await openBrowser();
  });
  afterAll(async () => {
    for (const s of [staffA, staffB, manager, admin]) await s?.close();
  });

  it('A proposes, B accepts through the e-mail link, the manager approves through the e-mail link', async () => {
    const { page } = staffA;
    await signIn(page, 'staff@example.com');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Swaps' }).click();
    await page.getByRole('heading', { level: 1, name: 'Swaps' }).waitFor();
    const form = page.getByRole('form', { name: 'Propose a swap' });
    const periodSelect = form.getByRole('combobox', { name: 'Roster period' });
    if (await periodSelect.count()) await periodSelect.selectOption({ label: 'From Mon 7 Mar (7 days)' });
    await form.getByRole('combobox', { name: 'My shift' }).selectOption({ label: 'Mon 7 Mar: L' });
    await form.getByRole('combobox', { name: 'Colleague' }).selectOption({ label: 'Priya Wendover' });
    await form.getByRole('combobox', { name: 'Their shift I take' }).selectOption({ label: 'Mon 7 Mar: E' });
    expect(await unnamedControls(page)).toEqual([]);
    await form.getByRole('button', { name: 'Check the rules' }).click();
    await form.getByText('The rules check found no problem').waitFor();
    await form
      .getByText('Robin Tallis works E on Mon 7 Mar; Priya Wendover works L on Mon 7 Mar', { exact: false })
      .waitFor();
    await form.getByRole('button', { name: 'Send swap request' }).click();
    const mine = page.getByRole('table', { name: 'All swap requests' });
    await mine.getByText('Waiting for colleague').first().waitFor();

    // B answers from the e-mail, without signing in.
    await signIn(admin.page, 'admin@example.com');
    const linkB = await linkFromMailbox(admin.page, 'priya.wendover@example.com', '/swap-decision?token=');
    await staffB.page.goto(linkB);
    await staffB.page.getByRole('heading', { name: 'Roster change' }).waitFor();
    await staffB.page.getByText('Swap asked by Robin Tallis with Priya Wendover', { exact: false }).waitFor();
    await staffB.page.getByRole('button', { name: 'Accept the swap' }).click();
    await staffB.page.getByText('Done: waiting for manager').waitFor();
    // The link works once.
    await staffB.page.reload();
    await staffB.page.getByText('This link cannot be used').waitFor();

    // The manager approves from their e-mail.
    const linkM = await linkFromMailbox(admin.page, 'manager@example.com', '/swap-decision?token=');
    await manager.page.goto(linkM);
    await manager.page.getByRole('button', { name: 'Approve the change' }).click();
    await manager.page.getByText('Done: approved').waitFor();

    // The roster holds the swap, and A's list shows it approved.
    const grid = await apiCall<AssignmentGridDto>(managerToken, 'GET', SOLVING_ROUTES.assignments(period.id));
    const cellOf = (id: string) => grid.rows.find((r) => r.staffMemberId === id)!.cells[0].shiftTypeId;
    expect(cellOf(robin)).toBe(shift['E']);
    expect(cellOf(priya)).toBe(shift['L']);
    // The approval is already stored (the grid above shows it): one reload must show it.
    await page.reload();
    await mine.getByText('Approved').first().waitFor();
  });

  it('both people’s calendars show the swapped shifts', async () => {
    const mineOn = async (session: Session) => {
      await session.page.goto(`/my-roster?date=${START}`);
      const own = session.page.getByTestId('my-roster-calendar').locator('[data-mine="true"]');
      await own.first().waitFor();
      // Names start with what the event shows (time and title); compare the words after it.
      const names = await own.evaluateAll((els) => els.map((el) => el.getAttribute('aria-label')));
      return [...new Set(names.map((n) => n?.replace(/^.*?\(you\), /, '')))];
    };
    expect(await mineOn(staffA)).toEqual([`Your shift, Early (E), ${START} 07:00 to 15:00`]);
    await signIn(staffB.page, 'priya.wendover@example.com');
    expect(await mineOn(staffB)).toEqual([`Your shift, Late (L), ${START} 14:30 to 22:30`]);
  });
});
