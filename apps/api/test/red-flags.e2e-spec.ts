import {
  type AuditEntryDto,
  PLANNING_ROUTES as P,
  type Page,
  PUBLISHING_ROUTES as PUB,
  type PublishCheckDto,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  type OpenShiftDto,
  SOLVING_ROUTES as R,
  SWAP_ROUTES as S,
} from '@rotaplex/contracts';
import { type SmallUnit, smallUnit } from './publishing-fixture';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(120_000);

// Red flags of safe staffing, NICE SG1 (2014, adult inpatient wards) as quoted in PRODUCT.md "Safe
// staffing": "red flags include fewer than 2 registered nurses on a shift, or a registered-nurse
// shortfall of more than 8 hours or 25% of the shift's need". A roster built by hand: one registered
// nurse on a night that needs two (fewer than 2; 1 x 11.5 h = 11.5 h > 8 h; 1 of 2 = 50% > 25%).
describe('red flags of safe staffing in the publish check and the publish guard', () => {
  let t: TestApp;
  let admin: string;
  let small: SmallUnit;
  let period: RosterPeriodDto;
  let night: ShiftTypeDto;
  let rn: SkillDto;

  const check = async () =>
    (
      await t
        .http()
        .get(api(PUB.publishCheck(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as PublishCheckDto;
  const publish = (body: object) =>
    t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(admin))
      .send(body);
  const markRegistered = (registered: unknown) =>
    t
      .http()
      .patch(api(P.skill(rn.id)))
      .set(bearer(admin))
      .send({ registered });

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    small = await smallUnit(t, admin, 'Merlin Ward', '2031-05-05');
    period = small.period;
    night = (
      await t
        .http()
        .post(api(P.shiftTypes(small.unit.id)))
        .set(bearer(admin))
        .send({ code: 'N', name: 'Night', start: '20:00', end: '08:00', paidMinutes: 690, colour: 'plum' })
        .expect(201)
    ).body as ShiftTypeDto;
    rn = (
      await t
        .http()
        .post(api(P.skills))
        .set(bearer(admin))
        .send({ code: 'MRN', name: 'Registered nurse', registered: true })
        .expect(201)
    ).body as SkillDto;
    expect(rn.registered).toBe(true);
    const [maren, tobiah] = small.staff;
    for (const s of [maren, tobiah]) {
      await t
        .http()
        .patch(api(P.staffMember(s.id)))
        .set(bearer(admin))
        .send({ skills: ['MRN'] })
        .expect(200);
    }
    // Only the first night needs anyone: 2 registered nurses (2031-05-05 is a Monday, weekday 1).
    await t
      .http()
      .put(api(P.coverPattern(small.unit.id)))
      .set(bearer(admin))
      .send({ rows: [{ weekday: 1, shiftTypeId: night.id, skillId: rn.id, min: 2, target: 2 }] })
      .expect(200);
    // One registered nurse on that night.
    await t
      .http()
      .put(api(R.assignmentCell(period.id)))
      .set(bearer(admin))
      .send({ staffMemberId: maren.id, date: '2031-05-05', shiftTypeId: night.id })
      .expect(200);
    period = (
      await t
        .http()
        .get(api(P.rosterPeriod(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as RosterPeriodDto;
  });
  afterAll(() => t?.close());

  it('defaults a new skill to not registered, and refuses a registered flag that is not a boolean', async () => {
    const other = (
      await t.http().post(api(P.skills)).set(bearer(admin)).send({ code: 'MHCA', name: 'Care' }).expect(201)
    ).body as SkillDto;
    expect(other.registered).toBe(false);
    const bad = await markRegistered('yes').expect(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/registered must be true or false/);
    const listed = (await t.http().get(api(P.skills)).set(bearer(admin)).expect(200)).body as SkillDto[];
    expect(listed.find((s) => s.id === rn.id)?.registered).toBe(true);
  });

  it('names the red flag first: 1 registered nurse on a night needing 2 (NICE SG1 2014 via PRODUCT.md)', async () => {
    const c = await check();
    expect(c.redFlags).toHaveLength(1);
    const [flag] = c.redFlags;
    expect(flag).toMatchObject({
      date: '2031-05-05',
      shiftCode: 'N',
      skillCode: 'MRN',
      need: 2,
      onShift: 1,
      // 1 short x 11.5 paid hours (690 min); 1 of 2 short.
      shortHours: 11.5,
      shortShare: 0.5,
      rules: ['fewerThanTwo', 'shortfallHours', 'shortfallShare'],
    });
    expect(flag.text).toBe(
      'Mon 5 May, Night, Registered nurse (MRN): 1 on the shift of 2 needed (fewer than 2 on the shift; ' +
        '11.5 h short, more than 8 h; 50% of the need short, more than 25%)',
    );
    expect(c.belowMinimum).toHaveLength(1);
    expect(c.needsAcknowledgement).toBe(true);
  });

  it('refuses to publish with a red flag unless acknowledged with a reason, and keeps the reason', async () => {
    const refused = await publish({ version: period.version }).expect(422);
    expect(refused.body.message).toMatch(
      /^1 red flag of safe staffing \(NICE SG1; first: Mon 5 May, Night, Registered nurse \(MRN\): 1 on the shift of 2/,
    );
    expect(refused.body.message).toMatch(/acknowledgeBelowMinimum/);
    await publish({ version: period.version, acknowledgeBelowMinimum: true }).expect(400);
    const status = (
      await t
        .http()
        .get(api(P.rosterPeriod(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as RosterPeriodDto;
    expect(status.status).toBe('draft');
  });

  it('reports no red flag when the skill is not marked registered (the shortfall stays below minimum)', async () => {
    expect((await markRegistered(false).expect(200)).body.registered).toBe(false);
    const c = await check();
    expect(c.redFlags).toEqual([]);
    expect(c.belowMinimum).toHaveLength(1);
    const refused = await publish({ version: period.version }).expect(422);
    expect(refused.body.message).not.toMatch(/red flag/);
    await markRegistered(true).expect(200);
  });

  it('publishes with the acknowledgement, and the audit trail names the red flag', async () => {
    const reason = 'Agency nurse booked for the night; escalated to the site manager';
    await publish({ version: period.version, acknowledgeBelowMinimum: true, reason }).expect(200);
    const trail = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    const entry = trail.items.find((e) => e.kind === 'publish')!;
    expect(entry.summary).toContain(
      'with 1 shift(s) below minimum cover and 1 red flag(s) of safe staffing (NICE SG1) acknowledged',
    );
    expect(entry.summary).toContain(`Reason: ${reason}`);
  });

  it('marks the published shortfall in the open shifts with its red flag (what the home page lists)', async () => {
    const open = (
      await t
        .http()
        .get(api(S.openShifts))
        .query({ rosterPeriodId: period.id })
        .set(bearer(admin))
        .expect(200)
    ).body as Page<OpenShiftDto>;
    expect(open.items).toHaveLength(1);
    expect(open.items[0]).toMatchObject({ date: '2031-05-05', short: 1, belowMinimum: 1 });
    expect(open.items[0].redFlag).toMatchObject({ need: 2, onShift: 1, shortHours: 11.5 });
    expect(open.items[0].redFlag?.rules).toEqual(['fewerThanTwo', 'shortfallHours', 'shortfallShare']);
  });
});
