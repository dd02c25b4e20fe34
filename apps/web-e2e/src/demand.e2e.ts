import {
  DEMAND_ROUTES as D,
  ERLANG_CAUTION,
  PLANNING_ROUTES as P,
  RATIO_CAUTION,
  SOLVING_ROUTES as S,
  type AssignmentGridDto,
  type CoverNeedsDto,
  type DemandPlanDto,
  type RosterPeriodDto,
  type UnitDemandDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { apiCall, apiSignIn, createPeriod, findWard, shiftIdsByCode } from './support/api';
import { seriousViolations } from './support/axe';
import {
  eventually,
  openBrowser,
  pressGenerate,
  screenshot,
  signIn,
  signOut,
  unnamedControls,
  type Session,
} from './support/browser';

// jstat 1.9 ships no type declarations; only the two Poisson functions are used.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { jStat } = require('jstat') as {
  jStat: { poisson: { pdf(k: number, l: number): number; cdf(k: number, l: number): number } };
};

/**
 * The fewest agents for a service target, computed here independently of the product: Erlang B from
 * jstat's Poisson distribution (a general-purpose statistics library from the registry), B = pmf(N; A)
 * / cdf(N; A); Erlang C = N B / (N - A (1 - B)); SL(T) = 1 - C e^(-(N - A) T / AHT) (the Erlang C
 * service-level formula as PRODUCT.md "Trade facts" quotes it); occupancy A / N at most the cap.
 */
function fewestAgents(a: number, aht: number, t: number, targetPercent: number, maxOccupancyPercent: number) {
  for (let n = Math.floor(a) + 1; ; n++) {
    const b = jStat.poisson.pdf(n, a) / jStat.poisson.cdf(n, a);
    const c = (n * b) / (n - a * (1 - b));
    const sl = 1 - c * Math.exp((-(n - a) * t) / aht);
    if (sl * 100 >= targetPercent && (a / n) * 100 <= maxOccupancyPercent) return n;
  }
}

