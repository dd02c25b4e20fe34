import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type Page,
  PUBLISHING_ROUTES as PUB,
  type RosterPeriodDto,
  SOLVING_ROUTES as R,
} from '@rotaplex/contracts';
import { parse } from 'csv-parse/sync';
import { AuditService } from '../src/audit/audit.module';
import { generate, type SmallUnit, smallUnit } from './publishing-fixture';
import { readPeriod } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(180_000);

describe('audit trail and period export', () => {
  let t: TestApp;
  let planner: string;
  let manager: string;
  let staff: string;
  let small: SmallUnit;
  let period: RosterPeriodDto;

  beforeAll(async () => {
    t = await startTestApp();
    planner = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    small = await smallUnit(t, planner, 'Lantern Row', '2030-10-07');
    period = small.period;
    const run = await generate(t, planner, period.id);
    expect([run.status, run.errorMessage]).toEqual(['finished', null]);
    // The finished solve raised the period's version: publish with the version it has now.
    const { version } = await readPeriod(t, planner, period.id);
    await t
      .http()
      .post(api(PUB.publish(period.id)))
      .set(bearer(planner))
      .send({ version })
      .expect(200);
    // A change recorded by another part of the product (as swaps do), by the system, with a
    // summary that a spreadsheet would run as a formula.
    await t.dataSource.transaction((em) =>
      t.app.get(AuditService).record(em, {
        rosterPeriodId: period.id,
        actorUserId: null,
        kind: 'manual-edit',
        summary: '=HYPERLINK("http://attacker.example","open")',
        before: { note: 'before' },
        after: { note: 'after' },
      }),
    );
  });
  afterAll(() => t?.close());

  it('AuditService.record refuses an unknown kind or actor and writes nothing', async () => {
    const audit = t.app.get(AuditService);
    await expect(
      t.dataSource.transaction((em) =>
        audit.record(em, {
          rosterPeriodId: period.id,
          actorUserId: null,
          kind: 'rewrite' as never,
          summary: 'x',
          before: null,
          after: null,
        }),
      ),
    ).rejects.toThrow(/kind must be one of/);
    await expect(
      t.dataSource.transaction((em) =>
        audit.record(em, {
          rosterPeriodId: period.id,
          actorUserId: '00000000-0000-4000-8000-000000000000',
          kind: 'swap',
          summary: 'x',
          before: null,
          after: null,
        }),
      ),
    ).rejects.toThrow(/actorUserId/);
    const rows = await t.dataSource.query(`SELECT id FROM audit_entries WHERE "rosterPeriodId" = ?`, [
      period.id,
    ]);
    expect(rows).toHaveLength(2);
  });

  it('lists the trail oldest first, paginated, for planners of the unit only', async () => {
    const first = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .query({ pageSize: 1 })
        .set(bearer(planner))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(first).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(first.items[0]).toMatchObject({ kind: 'publish', actorName: expect.stringMatching(/\S/) });
    expect(first.items[0].actorUserId).not.toBeNull();
    const second = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .query({ pageSize: 1, page: 2 })
        .set(bearer(planner))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(second.items[0]).toMatchObject({
      kind: 'manual-edit',
      actorUserId: null,
      actorName: 'Rotaplex (system)',
      before: { note: 'before' },
      after: { note: 'after' },
    });
    const newest = (
      await t
        .http()
        .get(api(PUB.audit(period.id)))
        .query({ order: 'desc' })
        .set(bearer(planner))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(newest.items.map((e) => e.kind)).toEqual(['manual-edit', 'publish']);

    await t
      .http()
      .get(api(PUB.audit(period.id)))
      .expect(401);
    await t
      .http()
      .get(api(PUB.audit(period.id)))
      .set(bearer(staff))
      .expect(403);
    await t
      .http()
      .get(api(PUB.audit(period.id)))
      .set(bearer(manager))
      .expect(403); // not their unit
    await t
      .http()
      .get(api(PUB.audit('not-a-uuid')))
      .set(bearer(planner))
      .expect(400);
    await t
      .http()
      .get(api(PUB.audit('00000000-0000-4000-8000-000000000000')))
      .set(bearer(planner))
      .expect(404);
    const bad = await t
      .http()
      .get(api(PUB.audit(period.id)))
      .query({ pageSize: 0 })
      .set(bearer(planner));
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/pageSize/);
  });

  it('exports the roster and the trail as CSV that a CSV parser reads back, formulas neutralised', async () => {
    const res = await t
      .http()
      .get(api(PUB.export(period.id)))
      .set(bearer(planner))
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename="roster-Lantern-Row-2030-10-07\.csv"/,
    );
    // RFC 4180 parsing by csv-parse, the reference parser of the csv package family.
    const records = parse(res.text, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
    const grid = (
      await t
        .http()
        .get(api(R.assignments(period.id)))
        .set(bearer(planner))
        .expect(200)
    ).body as AssignmentGridDto;
    const worked = grid.rows.flatMap((r) =>
      r.cells.flatMap((c, d) =>
        c.shiftTypeId ? [{ name: r.name, date: grid.dates[d], id: c.shiftTypeId }] : [],
      ),
    );
    const shiftRows = records.filter((r) => r.record === 'shift');
    expect(shiftRows).toHaveLength(worked.length);
    const code = new Map(small.shifts.map((s) => [s.id, s]));
    for (const w of worked) {
      const row = shiftRows.find((r) => r.date === w.date && r.staff_member === w.name);
      expect(row).toBeDefined();
      const st = code.get(w.id)!;
      expect(row!.shift_code).toBe(st.code);
      // Wall-clock times of the unit (October 2030 in London is still summer time, UTC+1).
      expect(row!.shift_times).toContain(`${st.start}–${st.end}`);
    }
    const auditRows = records.filter((r) => r.record === 'audit');
    expect(auditRows.map((r) => r.kind)).toEqual(['publish', 'manual-edit']);
    // OWASP CSV Injection: a cell starting with "=" is exported with a leading quote.
    expect(auditRows[1].summary).toBe(`'=HYPERLINK("http://attacker.example","open")`);
    expect(JSON.parse(auditRows[1].after)).toEqual({ note: 'after' });

    await t
      .http()
      .get(api(PUB.export(period.id)))
      .set(bearer(staff))
      .expect(403);
    await t
      .http()
      .get(api(PUB.export(period.id)))
      .set(bearer(manager))
      .expect(403);
  });
});
