import {
  type AvailabilityDto,
  type LeaveDto,
  type PeriodRequestsDto,
  REQUESTS_ROUTES as Q,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { apiCall, apiSignIn, managerPeriod, staffIdLookup } from './support/api';
import { openBrowser, screenshot, signIn, signOut, unnamedControls, type Session } from './support/browser';

// Issue 5, item 1: a staff member enters a day-off request and a leave request, the manager approves
// the leave, and the staff member sees the decision. A one-week draft period of its own, far ahead,
// so other journeys that publish the demo period do not close it. Calendar fact (GNU date +%A):
// 2035-01-01 is a Monday, so 3 January is a Wednesday and 4-5 January a Thursday and Friday.
describe('availability, requests and leave in the browser', () => {
  let browser: Session;
  let period: RosterPeriodDto;
  // Robin Tallis's weekly availability as the demo made it: the journey changes it and puts it back,
  // since other journeys (sharing the server, in Jest's order) roster Robin and solve the demo ward.
  let robin = '';
  let availability: AvailabilityDto | undefined;

  beforeAll(async () => {
    const { token, ward, period: created } = await managerPeriod('2035-01-01');
    period = created;
    robin = (await staffIdLookup(token, ward.id))('Robin Tallis');
    availability = await apiCall<AvailabilityDto>(token, 'GET', Q.availability(robin));
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    if (availability)
      await apiCall(await apiSignIn('staff@example.com'), 'PUT', Q.availability(robin), {
        cells: availability.cells,
      });
  });

  it('lets the staff member set their weekly availability', async () => {
    const { page } = browser;
    await signIn(page, 'staff@example.com');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'My availability', exact: true }).click();
    await page.getByRole('table', { name: 'Weekly availability' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await page.getByRole('combobox', { name: 'Monday, night' }).selectOption({ label: 'Unavailable' });
    await page.getByRole('button', { name: 'Save availability' }).click();
    await page.getByText('Availability saved').first().waitFor();
    await page.reload();
    await page.getByRole('table', { name: 'Weekly availability' }).waitFor();
    expect(await page.getByRole('combobox', { name: 'Monday, night' }).inputValue()).toBe('unavailable');
    await screenshot(page, 'my-availability');
  });

  it('takes a day-off request and a leave request from the staff member', async () => {
    const { page } = browser;
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'My requests', exact: true })
      .click();
    await page.getByRole('heading', { name: 'Date requests' }).waitFor();
    const periodPicker = page.getByRole('combobox', { name: 'Roster period' });
    if (await periodPicker.count()) await periodPicker.selectOption(period.id);
    else await page.getByText('Requests for the roster from Mon 1 Jan 2035').waitFor();
    const form = page.getByRole('form', { name: 'New date request' });
    await form.getByRole('combobox', { name: 'Date' }).selectOption('2035-01-03');
    await form.getByRole('combobox', { name: 'Request' }).selectOption({ label: 'Day off' });
    await form.getByRole('textbox', { name: 'Note (optional)' }).fill('School play');
    expect(await unnamedControls(page)).toEqual([]);
    await form.getByRole('button', { name: 'Send request' }).click();
    const dateRow = page
      .getByRole('table', { name: 'My date requests' })
      .getByRole('row')
      .filter({ hasText: 'Wed 3 Jan 2035' });
    await dateRow.waitFor();
    expect(await dateRow.innerText()).toMatch(/Day off[\s\S]*School play/);

    const leave = page.getByRole('form', { name: 'New leave request' });
    await leave.getByLabel('First day').fill('2035-01-04');
    await leave.getByLabel('Last day').fill('2035-01-05');
    await leave.getByRole('combobox', { name: 'Type' }).selectOption({ label: 'Annual leave' });
    await leave.getByRole('button', { name: 'Request leave' }).click();
    const leaveRow = page
      .getByRole('table', { name: 'My leave' })
      .getByRole('row')
      .filter({ hasText: 'Thu 4 Jan 2035 to Fri 5 Jan 2035' });
    await leaveRow.getByText('Pending').waitFor();
    await screenshot(page, 'my-requests');
    await signOut(page);
  });

  it('lets the manager approve the leave, and the staff member then sees it approved', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Requests', exact: true })
      .click();
    const table = page.getByRole('table', { name: /^Requests of / });
    await table.waitFor();
    await page.getByRole('combobox', { name: 'Roster period' }).selectOption(period.id);
    // Both of Robin's requests are in the table for that period.
    await table
      .getByRole('row')
      .filter({ hasText: 'Wed 3 Jan 2035' })
      .filter({ hasText: 'Robin Tallis' })
      .waitFor();
    await page.getByRole('combobox', { name: 'Status' }).selectOption({ label: 'Pending' });
    const row = table.getByRole('row').filter({ hasText: 'Thu 4 Jan 2035 to Fri 5 Jan 2035' });
    await row.waitFor();
    expect(await table.getByRole('row').filter({ hasText: 'Wed 3 Jan 2035' }).count()).toBe(0);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'requests-table');
    await row.getByRole('button', { name: /^Approve leave of Robin Tallis/ }).click();
    await page.getByText('Leave of Robin Tallis approved').first().waitFor();
    await row.waitFor({ state: 'detached' }); // no longer pending

    // The API agrees: the period holds Robin's day-off request, and the leave is approved by the manager.
    const managerToken = await apiSignIn('manager@example.com');
    const board = await apiCall<PeriodRequestsDto>(managerToken, 'GET', Q.periodRequests(period.id));
    expect(board.dateRequests.map((r) => [r.staffName, r.date, r.kind, r.note])).toEqual([
      ['Robin Tallis', '2035-01-03', 'dayOff', 'School play'],
    ]);
    expect(board.leave.map((l) => [l.staffName, l.status])).toEqual([['Robin Tallis', 'approved']]);
    const staffToken = await apiSignIn('staff@example.com');
    const mine = await apiCall<{ leave: LeaveDto[] }>(staffToken, 'GET', Q.mine);
    expect(mine.leave.find((l) => l.startDate === '2035-01-04')).toMatchObject({
      status: 'approved',
      decidedBy: 'Morgan Ashdown',
    });
    await signOut(page);
    await signIn(page, 'staff@example.com');
    await page.goto('/my-requests');
    const leaveRow = page
      .getByRole('table', { name: 'My leave' })
      .getByRole('row')
      .filter({ hasText: 'Thu 4 Jan 2035 to Fri 5 Jan 2035' });
    await leaveRow.getByText('Approved').waitFor();
    expect(await leaveRow.innerText()).toContain('by Morgan Ashdown');
  });
});
