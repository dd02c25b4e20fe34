import {
  MAX_PAGE_SIZE,
  type Page,
  PLANNING_ROUTES as R,
  type RosterPeriodDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { demoPeriodStart } from '../src/demo/demo-planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/roster-periods', () => {
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

  const create = (token: string, body: object) =>
    t.http().post(api(R.rosterPeriods)).set(bearer(token)).send(body);

  it('seeds a four-week draft per unit starting on a Monday at least three weeks ahead', async () => {
    const list = (
      (await t.http().get(api(R.rosterPeriods)).set(bearer(admin)).expect(200)).body as Page<RosterPeriodDto>
    ).items;
    expect(list.map((p) => p.unitId).sort()).toEqual([ward.id, centre.id].sort());
    for (const p of list) {
      expect(p).toMatchObject({ days: 28, status: 'draft', version: 1, publishedAt: null });
      expect(new Date(`${p.startDate}T00:00:00Z`).getUTCDay()).toBe(1);
      const ahead = (Date.parse(`${p.startDate}T00:00:00Z`) - Date.now()) / 86400000;
      expect(ahead).toBeGreaterThanOrEqual(20); // 21 days from the seed date, give or take the time zone
      expect(ahead).toBeLessThan(29);
    }
    // Calendar facts (checked with GNU date +%A): 2026-12-22 is a Tuesday, 2026-12-28 a Monday.
    expect(demoPeriodStart('2026-12-01')).toBe('2026-12-28');
    expect(demoPeriodStart('2026-12-07')).toBe('2026-12-28'); // +21 days is already a Monday
  });

  it('creates, changes (draft only, with version check) and archives a period', async () => {
    const res = await create(manager, { unitId: ward.id, startDate: '2030-01-07', days: 14 });
    expect(res.status).toBe(201);
    const p = res.body as RosterPeriodDto;
    expect(p).toMatchObject({ status: 'draft', version: 1 });
    const up = await t
      .http()
      .patch(api(R.rosterPeriod(p.id)))
      .set(bearer(manager))
      .send({ days: 21, version: 1 });
    expect(up.status).toBe(200);
    expect(up.body).toMatchObject({ days: 21, version: 2 });
    const stale = await t
      .http()
      .patch(api(R.rosterPeriod(p.id)))
      .set(bearer(manager))
      .send({ days: 28, version: 1 });
    expect(stale.status).toBe(409);
    const archived = await t
      .http()
      .post(api(R.rosterPeriodArchive(p.id)))
      .set(bearer(manager))
      .expect(200);
    expect(archived.body).toMatchObject({ status: 'archived' });
    const late = await t
      .http()
      .patch(api(R.rosterPeriod(p.id)))
      .set(bearer(manager))
      .send({ days: 7 });
    expect(late.status).toBe(409);
    expect(late.body.message).toMatch(/Only a draft/);
  });

  it('refuses overlapping periods in one unit with 409, not in another unit', async () => {
    await create(manager, { unitId: ward.id, startDate: '2031-03-03', days: 28 }).expect(201);
    const clash = await create(manager, { unitId: ward.id, startDate: '2031-03-30', days: 7 });
    expect(clash.status).toBe(409);
    expect(clash.body.message).toMatch(/overlaps the draft period from 2031-03-03 to 2031-03-30/);
    await create(manager, { unitId: ward.id, startDate: '2031-03-31', days: 7 }).expect(201);
    await create(manager2, { unitId: centre.id, startDate: '2031-03-10', days: 7 }).expect(201);
  });

  it('answers 400 naming the field', async () => {
    for (const [body, field] of [
      [{ unitId: ward.id, startDate: '2030-02-30', days: 28 }, 'startDate'],
      [{ unitId: ward.id, startDate: '5/1/2030', days: 28 }, 'startDate'],
      [{ unitId: ward.id, startDate: '2030-05-06', days: 6 }, 'days'],
      [{ unitId: ward.id, startDate: '2030-05-06', days: 85 }, 'days'],
      [{ unitId: 'ward', startDate: '2030-05-06', days: 28 }, 'unitId'],
    ] as const) {
      const res = await create(admin, body);
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.message).toEqual([expect.stringMatching(new RegExp(`^${field} `))]);
    }
  });

  it('pages newest first; page and pageSize are bounded', async () => {
    for (const startDate of ['2033-01-03', '2033-02-07', '2033-03-07']) {
      await create(manager, { unitId: ward.id, startDate, days: 7 }).expect(201);
    }
    const list = (query: Record<string, unknown>) =>
      t
        .http()
        .get(api(R.rosterPeriods))
        .query({ unitId: ward.id, ...query })
        .set(bearer(manager));
    const all = (await list({ pageSize: MAX_PAGE_SIZE }).expect(200)).body as Page<RosterPeriodDto>;
    expect(all.total).toBeGreaterThanOrEqual(4);
    const starts = all.items.map((p) => p.startDate);
    expect(starts).toEqual([...starts].sort().reverse());
    expect(starts.slice(0, 3)).toEqual(['2033-03-07', '2033-02-07', '2033-01-03']);
    const second = (await list({ page: 2, pageSize: 2 }).expect(200)).body as Page<RosterPeriodDto>;
    expect(second).toMatchObject({ total: all.total, page: 2, pageSize: 2 });
    expect(second.items.map((p) => p.id)).toEqual(all.items.slice(2, 4).map((p) => p.id));
    const defaults = (await list({}).expect(200)).body as Page<RosterPeriodDto>;
    expect([defaults.page, defaults.pageSize]).toEqual([1, 20]);
    for (const [query, field] of [
      [{ page: 0 }, 'page'],
      [{ pageSize: 0 }, 'pageSize'],
      [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
      [{ order: 'asc' }, 'order'],
    ] as const) {
      const res = await list(query).expect(400);
      expect(JSON.stringify(res.body.message)).toContain(field);
    }
  });

  it("refuses another unit's manager (403), staff writes (403), shows staff no drafts, anonymous 401", async () => {
    await create(manager2, { unitId: ward.id, startDate: '2032-01-05', days: 7 }).expect(403);
    await create(staff, { unitId: ward.id, startDate: '2032-01-05', days: 7 }).expect(403);
    const seen = (
      (await t.http().get(api(R.rosterPeriods)).set(bearer(staff)).expect(200)).body as Page<RosterPeriodDto>
    ).items;
    expect(seen.every((p) => p.status !== 'draft' && p.unitId === ward.id)).toBe(true);
    await t.http().get(api(R.rosterPeriods)).expect(401);
  });
});
