import {
  MAX_PAGE_SIZE,
  type MailMessageDto,
  type Page,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SwapLinkViewDto,
  type SwapPreviewDto,
  type SwapRequestDto,
  SWAP_DECISION_WEB_PATH,
  SWAP_ROUTES as S,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { RosterPeriodEntity } from '../src/roster-periods/roster-period.entity';
import { addDays } from '../src/common/dates';
import { SwapExpiryService } from '../src/swaps/swap-expiry.service';
import { SwapLinkTokenEntity, SwapRequestEntity } from '../src/swaps/swap-request.entity';
import { dateInWords } from '../src/common/text/date-words';
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
 * Swaps and offers on a published roster, end to end: the real app on a temporary SQLite file, the
 * real checker, mail through the outbox to the built-in SMTP catcher, links read from the caught mail.
 *
 * Rule used for the refusals: 11 consecutive hours of daily rest (EU Working Time Directive
 * 2003/88/EC, Art. 3). The ward's shifts (demo data): Early 07:00-15:00, Late 14:30-22:30,
 * Night 22:00-07:30; a Late followed by the next day's Early leaves 8.5 h of rest.
 */
describe('swaps', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let manager2: string;
  let tokens: Record<Who, string>;
  let period: RosterPeriodDto;
  let shift: Record<string, ShiftTypeDto>;
  let staffId: Record<string, string>;
  const seen = new Set<string>();

  const EMAIL = WARD_PEOPLE;
  type Who = WardPerson;
  const START = '2030-01-07';
  const day = (n: number) => addDays(START, n);

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    tokens = await loginAll(t, EMAIL);

    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, START, 28);
    shift = await shiftTypesByCode(t, manager, ward.id);

    // Every ward person on one contract with only the 11-hour daily rest (EU WTD Art. 3), so the
    // sparse test roster breaks no other rule.
    staffId = idsByEmail(await restOnlyContract(t, ward.id), EMAIL);
    await markPublished(t, period.id);
  });
  afterAll(() => t.close());

  const em = () => t.dataSource.manager;
  /** Sets a cell of the test period directly (the fixture a published roster would have). */
  const setCell = async (who: Who, d: number, code: string | null) => {
    await em().delete(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId[who],
      date: day(d),
    });
    if (code) {
      await em().insert(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: staffId[who],
        date: day(d),
        shiftTypeId: shift[code].id,
        pinned: false,
      });
    }
  };
  const cell = async (who: Who, d: number) => {
    const row = await em().findOneBy(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId[who],
      date: day(d),
    });
    return row?.shiftTypeId ? Object.values(shift).find((s) => s.id === row.shiftTypeId)!.code : null;
  };

  /** Waits for a new message to `to` whose subject matches, delivered by the outbox to the catcher. */
  const mailTo = (to: string, subject: RegExp) => nextMailTo(t, admin, seen, to, subject);
  const tokenIn = (mail: MailMessageDto) => linkToken(mail.text, SWAP_DECISION_WEB_PATH).token;

  const propose = (who: Who, body: object) =>
    t
      .http()
      .post(api(S.swaps))
      .set(bearer(tokens[who]))
      .send({ rosterPeriodId: period.id, ...body });
  const decide = (token: string, id: string, decision: string) =>
    t
      .http()
      .post(api(S.swapDecide(id)))
      .set(bearer(token))
      .send({ decision });
  const byLink = (token: string, decision: string) =>
    t.http().post(api(S.swapLink)).send({ token, decision });

  /** Moves a request's day into the past, as if the period had run on (the fixture a late decision meets). */
  const moveIntoPast = async (id: string, d: number) => {
    const row = await em().findOneByOrFail(SwapRequestEntity, { id });
    await em().update(
      SwapRequestEntity,
      { id },
      { changes: row.changes.split(day(d)).join('2020-01-06'), firstDate: '2020-01-06' },
    );
  };
  const read = async (token: string, id: string) =>
    (
      await t
        .http()
        .get(api(S.swap(id)))
        .set(bearer(token))
        .expect(200)
    ).body as SwapRequestDto;

  /** A: Late on day 0; B: Early on day 0; proposes the same-day swap, B accepts in the app. */
  const acceptedSwap = async (d: number): Promise<SwapRequestDto> => {
    await setCell('a', d, 'L');
    await setCell('b', d, 'E');
    const res = await propose('a', {
      kind: 'swap',
      myDate: day(d),
      colleagueStaffMemberId: staffId.b,
      theirDate: day(d),
    });
    expect([res.status, res.body.message]).toEqual([201, undefined]);
    const swap = res.body as SwapRequestDto;
    await mailTo(EMAIL.b, /asks to swap/);
    expect((await decide(tokens.b, swap.id, 'accept')).status).toBe(200);
    await mailTo('manager@example.com', /Swap to approve/);
    return swap;
  };

  it('previews, proposes, is accepted and approved through the e-mail links, and swaps the cells', async () => {
    await setCell('a', 0, 'L');
    await setCell('b', 0, 'E');
    const body = { kind: 'swap', myDate: day(0), colleagueStaffMemberId: staffId.b, theirDate: day(0) };
    const preview = await t
      .http()
      .post(api(S.swapPreview))
      .set(bearer(tokens.a))
      .send({ rosterPeriodId: period.id, ...body })
      .expect(200);
    const p = preview.body as SwapPreviewDto;
    expect(p.blocked).toBe(false);
    expect(p.violations).toEqual([]);
    expect(p.changes.map((c) => `${c.staffName}:${c.beforeShiftCode}>${c.afterShiftCode}`)).toEqual([
      'Robin Tallis:L>E',
      'Priya Wendover:E>L',
    ]);

    const created = (await propose('a', body).expect(201)).body as SwapRequestDto;
    expect(created.status).toBe('proposed');
    expect(created.actions).toEqual(['cancel']);

    // B's mail: plain text and HTML, a link to the decision page.
    const mailB = await mailTo(EMAIL.b, /Robin Tallis asks to swap/);
    expect(mailB.html).toContain('Accept or decline');
    expect(mailB.text).toContain('Europe/London');
    // Dates in words, and the colleague's menu item by its name.
    expect(`${mailB.subject}\n${mailB.text}`).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(mailB.text).toContain(`on ${dateInWords(day(0))}`);
    expect(mailB.text).toContain('decide in Rotaplex under Swaps.');
    const tokenB = tokenIn(mailB);

    // Fetching the link (as a mail scanner would) changes nothing.
    const view = (await t.http().get(api(S.swapLink)).query({ token: tokenB }).expect(200))
      .body as SwapLinkViewDto;
    expect(view.role).toBe('colleague');
    expect(view.decisions).toEqual(['accept', 'decline']);
    expect(view.swap.status).toBe('proposed');
    await t.http().get(api(S.swapLink)).query({ token: tokenB }).expect(200);
    expect(
      (
        await t
          .http()
          .get(api(S.swap(created.id)))
          .set(bearer(tokens.a))
          .expect(200)
      ).body.status,
    ).toBe('proposed');

    // The colleague's link cannot approve.
    await byLink(tokenB, 'approve').expect(400);
    const accepted = (await byLink(tokenB, 'accept').expect(200)).body as SwapRequestDto;
    expect(accepted.status).toBe('accepted');
    await mailTo(EMAIL.a, /accepted your swap/);
    // Reused link: refused with a clear message.
    const reused = await byLink(tokenB, 'decline').expect(410);
    expect(reused.body.message).toMatch(/already been used/);

    const mailM = await mailTo('manager@example.com', /Swap to approve: Robin Tallis and Priya Wendover/);
    // The manager decides under the menu item they see: "Swap approvals" (navItems.ts), not "Swaps".
    expect(mailM.text).toContain('decide in Rotaplex under Swap approvals.');
    expect(mailM.text).not.toMatch(/under Swaps\b/);
    expect(mailM.text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    const tokenM = tokenIn(mailM);
    const viewM = (await t.http().get(api(S.swapLink)).query({ token: tokenM }).expect(200))
      .body as SwapLinkViewDto;
    expect(viewM.decisions).toEqual(['approve', 'refuse']);
    expect(await cell('a', 0)).toBe('L'); // still unchanged before the POST
    const versionOf = async () => (await em().findOneByOrFail(RosterPeriodEntity, { id: period.id })).version;
    const before = await versionOf();
    const approved = (await byLink(tokenM, 'approve').expect(200)).body as SwapRequestDto;
    expect(approved.status).toBe('approved');
    expect(await cell('a', 0)).toBe('E');
    expect(await cell('b', 0)).toBe('L');
    // The period's writer raised the version with the cells, and recorded the change.
    expect(await versionOf()).toBe(before + 1);
    expect(
      await em().query(
        `SELECT "kind", "cells", "version" FROM "roster_period_changes" WHERE "rosterPeriodId" = ?`,
        [period.id],
      ),
    ).toEqual([{ kind: 'swap', cells: 2, version: before + 1 }]);

    // Everyone involved hears about it.
    await mailTo(EMAIL.a, /Your roster has changed/);
    await mailTo(EMAIL.b, /Your roster has changed/);
    await mailTo('manager@example.com', /You approved a roster change/);
    // The audit trail has the swap with before and after.
    const audit = await em().query(
      `SELECT "kind", "summary" FROM "audit_entries" WHERE "rosterPeriodId" = ?`,
      [period.id],
    );
    expect(audit).toEqual([expect.objectContaining({ kind: 'swap' })]);
    await byLink(tokenM, 'approve').expect(410);
  });

  it('refuses a proposal that would break the 11-hour daily rest (EU WTD Art. 3), with the findings', async () => {
    // A works Late on day 2 and Early on day 4; B works Early on day 3. A taking B's Early on day 3
    // leaves A 8.5 h of rest after the Late (22:30 -> 07:00).
    await setCell('a', 2, 'L');
    await setCell('a', 4, 'E');
    await setCell('b', 3, 'E');
    await setCell('b', 4, null);
    await setCell('a', 3, null);
    const body = { kind: 'swap', myDate: day(4), colleagueStaffMemberId: staffId.b, theirDate: day(3) };
    const preview = (
      await t
        .http()
        .post(api(S.swapPreview))
        .set(bearer(tokens.a))
        .send({ rosterPeriodId: period.id, ...body })
        .expect(200)
    ).body as SwapPreviewDto;
    expect(preview.blocked).toBe(true);
    expect(preview.violations).toEqual([
      expect.objectContaining({ rule: 'minRest', staffMemberId: staffId.a, isNew: true }),
    ]);
    const res = await propose('a', body).expect(422);
    expect(res.body.message).toMatch(/would break a rule/);
    expect((res.body.findings as SwapPreviewDto).violations[0].rule).toBe('minRest');
    expect(await cell('a', 3)).toBeNull();
  });

  it('colleague declines in the app; the proposer cancels another; a cancelled link is refused', async () => {
    await setCell('a', 6, 'E');
    const offer = (
      await propose('a', { kind: 'offer', myDate: day(6), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    await mailTo(EMAIL.c, /offers you a shift/);
    const declined = (await decide(tokens.c, offer.id, 'decline').expect(200)).body as SwapRequestDto;
    expect(declined.status).toBe('declined');
    await mailTo(EMAIL.a, /declined your swap/);

    const again = (
      await propose('a', { kind: 'offer', myDate: day(6), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    const tokenC = tokenIn(await mailTo(EMAIL.c, /offers you a shift/));
    expect(
      (
        await t
          .http()
          .post(api(S.swapCancel(again.id)))
          .set(bearer(tokens.a))
          .expect(200)
      ).body.status,
    ).toBe('cancelled');
    await mailTo(EMAIL.c, /cancelled a swap/);
    await t.http().get(api(S.swapLink)).query({ token: tokenC }).expect(410);
    await byLink(tokenC, 'accept').expect(410);
    expect(await cell('a', 6)).toBe('E');
    expect(await cell('c', 6)).toBeNull();
  });

  it('refuses tampered and expired links and keeps the request as it was', async () => {
    await setCell('a', 8, 'E');
    const offer = (
      await propose('a', { kind: 'offer', myDate: day(8), colleagueStaffMemberId: staffId.d }).expect(201)
    ).body as SwapRequestDto;
    const token = tokenIn(await mailTo(EMAIL.d, /offers you a shift/));
    const tampered = token.slice(0, -1) + (token.endsWith('A') ? 'B' : 'A');
    const bad = await t.http().get(api(S.swapLink)).query({ token: tampered }).expect(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/not valid/);
    await byLink(tampered, 'accept').expect(400);

    await em().update(
      SwapLinkTokenEntity,
      { swapRequestId: offer.id },
      { expiresAt: new Date(Date.now() - 1000) },
    );
    const expired = await t.http().get(api(S.swapLink)).query({ token }).expect(410);
    expect(expired.body.message).toMatch(/expired/);
    await byLink(token, 'accept').expect(410);
    expect(
      (
        await t
          .http()
          .get(api(S.swap(offer.id)))
          .set(bearer(tokens.d))
          .expect(200)
      ).body.status,
    ).toBe('proposed');
    // The colleague can still decide in the app.
    await decide(tokens.d, offer.id, 'decline').expect(200);
  });

  it('the scheduled expiry marks requests whose day has passed, and only those', async () => {
    await setCell('a', 22, 'E');
    const offer = (
      await propose('a', { kind: 'offer', myDate: day(22), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    await setCell('a', 23, 'E');
    const later = (
      await propose('a', { kind: 'offer', myDate: day(23), colleagueStaffMemberId: staffId.d }).expect(201)
    ).body as SwapRequestDto;
    await mailTo(EMAIL.c, /offers you a shift/);
    await mailTo(EMAIL.d, /offers you a shift/);
    await moveIntoPast(offer.id, 22);
    await t.app.get(SwapExpiryService).expireOverdue();
    const expired = await read(tokens.c, offer.id);
    expect(expired).toMatchObject({ status: 'expired', actions: [] });
    expect(expired.outcome).toMatch(/first day passed before a decision/);
    expect((await read(tokens.d, later.id)).status).toBe('proposed'); // its day is still to come
    const refused = await decide(tokens.c, offer.id, 'accept').expect(410);
    expect(refused.body.message).toMatch(/first day \(Mon 6 Jan 2020\) has passed/);
    expect(await t.app.get(SwapExpiryService).expireOverdue()).toBe(0); // nothing else is overdue
    await decide(tokens.d, later.id, 'decline').expect(200);
  });

  it('an accepted swap whose day has passed is refused on a direct approval, with no read before', async () => {
    const swap = await acceptedSwap(24);
    await moveIntoPast(swap.id, 24);
    const res = await decide(manager, swap.id, 'approve').expect(410);
    expect(res.body.message).toMatch(/expired: its first day \(Mon 6 Jan 2020\) has passed/);
    expect(res.body.statusCode).toBe(410);
    expect(await cell('a', 24)).toBe('L');
    expect(await cell('b', 24)).toBe('E');
    expect((await read(tokens.a, swap.id)).status).toBe('expired');
    await decide(manager, swap.id, 'approve').expect(410);
  });

  it('an offer whose day has passed is refused through its e-mail link and cannot be cancelled', async () => {
    await setCell('a', 25, 'E');
    const offer = (
      await propose('a', { kind: 'offer', myDate: day(25), colleagueStaffMemberId: staffId.d }).expect(201)
    ).body as SwapRequestDto;
    const token = tokenIn(await mailTo(EMAIL.d, /offers you a shift/));
    await moveIntoPast(offer.id, 25);
    const res = await byLink(token, 'accept').expect(410);
    expect(res.body.message).toMatch(/has passed before a decision was made/);
    expect((await read(tokens.d, offer.id)).status).toBe('expired');

    await setCell('a', 26, 'E');
    const other = (
      await propose('a', { kind: 'offer', myDate: day(26), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    await moveIntoPast(other.id, 26);
    await t
      .http()
      .post(api(S.swapCancel(other.id)))
      .set(bearer(tokens.a))
      .expect(410);
    expect((await read(tokens.a, other.id)).status).toBe('expired');
  });

  it('refuses the wrong role and other units', async () => {
    const swap = await acceptedSwap(10);
    await decide(tokens.a, swap.id, 'approve').expect(403); // staff cannot approve
    await decide(tokens.b, swap.id, 'accept').expect(409); // already accepted
    await decide(manager, swap.id, 'accept').expect(403); // a manager is not the colleague
    await decide(tokens.c, swap.id, 'approve').expect(404); // not theirs to see
    await decide(manager2, swap.id, 'approve').expect(403); // manager of another unit
    await t
      .http()
      .get(api(S.swap(swap.id)))
      .set(bearer(manager2))
      .expect(403);
    // Staff of another unit cannot propose on this roster.
    await propose('contact', { kind: 'offer', myDate: day(10), colleagueStaffMemberId: staffId.b }).expect(
      403,
    );
    // A manager cannot propose (staff permission).
    await t
      .http()
      .post(api(S.swaps))
      .set(bearer(manager))
      .send({ rosterPeriodId: period.id, kind: 'offer', myDate: day(10), colleagueStaffMemberId: staffId.b })
      .expect(403);
    // Anonymous: 401.
    await t
      .http()
      .post(api(S.swapDecide(swap.id)))
      .send({ decision: 'approve' })
      .expect(401);
    // Bad input: a clear 400.
    await decide(manager, swap.id, 'maybe').expect(400);
    const refused = (await decide(manager, swap.id, 'refuse').expect(200)).body as SwapRequestDto;
    expect(refused.status).toBe('refused');
    expect(await cell('a', 10)).toBe('L');
  });

  it('refuses a double approval', async () => {
    const swap = await acceptedSwap(12);
    await decide(manager, swap.id, 'approve').expect(200);
    const twice = await decide(manager, swap.id, 'approve').expect(409);
    expect(twice.body.message).toMatch(/already approved/);
    expect(await cell('a', 12)).toBe('E');
  });

  it('refuses a stale roster: a cell changed after the proposal', async () => {
    const swap = await acceptedSwap(14);
    await setCell('b', 14, 'N'); // the manager changed B's shift meanwhile
    const res = await decide(manager, swap.id, 'approve').expect(409);
    expect(res.body.message).toContain(
      `roster changed since this was asked (Priya Wendover on ${dateInWords(day(14))})`,
    );
    expect(await cell('a', 14)).toBe('L');
    expect(await cell('b', 14)).toBe('N');
    const after = (
      await t
        .http()
        .get(api(S.swap(swap.id)))
        .set(bearer(tokens.a))
        .expect(200)
    ).body as SwapRequestDto;
    expect(after.status).toBe('refused');
    expect(after.outcome).toMatch(/roster changed/);
  });

  it('refuses approval when the period is no longer published', async () => {
    const swap = await acceptedSwap(17); // not 16: the demo's Robin is unavailable for Wednesday earlies
    await em().update(RosterPeriodEntity, { id: period.id }, { status: 'archived' });
    try {
      const res = await decide(manager, swap.id, 'approve').expect(409);
      expect(res.body.message).toMatch(/no longer published/);
    } finally {
      await em().update(RosterPeriodEntity, { id: period.id }, { status: 'published' });
    }
    expect(await cell('a', 17)).toBe('L');
  });

  it('two approvals racing for the same shift: one succeeds, one is refused', async () => {
    // A offers one Early to B and to C; both accept; two approvals arrive at the same time.
    await setCell('a', 18, 'E');
    const toB = (
      await propose('a', { kind: 'offer', myDate: day(18), colleagueStaffMemberId: staffId.b }).expect(201)
    ).body as SwapRequestDto;
    const toC = (
      await propose('a', { kind: 'offer', myDate: day(18), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    await decide(tokens.b, toB.id, 'accept').expect(200);
    await decide(tokens.c, toC.id, 'accept').expect(200);
    const results = await Promise.all([decide(manager, toB.id, 'approve'), decide(admin, toC.id, 'approve')]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const [b, c] = [await cell('b', 18), await cell('c', 18)];
    expect([b, c].sort()).toEqual(['E', null].sort());
    expect(await cell('a', 18)).toBeNull();

    // The same request approved twice at once: one success, one refusal.
    const swap = await acceptedSwap(20);
    const twice = await Promise.all([decide(manager, swap.id, 'approve'), decide(admin, swap.id, 'approve')]);
    expect(twice.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(await cell('a', 20)).toBe('E');
    expect(await cell('b', 20)).toBe('L');
  });
  it('lists a page at a time, newest first, with what waits for the caller; pages are bounded', async () => {
    const accepted = await acceptedSwap(22);
    await setCell('a', 24, 'E');
    const offered = (
      await propose('a', { kind: 'offer', myDate: day(24), colleagueStaffMemberId: staffId.c }).expect(201)
    ).body as SwapRequestDto;
    const page = (token: string, query: Record<string, unknown>) =>
      t.http().get(api(S.swaps)).query(query).set(bearer(token));
    const all = async (token: string, query: Record<string, unknown> = {}) => {
      const items: SwapRequestDto[] = [];
      for (let n = 1; ; n++) {
        const body = (await page(token, { ...query, page: n, pageSize: 3 }).expect(200))
          .body as Page<SwapRequestDto>;
        items.push(...body.items);
        if (body.items.length === 0 || items.length >= body.total) return items;
      }
    };

    const managed = await all(manager);
    const stored = (await t.dataSource.query(
      `SELECT "id" FROM "swap_requests" WHERE "unitId" = ? ORDER BY "createdAt" DESC, "id" ASC`,
      [period.unitId],
    )) as { id: string }[];
    expect(managed.map((r) => r.id)).toEqual(stored.map((r) => r.id));
    const first = (await page(manager, { pageSize: 2 }).expect(200)).body as Page<SwapRequestDto>;
    expect(first).toMatchObject({ total: stored.length, page: 1, pageSize: 2 });
    expect(first.items.map((r) => r.id)).toEqual(stored.slice(0, 2).map((r) => r.id));
    const defaults = (await page(manager, {}).expect(200)).body as Page<SwapRequestDto>;
    expect([defaults.page, defaults.pageSize, defaults.items.length]).toEqual([
      1,
      20,
      Math.min(20, stored.length),
    ]);

    // waitingForMe gives what has an answer other than cancel for the caller (the web app's rule).
    for (const [token, expected] of [
      [manager, accepted.id],
      [tokens.c, offered.id],
    ] as const) {
      const everything = await all(token);
      const waiting = await all(token, { waitingForMe: true });
      expect(waiting.map((r) => r.id)).toEqual(
        everything.filter((r) => r.actions.some((a) => a !== 'cancel')).map((r) => r.id),
      );
      expect(waiting.map((r) => r.id)).toContain(expected);
    }
    expect(await all(tokens.a, { waitingForMe: true })).toEqual([]); // a proposed; a waits for no one

    for (const [query, field] of [
      [{ page: 0 }, 'page'],
      [{ pageSize: 0 }, 'pageSize'],
      [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
      [{ waitingForMe: 'yes' }, 'waitingForMe'],
      [{ status: 'open' }, 'status'],
    ] as const) {
      const res = await page(manager, query).expect(400);
      expect(JSON.stringify(res.body.message)).toContain(field);
    }
  });
});
