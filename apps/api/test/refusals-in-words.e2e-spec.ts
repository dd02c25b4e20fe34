import { PLANNING_ROUTES as P, REQUESTS_ROUTES as Q, type UnitDto } from '@rotaplex/contracts';
import { addDays, localDate } from '../src/common/dates';
import { createPeriod, findUnit } from './support/planning';
import { expressRoutes } from './support/routes';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/** Refusals a person can act on: a malformed id named as such, and requests dated in the past. */
describe('refusals in words', () => {
  let t: TestApp;
  let admin: string;
  let manager: string;
  /** Robin Tallis, ward staff nurse (demo data). */
  let robin: string;
  let ward: UnitDto;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    robin = (await t.login('staff@example.com')).token;
    ward = await findUnit(t, admin);
  });
  afterAll(() => t.close());

  const messageOf = (body: unknown) => JSON.stringify((body as { message?: unknown }).message);

  it('names the parameter when an id in the path is not a UUID, on every route that takes one', async () => {
    const one = await t
      .http()
      .get(api(P.skill('not-a-uuid')))
      .set(bearer(admin));
    expect(one.status).toBe(400);
    expect(one.body.message).toEqual(['id must be a UUID']);
    const unit = await t
      .http()
      .get(api(P.shiftTypes('12345')))
      .set(bearer(admin));
    expect(unit.status).toBe(400);
    expect(unit.body.message).toEqual(['unitId must be a UUID']);

    // Every route of the live router with a path parameter, every parameter malformed.
    const withParams = expressRoutes(t.app).filter((r) => /:[A-Za-z]+/.test(r.path));
    const named: string[] = [];
    for (const route of withParams) {
      const params = [...route.path.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1]);
      const path = route.path.replace(/:([A-Za-z]+)/g, 'x-1');
      const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
      const http = t.http();
      const body = route.method === 'GET' || route.method === 'DELETE' ? undefined : {};
      const res = await http[method](path).set(bearer(admin)).send(body);
      expect(`${route.method} ${route.path}: ${messageOf(res.body)}`).not.toMatch(/Validation failed/);
      if (res.status === 400 && params.some((p) => messageOf(res.body).includes(`${p} must be a UUID`))) {
        named.push(`${route.method} ${route.path}`);
      }
    }
    // Not vacuous: most routes with an id answered with the parameter's name (the others check the
    // caller's role or the body first, or take no UUID, like the calendar feed's file name).
    expect(named.length).toBeGreaterThanOrEqual(Math.round(withParams.length * 0.7));
    expect(named).toContain('GET /api/staff/:id');
  });

  it('refuses leave that starts before today in the unit time zone, and takes leave from today', async () => {
    const today = localDate(new Date(), ward.timeZone);
    const past = await t
      .http()
      .post(api(Q.leave))
      .set(bearer(robin))
      .send({ startDate: '2020-03-10', endDate: '2020-03-12', type: 'annual' });
    expect(past.status).toBe(400);
    expect(messageOf(past.body)).toMatch(
      /startDate is in the past: leave can start today \(\w{3} \d{1,2} \w{3} \d{4}\) or later/,
    );
    const yesterday = await t
      .http()
      .post(api(Q.leave))
      .set(bearer(robin))
      .send({ startDate: addDays(today, -1), endDate: addDays(today, 1), type: 'sick' });
    expect(yesterday.status).toBe(400);
    expect(messageOf(yesterday.body)).toMatch(/startDate is in the past/);
    // Today is not in the past.
    const fromToday = await t
      .http()
      .post(api(Q.leave))
      .set(bearer(robin))
      .send({ startDate: addDays(today, 400), endDate: addDays(today, 401), type: 'other' });
    expect(fromToday.status).toBe(201);
  });

  it('refuses a date request for a day before today, with the date in words', async () => {
    // A draft period of the ward in January 2020, before any demo period.
    const old = await createPeriod(t, manager, ward.id, '2020-01-06', 7);
    const res = await t
      .http()
      .post(api(Q.dateRequests))
      .set(bearer(robin))
      .send({ rosterPeriodId: old.id, date: '2020-01-07', kind: 'dayOff' });
    expect(res.status).toBe(400);
    expect(messageOf(res.body)).toContain('date is in the past: requests are for today (');
    expect(messageOf(res.body)).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });
});
