import {
  MY_ROSTER_ROUTES as M,
  type MyRosterDto,
  type Page,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  type StaffMemberDto,
  type UnitDto,
} from '@rotaplex/contracts';
import {
  createPeriod,
  DEMO_WARD,
  listUnits,
  publishPeriod,
  putCell,
  shiftTypesByCode,
  staffByName,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * GET /api/me/shifts: my published shifts and my unit's, colleagues with name and shift only
 * (PRODUCT.md: a staff member never sees another person's private requests, contact details or pay).
 * Expected instants follow the IANA rule for Europe/London (from memory): BST (UTC+1) from 01:00 UTC
 * on the last Sunday of March, 31 March in 2030.
 */
describe('/api/me/shifts', () => {
  let t: TestApp;
  let manager: string;
  let staff: string;
  let ward: UnitDto;
  let contact: UnitDto;
  let period: RosterPeriodDto;
  let robin: StaffMemberDto;
  let grace: StaffMemberDto;

  const myShifts = (token: string, query: Record<string, string>) =>
    t.http().get(api(M.myShifts)).query(query).set(bearer(token));

  beforeAll(async () => {
    t = await startTestApp();
    manager = (await t.login('manager@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const units = await listUnits(t, (await t.login('admin@example.com')).token);
    ward = units.find((u) => u.name === DEMO_WARD)!;
    contact = units.find((u) => u.name === 'Contact Centre North')!;
    const shift = await shiftTypesByCode(t, manager, ward.id);
    const person = await staffByName(t, manager, ward.id);
    robin = person('Robin Tallis');
    grace = person('Grace Holloway');
    period = await createPeriod(t, manager, ward.id, '2030-03-27');
    const cells: [string, string, string][] = [
      [robin.id, '2030-03-30', 'N'],
      [robin.id, '2030-04-01', 'E'],
      [grace.id, '2030-03-30', 'L'],
      [grace.id, '2030-04-02', 'E'],
    ];
    for (const [staffMemberId, date, code] of cells) {
      await putCell(t, manager, period.id, { staffMemberId, date, shiftTypeId: shift[code].id });
    }
  });
  afterAll(() => t.close());

  it('shows nothing of a draft roster', async () => {
    const res = await myShifts(staff, { from: '2030-03-27', to: '2030-04-02' }).expect(200);
    const body = res.body as MyRosterDto;
    expect(body.shifts).toEqual([]);
    expect(body.units).toEqual([{ unitId: ward.id, unitName: ward.name, timeZone: 'Europe/London' }]);
  });

  it("lists my published shifts and my unit's, as UTC instants with the unit's zone", async () => {
    await publishPeriod(t, manager, period.id);
    const body = (await myShifts(staff, { from: '2030-03-27', to: '2030-04-02' }).expect(200))
      .body as MyRosterDto;
    expect(body.shifts.map((s) => [s.date, s.name, s.shiftCode, s.mine, s.start, s.end])).toEqual([
      // Late 14:30-22:30 on 30 March (GMT, UTC+0)
      ['2030-03-30', 'Grace Holloway', 'L', false, '2030-03-30T14:30:00.000Z', '2030-03-30T22:30:00.000Z'],
      // Night 22:00 GMT to 07:30 BST: 06:30 UTC
      ['2030-03-30', 'Robin Tallis', 'N', true, '2030-03-30T22:00:00.000Z', '2030-03-31T06:30:00.000Z'],
      // Early 07:00-15:00 BST (UTC+1)
      ['2030-04-01', 'Robin Tallis', 'E', true, '2030-04-01T06:00:00.000Z', '2030-04-01T14:00:00.000Z'],
      ['2030-04-02', 'Grace Holloway', 'E', false, '2030-04-02T06:00:00.000Z', '2030-04-02T14:00:00.000Z'],
    ]);
    expect(body.shifts.every((s) => s.timeZone === 'Europe/London' && s.unitId === ward.id)).toBe(true);
  });

  it("gives a colleague's shift their name and the shift only", async () => {
    const body = (await myShifts(staff, { from: '2030-03-30', to: '2030-03-30' }).expect(200))
      .body as MyRosterDto;
    const colleague = body.shifts.find((s) => !s.mine)!;
    expect(Object.keys(colleague).sort()).toEqual(
      [
        'colour',
        'date',
        'end',
        'mine',
        'name',
        'shiftCode',
        'shiftName',
        'start',
        'timeZone',
        'unitId',
        'unitName',
      ].sort(),
    );
    const text = JSON.stringify(body);
    expect(text).not.toContain(grace.id); // no staff ids
    expect(text).not.toContain('@example.com'); // no e-mail addresses
    expect(text).not.toMatch(/hourlyCost|contract|skills|email|userId/);
  });

  it('limits the range to the days asked for', async () => {
    const body = (await myShifts(staff, { from: '2030-04-01', to: '2030-04-01' }).expect(200))
      .body as MyRosterDto;
    expect(body.shifts.map((s) => [s.name, s.date])).toEqual([['Robin Tallis', '2030-04-01']]);
  });

  it("shows nobody else's unit: the contact centre's staff see none of the ward's shifts", async () => {
    // A signed-in staff member of the demo contact centre.
    const people = (
      await t
        .http()
        .get(api(P.staff))
        .query({ unitId: contact.id, pageSize: 100 })
        .set(bearer((await t.login('manager2@example.com')).token))
        .expect(200)
    ).body as Page<StaffMemberDto>;
    const member = people.items.find((p) => p.userId && p.email)!;
    const token = (await t.login(member.email!)).token;
    const body = (await myShifts(token, { from: '2030-03-27', to: '2030-04-02' }).expect(200))
      .body as MyRosterDto;
    expect(body.shifts).toEqual([]);
    expect(body.units.map((u) => u.unitId)).toEqual([contact.id]);
  });

  it('gives a user without a staff record an empty roster', async () => {
    const body = (await myShifts(manager, { from: '2030-03-27', to: '2030-04-02' }).expect(200))
      .body as MyRosterDto;
    expect(body).toEqual({ from: '2030-03-27', to: '2030-04-02', units: [], shifts: [] });
  });

  it('refuses a bad range with 400 and an anonymous caller with 401', async () => {
    await myShifts(staff, { from: '2030-04-02', to: '2030-03-27' }).expect(400);
    await myShifts(staff, { from: '2030-01-01', to: '2030-12-31' }).expect(400);
    await myShifts(staff, { from: '2030-02-30', to: '2030-03-02' }).expect(400);
    await myShifts(staff, { from: 'soon', to: '2030-03-02' }).expect(400);
    await myShifts(staff, { from: '2030-03-01' }).expect(400);
    await t.http().get(api(M.myShifts)).query({ from: '2030-03-27', to: '2030-04-02' }).expect(401);
  });
});
