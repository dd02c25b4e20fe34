import { type OrganisationDto, type UnitDto } from '@rotaplex/contracts';
import { DEMO_ORGANISATION } from '../src/demo/demo-data';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/units and /api/organisation', () => {
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
    const units = (await t.http().get(api('/units')).set(bearer(admin)).expect(200)).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    centre = units.find((u) => u.name === 'Contact Centre North')!;
  });
  afterAll(() => t.close());

  describe('read', () => {
    it('admins see every unit; managers and staff only their own', async () => {
      const all = (await t.http().get(api('/units')).set(bearer(admin))).body as UnitDto[];
      expect(all.map((u) => u.name)).toEqual(['Contact Centre North', 'Ward 7 Acute Medicine']);
      expect(ward.timeZone).toBe('Europe/London');
      for (const [token, expected] of [
        [manager, [ward.id]],
        [manager2, [centre.id]],
        [staff, [ward.id]],
      ] as const) {
        const mine = (await t.http().get(api('/units')).set(bearer(token)).expect(200)).body as UnitDto[];
        expect(mine.map((u) => u.id)).toEqual(expected);
      }
    });

    it('a manager of one unit cannot read another unit (403); staff likewise', async () => {
      await t
        .http()
        .get(api(`/units/${ward.id}`))
        .set(bearer(manager))
        .expect(200);
      const res = await t
        .http()
        .get(api(`/units/${centre.id}`))
        .set(bearer(manager));
      expect(res.status).toBe(403);
      expect(res.body.message).toMatch(/access to this unit/);
      await t
        .http()
        .get(api(`/units/${centre.id}`))
        .set(bearer(staff))
        .expect(403);
      await t
        .http()
        .get(api(`/units/${centre.id}`))
        .set(bearer(manager2))
        .expect(200);
    });
  });

  describe('write (admin only)', () => {
    it('creates, renames, re-zones and deletes an empty unit', async () => {
      const created = await t
        .http()
        .post(api('/units'))
        .set(bearer(admin))
        .send({ name: ' Night Dispatch ', timeZone: 'America/Chicago' })
        .expect(201);
      const unit = created.body as UnitDto;
      expect(unit).toMatchObject({ name: 'Night Dispatch', timeZone: 'America/Chicago' });
      const updated = await t
        .http()
        .patch(api(`/units/${unit.id}`))
        .set(bearer(admin))
        .send({ name: 'Dispatch', timeZone: 'Australia/Lord_Howe' })
        .expect(200);
      expect(updated.body).toMatchObject({ name: 'Dispatch', timeZone: 'Australia/Lord_Howe' });
      await t
        .http()
        .delete(api(`/units/${unit.id}`))
        .set(bearer(admin))
        .expect(204);
      await t
        .http()
        .get(api(`/units/${unit.id}`))
        .set(bearer(admin))
        .expect(404);
    });

    it('validates the IANA time zone and the name, naming the field', async () => {
      for (const timeZone of ['Mars/Olympus_Mons', '+01:00', 'GMT+1 ', '', 42]) {
        const res = await t
          .http()
          .post(api('/units'))
          .set(bearer(admin))
          .send({ name: 'Somewhere', timeZone });
        expect({ timeZone, status: res.status }).toEqual({ timeZone, status: 400 });
        expect(res.body.message).toEqual([expect.stringMatching(/^timeZone must be an IANA time zone/)]);
      }
      const noName = await t
        .http()
        .post(api('/units'))
        .set(bearer(admin))
        .send({ name: '   ', timeZone: 'UTC' });
      expect(noName.status).toBe(400);
      expect(noName.body.message).toEqual([expect.stringMatching(/^name /)]);
    });

    it('refuses a duplicate name with 409', async () => {
      const res = await t
        .http()
        .post(api('/units'))
        .set(bearer(admin))
        .send({ name: 'Ward 7 Acute Medicine', timeZone: 'Europe/London' });
      expect(res.status).toBe(409);
      expect(res.body.message).toMatch(/already exists/);
    });

    it('refuses to delete a unit that still has people, with 409 and a clear message, keeping everything', async () => {
      const res = await t
        .http()
        .delete(api(`/units/${ward.id}`))
        .set(bearer(admin));
      expect(res.status).toBe(409);
      expect(res.body.message).toMatch(/^Unit "Ward 7 Acute Medicine" still has \d+ people: move them/);
      await t
        .http()
        .get(api(`/units/${ward.id}`))
        .set(bearer(admin))
        .expect(200);
    });

    it('refuses managers and staff with 403', async () => {
      for (const token of [manager, staff]) {
        await t
          .http()
          .post(api('/units'))
          .set(bearer(token))
          .send({ name: 'Mine', timeZone: 'UTC' })
          .expect(403);
        await t
          .http()
          .patch(api(`/units/${ward.id}`))
          .set(bearer(token))
          .send({ name: 'Renamed' })
          .expect(403);
        await t
          .http()
          .delete(api(`/units/${ward.id}`))
          .set(bearer(token))
          .expect(403);
      }
    });
  });

  describe('organisation', () => {
    it('everyone signed in reads it; only admins rename it', async () => {
      for (const token of [admin, manager, staff]) {
        const res = await t.http().get(api('/organisation')).set(bearer(token)).expect(200);
        expect((res.body as OrganisationDto).name).toBe(DEMO_ORGANISATION);
      }
      await t
        .http()
        .patch(api('/organisation'))
        .set(bearer(manager))
        .send({ name: 'Taken over' })
        .expect(403);
      const bad = await t.http().patch(api('/organisation')).set(bearer(admin)).send({ name: '' });
      expect(bad.status).toBe(400);
      expect(bad.body.message).toEqual([expect.stringMatching(/^name /)]);
      const ok = await t
        .http()
        .patch(api('/organisation'))
        .set(bearer(admin))
        .send({ name: 'Larkfield Health' })
        .expect(200);
      expect(ok.body.name).toBe('Larkfield Health');
      const me = await t.http().get(api('/me')).set(bearer(staff)).expect(200);
      expect(me.body.organisation.name).toBe('Larkfield Health');
    });
  });

  describe('mailbox', () => {
    it('is for admins only', async () => {
      await t.http().get(api('/mailbox')).set(bearer(admin)).expect(200);
      await t.http().get(api('/mailbox')).set(bearer(manager)).expect(403);
      await t.http().get(api('/mailbox')).set(bearer(staff)).expect(403);
      await t.http().get(api('/mailbox/5b0e5a7c-3f57-4b8e-9a59-3f1f2f0b9c11')).set(bearer(admin)).expect(404);
    });
  });
});
