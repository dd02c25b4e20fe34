import { PLANNING_ROUTES as R, type ShiftTypeDto, type UnitDto } from '@rotaplex/contracts';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/units/:unitId/shift-types', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  let staff: string;
  let ward: UnitDto;
  let centre: UnitDto;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const units = (await t.http().get(api('/units')).set(bearer(admin))).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    centre = units.find((u) => u.name === 'Contact Centre North')!;
  });
  afterAll(() => t.close());

  it('lists the seeded ward shifts to the ward manager and staff', async () => {
    for (const token of [manager, staff]) {
      const res = await t
        .http()
        .get(api(R.shiftTypes(ward.id)))
        .set(bearer(token))
        .expect(200);
      expect((res.body as ShiftTypeDto[]).map((s) => s.code)).toEqual(['E', 'L', 'N']);
    }
  });

  it('creates a shift crossing midnight and updates it', async () => {
    const res = await t
      .http()
      .post(api(R.shiftTypes(ward.id)))
      .set(bearer(manager))
      .send({
        code: 'tw',
        name: 'Twilight',
        start: '18:00',
        end: '02:00',
        paidMinutes: 450,
        colour: 'slate',
      });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ code: 'TW', unitId: ward.id, night: null, colour: 'slate' });
    const id = (res.body as ShiftTypeDto).id;
    const up = await t
      .http()
      .patch(api(R.shiftType(ward.id, id)))
      .set(bearer(manager))
      .send({ night: false, paidMinutes: 480 });
    expect(up.status).toBe(200);
    expect(up.body).toMatchObject({ night: false, paidMinutes: 480 });
    await t
      .http()
      .delete(api(R.shiftType(ward.id, id)))
      .set(bearer(manager))
      .expect(204);
  });

  it('answers 400 naming the field for bad times, colour, code and paid minutes', async () => {
    const base = { code: 'X', name: 'X', start: '07:00', end: '15:00', paidMinutes: 450, colour: 'teal' };
    for (const [patch, field] of [
      [{ start: '7:00' }, 'start'],
      [{ end: '24:00' }, 'end'],
      [{ colour: 'red' }, 'colour'],
      [{ code: 'TOOLONG' }, 'code'],
      [{ paidMinutes: 7.5 }, 'paidMinutes'],
      // 07:00-15:00 is 480 minutes long: 481 paid minutes cannot fit.
      [{ paidMinutes: 481 }, 'paidMinutes'],
    ] as const) {
      const res = await t
        .http()
        .post(api(R.shiftTypes(ward.id)))
        .set(bearer(admin))
        .send({ ...base, ...patch });
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.message).toEqual(
        expect.arrayContaining([expect.stringMatching(new RegExp(`^${field} `))]),
      );
    }
  });

  it('refuses a duplicate code in the unit (409) and a shift type used by cover needs (409)', async () => {
    const dup = await t
      .http()
      .post(api(R.shiftTypes(ward.id)))
      .set(bearer(admin))
      .send({ code: 'E', name: 'Early 2', start: '06:00', end: '14:00', paidMinutes: 450, colour: 'teal' });
    expect(dup.status).toBe(409);
    const early = (
      (
        await t
          .http()
          .get(api(R.shiftTypes(ward.id)))
          .set(bearer(admin))
      ).body as ShiftTypeDto[]
    )[0];
    await t
      .http()
      .delete(api(R.shiftType(ward.id, early.id)))
      .set(bearer(admin))
      .expect(409);
  });

  it("refuses another unit's manager (403), staff writes (403) and anonymous callers (401)", async () => {
    await t
      .http()
      .get(api(R.shiftTypes(centre.id)))
      .set(bearer(manager))
      .expect(403);
    await t
      .http()
      .post(api(R.shiftTypes(ward.id)))
      .set(bearer(manager2))
      .send({ code: 'Z', name: 'Z', start: '07:00', end: '15:00', paidMinutes: 450, colour: 'teal' })
      .expect(403);
    await t
      .http()
      .post(api(R.shiftTypes(ward.id)))
      .set(bearer(staff))
      .send({ code: 'Z', name: 'Z', start: '07:00', end: '15:00', paidMinutes: 450, colour: 'teal' })
      .expect(403);
    await t
      .http()
      .get(api(R.shiftTypes(ward.id)))
      .expect(401);
  });
});
