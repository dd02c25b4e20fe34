import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type Page,
  PUBLISHING_ROUTES as PUB,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { LeaveRequestEntity } from '../src/requests/requests.entities';
import { generate, outboxSettled, smallUnit, waitForRun } from './publishing-fixture';
import { publishPeriod, readGrid, readPeriod } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(240_000);

const OUTBOX_ENV = { OUTBOX_MAX_ATTEMPTS: '20', OUTBOX_BASE_DELAY_MS: '100', OUTBOX_MAX_DELAY_MS: '400' };

describe('POST /api/roster-periods/:id/repair', () => {
  let t: TestApp;
  /** Plans the small unit (admins hold rosters:plan for every unit). */
  let manager: string;
  let staff: string;
  let period: RosterPeriodDto;
  const savedEnv = { ...process.env };

  const grid = () => readGrid(t, manager, period.id);
  const cellKey = (staffMemberId: string, date: string) => `${staffMemberId}|${date}`;
  const cellsOf = (g: AssignmentGridDto) =>
    new Map(
      g.rows.flatMap((r) =>
        r.cells.map((c, d) => [cellKey(r.staffMemberId, g.dates[d]), c.shiftTypeId] as const),
      ),
    );

  beforeAll(async () => {
    Object.assign(process.env, OUTBOX_ENV);
    t = await startTestApp();
    manager = (await t.login('admin@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    period = (await smallUnit(t, manager, 'Quayside Team', '2030-09-02')).period;
    const run = await generate(t, manager, period.id);
    expect([run.status, run.errorMessage]).toEqual(['finished', null]);
  });
  afterAll(async () => {
    await t?.close();
    process.env = savedEnv;
  });

  it('refuses a draft (409), bad time limits (400) and staff (403)', async () => {
    const draft = await t
      .http()
      .post(api(PUB.repair(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 5 })
      .expect(409);
    expect(draft.body.message).toMatch(/published/);
    for (const timeLimitSeconds of [0, 601, 'ten']) {
      const res = await t
        .http()
        .post(api(PUB.repair(period.id)))
        .set(bearer(manager))
        .send({ timeLimitSeconds })
        .expect(400);
      expect(JSON.stringify(res.body.message)).toMatch(/timeLimitSeconds/);
    }
    await t
      .http()
      .post(api(PUB.repair(period.id)))
      .set(bearer(staff))
      .send({ timeLimitSeconds: 5 })
      .expect(403);
  });

  it('after sick leave, re-solves against the published roster: leave honoured, no hard violation, changes audited and e-mailed to the people concerned only', async () => {
    const version = await publishPeriod(t, manager, period.id);
    await outboxSettled(t);
    const before = await grid();
    expect(before.check.violations).toEqual([]);

    // A person who works on day 3 falls sick for days 3 and 4 (approved sick leave).
    const sickDate = before.dates[2];
    const sick = before.rows.find((r) => r.cells[2].shiftTypeId !== null)!;
    // Written through the entity (as the leave API does), so the board's read cache sees the write.
    await t.dataSource.getRepository(LeaveRequestEntity).insert({
      staffMemberId: sick.staffMemberId,
      startDate: sickDate,
      endDate: before.dates[3],
      type: 'sick',
      status: 'approved',
      note: null,
      decisionNote: null,
      decidedById: null,
      decidedAt: new Date(),
    });
    const broken = await grid();
    // The roster model's checker now finds the published roster wrong for that person.
    expect(broken.check.violations.some((v) => v.staffMemberId === sick.staffMemberId)).toBe(true);

    const mailsBefore = (await t.dataSource.query(`SELECT id FROM mail_messages`)) as unknown[];
    const started = await t
      .http()
      .post(api(PUB.repair(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 60 })
      .expect(202);
    const run = await waitForRun(t, manager, (started.body as { id: string }).id);
    expect([run.status, run.errorMessage]).toEqual(['finished', null]);

    const after = await grid();
    expect(after.check.violations).toEqual([]);
    const b = cellsOf(before);
    const a = cellsOf(after);
    expect(a.get(cellKey(sick.staffMemberId, sickDate))).toBeNull();
    const changed = [...a.keys()].filter((k) => a.get(k) !== b.get(k));
    expect(changed).toContain(cellKey(sick.staffMemberId, sickDate));
    // Fewest changes: each shift the sick person loses must be covered by someone free that day (one
    // of each shift is needed daily), so at best every lost shift costs two changed cells; with the
    // model's default weights (a change costs 50, more than any fairness gain here) the repair
    // should find exactly that.
    const lost = [2, 3].filter((d) => sick.cells[d].shiftTypeId !== null).length;
    expect(changed.length).toBe(2 * lost);

    // Audited: exactly the changed cells, before and after.
    const trail = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .set(bearer(manager))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(trail.items.map((e) => e.kind)).toEqual(['publish', 'repair']);
    const repair = trail.items[1];
    const audited = (
      repair.before as { staffMemberId: string; date: string; shiftTypeId: string | null }[]
    ).map((c) => cellKey(c.staffMemberId, c.date));
    expect(audited.sort()).toEqual([...changed].sort());
    for (const c of repair.after as { staffMemberId: string; date: string; shiftTypeId: string | null }[]) {
      expect(c.shiftTypeId).toBe(a.get(cellKey(c.staffMemberId, c.date)));
    }
    for (const c of repair.before as { staffMemberId: string; date: string; shiftTypeId: string | null }[]) {
      expect(c.shiftTypeId).toBe(b.get(cellKey(c.staffMemberId, c.date)));
    }

    // The period's version moved on; the board stays published.
    const now = await readPeriod(t, manager, period.id);
    expect(now).toMatchObject({ status: 'published', version: version + 2 });
    // Raised by the period's writer with the cells, which recorded the change.
    const [last] = (await t.dataSource.query(
      `SELECT kind, cells, version FROM roster_period_changes WHERE "rosterPeriodId" = ? ORDER BY version DESC`,
      [period.id],
    )) as { kind: string; cells: number; version: number }[];
    expect(last).toEqual({ kind: 'repair', cells: changed.length, version: now.version });

    // One "changed" e-mail per person whose cells changed (with an address), nobody else.
    const changedPeople = new Set(changed.map((k) => k.split('|')[0]));
    const emails = (await t.dataSource.query(
      `SELECT id, email FROM staff_members WHERE email IS NOT NULL AND id IN (${[...changedPeople].map(() => '?').join(',')})`,
      [...changedPeople],
    )) as { id: string; email: string }[];
    await outboxSettled(t);
    const newMails = (await t.dataSource.query(`SELECT "to", subject FROM mail_messages`)) as {
      to: string;
      subject: string;
    }[];
    const repairMails = newMails.slice(mailsBefore.length).filter((m) => m.subject.includes('has changed'));
    expect(repairMails.map((m) => (JSON.parse(m.to) as string[])[0]).sort()).toEqual(
      emails.map((e) => e.email).sort(),
    );
  });
});
