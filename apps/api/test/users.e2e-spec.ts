import { type Page, type UnitDto, type UserDto } from '@rotaplex/contracts';
import { DEMO_USERS } from '../src/demo/demo-data';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/users', () => {
  let t: TestApp;
  let admin: string;
  let manager: string; // Ward 7
  let manager2: string; // Contact centre
  let staff: string;
  let ward: UnitDto;
  let centre: UnitDto;
  const idOf = async (email: string) =>
    ((await t.dataSource.query(`SELECT id FROM users WHERE email = ?`, [email])) as { id: string }[])[0].id;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const units = (await t.http().get(api('/units')).set(bearer(admin)).expect(200)).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    centre = units.find((u) => u.name === 'Contact Centre North')!;
  });
  afterAll(() => t.close());

  describe('list', () => {
    it('gives admins every user, paginated, with total', async () => {
      const res = await t.http().get(api('/users')).query({ pageSize: 10 }).set(bearer(admin)).expect(200);
      const page = res.body as Page<UserDto>;
      expect(page.total).toBe(DEMO_USERS.length);
      expect(page.items).toHaveLength(10);
      expect(page).toMatchObject({ page: 1, pageSize: 10 });
      const last = (await t.http().get(api('/users')).query({ pageSize: 10, page: 3 }).set(bearer(admin)))
        .body as Page<UserDto>;
      expect(last.items).toHaveLength(DEMO_USERS.length - 20);
      const ids = new Set([...page.items, ...last.items].map((u) => u.id));
      expect(ids.size).toBe(page.items.length + last.items.length);
    });

    it('sorts by the requested column and order', async () => {
      const asc = (
        await t.http().get(api('/users')).query({ sort: 'email', pageSize: 100 }).set(bearer(admin))
      ).body as Page<UserDto>;
      const emails = asc.items.map((u) => u.email);
      expect(emails).toEqual([...emails].sort());
      const desc = (
        await t
          .http()
          .get(api('/users'))
          .query({ sort: 'displayName', order: 'desc', pageSize: 100 })
          .set(bearer(admin))
      ).body as Page<UserDto>;
      const names = desc.items.map((u) => u.displayName);
      expect(names).toEqual([...names].sort().reverse());
    });

    it('searches e-mail and name with q, and filters by role and unit', async () => {
      const q = (await t.http().get(api('/users')).query({ q: 'wendover' }).set(bearer(admin)))
        .body as Page<UserDto>;
      expect(q.items.map((u) => u.email)).toEqual(['priya.wendover@example.com']);
      const pct = (await t.http().get(api('/users')).query({ q: '%' }).set(bearer(admin)))
        .body as Page<UserDto>;
      expect(pct.total).toBe(0); // LIKE wildcards are escaped
      const managers = (await t.http().get(api('/users')).query({ role: 'manager' }).set(bearer(admin)))
        .body as Page<UserDto>;
      expect(managers.items.map((u) => u.email).sort()).toEqual([
        'manager2@example.com',
        'manager@example.com',
      ]);
      const inCentre = (
        await t.http().get(api('/users')).query({ unitId: centre.id, pageSize: 100 }).set(bearer(admin))
      ).body as Page<UserDto>;
      expect(inCentre.total).toBe(DEMO_USERS.filter((u) => u.unit === 'contact').length);
    });

    it('rejects unknown sort columns and bad paging with 400 naming the field', async () => {
      const res = await t
        .http()
        .get(api('/users'))
        .query({ sort: 'passwordHash', page: 0, pageSize: 1000 })
        .set(bearer(admin));
      expect(res.status).toBe(400);
      const msgs = res.body.message as string[];
      expect(msgs.some((m) => m.startsWith('sort '))).toBe(true);
      expect(msgs.some((m) => m.startsWith('page '))).toBe(true);
      expect(msgs.some((m) => m.startsWith('pageSize '))).toBe(true);
    });

    it('limits a manager to the people in their units', async () => {
      const res = await t.http().get(api('/users')).query({ pageSize: 100 }).set(bearer(manager)).expect(200);
      const page = res.body as Page<UserDto>;
      expect(page.total).toBe(DEMO_USERS.filter((u) => u.unit === 'ward').length);
      expect(page.items.every((u) => u.unitIds.includes(ward.id))).toBe(true);
      const other = (await t.http().get(api('/users')).query({ unitId: centre.id }).set(bearer(manager)))
        .body as Page<UserDto>;
      expect(other.total).toBe(0);
    });

    it('refuses staff with 403', async () => {
      const res = await t.http().get(api('/users')).set(bearer(staff));
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/users:read/);
    });
  });

  describe('get one', () => {
    it('lets a manager read someone in their unit but not in another unit', async () => {
      await t
        .http()
        .get(api(`/users/${await idOf('staff@example.com')}`))
        .set(bearer(manager))
        .expect(200);
      const res = await t
        .http()
        .get(api(`/users/${await idOf('sofia.marin@example.com')}`))
        .set(bearer(manager));
      expect(res.status).toBe(403);
      await t
        .http()
        .get(api(`/users/${await idOf('sofia.marin@example.com')}`))
        .set(bearer(manager2))
        .expect(200);
    });

    it('404 for an unknown id', async () => {
      await t.http().get(api('/users/0b0e5a7c-3f57-4b8e-9a59-3f1f2f0b9c11')).set(bearer(admin)).expect(404);
    });
  });

  describe('writes (admin only)', () => {
    it('refuses managers and staff with 403', async () => {
      const id = await idOf('lucy.fenwick@example.com');
      for (const token of [manager, staff]) {
        await t
          .http()
          .patch(api(`/users/${id}`))
          .set(bearer(token))
          .send({ displayName: 'X' })
          .expect(403);
        await t
          .http()
          .post(api(`/users/${id}/deactivate`))
          .set(bearer(token))
          .expect(403);
        await t
          .http()
          .post(api('/users'))
          .set(bearer(token))
          .send({ email: 'a@example.com', displayName: 'A', role: 'staff', unitIds: [] })
          .expect(403);
      }
    });

    it('updates name, role and units', async () => {
      const id = await idOf('lucy.fenwick@example.com');
      const res = await t
        .http()
        .patch(api(`/users/${id}`))
        .set(bearer(admin))
        .send({ displayName: 'Lucy Fenwick-Hart', role: 'manager', unitIds: [ward.id, centre.id] })
        .expect(200);
      expect(res.body).toMatchObject({
        displayName: 'Lucy Fenwick-Hart',
        role: 'manager',
        unitIds: [ward.id, centre.id].sort(),
      });
      // the new role applies at once, with the old token
      const lucy = await t.login('lucy.fenwick@example.com');
      await t.http().get(api('/users')).set(bearer(lucy.token)).expect(200);
      await t
        .http()
        .patch(api(`/users/${id}`))
        .set(bearer(admin))
        .send({ role: 'staff', unitIds: [ward.id] })
        .expect(200);
      await t.http().get(api('/users')).set(bearer(lucy.token)).expect(403);
    });

    it('validates updates naming the field', async () => {
      const id = await idOf('lucy.fenwick@example.com');
      const res = await t
        .http()
        .patch(api(`/users/${id}`))
        .set(bearer(admin))
        .send({ role: 'owner', email: 'new@example.com' });
      expect(res.status).toBe(400);
      expect(res.body.message).toEqual(
        expect.arrayContaining([
          expect.stringMatching(/^role must be one of/),
          'property email should not exist',
        ]),
      );
    });

    it('stops an admin from changing their own role or deactivating themselves', async () => {
      const me = await idOf('admin@example.com');
      await t
        .http()
        .patch(api(`/users/${me}`))
        .set(bearer(admin))
        .send({ role: 'staff' })
        .expect(409);
      await t
        .http()
        .post(api(`/users/${me}/deactivate`))
        .set(bearer(admin))
        .expect(409);
    });

    it('deactivation refuses sign-in, refresh and the access token already issued; reactivation restores sign-in', async () => {
      const email = 'ravi.chandran@example.com';
      const id = await idOf(email);
      const session = await t.login(email);
      await t.http().get(api('/me')).set(bearer(session.token)).expect(200);

      const res = await t
        .http()
        .post(api(`/users/${id}/deactivate`))
        .set(bearer(admin))
        .expect(200);
      expect(res.body.active).toBe(false);
      await t.http().get(api('/me')).set(bearer(session.token)).expect(401);
      const login = await t.http().post(api('/auth/login')).send({ email, password: 'rotaplex-demo' });
      expect(login.status).toBe(401);
      expect(login.body.message).toMatch(/deactivated/);
      await t
        .http()
        .post(api('/auth/refresh'))
        .set('Cookie', `rotaplex_refresh=${encodeURIComponent(session.refreshCookie)}`)
        .expect(401);
      const listed = (await t.http().get(api('/users')).query({ active: 'false' }).set(bearer(admin)))
        .body as Page<UserDto>;
      expect(listed.items.map((u) => u.email)).toEqual([email]);

      await t
        .http()
        .post(api(`/users/${id}/reactivate`))
        .set(bearer(admin))
        .expect(200);
      await t.login(email);
    });
  });
});
