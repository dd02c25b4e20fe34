import {
  type RosterPeriodDto,
  type ShiftTypeDto,
  type StaleVersionDto,
  type SwapRequestDto,
  SWAP_ROUTES as S,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { addDays } from '../src/common/dates';
import { UserEntity } from '../src/users/user.entity';
import {
  createPeriod,
  findUnit,
  idsByEmail,
  loginAll,
  markPublished,
  readPeriod,
  restOnlyContract,
  shiftTypesByCode,
  WARD_PEOPLE,
  type WardPerson,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * Decisions on a period changed since the request was made: the request's own cells are its lock
 * (a 409 names the changes the period's writer recorded since, with the version now), and the
 * rules are checked again on the roster as it is now. Rule used: 11 consecutive hours of daily
 * rest (EU Working Time Directive 2003/88/EC, Art. 3); the ward's Late ends 22:30 and its Early
 * starts 07:00 (demo data), 8.5 h apart.
 */
describe('swap and claim decisions against the period as it is now', () => {
  let t: TestApp;
  let manager: string;
  let managerName: string;
  let tokens: Record<WardPerson, string>;
  let period: RosterPeriodDto;
  let shift: Record<string, ShiftTypeDto>;
  let staffId: Record<string, string>;
  const START = '2030-03-04';
  const day = (n: number) => addDays(START, n);

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    const admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    managerName = (await t.dataSource.manager.findOneByOrFail(UserEntity, { email: 'manager@example.com' }))
      .displayName;
    tokens = await loginAll(t, WARD_PEOPLE);
    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, START, 28);
    shift = await shiftTypesByCode(t, manager, ward.id);
    staffId = idsByEmail(await restOnlyContract(t, ward.id), WARD_PEOPLE);
    await markPublished(t, period.id);
  });
  afterAll(() => t.close());

  /** The fixture a published roster would have: one cell written directly. */
  const setCell = async (who: WardPerson, d: number, code: string) => {
    await t.dataSource.manager.insert(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId[who],
      date: day(d),
      shiftTypeId: shift[code].id,
      pinned: false,
    });
  };
  const cell = async (who: WardPerson, d: number) => {
    const row = await t.dataSource.manager.findOneBy(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId[who],
      date: day(d),
    });
    return row?.shiftTypeId ? Object.values(shift).find((s) => s.id === row.shiftTypeId)!.code : null;
  };
  /** `from` offers their shift on day `d` to `to`, who accepts in the app. */
  const acceptedOffer = async (from: WardPerson, to: WardPerson, d: number) => {
    const res = await t
      .http()
      .post(api(S.swaps))
      .set(bearer(tokens[from]))
      .send({
        rosterPeriodId: period.id,
        kind: 'offer',
        myDate: day(d),
        colleagueStaffMemberId: staffId[to],
      });
    expect([res.status, res.body.message]).toEqual([201, undefined]);
    const offer = res.body as SwapRequestDto;
    await decide(tokens[to], offer.id, 'accept').expect(200);
    return offer;
  };
  const decide = (token: string, id: string, decision: string) =>
    t
      .http()
      .post(api(S.swapDecide(id)))
      .set(bearer(token))
      .send({ decision });

  it('a request whose cells another approval changed answers 409 with the version now and what changed', async () => {
    await setCell('a', 2, 'E');
    const toB = await acceptedOffer('a', 'b', 2);
    const toC = await acceptedOffer('a', 'c', 2);
    const before = (await readPeriod(t, manager, period.id)).version;
    await decide(manager, toB.id, 'approve').expect(200);
    const now = (await readPeriod(t, manager, period.id)).version;
    expect(now).toBe(before + 1); // the approval went through the period's writer

    const res = await decide(manager, toC.id, 'approve').expect(409);
    const body = res.body as StaleVersionDto;
    expect(body.version).toBe(now);
    expect(body.changes).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ version: now, kind: 'swap', cells: 2, actorName: managerName }),
      ]),
    );
    expect(body.message).toContain('The roster changed since this was asked');
    expect(body.message).toContain(`Changed since: swap by ${managerName}`);
    // Nothing changed: B keeps the shift, C has none, the version stays.
    expect([await cell('a', 2), await cell('b', 2), await cell('c', 2)]).toEqual([null, 'E', null]);
    expect((await readPeriod(t, manager, period.id)).version).toBe(now);
  });

  it('a request whose own cells held, but whose neighbours changed, is checked against the rules again', async () => {
    // A offers B an Early on day 9; B is free on day 8 when it is asked, so it breaks no rule.
    await setCell('a', 9, 'E');
    const earlyToB = await acceptedOffer('a', 'b', 9);
    // Meanwhile C gives B a Late on day 8, approved first: B would now have 8.5 h of rest.
    await setCell('c', 8, 'L');
    const lateToB = await acceptedOffer('c', 'b', 8);
    await decide(manager, lateToB.id, 'approve').expect(200);
    const version = (await readPeriod(t, manager, period.id)).version;

    const res = await decide(manager, earlyToB.id, 'approve').expect(422);
    expect(res.body.message).toMatch(/would now break a rule/);
    expect(res.body.findings.blocked).toBe(true);
    expect([await cell('a', 9), await cell('b', 9), await cell('b', 8)]).toEqual(['E', null, 'L']);
    expect((await readPeriod(t, manager, period.id)).version).toBe(version);
  });

  it('a request untouched by the changes since is approved and raises the version by one', async () => {
    await setCell('a', 14, 'E');
    const offer = await acceptedOffer('a', 'd', 14);
    await setCell('c', 20, 'E');
    await decide(manager, (await acceptedOffer('c', 'b', 20)).id, 'approve').expect(200);
    const version = (await readPeriod(t, manager, period.id)).version;
    await decide(manager, offer.id, 'approve').expect(200);
    expect((await readPeriod(t, manager, period.id)).version).toBe(version + 1);
    expect([await cell('a', 14), await cell('d', 14)]).toEqual([null, 'E']);
  });
});
