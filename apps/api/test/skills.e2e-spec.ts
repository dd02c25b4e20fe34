import { PLANNING_ROUTES as R, type SkillDto } from '@rotaplex/contracts';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/skills', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let staff: string;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
  });
  afterAll(() => t.close());

  it('lists the demo skills to every signed-in role', async () => {
    for (const token of [admin, manager, staff]) {
      const res = await t.http().get(api(R.skills)).set(bearer(token)).expect(200);
      expect((res.body as SkillDto[]).map((s) => s.code)).toEqual(
        expect.arrayContaining(['RN', 'HCA', 'GA']),
      );
    }
  });

  it('lets a manager create, rename and delete a skill (code stored upper case)', async () => {
    const created = await t
      .http()
      .post(api(R.skills))
      .set(bearer(manager))
      .send({ code: ' iv ', name: 'Intravenous therapy' })
      .expect(201);
    expect(created.body).toMatchObject({ code: 'IV', name: 'Intravenous therapy' });
    const id = (created.body as SkillDto).id;
    await t
      .http()
      .patch(api(R.skill(id)))
      .set(bearer(manager))
      .send({ name: 'IV therapy' })
      .expect(200);
    await t
      .http()
      .delete(api(R.skill(id)))
      .set(bearer(admin))
      .expect(204);
    await t
      .http()
      .get(api(R.skill(id)))
      .set(bearer(admin))
      .expect(404);
  });

  it('answers 400 naming the field', async () => {
    const res = await t.http().post(api(R.skills)).set(bearer(admin)).send({ code: 'has space', name: 'X' });
    expect(res.status).toBe(400);
    expect(res.body.message).toEqual([expect.stringMatching(/^code /)]);
    const noName = await t.http().post(api(R.skills)).set(bearer(admin)).send({ code: 'OK' });
    expect(noName.status).toBe(400);
    expect(noName.body.message).toEqual(expect.arrayContaining([expect.stringMatching(/^name /)]));
  });

  it('refuses a duplicate code (409) and deleting a skill in use (409)', async () => {
    await t.http().post(api(R.skills)).set(bearer(admin)).send({ code: 'rn', name: 'Again' }).expect(409);
    const rn = ((await t.http().get(api(R.skills)).set(bearer(admin))).body as SkillDto[]).find(
      (s) => s.code === 'RN',
    )!;
    const res = await t
      .http()
      .delete(api(R.skill(rn.id)))
      .set(bearer(admin));
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/still held/);
  });

  it('refuses staff writes (403) and anonymous callers (401)', async () => {
    await t.http().post(api(R.skills)).set(bearer(staff)).send({ code: 'X', name: 'X' }).expect(403);
    await t.http().get(api(R.skills)).expect(401);
  });
});
