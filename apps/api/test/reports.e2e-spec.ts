import {
  PAYROLL_CSV_COLUMNS,
  type PeriodReportDto,
  PLANNING_ROUTES as P,
  REPORTS_ROUTES,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { parse } from 'csv-parse/sync';
import { randomUUID } from 'node:crypto';
import { createPeriod, findUnit, putCell, readGrid, shiftTypesByCode } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * Reports of a one-week draft of the demo ward whose roster is set cell by cell through the
 * assignments API, so every expected number below is worked out by hand from the demo shift times
 * (Early 07:00-15:00 and Late 14:30-22:30 paid 450 minutes, Night 22:00-07:30 paid 540 minutes),
 * the demo hourly costs (nurses 24.50, healthcare assistants 15.80) and the demo contracts
 * (full-time 2250 paid minutes a week, part-time 1350). Plain arithmetic, common practice.
 */
describe('/api/reports', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  let staff: string;
  let period: RosterPeriodDto;
  let ids: Record<string, string>;
  const MON = '2030-01-07'; // a Monday
  const [WED, THU, SAT, SUN] = ['2030-01-09', '2030-01-10', '2030-01-12', '2030-01-13'];

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, MON);
    const shift = await shiftTypesByCode(t, manager, ward.id);
    const grid = await readGrid(t, manager, period.id);
    ids = Object.fromEntries(grid.rows.map((r) => [r.name, r.staffMemberId]));
    const cells: [string, string, string][] = [
      ['Priya Wendover', MON, 'E'],
      ['Priya Wendover', WED, 'L'],
      ['Priya Wendover', SAT, 'N'],
      ['Owen Treharne', MON, 'N'],
      ['Owen Treharne', THU, 'E'],
      ['Beth Lindqvist', SUN, 'E'],
    ];
    for (const [name, date, code] of cells) {
      await putCell(t, manager, period.id, { staffMemberId: ids[name], date, shiftTypeId: shift[code].id });
    }
  });
  afterAll(() => t.close());

  const getReport = async (token = manager) =>
    (
      await t
        .http()
        .get(api(REPORTS_ROUTES.report))
        .query({ periodId: period.id })
        .set(bearer(token))
        .expect(200)
    ).body as PeriodReportDto;

  it('reports hours against contract, nights, weekends and labour cost per person', async () => {
    const report = await getReport();
    expect(report).toMatchObject({ periodId: period.id, startDate: MON, days: 7, status: 'draft' });
    expect(report.dates).toHaveLength(7);
    const person = (name: string) => report.people.find((p) => p.name === name)!;
    // Priya (nurse, full-time): Early 450 + Late 450 + Night 540 = 1440 min = 24 h; 24 × 24.50 = 588.00.
    // Target for 7 days = 2250 (one week), so 1440 − 2250 = −810. The Saturday night is her one weekend.
    expect(person('Priya Wendover')).toMatchObject({
      shifts: 3,
      paidMinutes: 1440,
      targetPaidMinutes: 2250,
      minPaidMinutes: 1800,
      maxPaidMinutes: 2880,
      deviationMinutes: -810,
      nights: 1,
      weekendsWorked: 1,
      weekendDaysWorked: 1,
      hourlyCost: 24.5,
      labourCost: 588,
    });
    // Owen (assistant, full-time): Night 540 + Early 450 = 990 min = 16.5 h; 16.5 × 15.80 = 260.70.
    expect(person('Owen Treharne')).toMatchObject({
      shifts: 2,
      paidMinutes: 990,
      deviationMinutes: 990 - 2250,
      nights: 1,
      weekendsWorked: 0,
      labourCost: 260.7,
    });
    // Beth (nurse, part-time 1350): Sunday Early 450 min = 7.5 h; 7.5 × 24.50 = 183.75.
    expect(person('Beth Lindqvist')).toMatchObject({
      shifts: 1,
      paidMinutes: 450,
      targetPaidMinutes: 1350,
      deviationMinutes: -900,
      weekendsWorked: 1,
      labourCost: 183.75,
    });
    expect(person('Robin Tallis')).toMatchObject({ shifts: 0, paidMinutes: 0, labourCost: 0 });
    // 588.00 + 260.70 + 183.75 = 1032.45; 1440 + 990 + 450 = 2880 minutes.
    expect(report.totals).toMatchObject({
      people: report.people.length,
      shifts: 6,
      paidMinutes: 2880,
      nights: 2,
      weekendDaysWorked: 2,
      labourCost: 1032.45,
    });
  });

  it('reports cover against minimum and target per date, shift type and skill', async () => {
    const report = await getReport();
    const need = (date: string, shift: string, skill: string) =>
      report.cover.find((c) => c.date === date && c.shiftCode === shift && c.skillCode === skill)!;
    // Demo ward pattern: Early needs 3 RN (min 3, target 3); only Priya is on it on Monday → 2 short of the minimum.
    expect(need(MON, 'E', 'RN')).toMatchObject({
      min: 3,
      target: 3,
      assigned: 1,
      shortOfMin: 2,
      shortOfTarget: 0,
    });
    // Night needs 1 HCA (min 1, target 1): Owen covers Monday night.
    expect(need(MON, 'N', 'HCA')).toMatchObject({ assigned: 1, shortOfMin: 0, shortOfTarget: 0, over: 0 });
    // Early needs HCA min 1, target 2: Owen on Thursday → 1 short of the target only.
    expect(need(THU, 'E', 'HCA')).toMatchObject({ assigned: 1, shortOfMin: 0, shortOfTarget: 1 });
    // Six needs a day (E, L, N × RN, HCA), seven days.
    expect(report.cover).toHaveLength(42);
    expect(report.coverByDay.map((d) => d.date)).toEqual(report.dates);
    const monday = report.coverByDay[0];
    // Monday: E-RN short (met 0 of min 3 → 1 of 3), N-HCA met; the others have nobody.
    expect(monday).toMatchObject({ needs: 6, needsMetMin: 1 });
    expect(report.totals.needs).toBe(42);
  });

  it("agrees with the checker's objective terms the planning board shows for the same roster", async () => {
    const report = await getReport();
    const grid = await readGrid(t, manager, period.id);
    expect(report.objectiveTerms).toEqual(grid.check.terms);
    expect(report.objective).toBeCloseTo(grid.check.objective, 9);
    expect(report.totals.violations).toBe(grid.check.violations.length);
    // The weighted cover terms are the report's shortfalls times the solver's default weights (1000, 100).
    expect(report.objectiveTerms.coverUnderMin).toBe(report.totals.shortOfMin * 1000);
    expect(report.objectiveTerms.coverUnderTarget).toBe(report.totals.shortOfTarget * 100);
  });

  it('exports the payroll CSV as an attachment, one row per person and shift', async () => {
    const res = await t
      .http()
      .get(api(REPORTS_ROUTES.payrollCsv))
      .query({ periodId: period.id })
      .set(bearer(manager))
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toBe(
      'attachment; filename="payroll-ward-7-acute-medicine-2030-01-07-to-2030-01-13.csv"',
    );
    expect(res.text.split('\r\n')[0]).toBe(PAYROLL_CSV_COLUMNS.join(','));
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(6);
    const night = rows.find((r) => r.name === 'Priya Wendover' && r.date === SAT)!;
    // Saturday night 22:00 to Sunday 07:30, 540 minutes = 9.00 h; 9 × 24.50 = 220.50.
    expect(night).toMatchObject({
      staff_id: ids['Priya Wendover'],
      shift_code: 'N',
      start: `${SAT} 22:00`,
      end: `${SUN} 07:30`,
      paid_hours: '9.00',
      night: 'yes',
      weekend: 'yes',
      hourly_cost: '24.50',
      cost: '220.50',
    });
    // The lines add up to the report: 48 paid hours (2880 / 60) and 1032.45.
    const total = (key: string) => rows.reduce((s, r) => s + Number(r[key]), 0);
    expect(total('paid_hours')).toBeCloseTo(48, 9);
    expect(total('cost')).toBeCloseTo(1032.45, 9);
  });

  it('neutralises a spreadsheet formula in a name', async () => {
    await t
      .http()
      .patch(api(P.staffMember(ids['Beth Lindqvist'])))
      .set(bearer(manager))
      .send({ name: '=HYPERLINK("http://example.com","x")' })
      .expect(200);
    const res = await t
      .http()
      .get(api(REPORTS_ROUTES.payrollCsv))
      .query({ periodId: period.id })
      .set(bearer(manager))
      .expect(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    const beth = rows.find((r) => r.staff_id === ids['Beth Lindqvist'])!;
    expect(beth.name).toBe(`'=HYPERLINK("http://example.com","x")`);
  });

  it('validates the query and limits access by role and unit', async () => {
    for (const path of [REPORTS_ROUTES.report, REPORTS_ROUTES.payrollCsv]) {
      const missing = await t.http().get(api(path)).set(bearer(manager)).expect(400);
      expect(JSON.stringify(missing.body)).toMatch(/periodId/);
      const bad = await t.http().get(api(path)).query({ periodId: 'x' }).set(bearer(manager)).expect(400);
      expect(JSON.stringify(bad.body)).toMatch(/periodId must be a roster period id/);
      await t.http().get(api(path)).query({ periodId: period.id, extra: 1 }).set(bearer(manager)).expect(400);
      await t.http().get(api(path)).query({ periodId: randomUUID() }).set(bearer(manager)).expect(404);
      await t.http().get(api(path)).query({ periodId: period.id }).expect(401);
      await t.http().get(api(path)).query({ periodId: period.id }).set(bearer(staff)).expect(403);
      await t.http().get(api(path)).query({ periodId: period.id }).set(bearer(manager2)).expect(403);
      await t.http().get(api(path)).query({ periodId: period.id }).set(bearer(admin)).expect(200);
    }
  });
});
