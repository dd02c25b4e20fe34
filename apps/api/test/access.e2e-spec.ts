import { randomUUID } from 'node:crypto';
import { bearer, startTestApp, type TestApp } from './support/test-app';
import { controllerHandlers, expressRoutes, type RouteInfo } from './support/routes';

/**
 * The routes that need no sign-in, on purpose. Every other route the application answers must
 * refuse an anonymous caller with 401; a new route is covered automatically because the list of
 * routes is read from the running application's router.
 */
const PUBLIC_ROUTES = new Set([
  'GET /api/health',
  'POST /api/auth/login',
  'POST /api/auth/refresh',
  'POST /api/auth/logout',
  'POST /api/auth/invitations/accept',
  'POST /api/auth/password-reset/request',
  'POST /api/auth/password-reset/confirm',
  // A personal iCalendar feed: the secret token in the URL is the key (calendar programs cannot sign in).
  'GET /api/calendar-feeds/:file',
  // E-mailed swap decision links: the single-use token is the key; GET only shows, POST decides.
  'GET /api/swap-links',
  'POST /api/swap-links',
]);
/** Routes added by the OpenAPI module (documents, not data). */
const DOC_ROUTE = /^\/api\/docs/;

const key = (r: RouteInfo) => `${r.method} ${r.path}`;
const concrete = (path: string, id: string) => path.replace(/:[A-Za-z]+/g, id);
type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

/** An HTTP request with the route's own method. */
const send = (t: TestApp, method: string, path: string) => t.http()[method.toLowerCase() as Method](path);

describe('every route is closed by default', () => {
  let t: TestApp;
  let routes: RouteInfo[];
  beforeAll(async () => {
    t = await startTestApp();
    routes = expressRoutes(t.app).filter((r) => !DOC_ROUTE.test(r.path));
  });
  afterAll(() => t.close());

  it('finds the application routes', () => {
    // sanity: the enumeration works (a broken enumeration would make the checks below vacuous)
    expect(routes.length).toBeGreaterThanOrEqual(25);
    expect(routes.map(key)).toEqual(
      expect.arrayContaining(['GET /api/users', 'DELETE /api/units/:id', 'GET /api/mailbox/:id']),
    );
    // Publishing, repair, audit and the outbox (closed like every other route).
    expect(routes.map(key)).toEqual(
      expect.arrayContaining([
        'GET /api/outbox',
        'POST /api/outbox/:id/retry',
        'POST /api/roster-periods/:id/publish',
        'POST /api/roster-periods/:id/repair',
        'GET /api/roster-periods/:id/audit',
        'GET /api/roster-periods/:id/export',
      ]),
    );
  });

  it('refuses an anonymous caller with 401 on every non-public route', async () => {
    const failures: string[] = [];
    for (const r of routes.filter((x) => !PUBLIC_ROUTES.has(key(x)))) {
      const res = await send(t, r.method, concrete(r.path, randomUUID())).send({});
      if (res.status !== 401) failures.push(`${key(r)} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  it('refuses a bad bearer token with 401 on every non-public route', async () => {
    const failures: string[] = [];
    for (const r of routes.filter((x) => !PUBLIC_ROUTES.has(key(x)))) {
      const res = await send(t, r.method, concrete(r.path, randomUUID())).set(bearer('x.y.z'));
      if (res.status !== 401) failures.push(`${key(r)} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  it('answers a malformed id with 400 on every :id route (signed in as admin, or staff for staff-only routes)', async () => {
    const { token } = await t.login('admin@example.com');
    const { token: staffToken } = await t.login('staff@example.com');
    const failures: string[] = [];
    for (const r of routes.filter((x) => x.path.includes(':id'))) {
      let res = await send(t, r.method, concrete(r.path, 'not-a-uuid')).set(bearer(token)).send({});
      // Routes for a person's own requests are not the admin's: try them as a staff member.
      if (res.status === 403)
        res = await send(t, r.method, concrete(r.path, 'not-a-uuid')).set(bearer(staffToken)).send({});
      if (res.status !== 400) failures.push(`${key(r)} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  it('marks exactly the intended routes public, and gives every other handler an access rule', () => {
    const handlers = controllerHandlers(t.app);
    expect(handlers.length).toBe(routes.length);
    expect(handlers.filter((h) => h.isPublic)).toHaveLength(PUBLIC_ROUTES.size);
    const withoutRule = handlers
      .filter((h) => !h.isPublic && !h.access)
      .map((h) => `${h.controller}.${h.handler}`);
    expect(withoutRule).toEqual([]);
  });

  it('lists every route in the OpenAPI document', async () => {
    const doc = (await t.http().get('/api/docs-json').expect(200)).body as {
      paths: Record<string, Record<string, unknown>>;
    };
    const documented = new Set(
      Object.entries(doc.paths).flatMap(([p, ops]) =>
        Object.keys(ops).map((m) => `${m.toUpperCase()} ${p.replace(/\{([^}]+)\}/g, ':$1')}`),
      ),
    );
    expect(routes.map(key).filter((k) => !documented.has(k))).toEqual([]);
  });
});
