import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type Page,
  PLANNING_ROUTES as P,
  PUBLISHING_ROUTES as PUB,
  type PublishResultDto,
  type RosterPeriodDto,
  type ShiftTypeDto,
  SOLVING_ROUTES as R,
  type UnitDto,
} from '@rotaplex/contracts';
import { MailCatcherService } from '../src/mail/mail-catcher.service';
import { generate, outboxSettled, type SmallUnit, smallUnit, until } from './publishing-fixture';
import { caughtMails } from './support/mailbox';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(180_000);

const OUTBOX_ENV = { OUTBOX_MAX_ATTEMPTS: '20', OUTBOX_BASE_DELAY_MS: '100', OUTBOX_MAX_DELAY_MS: '400' };

describe('POST /api/roster-periods/:id/publish', () => {
  let t: TestApp;
  /** Plans the small unit (admins hold rosters:plan for every unit). */
  let planner: string;
  let manager: string;
  let manager2: string;
  let staff: string;
  let ward: UnitDto;
  let small: SmallUnit;
  let period: RosterPeriodDto;
  let shifts: ShiftTypeDto[];
  const savedEnv = { ...process.env };

  const readPeriod = async (id: string) =>
    (
      await t
        .http()
        .get(api(P.rosterPeriod(id)))
        .set(bearer(planner))
        .expect(200)
    ).body as RosterPeriodDto;
  const grid = async (id: string) =>
    (
      await t
        .http()
        .get(api(R.assignments(id)))
        .set(bearer(planner))
        .expect(200)
    ).body as AssignmentGridDto;

  beforeAll(async () => {
    Object.assign(process.env, OUTBOX_ENV);
    t = await startTestApp();
    planner = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    ward = ((await t.http().get(api('/units')).set(bearer(planner))).body as UnitDto[]).find(
      (u) => u.name === 'Ward 7 Acute Medicine',
    )!;
    // A July week: Europe/London is on summer time then (UTC+1, IANA tz database), so local and UTC
    // clock times differ by an hour.
    small = await smallUnit(t, planner, 'Harbour Desk', '2030-07-01');
    period = small.period;
    shifts = small.shifts;
    const run = await generate(t, planner, period.id);
    expect([run.status, run.errorMessage]).toEqual(['finished', null]);
  });
  afterAll(async () => {
    await t?.close();
    process.env = savedEnv;
  });

  it('refuses bad input, other units, staff and a stale version, and changes nothing', async () => {
    const current = await readPeriod(period.id);
    const bad = await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(planner))
      .send({ version: 'one' });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/version/);
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .send({ version: current.version })
      .expect(401);
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(staff))
      .send({ version: current.version })
      .expect(403);
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(manager2))
      .send({ version: current.version })
      .expect(403);
    // The ward's manager does not manage this unit.
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(manager))
      .send({ version: current.version })
      .expect(403);
    const stale = await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(planner))
      .send({ version: current.version + 1 })
      .expect(409);
    expect(stale.body.message).toMatch(/changed meanwhile/);
    expect((await readPeriod(period.id)).status).toBe('draft');
    expect(await t.dataSource.query(`SELECT id FROM outbox_messages`)).toHaveLength(0);
  });

  it('refuses to publish while a solve is running', async () => {
    const other = (
      await t
        .http()
        .post(api(P.rosterPeriods))
        .set(bearer(manager))
        .send({ unitId: ward.id, startDate: '2030-08-05', days: 7 })
        .expect(201)
    ).body as RosterPeriodDto;
    const started = await t
      .http()
      .post(api(R.periodSolveRuns(other.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 30 })
      .expect(202);
    const res = await t
      .http()
      .post(api(PUB.publish(other.id)))
      .set(bearer(manager))
      .send({ version: other.version })
      .expect(409);
    expect(res.body.message).toMatch(/solve run is (queued|running)/);
    await t
      .http()
      .post(api(R.solveRunCancel((started.body as { id: string }).id)))
      .set(bearer(manager))
      .expect(200);
    expect((await readPeriod(other.id)).status).toBe('draft');
  });

  it('a cell edit, a pin and a solve raise the version; a publish under the version read before answers 409 naming the changes', async () => {
    // The solve of beforeAll saved the roster through the period's writer.
    const [generated] = (await t.dataSource.query(
      `SELECT kind, cells FROM roster_period_changes WHERE "rosterPeriodId" = ? ORDER BY version`,
      [period.id],
    )) as { kind: string; cells: number }[];
    expect(generated.kind).toBe('generate');
    expect(generated.cells).toBeGreaterThan(0);
    const read = await readPeriod(period.id);
    const g = await grid(period.id);
    const row = g.rows.find((r) => r.cells.some((c) => c.shiftTypeId !== null))!;
    const day = row.cells.findIndex((c) => c.shiftTypeId !== null);
    const cell = { staffMemberId: row.staffMemberId, date: g.dates[day] };
    const shiftTypeId = row.cells[day].shiftTypeId;
    const edit = (body: object) =>
      t
        .http()
        .put(api(R.assignmentCell(period.id)))
        .set(bearer(planner))
        .send({ ...cell, overrideReason: 'test', ...body })
        .expect(200);
    // A day off, and the shift back: two edits, the roster as it was, the version two higher.
    await edit({ shiftTypeId: null });
    expect((await readPeriod(period.id)).version).toBe(read.version + 1);
    await edit({ shiftTypeId });
    expect((await readPeriod(period.id)).version).toBe(read.version + 2);
    // Setting a cell to what it holds changes nothing, so the version stays.
    await edit({ shiftTypeId });
    expect((await readPeriod(period.id)).version).toBe(read.version + 2);
    for (const pin of [R.assignmentPin(period.id), `/roster-periods/${period.id}/assignments/unpin`]) {
      await t.http().post(api(pin)).set(bearer(planner)).send(cell).expect(200);
    }
    const now = await readPeriod(period.id);
    expect(now.version).toBe(read.version + 4);
    expect(await grid(period.id)).toEqual(g);

    const stale = await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(planner))
      .send({ version: read.version })
      .expect(409);
    const [{ displayName }] = (await t.dataSource.query(
      `SELECT "displayName" FROM users WHERE email = 'admin@example.com'`,
    )) as { displayName: string }[];
    expect(stale.body).toMatchObject({ statusCode: 409, version: now.version });
    expect(stale.body.message).toContain(`4 cell(s) changed since version ${read.version}`);
    expect(stale.body.message).toContain(displayName);
    expect(
      (stale.body.changes as { version: number; kind: string; cells: number; actorName: string }[]).map(
        (c) => [c.version, c.kind, c.cells, c.actorName],
      ),
    ).toEqual([
      [read.version + 1, 'edit', 1, displayName],
      [read.version + 2, 'edit', 1, displayName],
      [read.version + 3, 'pin', 1, displayName],
      [read.version + 4, 'unpin', 1, displayName],
    ]);
    expect((await readPeriod(period.id)).status).toBe('draft');
    expect(await t.dataSource.query(`SELECT id FROM outbox_messages`)).toHaveLength(0);
    // The next test publishes with the version read now (200).
  });

  it('publishes with the SMTP server down; after it is back every person gets exactly one e-mail with only their own shifts, in the unit time zone', async () => {
    const before = await grid(period.id);
    const current = await readPeriod(period.id);
    const catcher = t.app.get(MailCatcherService);
    await catcher.stop();
    let result: PublishResultDto;
    try {
      result = (
        await t
          .http()
          .post(api(PUB.publish(period.id)))
          .set(bearer(planner))
          .send({ version: current.version })
          .expect(200)
      ).body as PublishResultDto;
      // Queued in the publish transaction; delivery fails while the server is down.
      await until('a failed attempt', async () => {
        const rows = (await t.dataSource.query(
          `SELECT attempts FROM outbox_messages WHERE attempts >= 1 AND status = 'pending'`,
        )) as unknown[];
        return rows.length > 0 ? true : undefined;
      });
    } finally {
      await catcher.start();
    }
    const published = await readPeriod(period.id);
    expect(published).toMatchObject({ status: 'published', version: current.version + 1 });
    expect(published.publishedAt).not.toBeNull();
    expect(result).toMatchObject({ status: 'published', version: published.version });

    const people = (await t.dataSource.query(
      `SELECT id, name, email FROM staff_members WHERE "unitId" = ? AND active AND email IS NOT NULL`,
      [small.unit.id],
    )) as { id: string; name: string; email: string }[];
    expect(people.length).toBeGreaterThan(1);
    expect(result.emailed).toBe(people.length);

    await outboxSettled(t);
    await new Promise((r) => setTimeout(r, 500)); // a duplicate would show up now

    const byCode = new Map(shifts.map((s) => [s.id, s]));
    for (const person of people) {
      const mails = (await caughtMails(t)).filter((m) => m.to.includes(person.email));
      expect(mails).toHaveLength(1);
      const [m] = mails;
      expect(m.subject).toContain('Harbour Desk');
      // Dates in words (1 Jul 2030 is a Monday), never ISO dates, in the subject and the body.
      expect(m.subject).toContain('Mon 1 Jul 2030 to ');
      expect(`${m.subject}\n${m.text}`).not.toMatch(/\d{4}-\d{2}-\d{2}/);
      expect(m.text).toContain('Europe/London');
      const row = before.rows.find((r) => r.staffMemberId === person.id)!;
      const own = row.cells.map((c, d) => ({ ...c, date: before.dates[d] })).filter((c) => c.shiftTypeId);
      const lines = m.text.split('\n').filter((l) => l.startsWith('- '));
      expect(lines).toHaveLength(own.length);
      for (const cell of own) {
        const st = byCode.get(cell.shiftTypeId!)!;
        // Wall-clock times of the shift type, as the unit defines them (not UTC, which is an hour
        // behind in July), on the right weekday.
        const weekday = new Date(`${cell.date}T12:00:00Z`).toLocaleDateString('en-GB', {
          weekday: 'short',
          timeZone: 'UTC',
        });
        const day = Number(cell.date.slice(8, 10));
        const line = lines.find((l) => l.includes(`${weekday} ${day} Jul 2030, ${st.start}`));
        expect(line).toBeDefined();
        expect(line).toContain(st.end);
        expect(line).toContain(st.code);
        expect(m.html).toContain(`${weekday} ${day} Jul 2030, ${st.start}`);
      }
      // No one else's name in it.
      for (const other of people)
        if (other.id !== person.id) expect(m.text + m.html).not.toContain(other.name);
    }
  });

  it('makes the board read-only: cell edits, pins, a new solve and a second publish are refused', async () => {
    const g = await grid(period.id);
    const [row] = g.rows;
    const edit = await t
      .http()
      .put(api(R.assignmentCell(period.id)))
      .set(bearer(planner))
      .send({ staffMemberId: row.staffMemberId, date: g.dates[0], shiftTypeId: null })
      .expect(409);
    expect(edit.body.message).toMatch(/published: change it through repair or a swap/);
    await t
      .http()
      .post(api(R.assignmentPin(period.id)))
      .set(bearer(planner))
      .send({ staffMemberId: row.staffMemberId, date: g.dates[0] })
      .expect(409);
    await t
      .http()
      .post(api(R.periodSolveRuns(period.id)))
      .set(bearer(planner))
      .send({ timeLimitSeconds: 5 })
      .expect(409);
    const version = (await readPeriod(period.id)).version;
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(planner))
      .send({ version })
      .expect(409);
    expect(await grid(period.id)).toEqual(g);
  });

  it('records the publish in the audit trail with the snapshot of the published shifts', async () => {
    const res = await t
      .http()
      .get(api(PUB.audit(period.id)))
      .set(bearer(planner))
      .expect(200);
    const page = res.body as Page<AuditEntryDto>;
    expect(page.total).toBe(1);
    const [entry] = page.items;
    expect(entry).toMatchObject({
      kind: 'publish',
      actorName: expect.any(String),
      rosterPeriodId: period.id,
    });
    const g = await grid(period.id);
    const worked = g.rows.flatMap((r) => r.cells.filter((c) => c.shiftTypeId !== null)).length;
    expect(entry.after).toHaveLength(worked);
    const [snapshot] = await t.dataSource.query(
      `SELECT cells FROM roster_publications WHERE "rosterPeriodId" = ?`,
      [period.id],
    );
    expect(JSON.parse(snapshot.cells)).toEqual(entry.after);
  });
});
