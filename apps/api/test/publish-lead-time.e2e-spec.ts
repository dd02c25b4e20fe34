import {
  PLANNING_ROUTES as P,
  PUBLISH_LEAD_DAYS_DEFAULT,
  PUBLISHING_ROUTES as PUB,
  SOLVING_ROUTES as R,
  type PublishCheckDto,
  type RosterPeriodDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { addDays, localDate } from '../src/common/dates';
import { OutboxDeliveryService } from '../src/mail/outbox/outbox-delivery.service';
import { caughtMails } from './support/mailbox';
import { smallUnit } from './publishing-fixture';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(120_000);

/**
 * Publish lead time per unit: the default is the 6 weeks many hospitals aim for before a roster starts
 * (Drake, J Adv Nurs 2018;74(8):1831-38, 42 days); the publish check cautions when a roster goes out
 * with less notice, and names predictability pay under fair-workweek laws (e.g. Seattle SMC 14.22,
 * 14 days) as a matter for local law.
 */
describe('publish lead time', () => {
  let t: TestApp;
  let admin: string;
  let unit: UnitDto;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    unit = (await smallUnit(t, admin, 'Heron Ward', '2031-03-03')).unit;
  });
  afterAll(() => t.close());

  const check = async (periodId: string) =>
    (
      await t
        .http()
        .get(api(PUB.publishCheck(periodId)))
        .set(bearer(admin))
        .expect(200)
    ).body as PublishCheckDto;
  const period = async (startDate: string) =>
    (
      await t
        .http()
        .post(api(P.rosterPeriods))
        .set(bearer(admin))
        .send({ unitId: unit.id, startDate, days: 7 })
        .expect(201)
    ).body as RosterPeriodDto;

  it('gives a new unit six weeks and takes a new value with bounds', async () => {
    expect(PUBLISH_LEAD_DAYS_DEFAULT).toBe(42); // 6 weeks x 7 days
    expect(unit.publishLeadDays).toBe(42);
    for (const bad of [-1, 366, 2.5, '14']) {
      const r = await t
        .http()
        .patch(api(`/units/${unit.id}`))
        .set(bearer(admin))
        .send({ publishLeadDays: bad });
      expect(r.status).toBe(400);
      expect(JSON.stringify(r.body.message)).toMatch(/publishLeadDays/);
    }
    const r = await t
      .http()
      .patch(api(`/units/${unit.id}`))
      .set(bearer(admin))
      .send({ publishLeadDays: 14 });
    expect(r.status).toBe(200);
    expect((r.body as UnitDto).publishLeadDays).toBe(14);
  });

  it('tells each person in the publish e-mail how many open shifts they could take', async () => {
    // Kestrel-style small unit: one Early and one Late needed every day, five people, no contracts.
    const small = await smallUnit(t, admin, 'Wren Ward', '2031-05-05');
    const [first, second] = small.staff;
    await t
      .http()
      .put(api(R.assignmentCell(small.period.id)))
      .set(bearer(admin))
      .send({ staffMemberId: first.id, date: small.period.startDate, shiftTypeId: small.shifts[0].id })
      .expect(200);
    const { version } = (
      await t
        .http()
        .get(api(P.rosterPeriod(small.period.id)))
        .set(bearer(admin))
    ).body as RosterPeriodDto;
    await t
      .http()
      .post(api(PUB.publish(small.period.id)))
      .set(bearer(admin))
      .send({ version, acknowledgeBelowMinimum: true, reason: 'A test week' })
      .expect(200);
    await t.app.get(OutboxDeliveryService).deliverDue();
    const mailOf = async (email: string) =>
      (await caughtMails(t)).find(
        (m) => m.to.includes(email) && /^Your roster for Wren Ward/.test(m.subject),
      )!;
    // 13 shifts are open (7 days x 2, less the one Early). The second person works none of them and
    // may take one of each day's two (no rule: no contract); counted per open shift.
    expect((await mailOf(second.email!)).text).toContain(
      '13 shifts of this roster are still open and you could take them',
    );
    // The first person works the first day, so its Late is not theirs to take: 12.
    expect((await mailOf(first.email!)).text).toContain('12 shifts of this roster are still open');
  });

  it('cautions when a roster starts sooner than the lead time, and not when it starts later', async () => {
    const today = localDate(new Date(), unit.timeZone);
    const soon = await period(addDays(today, 7));
    const soonCheck = await check(soon.id);
    expect(soonCheck.lateNotice).toMatch(
      /^This roster starts in 7 days: less notice than the 14 days this unit aims to give\..*local law and agreements decide\.$/,
    );
    // The late notice is its own line of the check, not one of the settings cautions.
    expect(soonCheck.cautions.some((c) => /less notice/.test(c))).toBe(false);
    const later = await period(addDays(today, 14));
    expect((await check(later.id)).lateNotice).toBeNull();
  });
});
