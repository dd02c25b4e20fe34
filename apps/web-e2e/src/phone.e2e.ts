import {
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  SOLVING_ROUTES,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import {
  apiCall,
  apiSignIn,
  createPeriod,
  demoPeriod,
  findWard,
  shiftIdsByCode,
  staffIdLookup,
} from './support/api';
import { openBrowser, screenshot, signIn, signOut, unnamedControls, type Session } from './support/browser';

/**
 * Issue 10, item 5: staff pages at 390 x 844 (a common phone viewport; the width is the one the
 * issue names): the menu collapses behind a button and opens as a drawer; My roster opens on a list
 * with the next shift first; the availability grid is one block per weekday with labelled drop-downs;
 * no page is wider than the window. The demo manager publishes a week right after the demo period
 * with shifts for Robin Tallis (invented data).
 */
describe('staff pages on a phone', () => {
  let browser: Session;
  let start: string;
  const addDays = (date: string, n: number) =>
    new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    const ward = await findWard(token);
    // The week right after the demo period (the first period made for the ward: other journeys add
    // periods of their own, before or after it, in Jest's order): free, and within 100 days of today.
    const demo = await demoPeriod(token, ward.id);
    start = addDays(demo.startDate, demo.days);
    const period = await createPeriod(token, ward.id, start);
    const shift = await shiftIdsByCode(token, ward.id);
    const id = await staffIdLookup(token, ward.id);
    for (const [name, day, code] of [
      ['Robin Tallis', 1, 'E'],
      ['Robin Tallis', 3, 'N'],
      ['Grace Holloway', 1, 'E'],
    ] as const) {
      await apiCall(token, 'PUT', SOLVING_ROUTES.assignmentCell(period.id), {
        staffMemberId: id(name),
        date: addDays(start, day),
        shiftTypeId: shift[code],
      });
    }
    const current = await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(period.id));
    await apiCall(token, 'POST', PUBLISHING_ROUTES.publish(period.id), {
      version: current.version,
      acknowledgeBelowMinimum: true,
      reason: 'A journey roster for the phone pages',
    });
    browser = await openBrowser();
    await browser.page.setViewportSize({ width: 390, height: 844 });
    await signIn(browser.page, 'staff@example.com');
  });
  afterAll(async () => {
    await browser?.close();
  });

  type Page = Session['page'];
  /** Whether the page is wider than the window (something overflows sideways). */
  const overflows = (page: Page) =>
    page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);

  it('collapses the menu behind a button that opens it as a drawer', async () => {
    const { page } = browser;
    expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
    await screenshot(page, 'phone-home', { fullPage: false });
    await page.getByRole('button', { name: 'Menu', exact: true }).click();
    const menu = page.getByRole('dialog', { name: 'Menu' });
    await menu.getByRole('link', { name: 'My roster' }).waitFor();
    // The drawer slides in: wait until it rests at the left edge.
    await page.waitForFunction(() => {
      const drawer = document.querySelector('[role="dialog"]');
      return drawer !== null && drawer.getBoundingClientRect().left >= 0;
    });
    await screenshot(page, 'phone-menu', { fullPage: false });
    await menu.getByRole('link', { name: 'My roster' }).click();
    await menu.waitFor({ state: 'detached' });
    await page.getByRole('heading', { level: 1, name: 'My roster' }).waitFor();
  });

  it('opens My roster on a list with the next shift first, each shift written out', async () => {
    const { page } = browser;
    const next = page.getByTestId('next-shift');
    await next.waitFor();
    // Robin's Early on the week's Tuesday, 07:00-15:00 (demo ward shift times), with Grace on it.
    const day = new Date(`${addDays(start, 1)}T12:00:00Z`).toLocaleDateString('en-GB', {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      timeZone: 'UTC',
    });
    expect(await next.innerText()).toContain(`${day}, 07:00–15:00`);
    expect(await next.innerText()).toContain('With Grace Holloway');
    // The night is one entry across midnight, not two halves.
    const list = page.getByRole('region', { name: 'Your upcoming shifts' });
    await list.getByText(/22:00 to \w{3} \d{1,2} \w{3}, 07:30/).waitFor();
    expect(await page.getByText(/\+\d+ more/).count()).toBe(0);
    expect(await overflows(page)).toBe(false);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'phone-my-roster');
  });

  it('shows the calendar week within the window', async () => {
    const { page } = browser;
    await page.getByRole('tab', { name: 'Calendar' }).click();
    await page.getByTestId('my-roster-calendar').waitFor();
    await screenshot(page, 'phone-my-roster-calendar');
    expect(await overflows(page)).toBe(false);
  });

  it('lays the availability grid out one weekday at a time, with readable drop-downs', async () => {
    const { page } = browser;
    await page.goto('/my-availability');
    const days = page.getByRole('list', { name: 'Weekly availability' });
    await days.getByRole('heading', { name: 'Monday' }).waitFor();
    const select = days.getByRole('combobox', { name: 'Monday, early' });
    const box = (await select.boundingBox())!;
    // The drop-down sits inside the window, wide enough for its longest option.
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(390);
    expect(await select.evaluate((el) => el.scrollWidth <= el.clientWidth + 1)).toBe(true);
    expect(await overflows(page)).toBe(false);
    await screenshot(page, 'phone-availability');
  });

  it('keeps open shifts and requests within the window', async () => {
    const { page } = browser;
    for (const path of ['/open-shifts', '/my-requests', '/swaps']) {
      await page.goto(path);
      await page.getByRole('heading', { level: 1 }).waitFor();
      await page.waitForLoadState('networkidle');
      await page.locator('[aria-busy="true"], .fui-Skeleton').first().waitFor({ state: 'detached' });
      await screenshot(page, `phone${path.replace(/\//g, '-')}`);
      expect(await overflows(page)).toBe(false);
    }
    await signOut(page);
  });
});
