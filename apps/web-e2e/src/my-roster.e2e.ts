import ICAL from 'ical.js';
import {
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  SOLVING_ROUTES,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { apiCall, apiSignIn, createPeriod, findWard, shiftIdsByCode, staffIdLookup } from './support/api';
import {
  baseUrl,
  eventually,
  navLinks,
  openBrowser,
  screenshot,
  signIn,
  unnamedControls,
  type Session,
} from './support/browser';

/**
 * Issue 5, item 2: a demo staff member sees their published shifts in the week and month views of
 * My roster, in the unit's time zone, with details on click, and copies and regenerates the feed
 * address. The manager builds and publishes a short roster through the API first (the demo periods
 * are drafts); it is a week of its own far from the demo period, so other journeys keep their draft.
 * Demo ward shift types (invented data): Early 07:00-15:00, Late 14:30-22:30, Night 22:00-07:30.
 */
describe('my roster as a demo staff member', () => {
  let browser: Session;
  // A week of its own (a Monday), apart from the demo period and every other journey's weeks: the
  // journeys share one server and run in Jest's order, so none picks its dates from what is there.
  const start = '2031-09-01';

  const addDays = (date: string, n: number) =>
    new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    const ward = await findWard(token);
    const period = await createPeriod(token, ward.id, start);
    const shift = await shiftIdsByCode(token, ward.id);
    const id = await staffIdLookup(token, ward.id);
    const cells: [string, string, string][] = [
      [id('Robin Tallis'), start, 'E'],
      [id('Robin Tallis'), addDays(start, 2), 'N'],
      [id('Grace Holloway'), start, 'L'],
    ];
    for (const [staffMemberId, date, code] of cells) {
      await apiCall(token, 'PUT', SOLVING_ROUTES.assignmentCell(period.id), {
        staffMemberId,
        date,
        shiftTypeId: shift[code],
      });
    }
    const current = await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(period.id));
    await apiCall(token, 'POST', PUBLISHING_ROUTES.publish(period.id), {
      version: current.version,
      // A few shifts only: the rest of the week is below minimum cover, acknowledged.
      acknowledgeBelowMinimum: true,
      reason: 'A journey roster with only the shifts it needs',
    });

    browser = await openBrowser();
    await signIn(browser.page, 'staff@example.com');
  });
  afterAll(async () => {
    await browser?.close();
  });

  const calendar = (page: Page) => page.getByTestId('my-roster-calendar');
  type Page = Session['page'];

  it('opens My roster from the navigation', async () => {
    const { page } = browser;
    expect(await navLinks(page)).toContain('My roster');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My roster' }).click();
    await page.getByRole('heading', { level: 1, name: 'My roster' }).waitFor();
    await calendar(page).waitFor();
  });

  it('shows my published shifts, highlighted, and a colleague by name in the week view', async () => {
    const { page } = browser;
    await page.goto(`/my-roster?date=${start}`);
    const mine = calendar(page).locator('[data-mine="true"]');
    await mine.first().waitFor();
    const labels = await mine.evaluateAll((els) => els.map((el) => el.getAttribute('aria-label')));
    // A night crossing midnight is drawn as one piece on each day: the same event twice.
    // Each name starts with what the event shows (time and title), as WCAG 2.5.3 asks.
    expect([...new Set(labels.map((l) => l?.replace(/^.*?\(you\), /, '')))]).toEqual([
      `Your shift, Early (E), ${start} 07:00 to 15:00`,
      `Your shift, Night (N), ${addDays(start, 2)} 22:00 to 07:30`,
    ]);
    expect(labels[0]).toMatch(/^\S.* Early \(you\), Your shift, /);
    const others = await calendar(page)
      .locator('[data-mine="false"]')
      .evaluateAll((els) => els.map((el) => el.getAttribute('aria-label')));
    expect(others.map((l) => l?.replace(/^.*?Grace Holloway: Late, /, ''))).toEqual([
      `Grace Holloway, Late (L), ${start} 14:30 to 22:30`,
    ]);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'my-roster-week');
  });

  it('opens the details of a shift on click', async () => {
    const { page } = browser;
    await calendar(page).locator('[data-mine="true"]').first().click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Early shift').waitFor();
    const text = await dialog.innerText();
    expect(text).toContain('07:00');
    expect(text).toContain('15:00');
    expect(text).toContain('Ward 7 Acute Medicine');
    expect(text).toContain('Europe/London');
    await dialog.getByRole('button', { name: 'Close' }).click();
    await dialog.waitFor({ state: 'detached' });
  });

  it('shows the same shifts in the month view', async () => {
    const { page } = browser;
    await page.getByRole('tab', { name: 'Month' }).click();
    await calendar(page).locator('.fc-dayGridMonth-view').waitFor();
    const mine = calendar(page).locator('[data-mine="true"]');
    await mine.first().waitFor();
    expect(await mine.count()).toBe(2);
    expect(await calendar(page).locator('[data-mine="false"]').count()).toBe(1);
    await screenshot(page, 'my-roster-month');
  });

  it('gives a feed address that calendar programs can read, and regenerates it', async () => {
    const { page } = browser;
    const address = page.getByRole('textbox', { name: 'Feed address' });
    await eventually(
      async () => ((await address.inputValue()).endsWith('.ics') ? true : undefined),
      'the feed address',
    );
    const first = await address.inputValue();
    expect(first.startsWith(`${baseUrl()}/api/calendar-feeds/`)).toBe(true);
    // The feed, read with a general-purpose iCalendar parser: my two shifts, no colleague's.
    const res = await fetch(first);
    expect(res.status).toBe(200);
    const cal = new ICAL.Component(ICAL.parse(await res.text()));
    // Other journeys publish rosters too: only this journey's week counts (the UID starts with the date).
    const summaries = cal
      .getAllSubcomponents('vevent')
      .filter((v) => {
        const date = String(v.getFirstPropertyValue('uid')).slice(0, 10);
        return date >= start && date < addDays(start, 7);
      })
      .map((v) => String(v.getFirstPropertyValue('summary')));
    expect(summaries.sort()).toEqual(['Early, Ward 7 Acute Medicine', 'Night, Ward 7 Acute Medicine']);

    await page.getByRole('button', { name: 'Regenerate' }).click();
    await page.getByRole('alertdialog').getByRole('button', { name: 'Regenerate' }).click();
    await eventually(
      async () => ((await address.inputValue()) !== first ? true : undefined),
      'a new feed address',
    );
    const second = await address.inputValue();
    expect((await fetch(first)).status).toBe(404);
    expect((await fetch(second)).status).toBe(200);
  });
});
