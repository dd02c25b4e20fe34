import {
  type AssignmentGridDto,
  type AvailabilityDto,
  type DateRequestDto,
  type LeaveDto,
  MAX_PAGE_SIZE,
  type MyRequestsDto,
  PLANNING_ROUTES as P,
  type Page,
  type PeriodRequestsDto,
  REQUESTS_ROUTES as Q,
  type RequestPage,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  SOLVING_ROUTES as S,
  type SolveRunDto,
  type StaffMemberDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { dateRangeInWords } from '../src/common/text/date-words';
import { DEMO_ON_LEAVE_PERSON, DEMO_SHORT_NEED_DAY } from '../src/demo/demo-requests';
import { addDays } from '../src/common/dates';
import { RosterPeriodEntity } from '../src/roster-periods/roster-period.entity';
import { RosterInputService } from '../src/roster-input/roster-input.service';
import { smallUnit } from './publishing-fixture';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/** Polls `read` until `done` holds (real solves on the worker pool take seconds). */
async function waitFor<T>(read: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 120_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (done(v)) return v;
    if (Date.now() > until) throw new Error(`timed out waiting; last value: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe('availability, date requests and leave', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  /** Robin Tallis, ward staff nurse. */
  let robin: string;
  let grace: string;
  let ward: UnitDto;
  let contact: UnitDto;
  let wardPeriod: RosterPeriodDto;
  let contactPeriod: RosterPeriodDto;
  let robinId: string;
  let graceId: string;
  let wardShifts: ShiftTypeDto[];

  const get = (path: string, token: string) => t.http().get(api(path)).set(bearer(token));
  const post = (path: string, token: string, body: object = {}) =>
    t.http().post(api(path)).set(bearer(token)).send(body);
  const put = (path: string, token: string, body: object) =>
    t.http().put(api(path)).set(bearer(token)).send(body);
  const messages = (res: { body: unknown }) => JSON.stringify(res.body);

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    robin = (await t.login('staff@example.com')).token;
    grace = (await t.login('grace.holloway@example.com')).token;
    const units = (await get('/units', admin)).body as UnitDto[];
    ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    contact = units.find((u) => u.name === 'Contact Centre North')!;
    wardPeriod = (
      (await get(P.rosterPeriods, manager).query({ unitId: ward.id })).body as Page<RosterPeriodDto>
    ).items[0];
    contactPeriod = (
      (await get(P.rosterPeriods, manager2).query({ unitId: contact.id })).body as Page<RosterPeriodDto>
    ).items[0];
    const staff = (await get(P.staff, manager).query({ unitId: ward.id, pageSize: 100 })).body as {
      items: StaffMemberDto[];
    };
    robinId = staff.items.find((s) => s.name === 'Robin Tallis')!.id;
    graceId = staff.items.find((s) => s.name === 'Grace Holloway')!.id;
    wardShifts = (await get(P.shiftTypes(ward.id), manager)).body as ShiftTypeDto[];
  });
  afterAll(() => t.close());

  it('pages date requests by date and leave by first day; page and pageSize are bounded', async () => {
    const query = { rosterPeriodId: wardPeriod.id };
    const everything = async (path: string, filter: Record<string, unknown>) => {
      const items: { id: string }[] = [];
      for (let page = 1; ; page++) {
        const body = (
          await get(path, manager)
            .query({ ...filter, page, pageSize: 4 })
            .expect(200)
        ).body as Page<{ id: string }>;
        items.push(...body.items);
        if (body.items.length === 0 || items.length >= body.total) return items;
      }
    };
    const dates = (await everything(Q.dateRequests, query)) as DateRequestDto[];
    expect(dates.length).toBeGreaterThan(4);
    expect(dates.map((d) => d.date)).toEqual(dates.map((d) => d.date).sort());
    expect(new Set(dates.map((d) => d.id)).size).toBe(dates.length); // no row on two pages
    const second = (
      await get(Q.dateRequests, manager)
        .query({ ...query, page: 2, pageSize: 4 })
        .expect(200)
    ).body as Page<DateRequestDto>;
    expect(second).toMatchObject({ total: dates.length, page: 2, pageSize: 4 });
    expect(second.items.map((d) => d.id)).toEqual(dates.slice(4, 8).map((d) => d.id));
    const leave = (await everything(Q.leave, { unitId: ward.id })) as LeaveDto[];
    expect(leave.length).toBeGreaterThan(0);
    expect(leave.map((l) => l.startDate)).toEqual(leave.map((l) => l.startDate).sort());
    const defaults = (await get(Q.leave, manager).expect(200)).body as Page<LeaveDto>;
    expect([defaults.page, defaults.pageSize]).toEqual([1, 20]);
    for (const path of [Q.dateRequests, Q.leave]) {
      for (const [bad, field] of [
        [{ page: 0 }, 'page'],
        [{ pageSize: 0 }, 'pageSize'],
        [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
        [{ sort: 'date' }, 'sort'],
      ] as const) {
        const res = await get(path, manager).query(bad).expect(400);
        expect(JSON.stringify(res.body.message)).toContain(field);
      }
    }
  });

  it('shows a staff member only their own requests, leave and availability', async () => {
    const mine = (await get(Q.mine, robin).expect(200)).body as MyRequestsDto;
    expect(mine.staffMembers.map((s) => s.name)).toEqual(['Robin Tallis']);
    expect(mine.periods.map((p) => p.id)).toContain(wardPeriod.id);
    expect(mine.dateRequests.length).toBeGreaterThan(0);
    expect(mine.leave.length).toBeGreaterThan(0);
    expect(new Set([...mine.dateRequests, ...mine.leave].map((r) => r.staffName))).toEqual(
      new Set(['Robin Tallis']),
    );

    // Lists: own only for staff, even when asking for the whole unit or for someone else.
    const dates = (await get(Q.dateRequests, robin).query({ unitId: ward.id }).expect(200))
      .body as Page<DateRequestDto>;
    expect(new Set(dates.items.map((d) => d.staffMemberId))).toEqual(new Set([robinId]));
    expect(
      (await get(Q.dateRequests, robin).query({ staffMemberId: graceId }).expect(200)).body,
    ).toMatchObject({ items: [], total: 0 });
    const leave = (await get(Q.leave, robin).expect(200)).body as Page<LeaveDto>;
    expect(new Set(leave.items.map((l) => l.staffMemberId))).toEqual(new Set([robinId]));
    // The managers' table and a period's requests are not for staff.
    await get(Q.requests, robin).expect(403);
    await get(Q.periodRequests(wardPeriod.id), robin).expect(403);
    await get(Q.availability(graceId), robin).expect(403);
    // Managers see the whole unit, but not another unit.
    const all = (
      await get(Q.dateRequests, manager)
        .query({ rosterPeriodId: wardPeriod.id, pageSize: MAX_PAGE_SIZE })
        .expect(200)
    ).body as Page<DateRequestDto>;
    expect(new Set(all.items.map((d) => d.staffName)).size).toBeGreaterThan(3);
    await get(Q.dateRequests, manager2).query({ unitId: ward.id }).expect(403);
    await get(Q.availability(graceId), manager2).expect(403);
    await get(Q.availability(graceId), manager).expect(200);
    await get(Q.mine, admin).expect(403);
  });

  it('saves the weekly availability of the person themselves, validated, and refuses anyone else', async () => {
    const cells = [
      { weekday: 1, part: 'night', status: 'unavailable' },
      { weekday: 6, part: 'late', status: 'prefer-not' },
      { weekday: 2, part: 'early', status: 'available' },
    ];
    const saved = (await put(Q.availability(robinId), robin, { cells }).expect(200)).body as AvailabilityDto;
    // "available" is the default and is not stored.
    expect(saved.cells).toEqual([
      { weekday: 1, part: 'night', status: 'unavailable' },
      { weekday: 6, part: 'late', status: 'prefer-not' },
    ]);
    expect((await get(Q.availability(robinId), robin).expect(200)).body).toEqual(saved);

    const badPart = await put(Q.availability(robinId), robin, {
      cells: [{ weekday: 1, part: 'dawn', status: 'available' }],
    });
    expect(badPart.status).toBe(400);
    expect(messages(badPart)).toMatch(/part must be one of early, day, late, night/);
    const badDay = await put(Q.availability(robinId), robin, {
      cells: [{ weekday: 7, part: 'day', status: 'available' }],
    });
    expect(badDay.status).toBe(400);
    expect(messages(badDay)).toMatch(/weekday/);
    const twice = await put(Q.availability(robinId), robin, {
      cells: [
        { weekday: 1, part: 'day', status: 'unavailable' },
        { weekday: 1, part: 'day', status: 'prefer-not' },
      ],
    });
    expect(twice.status).toBe(400);
    // The refused writes changed nothing.
    expect((await get(Q.availability(robinId), robin).expect(200)).body).toEqual(saved);

    await put(Q.availability(graceId), robin, { cells: [] }).expect(403);
    await put(Q.availability(graceId), manager, { cells: [] }).expect(403); // managers read, people write
    expect(((await get(Q.availability(graceId), grace).expect(200)).body as AvailabilityDto).cells).toEqual(
      [],
    );
  });

  it('validates date requests, keeps the per-period limit the manager sets, and takes them only in drafts', async () => {
    const early = wardShifts.find((s) => s.code === 'E')!;
    const first = wardPeriod.startDate;
    const last = addDays(first, wardPeriod.days - 1);
    const create = (body: object, token = robin) =>
      post(Q.dateRequests, token, { rosterPeriodId: wardPeriod.id, ...body });

    const outside = await create({ date: addDays(last, 1), kind: 'dayOff' });
    expect(outside.status).toBe(400);
    expect(messages(outside)).toContain(
      `date must be a day of the period (${dateRangeInWords(first, last)})`,
    );
    const noShift = await create({ date: addDays(first, 6), kind: 'shiftOn' });
    expect(noShift.status).toBe(400);
    expect(messages(noShift)).toMatch(/shiftTypeId is required/);
    const contactShift = ((await get(P.shiftTypes(contact.id), manager2)).body as ShiftTypeDto[])[0];
    const foreign = await create({ date: addDays(first, 6), kind: 'shiftOn', shiftTypeId: contactShift.id });
    expect(foreign.status).toBe(400);
    expect(messages(foreign)).toMatch(/shiftTypeId must be a shift type of this unit/);
    const kind = await create({ date: addDays(first, 6), kind: 'holiday' });
    expect(kind.status).toBe(400);
    expect(messages(kind)).toMatch(/kind must be one of shiftOn, shiftOff, dayOff/);
    const unreal = await create({ date: '2030-02-30', kind: 'dayOff' });
    expect(unreal.status).toBe(400);
    // Another unit's period: Robin is not on that roster.
    await post(Q.dateRequests, robin, {
      rosterPeriodId: contactPeriod.id,
      date: contactPeriod.startDate,
      kind: 'dayOff',
    }).expect(403);
    await create({ date: addDays(first, 6), kind: 'dayOff' }, manager).expect(403);

    // The limit: the demo gives Robin two requests in this period; the manager allows three.
    const before = ((await get(Q.mine, robin)).body as MyRequestsDto).dateRequests.filter(
      (r) => r.rosterPeriodId === wardPeriod.id,
    );
    expect(before).toHaveLength(2);
    await put(Q.periodRequestLimit(wardPeriod.id), manager2, { requestLimit: 3 }).expect(403);
    await put(Q.periodRequestLimit(wardPeriod.id), robin, { requestLimit: 30 }).expect(403);
    const badLimit = await put(Q.periodRequestLimit(wardPeriod.id), manager, { requestLimit: -1 });
    expect(badLimit.status).toBe(400);
    expect(messages(badLimit)).toMatch(/requestLimit/);
    expect(
      (
        (await put(Q.periodRequestLimit(wardPeriod.id), manager, { requestLimit: 3 }).expect(200)).body as {
          requestLimit: number;
        }
      ).requestLimit,
    ).toBe(3);

    const third = (
      await create({
        date: addDays(first, 6),
        kind: 'shiftOff',
        shiftTypeId: early.id,
        note: ' Church ',
      }).expect(201)
    ).body as DateRequestDto;
    expect(third).toMatchObject({
      staffMemberId: robinId,
      kind: 'shiftOff',
      shiftTypeCode: 'E',
      note: 'Church',
    });
    const fourth = await create({ date: addDays(first, 7), kind: 'dayOff' });
    expect(fourth.status).toBe(409);
    expect(messages(fourth)).toContain('You have reached the limit of 3 date requests for this period');
    const again = await create({ date: addDays(first, 6), kind: 'dayOff' });
    expect(again.status).toBe(409); // over the limit before the duplicate check

    // Editing: own only; moving onto a date that already has a request is refused.
    const graceRequest = (
      (await get(Q.dateRequests, manager).query({ rosterPeriodId: wardPeriod.id }))
        .body as Page<DateRequestDto>
    ).items.find((r) => r.staffMemberId !== robinId)!;
    await t
      .http()
      .patch(api(Q.dateRequest(graceRequest.id)))
      .set(bearer(robin))
      .send({ note: 'x' })
      .expect(403);
    await t
      .http()
      .delete(api(Q.dateRequest(graceRequest.id)))
      .set(bearer(robin))
      .expect(403);
    const clash = await t
      .http()
      .patch(api(Q.dateRequest(third.id)))
      .set(bearer(robin))
      .send({ date: before[0].date });
    expect(clash.status).toBe(409);
    expect(messages(clash)).toMatch(/already have a request/);
    const changed = (
      await t
        .http()
        .patch(api(Q.dateRequest(third.id)))
        .set(bearer(robin))
        .send({ kind: 'dayOff' })
        .expect(200)
    ).body as DateRequestDto;
    expect([changed.kind, changed.shiftTypeId]).toEqual(['dayOff', null]);
    await t
      .http()
      .delete(api(Q.dateRequest(third.id)))
      .set(bearer(robin))
      .expect(204);
    await create({ date: addDays(first, 7), kind: 'dayOff' }).expect(201);

    // Only drafts take requests: the same period once published refuses new ones and changes.
    await t.dataSource
      .getRepository(RosterPeriodEntity)
      .update({ id: wardPeriod.id }, { status: 'published' });
    try {
      const published = await create({ date: addDays(first, 8), kind: 'dayOff' });
      expect(published.status).toBe(409);
      expect(messages(published)).toMatch(/Only a draft period takes requests; this one is published/);
      await t
        .http()
        .delete(api(Q.dateRequest(before[0].id)))
        .set(bearer(robin))
        .expect(409);
      // Nor does its request limit change (RosterPeriodsService.setRequestLimit), and it stays as it was.
      const limit = await put(Q.periodRequestLimit(wardPeriod.id), manager, { requestLimit: 9 });
      expect(limit.status).toBe(409);
      expect(messages(limit)).toMatch(
        /request limit can only be changed on a draft period; this one is published/,
      );
      const stored = await t.dataSource
        .getRepository(RosterPeriodEntity)
        .findOneByOrFail({ id: wardPeriod.id });
      expect(stored.requestLimit).toBe(3);
    } finally {
      await t.dataSource.getRepository(RosterPeriodEntity).update({ id: wardPeriod.id }, { status: 'draft' });
    }
  });

  it('takes leave requests, refuses bad and overlapping ones, and lets only a unit manager decide them', async () => {
    const bad = await post(Q.leave, robin, {
      startDate: '2030-03-10',
      endDate: '2030-03-09',
      type: 'annual',
    });
    expect(bad.status).toBe(400);
    expect(messages(bad)).toMatch(/endDate must be on or after startDate/);
    const type = await post(Q.leave, robin, {
      startDate: '2030-03-10',
      endDate: '2030-03-11',
      type: 'sabbatical',
    });
    expect(type.status).toBe(400);
    expect(messages(type)).toMatch(/type must be one of annual, sick, other/);
    const unreal = await post(Q.leave, robin, {
      startDate: '2030-02-29',
      endDate: '2030-03-01',
      type: 'annual',
    });
    expect(unreal.status).toBe(400); // 2030 is not a leap year (Gregorian calendar rule)
    expect(messages(unreal)).toMatch(/startDate must be a real calendar date/);
    await post(Q.leave, robin, {
      staffMemberId: graceId,
      startDate: '2030-03-10',
      endDate: '2030-03-11',
      type: 'annual',
    }).expect(403);
    await post(Q.leave, manager, { startDate: '2030-03-10', endDate: '2030-03-11', type: 'annual' }).expect(
      403,
    );

    const leave = (
      await post(Q.leave, robin, {
        startDate: '2030-03-10',
        endDate: '2030-03-12',
        type: 'annual',
        note: 'Trip',
      }).expect(201)
    ).body as LeaveDto;
    expect(leave).toMatchObject({ staffMemberId: robinId, status: 'pending', note: 'Trip', decidedBy: null });
    const overlap = await post(Q.leave, robin, {
      startDate: '2030-03-12',
      endDate: '2030-03-14',
      type: 'sick',
    });
    expect(overlap.status).toBe(409);
    expect(messages(overlap)).toContain(
      'overlaps your pending leave from Sun 10 Mar 2030 to Tue 12 Mar 2030',
    );

    await post(Q.leaveApprove(leave.id), robin).expect(403);
    await post(Q.leaveApprove(leave.id), manager2).expect(403);
    await t
      .http()
      .delete(api(Q.leaveItem(leave.id)))
      .set(bearer(grace))
      .expect(403);

    // The managers' table: pending leave of the unit, Robin's included; staff cannot read it.
    const table = (
      await get(Q.requests, manager).query({ type: 'leave', status: 'pending', pageSize: 100 }).expect(200)
    ).body as RequestPage;
    expect(table.items.map((r) => r.id)).toContain(leave.id);
    expect(table.items.every((r) => r.type === 'leave' && r.status === 'pending')).toBe(true);
    expect(table.total).toBe(table.items.length);
    const other = (await get(Q.requests, manager2).query({ pageSize: 100 }).expect(200)).body as RequestPage;
    expect(other.items.map((r) => r.id)).not.toContain(leave.id);

    const approved = (await post(Q.leaveApprove(leave.id), manager, { note: 'Enjoy' }).expect(200))
      .body as LeaveDto;
    expect(approved).toMatchObject({
      status: 'approved',
      decisionNote: 'Enjoy',
      decidedBy: 'Morgan Ashdown',
    });
    const twice = await post(Q.leaveDecline(leave.id), manager);
    expect(twice.status).toBe(409);
    expect(messages(twice)).toMatch(/this one is approved/);
    // The staff member sees the decision.
    const mine = (await get(Q.mine, robin)).body as MyRequestsDto;
    expect(mine.leave.find((l) => l.id === leave.id)!.status).toBe('approved');

    const second = (
      await post(Q.leave, robin, { startDate: '2030-04-01', endDate: '2030-04-01', type: 'other' }).expect(
        201,
      )
    ).body as LeaveDto;
    expect(((await post(Q.leaveDecline(second.id), manager).expect(200)).body as LeaveDto).status).toBe(
      'declined',
    );
    // A declined range is free again; a cancelled one too.
    const third = (
      await post(Q.leave, robin, { startDate: '2030-04-01', endDate: '2030-04-02', type: 'sick' }).expect(201)
    ).body as LeaveDto;
    expect(
      (
        (
          await t
            .http()
            .delete(api(Q.leaveItem(third.id)))
            .set(bearer(robin))
            .expect(200)
        ).body as LeaveDto
      ).status,
    ).toBe('cancelled');
    await post(Q.leaveApprove(third.id), manager).expect(409);
  });

  it('gives approved leave to the model as an absence, credited against contract hours', async () => {
    // A one-week draft of the ward; Grace asks for three days of leave inside it.
    const week = (
      await post(P.rosterPeriods, manager, { unitId: ward.id, startDate: '2031-01-06', days: 7 }).expect(201)
    ).body as RosterPeriodDto;
    const leave = (
      await post(Q.leave, grace, { startDate: '2031-01-07', endDate: '2031-01-09', type: 'annual' }).expect(
        201,
      )
    ).body as LeaveDto;
    const input = t.app.get(RosterInputService);
    // Pending leave does not block anything yet.
    expect((await input.load(week.id)).problem.absences.filter((a) => a.personId === graceId)).toEqual([]);
    await post(Q.leaveApprove(leave.id), manager).expect(200);
    let problem = (await input.load(week.id)).problem;
    expect(problem.absences.filter((a) => a.personId === graceId)).toEqual([
      { personId: graceId, day: 1, kind: 'leave' },
      { personId: graceId, day: 2, kind: 'leave' },
      { personId: graceId, day: 3, kind: 'leave' },
    ]);
    // Three weekdays of leave are credited against her hours: 3/5 of a week off the minimum
    // (full-time demo contract: 1800 min a week; see creditLeave).
    expect(problem.people.find((p) => p.id === graceId)!.contract.minPaidMinutes).toBe(1800 - 3 * 360);
    // Robin's availability: unavailable for nights on Mondays (day 0 is a Monday: 2031-01-06, checked
    // with GNU date), prefer-not lates on Saturdays.
    await put(Q.availability(robinId), robin, {
      cells: [
        { weekday: 1, part: 'night', status: 'unavailable' },
        { weekday: 6, part: 'late', status: 'prefer-not' },
      ],
    }).expect(200);
    problem = (await input.load(week.id)).problem;
    const night = wardShifts.find((s) => s.code === 'N')!;
    const late = wardShifts.find((s) => s.code === 'L')!;
    expect(problem.absences.filter((a) => a.personId === robinId)).toEqual([
      { personId: robinId, day: 0, kind: 'unavailable', shiftTypeIds: [night.id] },
    ]);
    expect(problem.requests.filter((r) => r.personId === robinId)).toEqual([
      { personId: robinId, day: 5, kind: 'shiftOff', shiftTypeId: late.id, weight: 3 },
    ]);
    // The period's requests as the planning board reads them.
    const board = (await get(Q.periodRequests(week.id), manager).expect(200)).body as PeriodRequestsDto;
    expect(board.leave.map((l) => l.id)).toEqual([leave.id]);
    await get(Q.periodRequests(week.id), manager2).expect(403);
  });

  it('keeps a person on approved leave off the roster (real solver on a small unit), and says so', async () => {
    // The small unit of the publishing tests: five people, Early and Late, one of each every day.
    const small = await smallUnit(t, admin, 'Leave Check Unit', '2031-02-03');
    const early = small.shifts.find((s) => s.code === 'E')!;
    const [maren] = small.staff;
    // Grace also works in this unit: her user joins it and is linked to its first staff member.
    const graceUser = (await t.login('grace.holloway@example.com')).body.user;
    await t
      .http()
      .patch(api(`/users/${graceUser.id}`))
      .set(bearer(admin))
      .send({ unitIds: [...graceUser.unitIds, small.unit.id] })
      .expect(200);
    await t
      .http()
      .patch(api(P.staffMember(maren.id)))
      .set(bearer(admin))
      .send({ userId: graceUser.id })
      .expect(200);
    // On the three leave days all five people are needed on the Early shift (and nobody on the Late).
    const late = small.shifts.find((s) => s.code === 'L')!;
    const leaveDays = ['2031-02-04', '2031-02-05', '2031-02-06'];
    for (const date of leaveDays) {
      for (const [shiftTypeId, n] of [
        [early.id, 5],
        [late.id, 0],
      ] as const) {
        await post(P.coverOverrides(small.unit.id), admin, {
          date,
          shiftTypeId,
          skillId: null,
          min: n,
          target: n,
        }).expect(201);
      }
    }
    // Grace is on two rosters now, so she names the staff record the leave is for.
    const missing = await post(Q.leave, grace, {
      startDate: leaveDays[0],
      endDate: leaveDays[2],
      type: 'annual',
    });
    expect(missing.status).toBe(400);
    expect(messages(missing)).toMatch(/staffMemberId is required/);
    const leave = (
      await post(Q.leave, grace, {
        staffMemberId: maren.id,
        startDate: leaveDays[0],
        endDate: leaveDays[2],
        type: 'annual',
      }).expect(201)
    ).body as LeaveDto;
    await post(Q.leaveApprove(leave.id), admin).expect(200);

    const run = (await post(S.periodSolveRuns(small.period.id), admin, { timeLimitSeconds: 30 }).expect(202))
      .body as { id: string };
    const ended = await waitFor(
      async () => (await get(S.solveRun(run.id), admin)).body as SolveRunDto,
      (r) => ['finished', 'failed', 'cancelled'].includes(r.status),
    );
    expect([ended.status, ended.errorMessage]).toEqual(['finished', null]);
    const grid = (await get(S.assignments(small.period.id), admin).expect(200)).body as AssignmentGridDto;
    const row = grid.rows.find((r) => r.staffMemberId === maren.id)!;
    expect(row.cells.slice(1, 4).map((c) => c.shiftTypeId)).toEqual([null, null, null]);
    // Everyone else is on the Early shift those days, and the short need names the leave.
    for (const day of [1, 2, 3]) {
      expect(grid.rows.filter((r) => r.cells[day].shiftTypeId === early.id)).toHaveLength(4);
    }
    const short = ended.result!.explanations.unmetNeeds.filter((n) => n.shiftTypeId === early.id);
    expect(short.map((n) => [n.date, n.short])).toEqual(leaveDays.map((d) => [d, 1]));
    expect(short.every((n) => n.reasons.join(' ').includes(`is on leave (${maren.name})`))).toBe(true);
    expect(grid.check.violations).toEqual([]);
  }, 120_000);

  it("explains the demo's short need by the leave that causes it (real solver on the demo period)", async () => {
    const run = (
      await post(S.periodSolveRuns(contactPeriod.id), manager2, { timeLimitSeconds: 60 }).expect(202)
    ).body as { id: string };
    const ended = await waitFor(
      async () => (await get(S.solveRun(run.id), manager2)).body as SolveRunDto,
      (r) => ['finished', 'failed', 'cancelled'].includes(r.status),
      150_000,
    );
    expect([ended.status, ended.errorMessage]).toEqual(['finished', null]);
    const french = ((await get(P.skills, manager2)).body as SkillDto[]).find((s) => s.code === 'FR')!;
    const day = addDays(contactPeriod.startDate, DEMO_SHORT_NEED_DAY);
    const short = ended.result!.explanations.unmetNeeds.filter((n) => n.skillId === french.id);
    // Exactly the one French need on the day of the leave is short, and it says why.
    expect(short.map((n) => n.date)).toEqual([day]);
    expect(short[0].reasons.join(' ')).toMatch(new RegExp(`is on leave \\(${DEMO_ON_LEAVE_PERSON}\\)`));
    // Some requests conflict with cover: Jakub, the only Polish speaker, asked for a weekday off.
    const notHonoured = ended.result!.explanations.requestsNotHonoured;
    expect(notHonoured.length).toBeGreaterThan(0);
    const staff = (await get(P.staff, manager2).query({ unitId: contact.id, pageSize: 100 })).body as {
      items: StaffMemberDto[];
    };
    const jakub = staff.items.find((s) => s.name === 'Jakub Kowal')!;
    expect(notHonoured.map((r) => [r.staffMemberId, r.date])).toContainEqual([
      jakub.id,
      addDays(contactPeriod.startDate, 2),
    ]);
  }, 180_000);
});
