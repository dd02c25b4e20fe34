import { type LeaveDto, MAX_PAGE_SIZE, type MyRequestsDto, REQUESTS_ROUTES as Q } from '@rotaplex/contracts';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('GET /me/requests pages date requests and leave like the other lists', () => {
  let t: TestApp;
  let robin: string;

  const mine = (query: Record<string, unknown> = {}) =>
    t.http().get(api(Q.mine)).set(bearer(robin)).query(query);

  beforeAll(async () => {
    t = await startTestApp();
    robin = (await t.login('staff@example.com')).token;
    // Five separate weeks of leave, far ahead so "today" never makes them past.
    for (let i = 0; i < 5; i++) {
      const start = `2031-0${i + 3}-10`;
      const end = `2031-0${i + 3}-12`;
      await t
        .http()
        .post(api(Q.leave))
        .set(bearer(robin))
        .send({ startDate: start, endDate: end, type: 'annual' })
        .expect(201);
    }
  });
  afterAll(() => t.close());

  it('reads every row exactly once across pages, oldest first, with the totals', async () => {
    const whole = (await mine().expect(200)).body as MyRequestsDto;
    // Default: one page of MAX_PAGE_SIZE, so a single read holds everything the page shows.
    expect([whole.page, whole.pageSize]).toEqual([1, MAX_PAGE_SIZE]);
    expect(whole.leaveTotal).toBeGreaterThanOrEqual(5);
    expect(whole.leave).toHaveLength(whole.leaveTotal);
    expect(whole.dateRequests).toHaveLength(whole.dateRequestsTotal);

    const leave: LeaveDto[] = [];
    const dateIds: string[] = [];
    for (let page = 1; page <= 20; page++) {
      const body = (await mine({ page, pageSize: 2 }).expect(200)).body as MyRequestsDto;
      expect(body).toMatchObject({
        page,
        pageSize: 2,
        leaveTotal: whole.leaveTotal,
        dateRequestsTotal: whole.dateRequestsTotal,
      });
      expect(body.leave.length).toBeLessThanOrEqual(2);
      leave.push(...body.leave);
      dateIds.push(...body.dateRequests.map((d) => d.id));
      if (!body.leave.length && !body.dateRequests.length) break;
    }
    expect(leave.map((l) => l.id)).toEqual(whole.leave.map((l) => l.id));
    expect(new Set(leave.map((l) => l.id)).size).toBe(leave.length); // no row on two pages
    expect(leave.map((l) => l.startDate)).toEqual(leave.map((l) => l.startDate).sort());
    expect(dateIds).toEqual(whole.dateRequests.map((d) => d.id));
    // The staff memberships and periods come whole on every page.
    const third = (await mine({ page: 3, pageSize: 2 }).expect(200)).body as MyRequestsDto;
    expect(third.staffMembers).toEqual(whole.staffMembers);
    expect(third.periods).toEqual(whole.periods);
  });

  it('refuses pages out of bounds with 400 naming the field', async () => {
    for (const [query, field] of [
      [{ page: 0 }, 'page'],
      [{ page: '99999999999999999999' }, 'page'],
      [{ pageSize: 0 }, 'pageSize'],
      [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
      [{ pageSize: 'ten' }, 'pageSize'],
    ] as const) {
      const res = await mine(query);
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toContain(`${field} must be a whole number`);
    }
  });
});