// Issue 12, items 1 to 4: the contact centre's manager (demo manager2) takes the demo contact centre from a forecast (grid, CSV with a
// bad row, then a good one) to the plan of a period of its own, its charts, and accepts the plan as
// the period's cover needs, then generates that period's roster on its planning board. The period is a
// week in the past that the journey creates for itself (deleted at the end, with the overrides the
// accept wrote and, by the database's cascade, the generated roster and its solve run); the unit's
// demo forecast is put back at the end. The contact figures of the CSV
// are invented for the test.
describe('demand to cover needs as the demo manager', () => {
  const START = '2025-02-03'; // a Monday
  const CONTACTS = [4, 6, 8, 10, 12, 12, 10, 10, 12, 12, 10, 8, 6, 4]; // 09:00 … 15:30, invented
  const AHT = 300;
  let token: string;
  let unit: UnitDto;
  let period: RosterPeriodDto;
  let original: UnitDemandDto;
  let browser: Session;

  beforeAll(async () => {
    token = await apiSignIn('manager2@example.com');
    unit = await findWard(token, 'Contact Centre North');
    original = await apiCall<UnitDemandDto>(token, 'GET', D.demand(unit.id));
    period = await createPeriod(token, unit.id, START, 7);
    browser = await openBrowser();
    await signIn(browser.page, 'manager2@example.com');
  });
  afterAll(async () => {
    await browser?.close();
    if (original)
      await apiCall(token, 'PUT', D.demand(unit.id), {
        contactCentre: original.contactCentre,
        ward: original.ward,
      });
    if (period) {
      const needs = await apiCall<CoverNeedsDto>(token, 'GET', P.coverNeeds(unit.id));
      const end = '2025-02-09';
      for (const o of needs.overrides.filter((x) => x.date >= START && x.date <= end))
        await apiCall(token, 'DELETE', P.coverOverride(unit.id, o.id));
      await apiCall(token, 'DELETE', P.rosterPeriod(period.id));
    }
  });

  it('shows the demo forecast as a week grid with the service target and the Erlang caution', async () => {
    const { page } = browser;
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Demand', exact: true })
      .click();
    await page.getByRole('heading', { name: 'Demand', level: 1 }).waitFor();
    await page.getByRole('combobox', { name: 'Unit' }).selectOption({ label: 'Contact Centre North' });
    await page.getByRole('table', { name: 'Contacts per interval' }).waitFor();
    // Demo data (apps/api/src/demo/demo-demand.ts): weekdays 11:00 has 11 contacts, 5-minute AHT.
    expect(await page.getByLabel('Contacts Mon 11:00', { exact: true }).inputValue()).toBe('11');
    expect(await page.getByLabel('Contacts Sun 11:00', { exact: true }).inputValue()).toBe('');
    expect(await page.getByLabel('Answered within target (%)').first().inputValue()).toBe('80');
    expect(await page.getByLabel('Shrinkage (%)').first().inputValue()).toBe('30');
    await page.getByText(ERLANG_CAUTION).waitFor();
    await page.getByRole('tab', { name: 'Average handle time (s)' }).click();
    expect(await page.getByLabel('Average handle time Mon 11:00', { exact: true }).inputValue()).toBe('300');
    await page.getByRole('tab', { name: 'Contacts' }).click();
    expect(await unnamedControls(page)).toEqual([]);
    // axe-core, WCAG 2.1 A and AA: no serious or critical violation.
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'demand-contact');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'demand-contact-phone');
    await page.setViewportSize({ width: 1360, height: 860 });
  });

  it('refuses a CSV with a bad row, shows the row and saves nothing; then imports a good one', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Upload contacts CSV' }).click();
    const dialog = page.getByRole('dialog', { name: /^Upload the contact forecast of / });
    // RFC 4180 CSV, header on line 1: line 3 starts at 09:15, not on a 30-minute boundary.
    const bad = ['day,start,contacts,aht', 'Mon,09:00,10,300', 'Mon,09:15,10,300', 'Tue,09:00,10,300'].join(
      '\n',
    );
    await dialog
      .locator('input[type=file]')
      .setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await dialog.getByText('Nothing was saved').waitFor();
    const errorRow = dialog.getByRole('table', { name: 'Row errors' }).getByRole('row').nth(1);
    const cells = await errorRow.getByRole('cell').allInnerTexts();
    expect(cells.slice(0, 2)).toEqual(['3', 'start']);
    expect(await dialog.getByRole('button', { name: /^Import/ }).isDisabled()).toBe(true);
    await screenshot(page, 'demand-csv-errors', { fullPage: false });
    // Nothing saved: Monday 09:00 still has the demo's 6 contacts.
    const after = await apiCall<UnitDemandDto>(token, 'GET', D.demand(unit.id));
    const monday = after.contactCentre!.pattern.find((d) => d.weekday === 1)!;
    expect(monday.intervals.find((i) => i.start === '09:00')?.contacts).toBe(6);

    const lines = ['day,start,contacts,aht'];
    for (const day of ['Mon', 'Tue', 'Wed', 'Thu', 'Fri'])
      CONTACTS.forEach((c, i) => {
        const m = 9 * 60 + 30 * i;
        lines.push(
          `${day},${String(Math.floor(m / 60)).padStart(2, '0')}:${m % 60 ? '30' : '00'},${c},${AHT}`,
        );
      });
    await dialog
      .locator('input[type=file]')
      .setInputFiles({ name: 'good.csv', mimeType: 'text/csv', buffer: Buffer.from(lines.join('\n')) });
    await dialog.getByText('70 rows checked, no problems found. Nothing is saved yet.').waitFor();
    await dialog.getByRole('button', { name: 'Import 70 rows' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('table', { name: 'Contacts per interval' }).waitFor();
    const mon11 = page.getByLabel('Contacts Mon 11:00', { exact: true });
    await eventually(
      async () => ((await mon11.inputValue()) === '12' ? true : undefined),
      'the imported grid',
    );
    expect(await page.getByLabel('Contacts Sat 11:00', { exact: true }).inputValue()).toBe('');
    const saved = await apiCall<UnitDemandDto>(token, 'GET', D.demand(unit.id));
    // Weekday rows replace the whole pattern: five weekdays of 14 intervals, Saturday gone.
    expect(saved.contactCentre!.pattern.map((d) => [d.weekday, d.intervals.length])).toEqual([
      [1, 14],
      [2, 14],
      [3, 14],
      [4, 14],
      [5, 14],
    ]);

    // A change typed in the grid is saved with the rest of the forecast.
    await page.getByLabel('Contacts Tue 10:00', { exact: true }).fill('9');
    await page.getByRole('button', { name: 'Save forecast' }).click();
    const tuesday10 = async () =>
      (await apiCall<UnitDemandDto>(token, 'GET', D.demand(unit.id)))
        .contactCentre!.pattern.find((d) => d.weekday === 2)!
        .intervals.find((i) => i.start === '10:00')?.contacts;
    expect(await eventually(async () => ((await tuesday10()) === 9 ? 9 : undefined), 'the saved grid')).toBe(
      9,
    );
    await page.getByLabel('Contacts Tue 10:00', { exact: true }).fill('8');
    await page.getByRole('button', { name: 'Save forecast' }).click();
    await eventually(async () => ((await tuesday10()) === 8 ? true : undefined), 'the grid saved back');
  });

  it("shows the period's plan: requirement from Erlang C, the covering shifts and the charts", async () => {
    const { page } = browser;
    await page.getByRole('link', { name: 'Plan for Mon 3 Feb to Sun 9 Feb' }).click();
    await page.getByRole('heading', { name: 'Demand plan: Contact Centre North' }).waitFor();
    await page.getByLabel('Day').selectOption({ label: 'Mon 3 Feb' });
    const day = page.getByRole('region', { name: 'Demand and cover on Mon 3 Feb' });
    await day.locator('svg.recharts-surface').first().waitFor();
    expect(await day.getByRole('img', { name: 'Chart: Demand and cover on Mon 3 Feb' }).count()).toBe(1);
    const sl = page.getByRole('region', { name: 'Service level on Mon 3 Feb' });
    await sl.locator('svg.recharts-surface').first().waitFor();
    await sl.getByText(/^Target: 80% of contacts answered within 20 s\./).waitFor();
    await page
      .getByRole('region', { name: /^Demand and cover over the week from / })
      .locator('svg.recharts-surface')
      .first()
      .waitFor();

    // The requirement at 11:00 against an independent Erlang C (jstat): 12 contacts x 300 s over
    // 1,800 s = 2 Erlangs; demo target 80% in 20 s, occupancy at most 85%, shrinkage 30%.
    const agents = fewestAgents((12 * AHT) / 1800, AHT, 20, 80, 85);
    const scheduled = Math.ceil(agents / (1 - 0.3));
    await day.getByText('Show the figures as a table').click();
    const row = day.getByRole('row').filter({ hasText: /^11:00/ });
    expect((await row.getByRole('cell').allInnerTexts()).slice(0, 4)).toEqual([
      '11:00',
      '12',
      String(agents),
      String(scheduled),
    ]);
    // The starts table says what the API's plan says for Monday.
    const plan = await apiCall<DemandPlanDto>(token, 'GET', D.plan(period.id));
    const shifts = await shiftIdsByCode(token, unit.id);
    const mondayDay = plan.contactCentre!.starts.find((s) => s.date === START && s.shiftTypeId === shifts.D)!;
    const startsRow = page
      .getByRole('table', { name: 'People starting each shift' })
      .getByRole('row')
      .filter({ hasText: 'Mon 3 Feb' });
    expect((await startsRow.getByRole('cell').allInnerTexts())[1]).toBe(
      mondayDay.people > 0 ? `${mondayDay.people} (minimum ${mondayDay.minimum})` : '0',
    );
    await page.getByText(ERLANG_CAUTION).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    // axe-core, WCAG 2.1 A and AA: no serious or critical violation.
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'demand-plan');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'demand-plan-phone');
    await page.setViewportSize({ width: 1360, height: 860 });
  });

  it('accepts the plan after saying what changes, and the cover needs page shows the numbers', async () => {
    const { page } = browser;
    const plan = await apiCall<DemandPlanDto>(token, 'GET', D.plan(period.id));
    const shifts = await shiftIdsByCode(token, unit.id);
    const mondayDay = plan.contactCentre!.starts.find((s) => s.date === START && s.shiftTypeId === shifts.D)!;
    await page.getByRole('button', { name: 'Accept as cover needs' }).click();
    const dialog = page.getByRole('alertdialog', { name: 'Accept the plan as cover needs?' });
    await dialog.waitFor();
    const changeRow = dialog
      .getByRole('table', { name: 'Cover needs the plan changes' })
      .getByRole('row')
      .filter({ hasText: 'Mon 3 Feb' })
      .filter({ hasText: 'Day' });
    const changeCells = await changeRow.getByRole('cell').allInnerTexts();
    expect(changeCells[3]).toMatch(new RegExp(`→ ${mondayDay.minimum}$`));
    expect(changeCells[4]).toMatch(new RegExp(`→ ${mondayDay.people}$`));
    await screenshot(page, 'demand-accept-dialog', { fullPage: false });
    await dialog.getByRole('button', { name: /^Accept \d+ cover needs?$/ }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('link', { name: 'See the cover needs' }).click();
    await page.getByRole('heading', { name: 'Cover needs', level: 1 }).waitFor();
    const overrideRows = page
      .getByRole('table', { name: 'Date overrides' })
      .getByRole('row')
      .filter({ hasText: /Mon,? 3 Feb 2025/ });
    await overrideRows.first().waitFor();
    const texts = await overrideRows.allInnerTexts();
    const dayRow = texts
      .map((t) =>
        t
          .split(/\t|\n/)
          .map((c) => c.trim())
          .filter(Boolean),
      )
      .find((c) => c[1] === 'D');
    expect(dayRow?.slice(2, 5)).toEqual(['Anyone', String(mondayDay.minimum), String(mondayDay.people)]);
    // And the server has the same numbers (read back, not the page's own state).
    const needs = await apiCall<CoverNeedsDto>(token, 'GET', P.coverNeeds(unit.id));
    const written = needs.overrides.find(
      (o) => o.date === START && o.shiftTypeId === shifts.D && o.skillId === null,
    );
    expect([written?.min, written?.target]).toEqual([mondayDay.minimum, mondayDay.people]);
  });

  it("shows requirement against rostered cover on the period's planning board", async () => {
    const { page } = browser;
    await page.goto(`/planning/periods/${period.id}/board`);
    const panel = page.getByRole('region', { name: 'Requirement against rostered cover' });
    await panel.locator('svg.recharts-surface').first().waitFor();
    // Nobody is rostered in this new period, so every interval with a requirement is short.
    const plan = await apiCall<DemandPlanDto>(token, 'GET', D.plan(period.id));
    const needed = plan.contactCentre!.requirement.filter((r) => r.scheduled > 0).length;
    expect(needed).toBeGreaterThan(0);
    const all = plan.contactCentre!.requirement.length;
    await panel
      .getByText(`The rostered people are below the requirement in ${needed} of ${all} intervals`, {
        exact: false,
      })
      .waitFor();
    await panel.scrollIntoViewIfNeeded();
    await screenshot(page, 'demand-board', { fullPage: false });
    await panel.getByRole('link', { name: 'Open the demand plan' }).click();
    await page.getByRole('heading', { name: 'Demand plan: Contact Centre North' }).waitFor();
  });

  it('generates a roster on the board of the period, whose Monday Day cover stands against the accepted needs', async () => {
    const { page } = browser;
    await page.goto(`/planning/periods/${period.id}/board`);
    const board = page.getByRole('table', { name: 'Planning board' });
    await board.waitFor();
    // A short limit: the week is small, and the journey checks the roster, not its quality.
    await page.getByRole('textbox', { name: 'Time limit (seconds)' }).fill('20');
    await pressGenerate(page);
    await page.getByTestId('quality-statement').waitFor({ timeout: 110_000 });
    expect(await page.getByRole('status', { name: 'Solve progress' }).innerText()).toMatch(
      /Finished|Stopped/,
    );

    // The roster exists on the server: the period's stored assignments hold shifts.
    const shifts = await shiftIdsByCode(token, unit.id);
    const grid = await apiCall<AssignmentGridDto>(token, 'GET', S.assignments(period.id));
    expect(grid.dates[0]).toBe(START);
    const shiftsRostered = grid.rows.flatMap((r) => r.cells).filter((c) => c.shiftTypeId !== null).length;
    expect(shiftsRostered).toBeGreaterThan(0);
    // People on the Day shift on Monday, counted from the server's assignments.
    const onDay = grid.rows.filter((r) => r.cells[0]?.shiftTypeId === shifts.D).length;
    // The accepted needs, read back from the server (the override the accept wrote).
    const needs = await apiCall<CoverNeedsDto>(token, 'GET', P.coverNeeds(unit.id));
    const accepted = needs.overrides.find(
      (o) => o.date === START && o.shiftTypeId === shifts.D && o.skillId === null,
    )!;
    expect(accepted).toBeDefined();

    // The board's cover cell for Monday's Day shift (anyone) shows the server's count against the
    // accepted minimum and target, and says in words where the count stands.
    const coverCell = board
      .getByRole('rowgroup', { name: 'Cover against needs' })
      .locator('td[title^="Mon 3 Feb, Day: "]');
    const expectedTitle = `Mon 3 Feb, Day: ${onDay} on, minimum ${accepted.min}, target ${accepted.target}`;
    await eventually(
      async () => ((await coverCell.getAttribute('title'))?.startsWith(expectedTitle) ? true : undefined),
      'the cover cell of the generated roster',
    );
    expect(await coverCell.locator('strong').innerText()).toBe(String(onDay));
    const words =
      onDay < accepted.min
        ? `short ${accepted.min - onDay}`
        : onDay < accepted.target
          ? `target −${accepted.target - onDay}`
          : onDay > accepted.target
            ? `over ${onDay - accepted.target}`
            : 'met';
    expect(await coverCell.locator('div').innerText()).toBe(words);
    await coverCell.scrollIntoViewIfNeeded();
    await screenshot(page, 'demand-board-generated', { fullPage: false });
  }, 150_000);

  it("shows a ward's patients and ratios with the ratio caution, and a ward period's requirement", async () => {
    const { page } = browser;
    await signOut(page);
    await signIn(page, 'manager@example.com');
    await page.goto('/planning/demand');
    await page.getByRole('combobox', { name: 'Unit' }).selectOption({ label: 'Ward 7 Acute Medicine' });
    await page.getByRole('table', { name: 'Ratios per skill' }).waitFor();
    await page.getByText(RATIO_CAUTION).first().waitFor();
    await page.getByRole('table', { name: 'Expected patients per shift' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    // axe-core, WCAG 2.1 A and AA: no serious or critical violation.
    expect(await seriousViolations(page)).toEqual([]);
    await screenshot(page, 'demand-ward');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'demand-ward-phone');
    await page.setViewportSize({ width: 1360, height: 860 });

    // A change typed in the patients table is saved (and put back afterwards).
    const wardToken = await apiSignIn('manager@example.com');
    const ward = await findWard(wardToken);
    const earlyId = (await shiftIdsByCode(wardToken, ward.id)).E;
    const mondayEarlyLow = async () =>
      (await apiCall<UnitDemandDto>(wardToken, 'GET', D.demand(ward.id))).ward!.patients.find(
        (p) => p.weekday === 1 && p.date === null && p.shiftTypeId === earlyId,
      )?.patients.low;
    const lowCell = page.getByLabel('Mon Early: Low acuity patients', { exact: true });
    for (const value of [13, 12]) {
      await lowCell.fill(String(value));
      await page.getByRole('button', { name: 'Save patients and ratios' }).click();
      await eventually(async () => ((await mondayEarlyLow()) === value ? true : undefined), `${value} saved`);
    }

    // The plan of a ward period: per skill ceil(sum of patients / patients per person), never
    // below the floor (formula of docs/demand.md). Demo Early shift: 12 low, 6 medium, 2 high
    // patients; registered nurses 8 / 6 / 4 per person, floor 2: 12/8 + 6/6 + 2/4 = 3 -> 3;
    // healthcare assistants 12 / 10 / 6, floor 1: 1 + 0.6 + 0.33 = 1.93 -> 2.
    await page
      .getByRole('link', { name: /^Plan for / })
      .first()
      .click();
    await page.getByRole('heading', { name: 'Demand plan: Ward 7 Acute Medicine' }).waitFor();
    const table = page.getByRole('table', { name: 'Ward requirement per shift' });
    const early = (skill: string) =>
      table
        .getByRole('row')
        .filter({ hasText: 'Early' })
        .filter({ hasText: skill })
        .first()
        .getByRole('cell');
    expect((await early('Registered nurse').allInnerTexts()).slice(3)).toEqual(['12 / 6 / 2', '3', '2', '3']);
    expect((await early('Healthcare assistant').allInnerTexts()).slice(3)).toEqual([
      '12 / 6 / 2',
      '2',
      '1',
      '2',
    ]);
    await page.getByText(RATIO_CAUTION).first().waitFor();
    await screenshot(page, 'demand-ward-plan');
  });
});
