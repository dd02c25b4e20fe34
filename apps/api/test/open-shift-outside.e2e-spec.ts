import {
  type AuditEntryDto,
  MAX_PAGE_SIZE,
  OPEN_SHIFT_ROUTES as O,
  type OpenShiftDto,
  type OutsideOfferDto,
  type Page,
  PLANNING_ROUTES as P,
  PUBLISHING_ROUTES,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  SWAP_ROUTES as S,
  type WhatItWouldTakeDto,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { ContractEntity } from '../src/contracts/contract.entity';
import { addDays } from '../src/common/dates';
import { StaffMemberEntity } from '../src/staff/staff-member.entity';
import {
  createPeriod,
  findUnit,
  idsByEmail,
  loginAll,
  markPublished,
  restOnlyContract,
  shiftTypesByCode,
  WARD_PEOPLE,
  type WardPerson,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * Open shifts nobody may take: what it would take (which rule for whom, from the roster model's
 * checker) and offering one to bank or agency staff outside the roster (offer, fill, withdraw, each in
 * the audit trail). Everyone's contract keeps 11 consecutive hours of daily rest (EU Working Time
 * Directive 2003/88/EC, Art. 3); Tomasz's also allows at most 6 working days in a row (the presets'
 * limit: one whole day of weekly rest in 7, Art. 5). The ward's shifts are the demo's (Late
 * 14:30-22:30, Early 07:00-15:00, Night 22:00-07:30).
 */
