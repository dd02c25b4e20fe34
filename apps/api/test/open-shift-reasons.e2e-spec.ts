import {
  MAX_PAGE_SIZE,
  type OpenShiftDto,
  type Page,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  SWAP_ROUTES as S,
} from '@rotaplex/contracts';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { addDays } from '../src/common/dates';
import { OutboxDeliveryService } from '../src/mail/outbox/outbox-delivery.service';
import { caughtMails } from './support/mailbox';
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
 * Open shifts as staff see them with `withBlocked=true`: the same list the manager sees, each with
 * whether this person may take it and why not in words; and the manager's e-mail to the staff who may.
 * The rest rule is the EU Working Time Directive's 11 hours of daily rest (2003/88/EC, Art. 3); the
 * ward's shifts are the demo's (Late 14:30-22:30, Early 07:00-15:00, Night 22:00-07:30).
 */
describe('open shifts: reasons and e-mails', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  let tokens: Record<WardPerson, string>;
  let period: RosterPeriodDto;
  let shift: Record<string, ShiftTypeDto>;
  let skill: Record<string, string>;
  let staffId: Record<string, string>;
  const START = '2030-01-07'; // a Monday
  const day = (n: number) => addDays(START, n);

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    tokens = await loginAll(t, WARD_PEOPLE);
    const ward = await findUnit(t, admin);
    period = await createPeriod(t, manager, ward.id, START);
    shift = await shiftTypesByCode(t, manager, ward.id);
    const skills = (await t.http().get(api(P.skills)).set(bearer(manager))).body as SkillDto[];
    skill = Object.fromEntries(skills.map((s) => [s.code, s.id]));
    staffId = idsByEmail(await restOnlyContract(t, ward.id), WARD_PEOPLE);
    await t.dataSource.manager.insert(AssignmentEntity, {
      rosterPeriodId: period.id,
      staffMemberId: staffId.a,
      date: day(0),
      shiftTypeId: shift['L'].id,
      pinned: false,
    });
    await markPublished(t, period.id);
  });
  afterAll(() => t.close());

  const list = async (token: string, query: Record<string, unknown> = {}) => {
    const body = (
      await t
        .http()
        .get(api(S.openShifts))
        .query({ rosterPeriodId: period.id, page: 1, pageSize: MAX_PAGE_SIZE, ...query })
        .set(bearer(token))
        .expect(200)
    ).body as Page<OpenShiftDto>;
    expect(body.total).toBeLessThanOrEqual(MAX_PAGE_SIZE); // one page holds the whole list
    return body.items;
  };
  const find = (items: OpenShiftDto[], d: number, code: string, skillCode: string | null) =>
    items.find((o) => o.date === day(d) && o.shiftCode === code && o.skillCode === skillCode);

  it('shows staff every open shift the manager sees, with why they may not take the others', async () => {
    const all = await list(manager);
    const mine = await list(tokens.a, { withBlocked: 'true' });
    expect(mine.length).toBe(all.length);
    // The flag agrees with the plain list of what Robin may take.
    const may = await list(tokens.a);
    expect(mine.filter((o) => o.mayTake).length).toBe(may.length);
    // Those Robin may take come first.
    const firstBlocked = mine.findIndex((o) => !o.mayTake);
    expect(mine.slice(firstBlocked).every((o) => !o.mayTake)).toBe(true);

    // Skill: Robin is a registered nurse, not a health care assistant.
    expect(find(mine, 1, 'E', 'HCA')?.whyNot).toEqual(['It needs HCA, which is not on your staff record.']);
    // Already working that day (Monday's Late).
    expect(find(mine, 0, 'E', 'RN')?.whyNot).toEqual(['You already work the Late shift that day.']);
    // Rest: Tuesday's Early starts 8 h 30 min after Monday's Late ends (22:30 to 07:00), under 11 h.
    const rest = find(mine, 1, 'E', 'RN')!;
    expect(rest.mayTake).toBe(false);
    expect(rest.whyNot?.[0]).toMatch(/^Rest between shifts: only 8 h 30 min of rest/);
    expect(rest.whyNot?.join(' ')).not.toMatch(/Robin Tallis|\d{4}-\d\d-\d\d|\(s\)/);
    expect(find(mine, 1, 'L', 'RN')).toMatchObject({ mayTake: true, whyNot: [] });
    // Safety shortfalls are marked: below minimum as well as below target.
    expect(all.every((o) => o.belowMinimum >= 0 && o.belowMinimum <= o.short)).toBe(true);
  });

  it('without withBlocked, and for managers, the answer carries no reasons', async () => {
    expect((await list(tokens.a)).every((o) => o.mayTake === undefined && o.whyNot === undefined)).toBe(true);
    expect((await list(manager, { withBlocked: 'true' })).every((o) => o.mayTake === undefined)).toBe(true);
    await t
      .http()
      .get(api(S.openShifts))
      .query({ withBlocked: 'perhaps' })
      .set(bearer(tokens.a))
      .expect(400)
      .expect((r) => expect(JSON.stringify(r.body.message)).toMatch(/withBlocked must be true or false/));
  });

  it('e-mails the staff who may take an open shift, and only them', async () => {
    const target = find(await list(manager), 1, 'L', 'RN')!;
    const body = {
      rosterPeriodId: period.id,
      date: target.date,
      shiftTypeId: target.shiftTypeId,
      skillId: skill.RN,
    };
    await t.http().post(api(S.openShiftsNotify)).set(bearer(tokens.a)).send(body).expect(403);
    await t
      .http()
      .post(api(S.openShiftsNotify))
      .set(bearer(manager))
      .send({ ...body, date: '2030-02-30' })
      .expect(400);
    const done = await t.http().post(api(S.openShiftsNotify)).set(bearer(manager)).send(body).expect(201);
    const notified = done.body.notified as number;
    expect(notified).toBeGreaterThan(0);
    await t.app.get(OutboxDeliveryService).deliverDue();
    const mails = (await caughtMails(t)).filter((m) =>
      /^Open shift you could take: Late 14:30-22:30 on Tue 8 Jan 2030$/.test(m.subject),
    );
    expect(mails.length).toBe(notified);
    // Robin may take it (see above) and is among them; a health care assistant without RN is not.
    expect(mails.some((m) => m.to.includes(WARD_PEOPLE.a))).toBe(true);
    const hca = (await list(tokens.b, { withBlocked: 'true' })).find(
      (o) => o.date === target.date && o.shiftCode === 'L' && o.skillCode === 'RN',
    );
    if (hca && !hca.mayTake) expect(mails.some((m) => m.to.includes(WARD_PEOPLE.b))).toBe(false);
    // A shift that is not open is refused with 409.
    await t
      .http()
      .post(api(S.openShiftsNotify))
      .set(bearer(manager))
      .send({ ...body, date: day(20) })
      .expect(409);
  });
});
