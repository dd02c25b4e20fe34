import {
  MAX_PAGE_SIZE,
  type OpenShiftDto,
  type Page,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  SWAP_DECISION_WEB_PATH,
  SWAP_ROUTES as S,
  type SwapRequestDto,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { RosterPeriodEntity } from '../src/roster-periods/roster-period.entity';
import { addDays } from '../src/common/dates';
import { SwapRequestEntity } from '../src/swaps/swap-request.entity';
import { linkToken, nextMailTo } from './support/mailbox';
import {
  createPeriod,
  findUnit,
  idsByEmail,
  markPublished,
  restOnlyContract,
  shiftTypesByCode,
  WARD_PEOPLE,
  type WardPerson,
  loginAll,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * Open shifts: cover still short on a published roster, offered to staff who have the skill and
 * whom the checker allows, claimed, and approved by a manager (in the app or through the e-mail link).
 * Refusals use the 11-hour daily rest (EU Working Time Directive 2003/88/EC, Art. 3); the ward's
 * cover needs and shifts are the demo's (Late 14:30-22:30, Early 07:00-15:00, Night 22:00-07:30).
 */
describe('open shifts', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let tokens: Record<Who, string>;
  let period: RosterPeriodDto;
  let shift: Record<string, ShiftTypeDto>;
  let skill: Record<string, string>;
  let staffId: Record<string, string>;
  const seen = new Set<string>();
  const EMAIL = WARD_PEOPLE;
  type Who = WardPerson;
  const START = '2030-01-07'; // a Monday
  const day = (n: number) => addDays(START, n);

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    tokens = await loginAll(t, EMAIL);
    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, START);
    shift = await shiftTypesByCode(t, manager, ward.id);
    const skills = (await t.http().get(api(P.skills)).set(bearer(manager))).body as SkillDto[];
    skill = Object.fromEntries(skills.map((s) => [s.code, s.id]));
    const staff = await restOnlyContract(t, ward.id);
    staffId = idsByEmail(staff, EMAIL);
    await setCell('a', 0, 'L');
    await setCell('d', 4, 'N');
    await markPublished(t, period.id);
  });
  afterAll(() => t.close());

  const setCell = async (who: Who, d: number, code: string) => {
    await t.dataSource.manager.insert(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId[who],
      date: day(d),
      shiftTypeId: shift[code].id,
      pinned: false,
    });
  };
  const cell = async (who: Who, d: number) =>
    (
      await t.dataSource.manager.findOneBy(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: staffId[who],
        date: day(d),
      })
    )?.shiftTypeId ?? null;
  const page = (token: string, query: Record<string, unknown>) =>
    t
      .http()
      .get(api(S.openShifts))
      .query({ rosterPeriodId: period.id, ...query })
      .set(bearer(token));
  /** Every open shift of the period the caller sees, read page by page. */
  const list = async (token: string) => {
    const all: OpenShiftDto[] = [];
    for (let n = 1; ; n++) {
      const body = (await page(token, { page: n, pageSize: MAX_PAGE_SIZE }).expect(200))
        .body as Page<OpenShiftDto>;
      all.push(...body.items);
      if (body.items.length === 0 || all.length >= body.total) return all;
    }
  };
  const has = (items: OpenShiftDto[], d: number, code: string, skillCode: string) =>
    items.some((o) => o.date === day(d) && o.shiftCode === code && o.skillCode === skillCode);
  const claim = (who: Who, d: number, code: string, skillCode: string) =>
    t
      .http()
      .post(api(S.openShiftClaims))
      .set(bearer(tokens[who]))
      .send({
        rosterPeriodId: period.id,
        date: day(d),
        shiftTypeId: shift[code].id,
        skillId: skill[skillCode],
      });
  const mailTo = (to: string, subject: RegExp) => nextMailTo(t, admin, seen, to, subject);

  it('offers staff only the open shifts they have the skill for and the checker allows', async () => {
    const mine = await list(tokens.a);
    expect(mine.length).toBeGreaterThan(0);
    expect(mine.every((o) => o.skillCode === 'RN')).toBe(true); // Robin is a registered nurse, not an HCA
    expect(mine.some((o) => o.date === day(0))).toBe(false); // already working that day
    expect(has(mine, 1, 'E', 'RN')).toBe(false); // 8.5 h after Sunday's Late: under 11 h of rest
    expect(has(mine, 1, 'L', 'RN')).toBe(true);
    expect(has(mine, 2, 'E', 'RN')).toBe(false); // the demo's Robin is unavailable for Wednesday earlies
    expect(has(mine, 3, 'E', 'RN')).toBe(true);

    // The manager sees every open shift of the unit, with how many are still wanted.
    const all = await list(manager);
    expect(has(all, 1, 'E', 'HCA')).toBe(true);
    const night = all.find((o) => o.date === day(4) && o.shiftCode === 'N' && o.skillCode === 'RN')!;
    expect(night.short).toBe(1); // target 2, Grace is on it
    // Staff of another unit see none of this unit's open shifts and cannot claim them.
    expect(await list(tokens.contact)).toEqual([]);
    await claim('contact', 1, 'L', 'RN').expect(403);
    await claim('a', 1, 'L', 'RN').set(bearer(manager)).expect(403);
  });

  it('refuses claims the rules or skills forbid', async () => {
    const rest = await claim('a', 1, 'E', 'RN').expect(422);
    expect(rest.body.message).toMatch(/would break a rule/);
    expect(rest.body.findings.violations[0].rule).toBe('minRest');
    await claim('a', 1, 'E', 'HCA').expect(422);
    await claim('a', 0, 'E', 'RN').expect(400);
    expect(await cell('a', 1)).toBeNull();
  });

  it('a claim is approved through the manager e-mail link and fills the shift, audited', async () => {
    const created = (await claim('a', 1, 'L', 'RN').expect(201)).body as SwapRequestDto;
    expect(created).toMatchObject({ kind: 'claim', status: 'accepted', colleagueStaffMemberId: null });
    await claim('a', 1, 'L', 'RN').expect(409); // one claim per day at a time
    const mail = await mailTo('manager@example.com', /Robin Tallis claims an open shift/);
    const { token } = linkToken(mail.text, SWAP_DECISION_WEB_PATH);
    await t.http().get(api(S.swapLink)).query({ token }).expect(200);
    expect(await cell('a', 1)).toBeNull();
    const versionOf = async () =>
      (await t.dataSource.manager.findOneByOrFail(RosterPeriodEntity, { id: period.id })).version;
    const before = await versionOf();
    const approved = await t.http().post(api(S.swapLink)).send({ token, decision: 'approve' }).expect(200);
    expect(approved.body.status).toBe('approved');
    expect(await cell('a', 1)).toBe(shift['L'].id);
    // The period's writer raised the version with the cell, and recorded the change.
    expect(await versionOf()).toBe(before + 1);
    expect(
      await t.dataSource.query(
        `SELECT "kind", "cells" FROM "roster_period_changes" WHERE "rosterPeriodId" = ? AND "version" = ?`,
        [period.id, before + 1],
      ),
    ).toEqual([{ kind: 'open-shift-claim', cells: 1 }]);
    await mailTo(EMAIL.a, /Your roster has changed/);
    const audit = await t.dataSource.manager.query(
      `SELECT "kind" FROM "audit_entries" WHERE "rosterPeriodId" = ?`,
      [period.id],
    );
    expect(audit).toEqual([{ kind: 'open-shift-claim' }]);
    expect(has(await list(tokens.a), 1, 'L', 'RN')).toBe(false);
  });

  it('a claim whose day has passed is refused on a direct approval, with no read before', async () => {
    const created = (await claim('a', 3, 'E', 'RN').expect(201)).body as SwapRequestDto;
    // Its day moves into the past, as if the period had run on.
    const row = await t.dataSource.manager.findOneByOrFail(SwapRequestEntity, { id: created.id });
    await t.dataSource.manager.update(
      SwapRequestEntity,
      { id: created.id },
      { changes: row.changes.split(day(3)).join('2020-01-06'), firstDate: '2020-01-06' },
    );
    const res = await t
      .http()
      .post(api(S.swapDecide(created.id)))
      .set(bearer(manager))
      .send({ decision: 'approve' })
      .expect(410);
    expect(res.body.message).toMatch(/expired: its first day \(Mon 6 Jan 2020\) has passed/);
    expect(await cell('a', 3)).toBeNull();
    const after = await t
      .http()
      .get(api(S.swap(created.id)))
      .set(bearer(manager))
      .expect(200);
    expect(after.body).toMatchObject({ status: 'expired', actions: [] });
  });

  it('two claims for the last place approved at once: one succeeds, one is refused', async () => {
    const b = (await claim('b', 4, 'N', 'RN').expect(201)).body as SwapRequestDto;
    const c = (await claim('c', 4, 'N', 'RN').expect(201)).body as SwapRequestDto;
    const results = await Promise.all([
      t
        .http()
        .post(api(S.swapDecide(b.id)))
        .set(bearer(manager))
        .send({ decision: 'approve' }),
      t
        .http()
        .post(api(S.swapDecide(c.id)))
        .set(bearer(admin))
        .send({ decision: 'approve' }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(results.find((r) => r.status === 409)!.body.message).toMatch(/filled meanwhile/);
    const filled = [await cell('b', 4), await cell('c', 4)].filter((x) => x !== null);
    expect(filled).toEqual([shift['N'].id]);
  });
  it('pages by date, then shift and skill; page and pageSize are bounded', async () => {
    const all = await list(manager);
    expect(all.length).toBeGreaterThan(10);
    const keys = all.map((o) => `${o.date}|${o.unitId}|${o.shiftCode}|${o.skillCode ?? ''}`);
    expect(keys).toEqual([...keys].sort());
    const first = (await page(manager, { pageSize: 5 }).expect(200)).body as Page<OpenShiftDto>;
    const second = (await page(manager, { page: 2, pageSize: 5 }).expect(200)).body as Page<OpenShiftDto>;
    expect([first.total, first.page, first.pageSize, second.page]).toEqual([all.length, 1, 5, 2]);
    expect([...first.items, ...second.items]).toEqual(all.slice(0, 10));
    const defaults = (await page(manager, {}).expect(200)).body as Page<OpenShiftDto>;
    expect([defaults.items.length, defaults.pageSize]).toEqual([Math.min(20, all.length), 20]);
    for (const [query, field] of [
      [{ page: 0 }, 'page'],
      [{ page: 'last' }, 'page'],
      [{ pageSize: 0 }, 'pageSize'],
      [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
      [{ order: 'desc' }, 'order'],
    ] as const) {
      const res = await page(manager, query).expect(400);
      expect(JSON.stringify(res.body.message)).toContain(field);
    }
  });

  it('the list is kept until the next write: a shift given or taken away shows at once', async () => {
    const late = (items: OpenShiftDto[]) =>
      items.find((o) => o.date === day(6) && o.shiftCode === 'L' && o.skillCode === 'RN');
    const before = late(await list(manager))!;
    expect(before.short).toBeGreaterThan(0);
    expect(late(await list(tokens.b))).toBeDefined(); // b may claim it
    expect(late(await list(manager))).toEqual(before); // read again, nothing written

    // A write through an entity (as every cell change is): b now works that Late.
    await setCell('b', 6, 'L');
    const after = late(await list(manager));
    if (before.short === 1) expect(after).toBeUndefined();
    else expect(after?.short).toBe(before.short - 1);
    expect((await list(tokens.b)).some((o) => o.date === day(6))).toBe(false); // b works that day

    await t.dataSource.manager.delete(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId.b,
      date: day(6),
    });
    expect(late(await list(manager))).toEqual(before);
    expect(late(await list(tokens.b))).toBeDefined();
  });
});
