import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type Page,
  PUBLISHING_ROUTES as PUB,
  REST_RULE_WARNING,
  type RosterPeriodDto,
  type ShiftTypeDto,
  SOLVING_ROUTES as R,
  type SolveRunDto,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { createPeriod, findUnit, readGrid, shiftTypesByCode } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('/api/roster-periods/:id/assignments', () => {
  let t: TestApp;
  let manager: string;
  let manager2: string;
  let staff: string;
  let period: RosterPeriodDto;
  let shifts: Record<string, ShiftTypeDto>;

  beforeAll(async () => {
    t = await startTestApp();
    const admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const ward = await findUnit(t, admin);
    // A one-week draft of the demo ward (its people, contracts and needs): solved within seconds.
    period = await createPeriod(t, manager, ward.id, '2030-01-07');
    shifts = await shiftTypesByCode(t, manager, ward.id);
  });
  afterAll(() => t.close());

  const grid = (token = manager) => readGrid(t, token, period.id);
  const edit = (body: object, token = manager) =>
    t
      .http()
      .put(api(R.assignmentCell(period.id)))
      .set(bearer(token))
      .send(body);
  const pin = (body: object, token = manager) =>
    t
      .http()
      .post(api(R.assignmentPin(period.id)))
      .set(bearer(token))
      .send(body);
  const cell = (g: AssignmentGridDto, staffMemberId: string, date: string) =>
    g.rows.find((r) => r.staffMemberId === staffMemberId)!.cells[g.dates.indexOf(date)];

  it('reads the empty grid of people by days with the checker result', async () => {
    const g = await grid();
    expect(g.dates).toHaveLength(period.days);
    expect(g.dates[0]).toBe(period.startDate);
    expect(g.rows.length).toBeGreaterThan(0);
    expect(
      g.rows.every((r) => r.cells.length === period.days && r.cells.every((c) => c.shiftTypeId === null)),
    ).toBe(true);
    // An empty roster leaves every cover need short: the cover terms are positive.
    expect(g.check.terms.coverUnderMin).toBeGreaterThan(0);
  });

  const audit = async () =>
    (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .set(bearer(manager))
        .expect(200)
    ).body as Page<AuditEntryDto>;

  it('keeps an edit that breaks the rest rule only with a reason, which lands in the audit trail', async () => {
    const g = await grid();
    const person = g.rows[0].staffMemberId;
    const [d1, d2] = [g.dates[2], g.dates[3]];
    expect((await edit({ staffMemberId: person, date: d1, shiftTypeId: shifts.L.id })).status).toBe(200);
    // Late 14:30-22:30 then Early 07:00 leaves 8 h 30 min of rest, under the 11 consecutive hours of
    // daily rest of the demo contracts (EU Working Time Directive 2003/88/EC, Art. 3).
    const refused = await edit({ staffMemberId: person, date: d2, shiftTypeId: shifts.E.id });
    expect(refused.status).toBe(422);
    expect(refused.body.message.join(' ')).toMatch(/only 8 h 30 min of rest between L on .* and E on/);
    expect(refused.body.message.join(' ')).toMatch(/give the reason \(overrideReason\)/);
    expect(cell(await grid(), person, d2)).toEqual({ shiftTypeId: null, pinned: false });
    for (const overrideReason of ['   ', 'x'.repeat(501)]) {
      const bad = await edit({ staffMemberId: person, date: d2, shiftTypeId: shifts.E.id, overrideReason });
      expect(bad.status).toBe(overrideReason.trim() ? 400 : 422);
      expect(JSON.stringify(bad.body.message)).toMatch(/overrideReason/);
    }
    expect((await audit()).total).toBe(0);

    const reason = 'Agreed with the nurse: swaps her Thursday for a long weekend';
    const res = await edit({
      staffMemberId: person,
      date: d2,
      shiftTypeId: shifts.E.id,
      overrideReason: reason,
    });
    expect(res.status).toBe(200);
    const after = res.body as AssignmentGridDto;
    expect(cell(after, person, d2)).toEqual({ shiftTypeId: shifts.E.id, pinned: false });
    const rest = after.check.violations.filter((v) => v.rule === 'minRest' && v.staffMemberId === person);
    expect(rest).toHaveLength(1);
    expect(rest[0].dates).toEqual([d1, d2]);
    expect(rest[0].warning).toBe(REST_RULE_WARNING);
    expect(rest[0].warning).toMatch(/Local law and collective agreements/);
    expect(rest[0].message).toMatch(/only 8 h 30 min of rest between L on .* and E on .* at least 11 h/);
    expect(rest[0].message).toContain(d1);
    expect(rest[0].message).not.toContain(shifts.L.id); // shift codes, not ids, in the words
    const trail = await audit();
    expect(trail.total).toBe(1);
    expect(trail.items[0]).toMatchObject({
      kind: 'manual-edit',
      before: { staffMemberId: person, date: d2, shiftTypeId: null },
      after: { staffMemberId: person, date: d2, shiftTypeId: shifts.E.id, rules: ['minRest'], reason },
    });
    expect(trail.items[0].summary).toContain(`Reason: ${reason}`);

    // Undo: a day off again clears the finding, and needs no reason.
    const undone = (await edit({ staffMemberId: person, date: d2, shiftTypeId: null }).expect(200))
      .body as AssignmentGridDto;
    expect(undone.check.violations.filter((v) => v.rule === 'minRest' && v.staffMemberId === person)).toEqual(
      [],
    );
    await edit({ staffMemberId: person, date: d1, shiftTypeId: null }).expect(200);
    expect((await audit()).total).toBe(1);
  });

  it('refuses outright a shift that overlaps the one before or after, whatever the reason', async () => {
    const g = await grid();
    const person = g.rows[2].staffMemberId;
    const [d1, d2] = [g.dates[1], g.dates[2]];
    await edit({ staffMemberId: person, date: d1, shiftTypeId: shifts.N.id }).expect(200);
    // The demo Night runs 22:00-07:30 and the Early starts at 07:00: they overlap by half an hour.
    for (const overrideReason of [undefined, 'Short of staff']) {
      const res = await edit({ staffMemberId: person, date: d2, shiftTypeId: shifts.E.id, overrideReason });
      expect(res.status).toBe(422);
      const words = res.body.message.join(' ');
      expect(words).toMatch(/overlap by 30 min/);
      expect(words).not.toMatch(/-0 h/);
    }
    // The same pair entered the other way round (the Early first, then the Night before it).
    await edit({ staffMemberId: person, date: d1, shiftTypeId: null }).expect(200);
    await edit({ staffMemberId: person, date: d2, shiftTypeId: shifts.E.id }).expect(200);
    const reverse = await edit({
      staffMemberId: person,
      date: d1,
      shiftTypeId: shifts.N.id,
      overrideReason: 'x',
    });
    expect(reverse.status).toBe(422);
    expect(reverse.body.message.join(' ')).toMatch(/overlap by 30 min/);
    const now = await grid();
    expect(cell(now, person, d1)).toEqual({ shiftTypeId: null, pinned: false });
    expect(cell(now, person, d2)).toEqual({ shiftTypeId: shifts.E.id, pinned: false });
    await edit({ staffMemberId: person, date: d2, shiftTypeId: null }).expect(200);
    expect((await audit()).items.filter((e) => e.summary.includes('overlap'))).toEqual([]);
  });

  it('words a stored overlap as an overlap, never as negative rest', async () => {
    const g = await grid();
    const person = g.rows[3].staffMemberId;
    const [d1, d2] = [g.dates[4], g.dates[5]];
    // Rows from before edits were checked for overlaps, written directly.
    for (const [date, shift] of [
      [d1, shifts.N],
      [d2, shifts.E],
    ] as const) {
      await t.dataSource.manager.insert(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: person,
        date,
        shiftTypeId: shift.id,
        pinned: false,
      });
    }
    try {
      const rest = (await grid()).check.violations.filter(
        (v) => v.rule === 'minRest' && v.staffMemberId === person,
      );
      expect(rest).toHaveLength(1);
      expect(rest[0].message).toMatch(
        /: N on .* and E on .* overlap by 30 min \(the contract asks for at least 11 h\)$/,
      );
      expect(rest[0].message).not.toMatch(/-\d+ h|rest between/);
      expect(rest[0].warning).toBe(REST_RULE_WARNING);
    } finally {
      await t.dataSource.manager.delete(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: person,
      });
    }
  });

  it('refuses bad cells naming the field, and callers without access', async () => {
    const g = await grid();
    const person = g.rows[0].staffMemberId;
    const bad = [
      [{ staffMemberId: 'x', date: g.dates[0], shiftTypeId: null }, /staffMemberId/],
      [{ staffMemberId: person, date: '2027-13-01', shiftTypeId: null }, /date/],
      [{ staffMemberId: person, date: '1999-01-01', shiftTypeId: null }, /date must be a day of the period/],
      [{ staffMemberId: person, date: g.dates[0], shiftTypeId: 'E' }, /shiftTypeId/],
      [{ staffMemberId: person, date: g.dates[0] }, /shiftTypeId/],
      [
        { staffMemberId: person, date: g.dates[0], shiftTypeId: '00000000-0000-4000-8000-000000000000' },
        /shiftTypeId must be a shift type of the period's unit/,
      ],
    ] as const;
    for (const [body, field] of bad) {
      const res = await edit(body);
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toMatch(field);
    }
    await t
      .http()
      .get(api(R.assignments(period.id)))
      .expect(401);
    await t
      .http()
      .get(api(R.assignments(period.id)))
      .set(bearer(staff))
      .expect(403);
    await t
      .http()
      .get(api(R.assignments(period.id)))
      .set(bearer(manager2))
      .expect(403);
    expect(
      (await edit({ staffMemberId: person, date: g.dates[0], shiftTypeId: null }, manager2)).status,
    ).toBe(403);
    expect((await pin({ staffMemberId: person, date: g.dates[0] }, staff)).status).toBe(403);
    // Nothing changed.
    expect((await grid()).rows).toEqual(g.rows);
  });

  it('keeps a pinned cell through a new solve, and unpins it', async () => {
    const g = await grid();
    const person = g.rows[1].staffMemberId;
    const night = g.dates[2]; // a Wednesday: a one-week period allows no weekend work (2 in 4 weeks, rounded down)
    const off = g.dates[3];
    await edit({ staffMemberId: person, date: night, shiftTypeId: shifts.N.id }).expect(200);
    await pin({ staffMemberId: person, date: night }).expect(200);
    const pinnedOff = (await pin({ staffMemberId: person, date: off }).expect(200)).body as AssignmentGridDto;
    expect(cell(pinnedOff, person, night)).toEqual({ shiftTypeId: shifts.N.id, pinned: true });
    expect(cell(pinnedOff, person, off)).toEqual({ shiftTypeId: null, pinned: true });

    const { id } = (
      await t
        .http()
        .post(api(R.periodSolveRuns(period.id)))
        .set(bearer(manager))
        .send({ timeLimitSeconds: 20 })
        .expect(202)
    ).body as { id: string };
    let run: SolveRunDto;
    const until = Date.now() + 90_000;
    do {
      await new Promise((r) => setTimeout(r, 250));
      run = (
        await t
          .http()
          .get(api(R.solveRun(id)))
          .set(bearer(manager))
          .expect(200)
      ).body as SolveRunDto;
    } while (!['finished', 'failed', 'cancelled'].includes(run.status) && Date.now() < until);
    expect([run.status, run.errorMessage, run.result?.explanations.conflicts]).toEqual([
      'finished',
      null,
      null,
    ]);

    const solved = await grid();
    expect(cell(solved, person, night)).toEqual({ shiftTypeId: shifts.N.id, pinned: true });
    expect(cell(solved, person, off)).toEqual({ shiftTypeId: null, pinned: true });
    expect(solved.rows.flatMap((r) => r.cells).filter((c) => c.shiftTypeId !== null).length).toBeGreaterThan(
      1,
    );
    expect(solved.check.violations).toEqual([]);

    const unpinned = (
      await t
        .http()
        .post(api(R.assignmentUnpin(period.id)))
        .set(bearer(manager))
        .send({ staffMemberId: person, date: night })
        .expect(200)
    ).body as AssignmentGridDto;
    expect(cell(unpinned, person, night)).toEqual({ shiftTypeId: shifts.N.id, pinned: false });
  }, 120_000);

  it('refuses edits once the period is not a draft', async () => {
    const g = await grid();
    await t.dataSource.query(`UPDATE roster_periods SET status = 'published' WHERE id = ?`, [period.id]);
    try {
      const res = await edit({ staffMemberId: g.rows[0].staffMemberId, date: g.dates[0], shiftTypeId: null });
      expect(res.status).toBe(409);
      expect((await grid()).rows).toEqual(g.rows);
    } finally {
      await t.dataSource.query(`UPDATE roster_periods SET status = 'draft' WHERE id = ?`, [period.id]);
    }
  });
});
