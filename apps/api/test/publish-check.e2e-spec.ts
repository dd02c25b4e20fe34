import {
  type AuditEntryDto,
  type ContractDto,
  PLANNING_ROUTES as P,
  type Page,
  PUBLISHING_ROUTES as PUB,
  type PublishCheckDto,
  type RosterPeriodDto,
  type SkillDto,
  SOLVING_ROUTES as R,
} from '@rotaplex/contracts';
import { LeaveRequestEntity } from '../src/requests/requests.entities';
import { type SmallUnit, smallUnit } from './publishing-fixture';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(120_000);

// Publishing with eyes open: the publish check lists shifts below minimum cover (worst first), rule
// findings, shifts on approved leave and settings cautions; an empty roster cannot be published, and
// a roster below minimum only with an acknowledgement and a reason that lands in the audit trail.
describe('GET /api/roster-periods/:id/publish-check and the publish guard', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let staff: string;
  let small: SmallUnit;
  let period: RosterPeriodDto;
  let rn: SkillDto;
  const [early, late] = [0, 1];

  const check = async (token = admin) =>
    (
      await t
        .http()
        .get(api(PUB.publishCheck(period.id)))
        .set(bearer(token))
        .expect(200)
    ).body as PublishCheckDto;
  const readPeriod = async () =>
    (
      await t
        .http()
        .get(api(P.rosterPeriod(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as RosterPeriodDto;
  const publish = (body: object) =>
    t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(admin))
      .send(body);
  const put = (staffMemberId: string, day: number, shift: number, overrideReason?: string) =>
    t
      .http()
      .put(api(R.assignmentCell(period.id)))
      .set(bearer(admin))
      .send({
        staffMemberId,
        date: addDays(period.startDate, day),
        shiftTypeId: small.shifts[shift].id,
        ...(overrideReason ? { overrideReason } : {}),
      });

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    small = await smallUnit(t, admin, 'Kestrel Ward', '2031-03-03');
    period = small.period;
    rn = (
      await t
        .http()
        .post(api(P.skills))
        .set(bearer(admin))
        .send({ code: 'KRN', name: 'Kestrel registered nurse' })
        .expect(201)
    ).body as SkillDto;
    // Maren is the only one with the skill. Every day: Early needs 1 of anyone and 1 KRN, Late needs 2.
    await t
      .http()
      .patch(api(P.staffMember(small.staff[0].id)))
      .set(bearer(admin))
      .send({ skills: ['KRN'] })
      .expect(200);
    const rows = [0, 1, 2, 3, 4, 5, 6].flatMap((weekday) => [
      { weekday, shiftTypeId: small.shifts[early].id, skillId: null, min: 1, target: 1 },
      { weekday, shiftTypeId: small.shifts[early].id, skillId: rn.id, min: 1, target: 1 },
      { weekday, shiftTypeId: small.shifts[late].id, skillId: null, min: 2, target: 2 },
    ]);
    await t
      .http()
      .put(api(P.coverPattern(small.unit.id)))
      .set(bearer(admin))
      .send({ rows })
      .expect(200);
  });
  afterAll(() => t?.close());

  it('does not publish an empty roster, and the check says why', async () => {
    const empty = await check();
    expect(empty).toMatchObject({ shifts: 0, people: 0, needsAcknowledgement: true });
    expect(empty.blockers.join(' ')).toMatch(/no shifts: there is nothing to publish/);
    for (const body of [
      { version: period.version },
      { version: period.version, acknowledgeBelowMinimum: true, reason: 'Publish anyway' },
    ]) {
      const res = await publish(body).expect(422);
      expect(res.body.message).toMatch(/no shifts/);
    }
    expect((await readPeriod()).status).toBe('draft');
    expect(await t.dataSource.query(`SELECT id FROM outbox_messages`)).toHaveLength(0);
  });

  it('lists shifts below minimum worst first, rule findings, shifts on approved leave and contract cautions', async () => {
    const [maren, tobiah, sunniva] = small.staff;
    // Day 0: Maren (KRN) on Early, Tobiah on Late: only the Late is short (1 of 2).
    await put(maren.id, 0, early).expect(200);
    await put(tobiah.id, 0, late).expect(200);
    // Day 1: Tobiah on Early: anyone's Early is met, the KRN Early has nobody, the Late nobody.
    await put(tobiah.id, 1, early).expect(200);
    // Sunniva has approved annual leave on day 2; a shift there needs a reason and is listed.
    await t.dataSource.manager.save(
      t.dataSource.manager.create(LeaveRequestEntity, {
        staffMemberId: sunniva.id,
        startDate: addDays(period.startDate, 2),
        endDate: addDays(period.startDate, 2),
        type: 'annual',
        status: 'approved',
        note: null,
        decisionNote: null,
        decidedById: null,
        decidedAt: new Date(),
      }),
    );
    const refused = await put(sunniva.id, 2, late);
    expect(refused.status).toBe(422);
    expect(JSON.stringify(refused.body.message)).toMatch(/overrideReason/);
    await put(sunniva.id, 2, late, 'She offered to come in for the handover').expect(200);
    // A contract with 2 h of rest and 90 h a week, beyond the working-time presets.
    const contract = (
      await t
        .http()
        .post(api(P.contracts))
        .set(bearer(admin))
        .send({
          unitId: small.unit.id,
          name: 'Kestrel stretch',
          minRestMinutes: 120,
          maxPaidMinutes: 90 * 60,
          maxConsecutiveWorkDays: 6,
        })
        .expect(201)
    ).body as ContractDto;
    expect(contract.cautions?.join(' ')).toMatch(/2 h is less than the 11 h/);
    await t
      .http()
      .patch(api(P.staffMember(tobiah.id)))
      .set(bearer(admin))
      .send({ contractId: contract.id })
      .expect(200);

    const c = await check();
    expect(c).toMatchObject({ shifts: 4, people: 3, blockers: [], needsAcknowledgement: true });
    // Days 2-6 (Sunniva's Late on day 2 aside): Early of anyone, KRN Early and Late all empty.
    const list = c.belowMinimum.map(
      (s) => `${s.date} ${s.shiftCode} ${s.skillCode ?? '-'} ${s.onShift}/${s.min}`,
    );
    expect(list).toHaveLength(18);
    // Worst first: nobody on it (the largest shortfall first), then shifts with some people on.
    const firstNotNone = c.belowMinimum.findIndex((s) => !s.none);
    expect(firstNotNone).toBe(16);
    expect(c.belowMinimum.slice(0, firstNotNone).every((s) => s.none && s.onShift === 0)).toBe(true);
    expect(list.slice(0, 5)).toEqual([1, 3, 4, 5, 6].map((d) => `${addDays(period.startDate, d)} L - 0/2`));
    expect(list).toContain(`${addDays(period.startDate, 1)} E KRN 0/1`);
    expect(list.slice(16)).toEqual([
      `${addDays(period.startDate, 0)} L - 1/2`,
      `${addDays(period.startDate, 2)} L - 1/2`,
    ]);
    expect(list).not.toContain(`${addDays(period.startDate, 1)} E - 0/1`);
    // The roster model's reasons, without repeating the count.
    const krn = c.belowMinimum.find((s) => s.skillCode === 'KRN' && s.date === addDays(period.startDate, 1))!;
    expect(krn.reasons.join(' ')).toMatch(/Maren Oakes/);
    // The rule finding of the edit kept on leave, and the leave itself.
    expect(c.ruleFindings.filter((f) => f.rule === 'absence').map((f) => f.staffMemberId)).toEqual([
      sunniva.id,
    ]);
    expect(c.unhonouredLeave).toEqual([
      {
        staffMemberId: sunniva.id,
        name: 'Sunniva Hart',
        date: addDays(period.startDate, 2),
        shiftTypeId: small.shifts[late].id,
        shiftCode: 'L',
      },
    ]);
    expect(c.cautions.join(' ')).toMatch(
      /Contract "Kestrel stretch" \(Tobiah Quill\) is outside the working-time presets/,
    );
    expect(c.cautions.join(' ')).toMatch(/Local law|fatigue/);
  });

  it('refuses staff, other units and anonymous callers', async () => {
    await t
      .http()
      .get(api(PUB.publishCheck(period.id)))
      .expect(401);
    await t
      .http()
      .get(api(PUB.publishCheck(period.id)))
      .set(bearer(staff))
      .expect(403);
    await t
      .http()
      .get(api(PUB.publishCheck(period.id)))
      .set(bearer(manager))
      .expect(403);
    await t
      .http()
      .get(api(PUB.publishCheck('not-a-uuid')))
      .set(bearer(admin))
      .expect(400);
  });

  it('publishes below minimum only with an acknowledgement and a written reason, kept in the audit trail', async () => {
    const { version } = await readPeriod();
    const none = await publish({ version }).expect(422);
    expect(none.body.message).toMatch(/18 shifts are below minimum cover \(worst: Late on .*, 0 of 2\)/);
    expect(none.body.message).toMatch(/acknowledgeBelowMinimum/);
    const noReason = await publish({ version, acknowledgeBelowMinimum: true }).expect(400);
    expect(JSON.stringify(noReason.body.message)).toMatch(/reason must/);
    const blank = await publish({ version, acknowledgeBelowMinimum: true, reason: '   ' }).expect(400);
    expect(JSON.stringify(blank.body.message)).toMatch(/reason must say why/);
    const long = await publish({ version, acknowledgeBelowMinimum: true, reason: 'x'.repeat(501) }).expect(
      400,
    );
    expect(JSON.stringify(long.body.message)).toMatch(/at most 500 characters/);
    const reasonOnly = await publish({ version, reason: 'We know' }).expect(422);
    expect(reasonOnly.body.message).toMatch(/below minimum cover/);
    expect((await readPeriod()).status).toBe('draft');
    expect(await t.dataSource.query(`SELECT id FROM outbox_messages`)).toHaveLength(0);

    const reason = 'Bank staff booked for the empty shifts; escalated to the matron on call';
    await publish({ version, acknowledgeBelowMinimum: true, reason }).expect(200);
    expect((await readPeriod()).status).toBe('published');
    const trail = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    const entry = trail.items.find((e) => e.kind === 'publish')!;
    expect(entry.summary).toContain('with 18 shift(s) below minimum cover acknowledged');
    expect(entry.summary).toContain(`Reason: ${reason}`);
    // The override on leave is in the trail too, with its reason.
    const edit = trail.items.find((e) => e.kind === 'manual-edit')!;
    expect(edit.summary).toContain('Reason: She offered to come in for the handover');
    // A published period: the check names it as the blocker.
    expect((await check()).blockers.join(' ')).toMatch(/this period is published/);
  });
});

function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}
