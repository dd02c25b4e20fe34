import {
  type CoverOverrideDto,
  type CoverNeedsDto,
  type CsvImportResult,
  PLANNING_ROUTES as R,
  type ShiftTypeDto,
  type SkillDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/units/:unitId/cover-needs', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  let staff: string;
  let ward: UnitDto;
  let centre: UnitDto;
  let shifts: Record<string, ShiftTypeDto>;
  let skills: Record<string, SkillDto>;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const units = (await t.http().get(api('/units')).set(bearer(admin))).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    centre = units.find((u) => u.name === 'Contact Centre North')!;
    const st = (
      await t
        .http()
        .get(api(R.shiftTypes(ward.id)))
        .set(bearer(admin))
    ).body as ShiftTypeDto[];
    shifts = Object.fromEntries(st.map((s) => [s.code, s]));
    const sk = (await t.http().get(api(R.skills)).set(bearer(admin))).body as SkillDto[];
    skills = Object.fromEntries(sk.map((s) => [s.code, s]));
  });
  afterAll(() => t.close());

  const needs = async (token = manager) =>
    (
      await t
        .http()
        .get(api(R.coverNeeds(ward.id)))
        .set(bearer(token))
        .expect(200)
    ).body as CoverNeedsDto;
  const upload = (csv: string, dryRun = false, token = manager) =>
    t
      .http()
      .post(api(R.coverImport(ward.id)))
      .query({ dryRun: String(dryRun) })
      .set(bearer(token))
      .set('Content-Type', 'text/csv')
      .send(csv);

  it('reads the seeded weekly pattern (every day, 6 needs) and its override', async () => {
    const n = await needs();
    expect(n.pattern).toHaveLength(42);
    expect(n.overrides).toHaveLength(1);
    expect(n.overrides[0]).toMatchObject({ shiftTypeId: shifts.E.id, skillId: skills.RN.id, min: 4 });
  });

  it('replaces the whole pattern in one PUT', async () => {
    const rows = [
      { weekday: 1, shiftTypeId: shifts.E.id, skillId: skills.RN.id, min: 2, target: 3 },
      { weekday: 1, shiftTypeId: shifts.E.id, skillId: null, min: 3, target: 4 },
    ];
    const res = await t
      .http()
      .put(api(R.coverPattern(ward.id)))
      .set(bearer(manager))
      .send({ rows });
    expect(res.status).toBe(200);
    expect((res.body as CoverNeedsDto).pattern).toEqual(expect.arrayContaining(rows));
    expect((res.body as CoverNeedsDto).pattern).toHaveLength(2);
  });

  it('answers 400 naming the field and keeps the pattern', async () => {
    const before = await needs();
    for (const [row, field] of [
      [{ weekday: 7, shiftTypeId: shifts.E.id, skillId: null, min: 1, target: 1 }, 'rows.0.weekday'],
      [{ weekday: 1, shiftTypeId: shifts.E.id, skillId: null, min: 3, target: 2 }, 'rows.0.target'],
      [{ weekday: 1, shiftTypeId: shifts.E.id, skillId: null, min: -1, target: 2 }, 'rows.0.min'],
      [{ weekday: 1, shiftTypeId: shifts.E.id, min: 1, target: 2 }, 'rows.0.skillId'],
    ] as const) {
      const res = await t
        .http()
        .put(api(R.coverPattern(ward.id)))
        .set(bearer(manager))
        .send({ rows: [row] });
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.message).toEqual([
        expect.stringMatching(new RegExp(`^${field.replace(/\./g, '\\.')} `)),
      ]);
    }
    // A shift type of another unit is refused too.
    const centreShift = (
      (
        await t
          .http()
          .get(api(R.shiftTypes(centre.id)))
          .set(bearer(admin))
      ).body as ShiftTypeDto[]
    )[0];
    const foreign = await t
      .http()
      .put(api(R.coverPattern(ward.id)))
      .set(bearer(manager))
      .send({ rows: [{ weekday: 1, shiftTypeId: centreShift.id, skillId: null, min: 1, target: 1 }] });
    expect(foreign.status).toBe(400);
    expect(foreign.body.message).toEqual(['rows.0.shiftTypeId must be a shift type of this unit']);
    expect(await needs()).toEqual(before);
  });

  it('adds, replaces and removes a date override', async () => {
    const body = { date: '2030-12-25', shiftTypeId: shifts.N.id, skillId: null, min: 2, target: 2 };
    const first = await t
      .http()
      .post(api(R.coverOverrides(ward.id)))
      .set(bearer(manager))
      .send(body)
      .expect(201);
    const second = await t
      .http()
      .post(api(R.coverOverrides(ward.id)))
      .set(bearer(manager))
      .send({ ...body, min: 3, target: 3 })
      .expect(201);
    const overrides = (await needs()).overrides.filter((o) => o.date === '2030-12-25');
    // The answer to a write carries the guard-rail cautions (none: the minimum went up).
    const { cautions, ...saved } = second.body as CoverOverrideDto;
    expect(cautions).toEqual([]);
    expect(overrides).toEqual([saved]);
    expect(second.body.id).not.toBe(first.body.id);
    await t
      .http()
      .delete(api(R.coverOverride(ward.id, second.body.id)))
      .set(bearer(manager))
      .expect(204);
    const bad = await t
      .http()
      .post(api(R.coverOverrides(ward.id)))
      .set(bearer(manager))
      .send({ ...body, date: '2030-02-29' });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toEqual([expect.stringMatching(/^date /)]);
  });

  it('CSV: a dry run lists bad rows with line and field; one bad row saves nothing', async () => {
    const before = await needs();
    const csv =
      'day,shift,skill,min,target\n' +
      'Mon,E,RN,3,3\n' +
      'Tue,E,,4,5\n' +
      'Funday,L,RN,2,2\n' +
      '2030-07-01,N,XX,2,1\n';
    const dry = await upload(csv, true);
    expect(dry.status).toBe(200);
    expect((dry.body as CsvImportResult).errors).toEqual([
      { line: 4, field: 'day', message: expect.stringMatching(/"Funday" must be a weekday/) },
      { line: 5, field: 'skill', message: 'unknown skill code "XX"' },
      { line: 5, field: 'target', message: 'target must be at least min' },
    ]);
    const real = await upload(csv);
    expect(real.status).toBe(400);
    expect(real.body.errors).toHaveLength(3);
    expect(await needs()).toEqual(before);
  });

  it('CSV: a clean file replaces the pattern and adds overrides in one go', async () => {
    const csv =
      'Day,Shift,Skill,Min,Target\nMon,E,RN,3,3\n0,N,,2,2\nsaturday,L,HCA,1,2\n2030-08-03,E,RN,4,4\n';
    const res = await upload(csv);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ rows: 4, saved: 4, errors: [] });
    const n = await needs();
    expect(n.pattern.map((p) => [p.weekday, p.shiftTypeId, p.skillId])).toEqual(
      expect.arrayContaining([
        [1, shifts.E.id, skills.RN.id],
        [0, shifts.N.id, null],
        [6, shifts.L.id, skills.HCA.id],
      ]),
    );
    expect(n.pattern).toHaveLength(3);
    expect(n.overrides.map((o) => o.date)).toContain('2030-08-03');
  });

  it("refuses another unit's manager and staff (403) and anonymous callers (401)", async () => {
    await t
      .http()
      .get(api(R.coverNeeds(ward.id)))
      .set(bearer(manager2))
      .expect(403);
    await t
      .http()
      .put(api(R.coverPattern(ward.id)))
      .set(bearer(manager2))
      .send({ rows: [] })
      .expect(403);
    await upload('day,shift,skill,min,target\nMon,E,,1,1\n', false, manager2).expect(403);
    await t
      .http()
      .get(api(R.coverNeeds(ward.id)))
      .set(bearer(staff))
      .expect(403);
    await t
      .http()
      .get(api(R.coverNeeds(ward.id)))
      .expect(401);
  });
});
