import { readFileSync } from 'node:fs';
import {
  type AssignmentGridDto,
  PAYROLL_CSV_COLUMNS,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  SOLVING_ROUTES as R,
  type UnitDto,
} from '@rotaplex/contracts';
import { apiCall, managerPeriod, shiftIdsByCode } from './support/api';
import { openBrowser, screenshot, signIn, unnamedControls, type Session } from './support/browser';

// Issue 4, items 1 and 3: the reports of a ward period whose cells the manager has set. A one-week
// period in the past of its own (so it neither overlaps nor heads the ward's list of periods), deleted
// at the end. Expected figures are worked out by hand from the demo shift times: Early 07:00-15:00 is
// paid 450 minutes, Night 22:00-07:30 540 minutes; a nurse costs 24.50 an hour (demo data).
describe('reports of a period as the demo manager', () => {
  const START = '2025-01-06'; // a Monday
  let token: string;
  let period: RosterPeriodDto;
  let browser: Session;

  beforeAll(async () => {
    let ward: UnitDto;
    ({ token, ward, period } = await managerPeriod(START));
    const shift = await shiftIdsByCode(token, ward.id);
    const grid = await apiCall<AssignmentGridDto>(token, 'GET', R.assignments(period.id));
    const priya = grid.rows.find((r) => r.name === 'Priya Wendover')!.staffMemberId;
    // Priya: Early on Monday 6 Jan, Night on Saturday 11 Jan (to Sunday 07:30).
    for (const [date, code] of [
      [START, 'E'],
      ['2025-01-11', 'N'],
    ]) {
      await apiCall(token, 'PUT', R.assignmentCell(period.id), {
        staffMemberId: priya,
        date,
        shiftTypeId: shift[code],
      });
    }
    browser = await openBrowser();
    await signIn(browser.page, 'manager@example.com');
  });
  afterAll(async () => {
    await browser?.close();
    if (period) await apiCall(token, 'DELETE', P.rosterPeriod(period.id));
  });

  it('opens the reports from the roster periods list and shows the charts with their tables', async () => {
    const { page } = browser;
    await page.goto('/planning/periods');
    const row = page.getByRole('row').filter({ hasText: /Mon,? 6 Jan 2025/ });
    await row.getByRole('button', { name: /^Actions for the period from / }).click();
    await page.getByRole('menuitem', { name: 'Reports' }).click();
    await page.getByRole('heading', { name: 'Reports: Ward 7 Acute Medicine' }).waitFor();

    for (const title of ['Hours against contract', 'Nights and weekends per person', 'Cover met per day']) {
      const region = page.getByRole('region', { name: title });
      await region.waitFor();
      // A chart drawn by the chart package (an SVG surface with bars), named for screen readers.
      await region.locator('svg.recharts-surface').first().waitFor();
      expect(await region.getByRole('img', { name: `Chart: ${title}` }).count()).toBe(1);
    }
    // Two shifts, 450 + 540 = 990 paid minutes = 16.5 hours; cost 16.5 × 24.50 = 404.25.
    const totals = page.getByRole('definition');
    const texts = await totals.allInnerTexts();
    expect(texts).toEqual(expect.arrayContaining(['2', '16.5']));
    // Other journeys may add people without an hourly rate; the cost then says how many.
    // The rates carry no currency, so the amount says its units plainly.
    expect(texts.some((t) => /^404\.25 cost units( \(\d+ without a rate\))?$/.test(t))).toBe(true);
    // Shortfalls are counted as shifts, with the people missing on them.
    await page.getByRole('term').filter({ hasText: 'Shifts below minimum' }).waitFor();
    expect(
      await page
        .getByRole('term')
        .filter({ hasText: /People short/ })
        .count(),
    ).toBe(0);

    // The table alternative of the hours chart: Priya's row.
    const hours = page.getByRole('region', { name: 'Hours against contract' });
    await hours.getByText('Show the figures as a table').click();
    const priyaRow = hours.getByRole('row').filter({ hasText: 'Priya Wendover' });
    expect((await priyaRow.getByRole('cell').allInnerTexts()).slice(0, 3)).toEqual([
      'Priya Wendover',
      '2',
      '16.5',
    ]);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'reports');
  });

  it('downloads the payroll CSV with the period in its name, one line per shift', async () => {
    const { page } = browser;
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download payroll CSV' }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('payroll-ward-7-acute-medicine-2025-01-06-to-2025-01-12.csv');
    const lines = readFileSync((await download.path())!, 'utf8').split('\r\n');
    expect(lines[0]).toBe(PAYROLL_CSV_COLUMNS.join(','));
    // Monday Early: 7.50 paid hours × 24.50 = 183.75.
    expect(lines[1]).toMatch(
      /^[0-9a-f-]{36},Priya Wendover,2025-01-06,E,Early,2025-01-06 07:00,2025-01-06 15:00,7\.50,no,no,24\.50,183\.75$/,
    );
    expect(lines[2]).toContain(',2025-01-11 22:00,2025-01-12 07:30,9.00,yes,yes,24.50,220.50');
  });

  it('links the planning board header to the reports', async () => {
    const { page } = browser;
    await page.goto(`/planning/periods/${period.id}/board`);
    await page.getByRole('heading', { name: /^Planning board: / }).waitFor();
    await page.getByRole('link', { name: 'Reports', exact: true }).click();
    await page.getByRole('heading', { name: 'Reports: Ward 7 Acute Medicine' }).waitFor();
  });
});
