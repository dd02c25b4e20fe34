import {
  type ContractDto,
  type ContractPresetDto,
  PLANNING_ROUTES as R,
  type UnitDto,
  WORKING_TIME_CAUTION,
} from '@rotaplex/contracts';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/contracts', () => {
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

  it('serves presets of working-time limits, each with the caution', async () => {
    const res = await t.http().get(api(R.contractPresets)).set(bearer(manager)).expect(200);
    const presets = res.body as ContractPresetDto[];
    const eu = presets.find((p) => p.key === 'eu-wtd')!;
    // EU Working Time Directive 2003/88/EC: 11 h daily rest (Art. 3), 48 h average week (Art. 6),
    // 24 h weekly rest per 7 days (Art. 5) so at most 6 working days in a row.
    expect(eu.rules).toMatchObject({ minRestMinutes: 660, maxPaidMinutes: 2880, maxConsecutiveWorkDays: 6 });
    // UK Working Time Regulations 1998: 48 h average week.
    expect(presets.find((p) => p.key === 'uk-wtr')!.rules.maxPaidMinutes).toBe(2880);
    expect(presets.find((p) => p.key === 'part-time')).toBeDefined();
    for (const p of presets) {
      expect(p.caution).toBe(WORKING_TIME_CAUTION);
      expect(p.caution).toMatch(/not legal advice/);
      expect(p.caution).toMatch(/qualified person signs the roster off/);
    }
  });

  it('lets a manager create a unit contract from a preset and change it', async () => {
    const presets = (await t.http().get(api(R.contractPresets)).set(bearer(manager)))
      .body as ContractPresetDto[];
    const res = await t
      .http()
      .post(api(R.contracts))
      .set(bearer(manager))
      .send({ unitId: ward.id, name: 'Nights only', ...presets[0].rules, maxShiftsPerType: { E: 0, L: 0 } });
    expect(res.status).toBe(201);
    const c = res.body as ContractDto;
    expect(c).toMatchObject({ unitId: ward.id, minRestMinutes: 660, maxShiftsPerType: { E: 0, L: 0 } });
    const up = await t
      .http()
      .patch(api(R.contract(c.id)))
      .set(bearer(manager))
      .send({ maxConsecutiveNights: 3, minRestMinutes: null });
    expect(up.body).toMatchObject({ maxConsecutiveNights: 3, minRestMinutes: null, maxPaidMinutes: 2880 });
    const mine = (await t.http().get(api(R.contracts)).set(bearer(manager))).body as ContractDto[];
    expect(mine.map((x) => x.name)).toEqual(['Full-time 37.5 h', 'Nights only', 'Part-time 22.5 h']);
    const theirs = (await t.http().get(api(R.contracts)).set(bearer(manager2))).body as ContractDto[];
    expect(theirs.map((x) => x.name)).not.toContain('Nights only');
    await t
      .http()
      .get(api(R.contract(c.id)))
      .set(bearer(manager2))
      .expect(403);
    await t
      .http()
      .delete(api(R.contract(c.id)))
      .set(bearer(manager))
      .expect(204);
  });

  it('answers 400 naming the field, and for inconsistent limits', async () => {
    for (const [body, field] of [
      [{ name: 'X', minRestMinutes: -1 }, 'minRestMinutes'],
      [{ name: 'X', maxWeekends: 1.5 }, 'maxWeekends'],
      [{ name: 'X', maxShiftsPerType: { early: 2 } }, 'maxShiftsPerType'],
      [{ name: '' }, 'name'],
      [{ name: 'X', minPaidMinutes: 2000, maxPaidMinutes: 1000 }, 'minPaidMinutes'],
    ] as const) {
      const res = await t
        .http()
        .post(api(R.contracts))
        .set(bearer(admin))
        .send({ unitId: ward.id, ...body });
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.message).toEqual(
        expect.arrayContaining([expect.stringMatching(new RegExp(`^${field} `))]),
      );
    }
  });

  it('keeps organisation-wide contracts to admins, other units to their managers, staff out', async () => {
    const orgWide = await t.http().post(api(R.contracts)).set(bearer(manager)).send({ name: 'Mine' });
    expect(orgWide.status).toBe(403);
    expect(orgWide.body.message).toMatch(/admin/);
    await t
      .http()
      .post(api(R.contracts))
      .set(bearer(manager))
      .send({ unitId: centre.id, name: 'X' })
      .expect(403);
    await t.http().get(api(R.contracts)).set(bearer(staff)).expect(403);
    await t.http().get(api(R.contractPresets)).expect(401);
    const created = await t
      .http()
      .post(api(R.contracts))
      .set(bearer(admin))
      .send({ name: 'Bank' })
      .expect(201);
    expect(created.body).toMatchObject({ unitId: null, maxPaidMinutes: null });
  });

  it('refuses deleting a contract held by staff (409)', async () => {
    const full = ((await t.http().get(api(R.contracts)).set(bearer(admin))).body as ContractDto[]).find(
      (c) => c.name === 'Full-time 37.5 h',
    )!;
    const res = await t
      .http()
      .delete(api(R.contract(full.id)))
      .set(bearer(admin));
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/held by \d+ staff member/);
  });
});
