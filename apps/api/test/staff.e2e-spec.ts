import {
  type ContractDto,
  type CsvImportResult,
  type Page,
  PLANNING_ROUTES as R,
  type StaffMemberDto,
  type UnitDto,
  type UserDto,
} from '@rotaplex/contracts';
import { parse } from 'csv-parse/sync';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/staff', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  let staff: string;
  let staffUserId: string;
  let ward: UnitDto;
  let centre: UnitDto;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    const s = await t.login('staff@example.com');
    staff = s.token;
    staffUserId = s.body.user.id;
    const units = (await t.http().get(api('/units')).set(bearer(admin))).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    centre = units.find((u) => u.name === 'Contact Centre North')!;
  });
  afterAll(() => t.close());

  const list = async (token: string, query: Record<string, string | number> = {}) =>
    (await t.http().get(api(R.staff)).query(query).set(bearer(token)).expect(200))
      .body as Page<StaffMemberDto>;
  const count = async () =>
    Number((await t.dataSource.query(`SELECT COUNT(*) AS n FROM staff_members`))[0].n);
  const upload = (token: string, csv: string, query: Record<string, string>) =>
    t
      .http()
      .post(api(R.staffImport))
      .query(query)
      .set(bearer(token))
      .set('Content-Type', 'text/csv')
      .send(csv);

  it('lists, searches, filters and sorts the staff of the manager own units only', async () => {
    const mine = await list(manager, { pageSize: 100 });
    expect(mine.total).toBe(21); // 17 ward staff with a sign-in and 4 without (demo-planning.ts)
    expect(mine.items.every((s) => s.unitId === ward.id)).toBe(true);
    const hca = await list(manager, { skill: 'hca', sort: 'name', order: 'desc' });
    expect(hca.items.map((s) => s.name)).toEqual([
      'Tariq Osei',
      'Ravi Chandran',
      'Owen Treharne',
      'Lucy Fenwick',
      'Kwame Asante',
      'Ines Moreau',
      'Agnieszka Nowak',
    ]);
    const found = await list(manager, { q: 'tallis' });
    expect(found.items).toEqual([
      expect.objectContaining({ name: 'Robin Tallis', userId: staffUserId, skills: ['RN'] }),
    ]);
    expect((await list(admin, { pageSize: 100 })).total).toBe(31);
    const page4 = await list(admin, { pageSize: 10, page: 4 });
    expect(page4.items).toHaveLength(1);
    await t.http().get(api(R.staff)).query({ sort: 'password' }).set(bearer(admin)).expect(400);
  });

  it('lets staff read only their own record, never the list', async () => {
    const me = (await list(manager, { q: 'tallis' })).items[0];
    await t
      .http()
      .get(api(R.staffMember(me.id)))
      .set(bearer(staff))
      .expect(200);
    const other = (await list(manager, { q: 'wendover' })).items[0];
    await t
      .http()
      .get(api(R.staffMember(other.id)))
      .set(bearer(staff))
      .expect(403);
    await t.http().get(api(R.staff)).set(bearer(staff)).expect(403);
    await t.http().get(api(R.staff)).expect(401);
  });

  it('creates a staff member by form, links a user of the unit, and refuses a foreign unit', async () => {
    const contracts = (await t.http().get(api(R.contracts)).set(bearer(manager))).body as ContractDto[];
    const res = await t
      .http()
      .post(api(R.staff))
      .set(bearer(manager))
      .send({
        unitId: ward.id,
        name: 'Jo Pemberton',
        email: 'Jo.Pemberton@Example.com',
        skills: ['rn', 'HCA'],
        contractId: contracts[0].id,
        hourlyCost: 21.75,
      });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      email: 'jo.pemberton@example.com',
      skills: ['HCA', 'RN'],
      active: true,
    });
    const id = (res.body as StaffMemberDto).id;
    const up = await t
      .http()
      .patch(api(R.staffMember(id)))
      .set(bearer(manager))
      .send({ active: false, skills: [] });
    expect(up.body).toMatchObject({ active: false, skills: [] });
    // The ward manager's own user may be linked (a user of the unit); a contact-centre user may not.
    const users = (await t.http().get(api('/users')).query({ pageSize: 100 }).set(bearer(admin)))
      .body as Page<UserDto>;
    const centreUser = users.items.find((u) => u.unitIds.includes(centre.id) && u.role === 'staff')!;
    const bad = await t
      .http()
      .patch(api(R.staffMember(id)))
      .set(bearer(manager))
      .send({ userId: centreUser.id });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toEqual(['userId must be a user of this unit']);
    const taken = await t
      .http()
      .patch(api(R.staffMember(id)))
      .set(bearer(manager))
      .send({ userId: staffUserId });
    expect(taken.status).toBe(409);
    await t
      .http()
      .post(api(R.staff))
      .set(bearer(manager2))
      .send({ unitId: ward.id, name: 'X', skills: [] })
      .expect(403);
    const other = (await list(admin, { unitId: centre.id, pageSize: 1 })).items[0];
    await t
      .http()
      .patch(api(R.staffMember(other.id)))
      .set(bearer(manager))
      .send({ name: 'Y' })
      .expect(403);
  });

  it("refuses another unit's contract for a staff member (400 naming contractId)", async () => {
    const theirs = await t
      .http()
      .post(api(R.contracts))
      .set(bearer(manager2))
      .send({ unitId: centre.id, name: 'Centre evenings' })
      .expect(201);
    const res = await t
      .http()
      .post(api(R.staff))
      .set(bearer(admin))
      .send({ unitId: ward.id, name: 'A', skills: [], contractId: theirs.body.id });
    expect(res.status).toBe(400);
    expect(res.body.message).toEqual([
      'contractId must be a contract of this unit or of the whole organisation',
    ]);
  });

  it('answers 400 naming the field', async () => {
    for (const [body, field] of [
      [{ unitId: ward.id, name: '', skills: [] }, 'name'],
      [{ unitId: ward.id, name: 'A', skills: ['NOPE'] }, 'skills'],
      [{ unitId: ward.id, name: 'A', skills: [], email: 'not-mail' }, 'email'],
      [{ unitId: ward.id, name: 'A', skills: [], hourlyCost: -1 }, 'hourlyCost'],
      [{ unitId: ward.id, name: 'A', skills: 'RN' }, 'skills'],
    ] as const) {
      const res = await t.http().post(api(R.staff)).set(bearer(admin)).send(body);
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.message).toEqual(
        expect.arrayContaining([expect.stringMatching(new RegExp(`^${field} `))]),
      );
    }
  });

  describe('CSV upload', () => {
    const good =
      'name,email,skills,contract,hourlyCost,active\nAmy Stroud,amy@example.org,RN,Full-time 37.5 h,24.50,true\n';
    const oneBad =
      'name,skills,contract,hourlyCost\n' +
      'Ben Ashby,HCA,Part-time 22.5 h,15.80\n' +
      'Cara Dunn,RN;XX,Full-time 37.5 h,24\n' +
      '"Dev ""DJ"" Mistry",HCA,Nonexistent,abc\n';

    it('dry run lists every bad row with its line and field and saves nothing', async () => {
      const before = await count();
      const res = await upload(manager, oneBad, { unitId: ward.id, dryRun: 'true' });
      expect(res.status).toBe(200);
      const body = res.body as CsvImportResult;
      expect(body).toMatchObject({ dryRun: true, rows: 3, saved: 0 });
      expect(body.errors).toEqual([
        { line: 3, field: 'skills', message: 'unknown skill code "XX"' },
        { line: 4, field: 'contract', message: expect.stringMatching(/no contract named "Nonexistent"/) },
        { line: 4, field: 'hourlyCost', message: expect.stringMatching(/"abc" is not an amount/) },
      ]);
      expect(await count()).toBe(before);
    });

    it('a real import with one bad row saves nothing (400 with the errors)', async () => {
      const before = await count();
      const res = await upload(manager, oneBad, { unitId: ward.id });
      expect(res.status).toBe(400);
      expect(res.body.message).toContain('line 3, skills: unknown skill code "XX"');
      expect(res.body.errors).toHaveLength(3);
      expect(await count()).toBe(before);
    });

    it('a clean file saves every row; bad headers and missing bodies are clear errors', async () => {
      const before = await count();
      const res = await upload(manager, good, { unitId: ward.id });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ dryRun: false, rows: 1, saved: 1, errors: [] });
      expect(await count()).toBe(before + 1);
      const header = await upload(manager, 'fullname\nX\n', { unitId: ward.id, dryRun: 'true' });
      expect(header.body.errors.map((e: { field: string }) => e.field)).toEqual(['fullname', 'name']);
      const json = await t
        .http()
        .post(api(R.staffImport))
        .query({ unitId: ward.id })
        .set(bearer(manager))
        .send({});
      expect(json.status).toBe(400);
      expect(json.body.message).toEqual([expect.stringMatching(/^body must be CSV text/)]);
      await upload(manager2, good, { unitId: ward.id }).expect(403);
      const noUnit = await upload(manager, good, {});
      expect(noUnit.status).toBe(400);
      expect(noUnit.body.message).toEqual([expect.stringMatching(/^unitId /)]);
    });
  });

  it('exports CSV with spreadsheet formulas neutralised (OWASP "CSV Injection")', async () => {
    await t
      .http()
      .post(api(R.staff))
      .set(bearer(manager))
      .send({ unitId: ward.id, name: '=HYPERLINK("http://x.test","open")', skills: [] })
      .expect(201);
    await t
      .http()
      .post(api(R.staff))
      .set(bearer(manager))
      .send({ unitId: ward.id, name: '@SUM(1)', skills: [] });
    const res = await t
      .http()
      .get(api(R.staffExport))
      .query({ unitId: ward.id })
      .set(bearer(manager))
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual(['name', 'email', 'skills', 'contract', 'hourlyCost', 'active']);
    const names = rows.map((r) => r.name);
    expect(names).toContain(`'=HYPERLINK("http://x.test","open")`);
    expect(names).toContain(`'@SUM(1)`);
    expect(names.some((n) => /^[=+\-@\t\r]/.test(n))).toBe(false);
    expect(rows.find((r) => r.name === 'Robin Tallis')).toMatchObject({
      skills: 'RN',
      contract: 'Full-time 37.5 h',
    });
    // The exported file uploads back without errors (a dry run), formulas read back as typed.
    const back = await upload(manager, res.text, { unitId: ward.id, dryRun: 'true' });
    expect(back.body).toMatchObject({ rows: rows.length, errors: [] });
    const theirs = await t.http().get(api(R.staffExport)).set(bearer(manager2)).expect(200);
    expect(theirs.text).not.toContain('Robin Tallis');
    await t.http().get(api(R.staffExport)).set(bearer(staff)).expect(403);
  });
});
