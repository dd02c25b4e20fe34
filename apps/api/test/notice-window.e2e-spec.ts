import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type LateChangesDto,
  NOTICE_WINDOW_DAYS_DEFAULT,
  NOTICE_WINDOW_ROUTES as NW,
  type NoticeWindowSettingsDto,
  type Page,
  PUBLISHING_ROUTES as PUB,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SwapRequestDto,
  SWAP_ROUTES as S,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { addDays, localDate } from '../src/common/dates';
import { dateInWords } from '../src/common/text/date-words';
import { LeaveRequestEntity } from '../src/requests/requests.entities';
import { caughtMails } from './support/mailbox';
import { generate, outboxSettled, smallUnit, waitForRun } from './publishing-fixture';
import {
  createPeriod,
  findUnit,
  idsByEmail,
  loginAll,
  markPublished,
  publishPeriod,
  readGrid,
  restOnlyContract,
  shiftTypesByCode,
  WARD_PEOPLE,
  type WardPerson,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(300_000);

/**
 * Changes to a published roster inside a notice window. US predictive scheduling ("fair workweek")
 * laws ask for schedules 14 days ahead and attach predictability pay to later changes: Seattle SMC
 * 14.22, Oregon SB 828, Chicago's Fair Workweek Ordinance, Philadelphia ch. 9-4600 (all 14 days;
 * PRODUCT.md "Trade facts"). Changes a person asks for themselves (a shift trade they agreed, an
 * open shift they claimed, their own leave) are among the usual exceptions (Seattle SMC 14.22,
 * from memory). A change with 13 days' notice or fewer is inside a 14-day window, 14 or more
 * outside (the laws' "14 days in advance").
 *
 * Published rosters change through repair (a solve against the published roster), swaps and open
 * shift claims: manual cell edits are refused once published (publish.e2e-spec.ts), so the
 * employer-initiated changes here come from repairs after approved sick leave.
 */
describe('changes inside the notice window', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  const TZ = 'Europe/London';
  const today = () => localDate(new Date(), TZ);

  beforeAll(async () => {
    t = await startTestApp({
      LOGIN_RATE_LIMIT: '1000',
      OUTBOX_MAX_ATTEMPTS: '20',
      OUTBOX_BASE_DELAY_MS: '100',
      OUTBOX_MAX_DELAY_MS: '400',
    });
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
  });
  afterAll(() => t?.close());

  const settings = (token: string) => t.http().get(api(NW.settings)).set(bearer(token));
  const putSettings = (token: string, body: unknown) =>
    t
      .http()
      .put(api(NW.settings))
      .set(bearer(token))
      .send(body as object);
  const lateChanges = async (periodId: string, token = manager) =>
    (
      await t
        .http()
        .get(api(NW.lateChanges(periodId)))
        .set(bearer(token))
        .expect(200)
    ).body as LateChangesDto;
  const sick = (staffMemberId: string, date: string) =>
    // Written through the entity (as the leave API does once approved).
    t.dataSource.getRepository(LeaveRequestEntity).insert({
      staffMemberId,
      startDate: date,
      endDate: date,
      type: 'sick',
      status: 'approved',
      note: null,
      decisionNote: null,
      decidedById: null,
      decidedAt: new Date(),
    });
  const repair = async (periodId: string) => {
    const started = await t
      .http()
      .post(api(PUB.repair(periodId)))
      .set(bearer(admin))
      .send({ timeLimitSeconds: 60 })
      .expect(202);
    const run = await waitForRun(t, admin, (started.body as { id: string }).id);
    expect([run.status, run.errorMessage]).toEqual(['finished', null]);
  };
  const changedCells = (before: AssignmentGridDto, after: AssignmentGridDto) =>
    after.rows.flatMap((r) =>
      r.cells.flatMap((c, d) => {
        const b = before.rows.find((x) => x.staffMemberId === r.staffMemberId)!.cells[d];
        return b.shiftTypeId !== c.shiftTypeId
          ? [{ staffMemberId: r.staffMemberId, date: after.dates[d] }]
          : [];
      }),
    );

  const VALID: NoticeWindowSettingsDto = {
    noticeWindowDays: 14,
    recordPredictabilityPay: true,
    predictabilityPayHours: 1.5,
    predictabilityPayRule: 'One and a half hours of pay per late change (a test rule)',
  };

  it('keeps a 14-day window and no pay recording by default, and refuses bad settings with 400', async () => {
    expect(NOTICE_WINDOW_DAYS_DEFAULT).toBe(14); // the laws above: 14 days
    expect((await settings(manager).expect(200)).body).toEqual({
      noticeWindowDays: 14,
      recordPredictabilityPay: false,
      predictabilityPayHours: 1,
      predictabilityPayRule: '',
    });
    const bad: [Partial<Record<keyof NoticeWindowSettingsDto | 'extra', unknown>>, RegExp][] = [
      [{ noticeWindowDays: -1 }, /noticeWindowDays/],
      [{ noticeWindowDays: 61 }, /noticeWindowDays/],
      [{ noticeWindowDays: 2.5 }, /noticeWindowDays/],
      [{ noticeWindowDays: '14' }, /noticeWindowDays/],
      [{ recordPredictabilityPay: 'yes' }, /recordPredictabilityPay/],
      [{ predictabilityPayHours: -0.25 }, /predictabilityPayHours/],
      [{ predictabilityPayHours: 24.25 }, /predictabilityPayHours/],
      [{ predictabilityPayHours: 1.1 }, /predictabilityPayHours/],
      [{ predictabilityPayRule: 'x'.repeat(501) }, /predictabilityPayRule/],
      [{ predictabilityPayRule: undefined }, /predictabilityPayRule/],
      [{ extra: 1 }, /extra/],
    ];
    for (const [change, field] of bad) {
      const res = await putSettings(admin, { ...VALID, ...change });
      expect([res.status, JSON.stringify(res.body.message)]).toEqual([400, expect.stringMatching(field)]);
    }
    // Only an administrator changes the organisation's settings.
    await putSettings(manager, VALID).expect(403);
    const staff = (await t.login('staff@example.com')).token;
    await settings(staff).expect(403);
    // The late-change list: planners with reports of the unit only; a malformed id is a 400.
    await t
      .http()
      .get(api(NW.lateChanges('not-an-id')))
      .set(bearer(manager))
      .expect(400);
    await t
      .http()
      .get(api(NW.lateChanges('00000000-0000-4000-8000-000000000000')))
      .set(bearer(manager))
      .expect(404);
    await t
      .http()
      .get(api(NW.lateChanges('00000000-0000-4000-8000-000000000000')))
      .set(bearer(staff))
      .expect(403);
    // Nothing was saved by the refused requests.
    expect((await settings(admin).expect(200)).body).toMatchObject({ recordPredictabilityPay: false });
  });

  describe('repairs of a published roster after sick leave (employer-initiated)', () => {
    let period: RosterPeriodDto;

    beforeAll(async () => {
      // A small unit of our own (invented), one of each of two shifts needed daily; its 21-day period
      // starts in 3 days, so its 3rd day is 5 days away and its 18th day 20 days away.
      const small = await smallUnit(t, admin, 'Plover Ward', '2041-01-07', TZ);
      period = await createPeriod(t, admin, small.unit.id, addDays(today(), 3), 21);
      const run = await generate(t, admin, period.id);
      expect([run.status, run.errorMessage]).toEqual(['finished', null]);
      await publishPeriod(t, admin, period.id);
      await outboxSettled(t);
    });

    it('marks a change 5 days ahead as late with no pay while recording is off', async () => {
      const before = await readGrid(t, admin, period.id);
      const day = 2; // today + 5
      expect(before.dates[day]).toBe(addDays(today(), 5));
      const person = before.rows.find((r) => r.cells[day].shiftTypeId !== null)!;
      await sick(person.staffMemberId, before.dates[day]);
      await repair(period.id);
      const after = await readGrid(t, admin, period.id);
      const changed = changedCells(before, after);
      expect(changed).toContainEqual({ staffMemberId: person.staffMemberId, date: before.dates[day] });

      const late = await lateChanges(period.id, admin);
      expect(late.changes).toHaveLength(changed.length);
      for (const c of late.changes) {
        expect(c).toMatchObject({ kind: 'repair', daysNotice: 5, noticeWindowDays: 14, payHours: null });
      }
      // The sick person's own shift is theirs (their own leave); the cover put in its place is the employer's.
      const own = late.changes.find((c) => c.staffMemberId === person.staffMemberId)!;
      expect(own).toMatchObject({ initiatedBy: 'employee', shiftAfter: null });
      expect(own.reason).toMatch(/own approved leave/);
      expect(late.changes.some((c) => c.initiatedBy === 'employer')).toBe(true);
      expect(late.owed).toEqual([]);
      expect(late.caution).toMatch(/local law and agreements/);

      // The audit entry and the e-mail to the person put on the shift say so.
      const trail = (
        await t
          .http()
          .get(api(PUB.audit(period.id)))
          .set(bearer(admin))
          .query({ order: 'desc' })
          .expect(200)
      ).body as Page<AuditEntryDto>;
      expect(trail.items[0].summary).toMatch(
        new RegExp(
          `${changed.length} changes? (is|are) inside the 14-day notice window \\(1 asked for by the person`,
        ),
      );
      await outboxSettled(t);
      const cover = late.changes.find((c) => c.initiatedBy === 'employer')!;
      const email = (
        (await t.dataSource.query(`SELECT email FROM staff_members WHERE id = ?`, [cover.staffMemberId])) as {
          email: string;
        }[]
      )[0].email;
      const mail = (await caughtMails(t)).filter(
        (m) => m.to.includes(email) && /has changed/.test(m.subject),
      );
      expect(mail.at(-1)?.text).toMatch(/This is a late change: .* is less than 14 days away/);
    });

    it('records predictability pay for the employer-initiated late changes once on, and none 20 days ahead', async () => {
      await putSettings(admin, VALID).expect(200);
      const before = await readGrid(t, admin, period.id);
      const soon = 3; // today + 6
      const later = 17; // today + 20
      expect([before.dates[soon], before.dates[later]]).toEqual([addDays(today(), 6), addDays(today(), 20)]);
      const first = before.rows.find((r) => r.cells[soon].shiftTypeId !== null)!;
      const second = before.rows.find((r) => r.cells[later].shiftTypeId !== null)!;
      await sick(first.staffMemberId, before.dates[soon]);
      await sick(second.staffMemberId, before.dates[later]);
      const known = new Set((await lateChanges(period.id, admin)).changes.map((c) => c.id));
      await repair(period.id);
      const after = await readGrid(t, admin, period.id);
      const changed = changedCells(before, after);
      // The repair changed cells on both days ...
      expect(changed.filter((c) => c.date === before.dates[later]).length).toBeGreaterThan(0);
      // ... but only those 6 days ahead are late: 20 days is outside the 14-day window.
      const fresh = (await lateChanges(period.id, admin)).changes.filter((c) => !known.has(c.id));
      expect(fresh.map((c) => `${c.staffMemberId}|${c.date}`).sort()).toEqual(
        changed
          .filter((c) => c.date === before.dates[soon])
          .map((c) => `${c.staffMemberId}|${c.date}`)
          .sort(),
      );
      const employer = fresh.filter((c) => c.initiatedBy === 'employer');
      expect(employer.length).toBeGreaterThan(0);
      for (const c of employer) {
        expect(c).toMatchObject({ daysNotice: 6, payHours: 1.5, payRule: VALID.predictabilityPayRule });
      }
      // The sick person's own shift stays exempt even with pay recording on.
      expect(fresh.find((c) => c.staffMemberId === first.staffMemberId)).toMatchObject({
        initiatedBy: 'employee',
        payHours: null,
      });
      // Owed per person: 1.5 h for each employer-initiated late change of theirs, nothing for the rest.
      const expected = new Map<string, number>();
      for (const c of employer) expected.set(c.staffMemberId, (expected.get(c.staffMemberId) ?? 0) + 1.5);
      const { owed } = await lateChanges(period.id, admin);
      expect(Object.fromEntries(owed.map((o) => [o.staffMemberId, o.hours]))).toEqual(
        Object.fromEntries(expected),
      );
      expect(owed.reduce((n, o) => n + o.changes, 0)).toBe(employer.length);
    });
  });

  it('marks an approved swap inside the window as late but asked for by the person: no pay, setting on', async () => {
    await putSettings(admin, VALID).expect(200);
    const tokens = await loginAll(t, WARD_PEOPLE);
    const ward = await findUnit(t, admin);
    // The demo ward's own period starts 3 weeks ahead at the earliest: this one ends before it.
    const start = addDays(today(), 1);
    const period = await createPeriod(t, manager, ward.id, start, 14);
    const shift: Record<string, ShiftTypeDto> = await shiftTypesByCode(t, manager, ward.id);
    const staffId = idsByEmail(await restOnlyContract(t, ward.id), WARD_PEOPLE);
    await markPublished(t, period.id);
    const date = addDays(today(), 5);
    await t.dataSource.manager.insert(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId.a,
      date,
      shiftTypeId: shift.E.id,
      pinned: false,
    });
    const decide = (who: string, id: string, decision: string) =>
      t
        .http()
        .post(api(S.swapDecide(id)))
        .set(bearer(who))
        .send({ decision });
    const offer = await t
      .http()
      .post(api(S.swaps))
      .set(bearer(tokens.a))
      .send({ rosterPeriodId: period.id, kind: 'offer', myDate: date, colleagueStaffMemberId: staffId.b });
    expect([offer.status, offer.body.message]).toEqual([201, undefined]);
    const id = (offer.body as SwapRequestDto).id;
    await decide(tokens.b, id, 'accept').expect(200);
    await decide(manager, id, 'approve').expect(200);

    const late = await lateChanges(period.id);
    const byPerson = (p: WardPerson) => late.changes.find((c) => c.staffMemberId === staffId[p]);
    expect(late.changes).toHaveLength(2);
    expect(byPerson('a')).toMatchObject({
      kind: 'swap',
      initiatedBy: 'employee',
      date,
      daysNotice: 5,
      shiftAfter: null,
      payHours: null,
    });
    expect(byPerson('b')).toMatchObject({ kind: 'swap', initiatedBy: 'employee', payHours: null });
    expect(byPerson('b')?.reason).toMatch(/Asked for by the person/);
    expect(late.owed).toEqual([]);

    // The approval's audit entry counts both late changes as asked for by the person, with no pay.
    const trail = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .set(bearer(manager))
        .query({ order: 'desc' })
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(trail.items[0]).toMatchObject({ kind: 'swap' });
    expect(trail.items[0].summary).toMatch(
      /^Shift given away: .*; 2 changes are inside the 14-day notice window \(2 asked for by the person, commonly exempt\)$/,
    );
    expect(trail.items[0].summary).not.toMatch(/predictability pay recorded/);
    // Each person's mail and the approving manager's note say it is a late change the staff asked for.
    await outboxSettled(t);
    const mails = await caughtMails(t);
    const newest = (to: string, subject: RegExp) =>
      mails.filter((m) => m.to.includes(to) && subject.test(m.subject)).at(-1)?.text ?? '';
    const day = dateInWords(date);
    for (const p of ['a', 'b'] as const) {
      const text = newest(WARD_PEOPLE[p], /^Your roster has changed$/);
      expect(text).toContain(`This is a late change: ${day} is less than 14 days away.`);
      expect(text).toContain('You asked for or agreed to this change');
    }
    expect(newest('manager@example.com', /^You approved a roster change$/)).toContain(
      `This is a late change: ${day} is less than 14 days away. The staff asked for it`,
    );
  });
});