describe('open shifts: what it would take, and offers outside the roster', () => {
  let t: TestApp;
  let manager: string;
  let tokens: Record<WardPerson, string>;
  let period: RosterPeriodDto;
  let shift: Record<string, ShiftTypeDto>;
  let skill: Record<string, string>;
  let staffId: Record<WardPerson, string>;
  let tomaszSkill: string;
  const START = '2030-01-07'; // a Monday
  const day = (n: number) => addDays(START, n);

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    const admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    tokens = await loginAll(t, WARD_PEOPLE);
    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, START);
    shift = await shiftTypesByCode(t, manager, ward.id);
    const skills = (await t.http().get(api(P.skills)).set(bearer(manager))).body as SkillDto[];
    skill = Object.fromEntries(skills.map((s) => [s.code, s.id]));
    staffId = idsByEmail(await restOnlyContract(t, ward.id), WARD_PEOPLE);
    const em = t.dataSource.manager;
    // Robin: Monday's Late, which ends at 22:30.
    await em.insert(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId.a,
      date: day(0),
      shiftTypeId: shift['L'].id,
      pinned: false,
    });
    // Tomasz: at most 6 days in a row, and Earlies Monday to Saturday (16 h of rest between them).
    const tomasz = await em.findOneOrFail(StaffMemberEntity, {
      where: { id: staffId.c },
      relations: { skills: true },
    });
    tomaszSkill = tomasz.skills[0].id;
    const own = await em.save(
      em.create(ContractEntity, {
        ...(await em.findOneByOrFail(ContractEntity, { id: tomasz.contractId! })),
        id: undefined,
        name: 'Rest and six days (test)',
        maxConsecutiveWorkDays: 6,
      }),
    );
    await em.update(StaffMemberEntity, { id: staffId.c }, { contractId: own.id });
    for (let d = 0; d < 6; d++) {
      await em.insert(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: staffId.c,
        date: day(d),
        shiftTypeId: shift['E'].id,
        pinned: false,
      });
    }
    await markPublished(t, period.id);
  });
  afterAll(() => t.close());

  const list = async (token: string, query: Record<string, unknown> = {}) =>
    (
      (
        await t
          .http()
          .get(api(S.openShifts))
          .query({ rosterPeriodId: period.id, page: 1, pageSize: MAX_PAGE_SIZE, ...query })
          .set(bearer(token))
          .expect(200)
      ).body as Page<OpenShiftDto>
    ).items;
  const find = (items: OpenShiftDto[], d: number, code: string, skillId: string | null) =>
    items.find((o) => o.date === day(d) && o.shiftCode === code && o.skillId === skillId);
  const take = async (d: number, code: string, skillId: string | null) =>
    (
      await t
        .http()
        .get(api(O.whatItWouldTake))
        .query({
          rosterPeriodId: period.id,
          date: day(d),
          shiftTypeId: shift[code].id,
          skillId: skillId ?? '',
        })
        .set(bearer(manager))
        .expect(200)
    ).body as WhatItWouldTakeDto;

  it('names the rest rule, with dates and hours, for the person whose Late ends 8 h 30 min before the Early', async () => {
    const open = find(await list(manager), 1, 'E', skill.RN);
    expect(open).toBeDefined();
    const answer = await take(1, 'E', skill.RN);
    const robin = answer.candidates.find((c) => c.staffMemberId === staffId.a)!;
    // Late 14:30-22:30 on Monday, Early 07:00 on Tuesday: 8 h 30 min of rest, under the 11 h of
    // EU Working Time Directive 2003/88/EC, Art. 3 that the contract asks for.
    expect(robin.breaks).toEqual([
      {
        rule: 'minRest',
        serious: true,
        words:
          'Rest between shifts: Robin Tallis: only 8 h 30 min of rest between Late (L) on Mon 7 Jan 2030 ' +
          'and Early (E) on Tue 8 Jan 2030 (the contract asks for at least 11 h)',
      },
    ]);
    expect(robin.alreadyWorks).toBeNull();
    // Nearest first: nobody with a serious break comes before someone without one.
    const serious = answer.candidates.map(
      (c) => c.breaks.filter((b) => b.serious).length + (c.alreadyWorks ? 1 : 0),
    );
    expect(serious).toEqual([...serious].sort((a, b) => a - b));
    expect(answer.candidates.findIndex((c) => c.staffMemberId === staffId.a)).toBeGreaterThan(0);
    // Only registered nurses are candidates (the demo ward's nurses hold RN, its assistants HCA).
    const unitStaff = await t.dataSource.manager.find(StaffMemberEntity, {
      where: { unitId: period.unitId, active: true },
      relations: { skills: true },
    });
    const nurses = new Set(unitStaff.filter((p) => p.skills.some((k) => k.id === skill.RN)).map((p) => p.id));
    expect(unitStaff.length).toBeGreaterThan(nurses.size); // assistants exist, and are left out
    expect(answer.candidates.length).toBeGreaterThan(1);
    expect(answer.candidates.every((c) => nurses.has(c.staffMemberId))).toBe(true);
    // The cautions: fatigue for the rest rule, the deferral to local law.
    expect(answer.cautions.join(' ')).toMatch(/Fatigue risk/);
    expect(answer.cautions.join(' ')).toMatch(/Local law, collective agreements/);
    expect(answer.howToChange).toMatch(/audit trail/);
  });

  it('names a seventh day in a row, and leaves out whoever is away that day', async () => {
    // Tomasz (a nurse) works Monday to Saturday; Sunday's Early (3 nurses wanted, none on it) would be
    // his 7th working day in a row, and his contract allows 6.
    expect(tomaszSkill).toBe(skill.RN);
    const sunday = await take(6, 'E', skill.RN);
    const tomasz = sunday.candidates.find((c) => c.staffMemberId === staffId.c)!;
    expect(tomasz.breaks).toEqual([
      {
        rule: 'maxConsecutiveWorkDays',
        serious: true,
        words: 'Days in a row: Tomasz Kellaway: 7 working days in a row from Mon 7 Jan 2030 (at most 6)',
      },
    ]);
    // The demo's Robin is unavailable for Wednesday earlies: not a candidate, counted as away.
    const wednesday = await take(2, 'E', skill.RN);
    expect(wednesday.candidates.some((c) => c.staffMemberId === staffId.a)).toBe(false);
    expect(wednesday.absent).toBeGreaterThanOrEqual(1);
    // Tomasz works Monday's Early already: moving him to the Late is shown as such.
    const mondayLate = await take(0, 'L', skill.RN);
    expect(mondayLate.candidates.find((c) => c.staffMemberId === staffId.c)?.alreadyWorks).toBe('Early (E)');
  });

  it('refuses staff (403) and bad questions (400), and a shift that is not open (409)', async () => {
    const q = { rosterPeriodId: period.id, date: day(1), shiftTypeId: shift['E'].id, skillId: skill.RN };
    await t.http().get(api(O.whatItWouldTake)).query(q).set(bearer(tokens.a)).expect(403);
    await t
      .http()
      .get(api(O.whatItWouldTake))
      .query({ ...q, date: '2030-02-30' })
      .set(bearer(manager))
      .expect(400);
    await t
      .http()
      .get(api(O.whatItWouldTake))
      .query({ ...q, skillId: 'RN' })
      .set(bearer(manager))
      .expect(400)
      .expect((r) => expect(JSON.stringify(r.body.message)).toMatch(/skillId must be a skill id/));
    await t
      .http()
      .get(api(O.whatItWouldTake))
      .query({ ...q, date: day(30) })
      .set(bearer(manager))
      .expect(409);
  });

  it('offers a shift outside the roster, marks it for manager and staff, fills it and withdraws it, with audit', async () => {
    const target = find(await list(manager), 3, 'N', skill.RN)!;
    expect(target).toBeDefined();
    const body = {
      rosterPeriodId: period.id,
      date: target.date,
      shiftTypeId: target.shiftTypeId,
      skillId: skill.RN,
      offeredTo: '  Staff bank office  ',
      note: 'Asked by phone at 09:10',
    };
    const post = (token: string, path: string, send: object) =>
      t.http().post(api(path)).set(bearer(token)).send(send);

    // Staff may not record offers; bad bodies are refused with the field named.
    await post(tokens.a, O.outsideOffers, body).expect(403);
    await post(manager, O.outsideOffers, { ...body, offeredTo: '   ' })
      .expect(400)
      .expect((r) => expect(JSON.stringify(r.body.message)).toMatch(/offeredTo must say to whom/));
    await post(manager, O.outsideOffers, { ...body, offeredTo: 'x'.repeat(201) }).expect(400);
    await post(manager, O.outsideOffers, { ...body, skillId: 'RN' }).expect(400);
    await post(manager, O.outsideOffers, { ...body, extra: 1 }).expect(400);
    await post(manager, O.outsideOffers, { ...body, date: day(30) }).expect(409);

    const offer = (await post(manager, O.outsideOffers, body).expect(201)).body as OutsideOfferDto;
    expect(offer).toMatchObject({ status: 'offered', offeredTo: 'Staff bank office', people: null });
    await post(manager, O.outsideOffers, body)
      .expect(409)
      .expect((r) => expect(r.body.message).toMatch(/already offered outside the roster/));

    // Marked in the manager's list and in the staff view, which still shows it (without to whom).
    expect(find(await list(manager), 3, 'N', skill.RN)?.outsideOffer).toMatchObject({
      id: offer.id,
      status: 'offered',
      offeredTo: 'Staff bank office',
    });
    const staffView = find(await list(tokens.a, { withBlocked: 'true' }), 3, 'N', skill.RN)!;
    expect(staffView.outsideOffer).toMatchObject({ status: 'offered', offeredTo: '', note: null });

    // Filled: staff may not; too many people or a bad number is a 400; then it is no longer open.
    await post(tokens.a, O.outsideOfferFilled(offer.id), {}).expect(403);
    await post(manager, O.outsideOfferFilled(offer.id), { people: target.short + 1 })
      .expect(400)
      .expect((r) => expect(JSON.stringify(r.body.message)).toMatch(/people: the shift wants/));
    await post(manager, O.outsideOfferFilled(offer.id), { people: 0 }).expect(400);
    await post(manager, O.outsideOfferFilled(offer.id), { people: 'two' }).expect(400);
    await post(manager, O.outsideOfferFilled('not-an-id'), {}).expect(400);
    const filled = (await post(manager, O.outsideOfferFilled(offer.id), {}).expect(200))
      .body as OutsideOfferDto;
    expect(filled).toMatchObject({ status: 'filled', people: target.short });
    expect(find(await list(manager), 3, 'N', skill.RN)).toBeUndefined();
    expect(find(await list(tokens.a, { withBlocked: 'true' }), 3, 'N', skill.RN)).toBeUndefined();
    await post(manager, O.outsideOfferFilled(offer.id), {}).expect(409);
    // Nobody can claim what outside staff fill.
    await post(tokens.a, S.openShiftClaims, {
      rosterPeriodId: period.id,
      date: target.date,
      shiftTypeId: target.shiftTypeId,
      skillId: skill.RN,
    }).expect(409);

    // Withdrawn: open again as before; a second withdrawal is a 409.
    await post(tokens.a, O.outsideOfferWithdraw(offer.id), {}).expect(403);
    await post(manager, O.outsideOfferWithdraw(offer.id), {}).expect(200);
    expect(find(await list(manager), 3, 'N', skill.RN)).toMatchObject({
      short: target.short,
      belowMinimum: target.belowMinimum,
      outsideOffer: null,
    });
    await post(manager, O.outsideOfferWithdraw(offer.id), {}).expect(409);

    // The audit trail: offered, filled, withdrawn, oldest first, each by the manager.
    const audit = (
      await t
        .http()
        .get(api(PUBLISHING_ROUTES.audit(period.id)))
        .query({ page: 1, pageSize: MAX_PAGE_SIZE })
        .set(bearer(manager))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    const mine = audit.items
      .filter((e) => e.kind === 'open-shift-outside')
      .sort((a, b) => a.at.localeCompare(b.at));
    expect(mine.map((e) => e.summary)).toEqual([
      expect.stringMatching(
        /^Offered Night \(N\) on Thu 10 Jan 2030 needing RN outside the roster to Staff bank office .*Note: Asked by phone at 09:10$/,
      ),
      expect.stringMatching(
        /^Filled Night \(N\) on Thu 10 Jan 2030 needing RN outside the roster: \d+ (person|people) from Staff bank office$/,
      ),
      expect.stringMatching(
        /^Withdrew the offer of Night \(N\) on Thu 10 Jan 2030 needing RN to Staff bank office \(it was filled/,
      ),
    ]);
    expect(mine.every((e) => e.actorName.length > 0)).toBe(true);
  });

  it('leaves an offered shift open to claims, and a part-filled one open for the rest', async () => {
    // Tuesday's Late for nurses: Robin may take it (see the open-shift reasons spec); 3 wanted, none on it.
    const target = find(await list(manager), 1, 'L', skill.RN)!;
    expect(target.short).toBeGreaterThanOrEqual(2);
    const key = {
      rosterPeriodId: period.id,
      date: target.date,
      shiftTypeId: target.shiftTypeId,
      skillId: skill.RN,
    };
    const offer = (
      await t
        .http()
        .post(api(O.outsideOffers))
        .set(bearer(manager))
        .send({ ...key, offeredTo: 'Agency North' })
        .expect(201)
    ).body as OutsideOfferDto;
    // Staff may still claim a shift offered outside the roster.
    await t.http().post(api(S.openShiftClaims)).set(bearer(tokens.a)).send(key).expect(201);
    // One person from outside: one fewer wanted, and one fewer below the minimum.
    await t
      .http()
      .post(api(O.outsideOfferFilled(offer.id)))
      .set(bearer(manager))
      .send({ people: 1 })
      .expect(200);
    expect(find(await list(manager), 1, 'L', skill.RN)).toMatchObject({
      short: target.short - 1,
      belowMinimum: Math.max(0, target.belowMinimum - 1),
      outsideOffer: { id: offer.id, status: 'filled', people: 1, offeredTo: 'Agency North' },
    });
    expect(find(await list(tokens.a, { withBlocked: 'true' }), 1, 'L', skill.RN)?.outsideOffer).toMatchObject(
      {
        status: 'filled',
        people: 1,
        offeredTo: '',
      },
    );
    await t
      .http()
      .post(api(O.outsideOfferWithdraw(offer.id)))
      .set(bearer(manager))
      .expect(200);
    expect(find(await list(manager), 1, 'L', skill.RN)?.short).toBe(target.short);
  });
});
