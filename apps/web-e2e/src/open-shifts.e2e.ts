import {
  type OpenShiftDto,
  type Page as ListPage,
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  SOLVING_ROUTES,
  SWAP_ROUTES,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { apiCall, apiSignIn, createPeriod, findWard, shiftIdsByCode, staffIdLookup } from './support/api';
import { openBrowser, screenshot, signIn, signOut, unnamedControls, type Session } from './support/browser';

/**
 * Issue 10, item 6: staff see the open shifts of their unit's published roster, the ones they may take
 * with Claim and the others with why not in words; the page never says "everything is covered" while
 * shifts are open (the demo's staff were told so while the manager saw 29). The manager e-mails the
 * staff who may take one. A week of its own (February 2032), published with two
 * shifts only (the rest of the week is below minimum, acknowledged).
 */
describe('open shifts for staff and managers', () => {
  let browser: Session;
  let managerTotal = 0;

  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    const ward = await findWard(token);
    // A week of its own (a Monday), apart from the demo period and every other journey's weeks: the
    // journeys share one server and run in Jest's order, so none picks its dates from what is there.
    const start = '2032-02-02';
    const period = await createPeriod(token, ward.id, start);
    const shift = await shiftIdsByCode(token, ward.id);
    const id = await staffIdLookup(token, ward.id);
    for (const [name, date, code] of [
      ['Robin Tallis', start, 'L'],
      ['Grace Holloway', start, 'E'],
    ] as const) {
      await apiCall(token, 'PUT', SOLVING_ROUTES.assignmentCell(period.id), {
        staffMemberId: id(name),
        date,
        shiftTypeId: shift[code],
      });
    }
    const current = await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(period.id));
    await apiCall(token, 'POST', PUBLISHING_ROUTES.publish(period.id), {
      version: current.version,
      acknowledgeBelowMinimum: true,
      reason: 'A journey roster for open shifts',
    });
    managerTotal = (
      await apiCall<ListPage<OpenShiftDto>>(token, 'GET', `${SWAP_ROUTES.openShifts}?pageSize=1`)
    ).total;
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  type Page = Session['page'];
  /** Goes through the open-shift pages from where it is until `target` is shown (fails after the last). */
  const onSomePage = async (page: Page, target: ReturnType<Page['getByText']>) => {
    const next = page
      .getByRole('navigation', { name: 'Open shifts pages' })
      .getByRole('button', { name: 'Next' });
    for (let n = 1; ; n++) {
      await page.getByRole('table', { name: 'Open shifts' }).waitFor();
      if ((await target.count()) > 0) return;
      if ((await next.count()) === 0 || (await next.isDisabled())) throw new Error('Not on any page');
      await next.click();
      // The list keeps the page it shows until the next one has arrived.
      await page.getByText(new RegExp(`^Page ${n + 1} of \\d+$`)).waitFor();
      await page.waitForLoadState('networkidle');
    }
  };

  it('tells staff how many shifts are open and, for those they may not take, why in words', async () => {
    const { page } = browser;
    expect(managerTotal).toBeGreaterThan(0);
    await signIn(page, 'staff@example.com');
    await page.goto('/open-shifts');
    const summary = page.getByTestId('open-shift-summary');
    // The same count the manager sees, never "every shift is covered".
    expect(await summary.innerText()).toMatch(
      new RegExp(`^${managerTotal} shifts are open; (none you may take|you may take \\d+ shifts?)`),
    );
    expect(await page.getByText('Every shift on your units’ published rosters is covered.').count()).toBe(0);
    // Robin is a registered nurse: a shift that needs a health care assistant says so; Robin works
    // the Late on the week's first day, so another shift that day is "already working". Other
    // journeys publish weeks of their own, so the reasons may be on a later page.
    const table = page.getByRole('table', { name: 'Open shifts' });
    const reasons = table.getByRole('list', { name: 'Why you may not take it' });
    await onSomePage(page, reasons.getByText('It needs HCA, which is not on your staff record.'));
    await page.goto('/open-shifts');
    await onSomePage(page, reasons.getByText(/^You already work the \w+ shift that day\.$/));
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'open-shifts-staff');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'open-shifts-staff-390');
    await page.setViewportSize({ width: 1360, height: 860 });
    await signOut(page);
  });

  it('lets the manager e-mail the staff who may take an open shift', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    await page.goto('/open-shifts');
    const table = page.getByRole('table', { name: 'Open shifts' });
    await table
      .getByText(/\d+ below minimum/)
      .first()
      .waitFor();
    await table.getByRole('button', { name: 'E-mail who may take it' }).first().click();
    await page
      .locator('.fui-ToastTitle')
      .getByText(/^(E-mailed \d+ (person|people) who may take it|Nobody on the roster may take this shift)/)
      .waitFor();
    await screenshot(page, 'open-shifts-manager');
    await signOut(page);
  });
});
