import { REFRESH_COOKIE, type UnitDto, type UserDto } from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request, { type Test } from 'supertest';
import { createApp } from '../src/app';
import { MAX_JSON_BODY_BYTES, MAX_JSON_DEPTH } from '../src/common/http/body-limits';
import { loadConfig, resolveJwtSecret } from '../src/config/app-config';
import { DEMO_PASSWORD, DEMO_USERS } from '../src/demo/demo-data';
import { api, bearer, refreshCookieOf, startTestApp, type TestApp } from './support/test-app';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';
interface Operation {
  method: string;
  /** Express-style path with a fresh UUID for every parameter. */
  path: string;
  key: string;
  /** Documented JSON body properties and whether each may be null ({} when the body is not JSON). */
  props: Record<string, boolean>;
  ownBodyType: boolean;
  paged: boolean;
  /** Names of the documented query parameters. */
  query: string[];
  /** Body fields and query parameters documented as dates (format date or a YYYY-MM-DD example). */
  dates: { name: string; in: 'body' | 'query' }[];
}
interface SchemaObject {
  $ref?: string;
  properties?: Record<string, SchemaObject & { nullable?: boolean; format?: string; example?: unknown }>;
  allOf?: SchemaObject[];
}
interface OpenApiDoc {
  paths: Record<
    string,
    Record<
      string,
      {
        parameters?: {
          name: string;
          in: string;
          example?: unknown;
          schema?: { example?: unknown; format?: string };
        }[];
        requestBody?: { content: Record<string, { schema?: SchemaObject }> };
      }
    >
  >;
  components: { schemas: Record<string, SchemaObject> };
}

const BODY_METHODS = ['POST', 'PUT', 'PATCH', 'DELETE'];
const HUGE_PAGE = '99999999999999999999';
/**
 * Requests without a body, as clients send them: none at all, Content-Length: 0 with a type (a
 * fetch() or sendBeacon() of an empty string), and chunked with no bytes (a stream that ends at once).
 */
const BODILESS: Record<string, Record<string, string>> = {
  'with no body or type': {},
  'with Content-Length: 0 and text/plain': { 'Content-Type': 'text/plain;charset=UTF-8' },
  'with Content-Length: 0 and application/json': { 'Content-Type': 'application/json' },
  'chunked with no bytes and text/plain': { 'Content-Type': 'text/plain', 'Transfer-Encoding': 'chunked' },
  'chunked with no bytes and no type': { 'Transfer-Encoding': 'chunked' },
};
/** JSON nested 2,000 deep: this overflowed class-transformer's stack (a 500 on every JSON route). */
const DEEP_JSON = `{"a":${'['.repeat(2000)}${']'.repeat(2000)}}`;

/** Every operation of the running app's OpenAPI document, with what its request body looks like. */
function operations(doc: OpenApiDoc): Operation[] {
  const resolve = (s: SchemaObject | undefined): SchemaObject | undefined =>
    s?.$ref ? doc.components.schemas[s.$ref.split('/').pop()!] : s;
  const propsOf = (s: SchemaObject | undefined): Record<string, boolean> => {
    const schema = resolve(s);
    const own = Object.fromEntries(
      Object.entries(schema?.properties ?? {}).map(([k, v]) => [k, v.nullable === true]),
    );
    return Object.assign({}, ...(schema?.allOf ?? []).map(propsOf), own) as Record<string, boolean>;
  };
  const isDate = (d: { format?: string; example?: unknown } | undefined) =>
    d?.format === 'date' || (typeof d?.example === 'string' && /^\d{4}-\d{2}-\d{2}$/.test(d.example));
  const bodyDates = (s: SchemaObject | undefined): string[] => {
    const schema = resolve(s);
    return [
      ...(schema?.allOf ?? []).flatMap(bodyDates),
      ...Object.entries(schema?.properties ?? {})
        .filter(([, v]) => isDate(v))
        .map(([k]) => k),
    ];
  };
  const out: Operation[] = [];
  for (const [path, ops] of Object.entries(doc.paths)) {
    if (path.startsWith('/api/docs')) continue;
    for (const [method, op] of Object.entries(ops)) {
      const content = op.requestBody?.content ?? {};
      const express = path.replace(/\{([^}]+)\}/g, ':$1');
      out.push({
        method: method.toUpperCase(),
        path: path.replace(/\{[^}]+\}/g, () => randomUUID()),
        key: `${method.toUpperCase()} ${express}`,
        props: propsOf(content['application/json']?.schema),
        ownBodyType: Object.keys(content).some((t) => t !== 'application/json'),
        paged: (op.parameters ?? []).some((p) => p.in === 'query' && p.name === 'page'),
        query: (op.parameters ?? []).filter((p) => p.in === 'query').map((p) => p.name),
        dates: [
          ...bodyDates(content['application/json']?.schema).map((name) => ({ name, in: 'body' as const })),
          ...(op.parameters ?? [])
            .filter((p) => p.in === 'query' && (isDate(p) || isDate(p.schema)))
            .map((p) => ({ name: p.name, in: 'query' as const })),
        ],
      });
    }
  }
  return out;
}

describe('bad input is a 4xx with a clear message, and changes nothing', () => {
  let t: TestApp;
  let admin: string;
  let staff: string;
  let ops: Operation[];

  const send = (method: string, path: string) => t.http()[method.toLowerCase() as Method](path);
  /** As admin; routes for one's own requests are not the admin's, so a 403 is retried as staff. */
  const probe = async (op: Operation, build: (req: Test) => Test) => {
    let res = await build(send(op.method, op.path).set(bearer(admin)));
    if (res.status === 403) res = await build(send(op.method, op.path).set(bearer(staff)));
    return res;
  };

  beforeAll(async () => {
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' });
    admin = (await t.login('admin@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    ops = operations((await t.http().get('/api/docs-json').expect(200)).body as OpenApiDoc);
  });
  afterAll(() => t.close());

  it('reads the routes and their bodies from the OpenAPI document', () => {
    // sanity: a broken enumeration would make every probe below vacuous
    expect(ops.length).toBeGreaterThanOrEqual(60);
    const byKey = new Map(ops.map((o) => [o.key, o]));
    expect(byKey.get('PATCH /api/users/:id')?.props).toMatchObject({ unitIds: false, role: false });
    expect(byKey.get('POST /api/auth/login')?.props).toEqual({ email: false, password: false });
    expect(byKey.get('POST /api/staff/import')?.ownBodyType).toBe(true);
    expect(ops.filter((o) => o.paged).map((o) => o.key)).toEqual(
      expect.arrayContaining(['GET /api/users', 'GET /api/staff', 'GET /api/mailbox', 'GET /api/outbox']),
    );
  });

  describe('every route of the OpenAPI document', () => {
    it('answers JSON nested 2,000 deep with 400, signed in or not', async () => {
      const failures: string[] = [];
      for (const op of ops.filter((o) => BODY_METHODS.includes(o.method) && !o.ownBodyType)) {
        for (const res of [
          await probe(op, (r) => r.set('Content-Type', 'application/json').send(DEEP_JSON)),
          await send(op.method, op.path).set('Content-Type', 'application/json').send(DEEP_JSON),
        ]) {
          if (res.status !== 400 || !JSON.stringify(res.body).includes('nest'))
            failures.push(`${op.key} → ${res.status} ${JSON.stringify(res.body)}`);
        }
      }
      expect(failures).toEqual([]);
    });

    it(`accepts nesting up to ${MAX_JSON_DEPTH} levels (the check counts brackets, not bracket characters in strings)`, async () => {
      const login = (body: string) =>
        t.http().post(api('/auth/login')).set('Content-Type', 'application/json').send(body);
      const ok = await login(JSON.stringify({ email: 'admin@example.com', password: DEMO_PASSWORD }));
      expect(ok.status).toBe(200);
      const brackets = await login(
        JSON.stringify({ email: 'admin@example.com', password: `${'['.repeat(100)}{{{` }),
      );
      expect(brackets.status).toBe(401); // a wrong password, not a too deep body
      const deepest = `${'['.repeat(MAX_JSON_DEPTH - 1)}${']'.repeat(MAX_JSON_DEPTH - 1)}`;
      const atLimit = await login(`{"email":"admin@example.com","password":${deepest}}`);
      expect(atLimit.status).toBe(400);
      expect(atLimit.body.message).toContain('password must be a string');
      const over = await login(`{"email":"admin@example.com","password":[${deepest}]}`);
      expect(over.status).toBe(400);
      expect(over.body.message).toEqual([
        `body must not nest arrays and objects more than ${MAX_JSON_DEPTH} deep`,
      ]);
    });

    it('answers null on a field that is not nullable with 400 naming the field', async () => {
      const failures: string[] = [];
      let probed = 0;
      for (const op of ops.filter((o) => BODY_METHODS.includes(o.method))) {
        for (const [field, nullable] of Object.entries(op.props)) {
          const res = await probe(op, (r) => r.send({ [field]: null }));
          if (res.status >= 500) failures.push(`${op.key} ${field}: null → ${res.status}`);
          if (nullable || res.status === 401 || res.status === 403) continue;
          probed++;
          if (res.status !== 400 || !(res.body.message as string[]).includes(`${field} must not be null`))
            failures.push(`${op.key} ${field}: null → ${res.status} ${JSON.stringify(res.body.message)}`);
        }
      }
      expect(failures).toEqual([]);
      expect(probed).toBeGreaterThan(100);
    });

    it('answers a text/plain or XML body on a JSON route with 415', async () => {
      const failures: string[] = [];
      for (const op of ops.filter((o) => BODY_METHODS.includes(o.method) && !o.ownBodyType)) {
        const text = await probe(op, (r) => r.set('Content-Type', 'text/plain').send('name=x'));
        const xml = await probe(op, (r) =>
          r.set('Content-Type', 'application/xml').send('<unit><name>x</name></unit>'),
        );
        for (const res of [text, xml])
          if (res.status !== 415) failures.push(`${op.key} → ${res.status} ${JSON.stringify(res.body)}`);
      }
      expect(failures).toEqual([]);
    });

    it('never answers a request without a body with 415, whatever Content-Type it names', async () => {
      const failures: string[] = [];
      for (const op of ops.filter((o) => BODY_METHODS.includes(o.method))) {
        for (const [name, headers] of Object.entries(BODILESS)) {
          const res = await probe(op, (r) => r.set(headers));
          if (res.status === 415 || res.status >= 500)
            failures.push(`${op.key} ${name} → ${res.status} ${JSON.stringify(res.body)}`);
        }
      }
      expect(failures).toEqual([]);
    });

    it('answers wrong-typed body fields and query parameters with a 4xx, never a 5xx', async () => {
      const WRONG: unknown[] = [{}, 1e308, 'x'.repeat(5000), true, [{}]];
      const failures: string[] = [];
      let probed = 0;
      for (const op of ops) {
        for (const field of Object.keys(op.props)) {
          for (const value of WRONG) {
            const res = await probe(op, (r) => r.send({ [field]: value }));
            probed++;
            if (res.status >= 500)
              failures.push(`${op.key} ${field}: ${JSON.stringify(value)} → ${res.status}`);
          }
        }
        for (const name of op.query) {
          for (const value of [HUGE_PAGE, '-1', 'x', '1e308', ['a', 'b']]) {
            const res = await probe(op, (r) => r.query({ [name]: value }));
            probed++;
            if (res.status >= 500)
              failures.push(`${op.key} ?${name}=${JSON.stringify(value)} → ${res.status}`);
          }
        }
      }
      expect(failures).toEqual([]);
      expect(probed).toBeGreaterThan(500);
    }, 120_000);

    it('answers an impossible date (2026-02-30) with 400 naming the field, in every body and query', async () => {
      const failures: string[] = [];
      const probed: string[] = [];
      for (const op of ops) {
        for (const d of op.dates) {
          const res = await probe(op, (r) =>
            d.in === 'body' ? r.send({ [d.name]: '2026-02-30' }) : r.query({ [d.name]: '2026-02-30' }),
          );
          probed.push(`${op.key} ${d.name}`);
          if (
            res.status !== 400 ||
            !JSON.stringify(res.body.message).includes(`${d.name} must be a real calendar date`)
          )
            failures.push(`${op.key} ${d.name} → ${res.status} ${JSON.stringify(res.body.message)}`);
        }
      }
      expect(failures).toEqual([]);
      expect(probed).toEqual(
        expect.arrayContaining([
          'POST /api/open-shifts/claims date',
          'PUT /api/roster-periods/:id/assignments/cell date',
          'POST /api/leave endDate',
          'GET /api/me/shifts from',
        ]),
      );
    });

    it('answers a page number beyond the last possible one with 400 on paged lists, and no 5xx anywhere', async () => {
      const failures: string[] = [];
      for (const op of ops.filter((o) => o.method === 'GET')) {
        const res = await probe(op, (r) => r.query({ page: HUGE_PAGE }));
        if (res.status >= 500) failures.push(`${op.key} → ${res.status}`);
        if (op.paged && (res.status !== 400 || !JSON.stringify(res.body.message).includes('page must be')))
          failures.push(`${op.key} → ${res.status} ${JSON.stringify(res.body)}`);
      }
      expect(failures).toEqual([]);
    });
  });

  describe('the cases found by hand', () => {
    let ward: UnitDto;
    beforeAll(async () => {
      const units = (await t.http().get(api('/units')).set(bearer(admin)).expect(200)).body as UnitDto[];
      ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    });

    it('POST /api/auth/refresh without a body refreshes the session, whatever Content-Type comes with it', async () => {
      // The web app restores a session on every page load with this body-less call.
      let refreshCookie = (await t.login('manager@example.com')).refreshCookie;
      for (const [name, headers] of Object.entries(BODILESS)) {
        const res = await t
          .http()
          .post(api('/auth/refresh'))
          .set('Cookie', `${REFRESH_COOKIE}=${encodeURIComponent(refreshCookie)}`)
          .set(headers);
        expect(`${name} → ${res.status}`).toBe(`${name} → 200`);
        expect(typeof res.body.accessToken).toBe('string');
        refreshCookie = refreshCookieOf(res);
      }
    });

    it('PATCH /api/users/:id with unitIds: null is a 400 and keeps the user in their units', async () => {
      const [{ id }] = (await t.dataSource.query(`SELECT id FROM users WHERE email = ?`, [
        'manager@example.com',
      ])) as { id: string }[];
      const before = (
        await t
          .http()
          .get(api(`/users/${id}`))
          .set(bearer(admin))
          .expect(200)
      ).body as UserDto;
      expect(before.unitIds.length).toBeGreaterThan(0);
      const res = await t
        .http()
        .patch(api(`/users/${id}`))
        .set(bearer(admin))
        .send({ unitIds: null });
      expect(res.status).toBe(400);
      expect(res.body.message).toEqual(['unitIds must not be null']);
      const after = (
        await t
          .http()
          .get(api(`/users/${id}`))
          .set(bearer(admin))
          .expect(200)
      ).body as UserDto;
      expect(after.unitIds).toEqual(before.unitIds);
    });

    it('PATCH /api/units/:id with name: null is a 400; a text/plain or XML body is a 415 and changes nothing', async () => {
      const nul = await t
        .http()
        .patch(api(`/units/${ward.id}`))
        .set(bearer(admin))
        .send({ name: null });
      expect(nul.status).toBe(400);
      expect(nul.body.message).toEqual(['name must not be null']);
      const xml = await t
        .http()
        .patch(api(`/units/${ward.id}`))
        .set(bearer(admin))
        .set('Content-Type', 'application/xml')
        .send('<unit><name>Renamed</name></unit>');
      expect(xml.status).toBe(415);
      expect(xml.body.message).toEqual([
        'body must be JSON sent with Content-Type: application/json, not application/xml',
      ]);
      const unit = (
        await t
          .http()
          .get(api(`/units/${ward.id}`))
          .set(bearer(admin))
          .expect(200)
      ).body as UnitDto;
      expect(unit.name).toBe(ward.name);
    });

    it('PUT /api/staff/{own}/availability with cells: [[]] is a 400 for the staff member', async () => {
      const [{ id }] = (await t.dataSource.query(
        `SELECT s.id FROM staff_members s JOIN users u ON u.id = s."userId" WHERE u.email = ?`,
        ['staff@example.com'],
      )) as { id: string }[];
      const res = await t
        .http()
        .put(api(`/staff/${id}/availability`))
        .set(bearer(staff))
        .send({ cells: [[]] });
      expect(res.status).toBe(400);
      expect(res.body.message).toEqual(['each value in cells must be an object']);
    });

    it('refuses an impossible date (2026-02-30) on an open-shift claim with 400 naming the field', async () => {
      const res = await t
        .http()
        .post(api('/open-shifts/claims'))
        .set(bearer(staff))
        .send({ rosterPeriodId: randomUUID(), date: '2026-02-30', shiftTypeId: randomUUID(), skillId: null });
      expect(res.status).toBe(400);
      expect(res.body.message).toEqual(['date must be a real calendar date YYYY-MM-DD']);
    });

    it('answers a JSON body over the size limit with 413, signed in or not', async () => {
      const big = JSON.stringify({ name: 'x'.repeat(MAX_JSON_BODY_BYTES) });
      for (const req of [
        t
          .http()
          .patch(api(`/units/${ward.id}`))
          .set(bearer(admin)),
        t.http().post(api('/auth/login')),
      ]) {
        const res = await req.set('Content-Type', 'application/json').send(big);
        expect(res.status).toBe(413);
        expect(res.body.message).toEqual([`body must be at most ${MAX_JSON_BODY_BYTES} bytes of JSON`]);
      }
    });

    it('answers page=99999999999999999999 with 400 on users, staff, mailbox and outbox', async () => {
      for (const path of ['/users', '/staff', '/mailbox', '/outbox']) {
        const res = await t.http().get(api(path)).query({ page: HUGE_PAGE }).set(bearer(admin));
        expect(`${path} ${res.status}`).toBe(`${path} 400`);
        expect(res.body.message).toEqual(['page must be a whole number from 1 to 1000000']);
      }
    });
  });
});

describe('sign-in limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    // LOGIN_RATE_LIMIT=5: 5 per address and e-mail, 10 per e-mail, 20 failed per address, each a minute.
    t = await startTestApp({ TRUST_PROXY_HOPS: '1' });
  });
  afterAll(() => t.close());

  const attempt = (ip: string, email: string) =>
    t.http().post(api('/auth/login')).set('X-Forwarded-For', ip).send({ email, password: 'Winter2026!' });

  it('slows password spraying: one address trying many e-mails gets 429 with Retry-After', async () => {
    // Addresses from the documentation ranges (RFC 5737).
    const statuses: number[] = [];
    let limited: Awaited<ReturnType<typeof attempt>> | undefined;
    for (let i = 0; i < 25; i++) {
      const res = await attempt('198.51.100.20', `sprayed-${i}@example.com`);
      statuses.push(res.status);
      if (res.status === 429) limited ??= res;
    }
    expect(statuses.slice(0, 20).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(20)).toEqual([429, 429, 429, 429, 429]);
    expect(Number(limited!.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(Number(limited!.headers['retry-after'])).toBeLessThanOrEqual(60);
    expect(limited!.body.message).toMatch(/Too many failed sign-ins from this address/);
    // another address is not affected
    expect((await attempt('198.51.100.21', 'sprayed-0@example.com')).status).toBe(401);
  });

  it('does not slow many people signing in successfully from one address (an office behind one router)', async () => {
    const people = DEMO_USERS.slice(0, 25);
    expect(people).toHaveLength(25);
    const statuses = [];
    for (const p of people) {
      const res = await t
        .http()
        .post(api('/auth/login'))
        .set('X-Forwarded-For', '192.0.2.30')
        .send({ email: p.email, password: DEMO_PASSWORD });
      statuses.push(res.status);
    }
    expect(statuses.filter((s) => s !== 200)).toEqual([]);
  });

  it('limits one account across addresses: the 11th attempt within a minute gets 429 with Retry-After', async () => {
    expect(DEMO_USERS.length).toBeGreaterThan(25);
    const email = DEMO_USERS[DEMO_USERS.length - 1].email; // not among the 25 above
    for (let i = 0; i < 10; i++) expect((await attempt(`203.0.113.${i + 1}`, email)).status).toBe(401);
    const limited = await t
      .http()
      .post(api('/auth/login'))
      .set('X-Forwarded-For', '203.0.113.99')
      .send({ email, password: DEMO_PASSWORD });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    // other accounts from those addresses are not affected
    expect((await attempt('203.0.113.1', 'tomasz.kellaway@example.com')).status).toBe(401);
  });
});

describe('refused bodies are not server errors in the log', () => {
  it('logs no ERROR for anonymous 413, 415 and too deep requests', async () => {
    // The real app with Nest's console logger on (startTestApp turns it off).
    const dataDir = mkdtempSync(join(tmpdir(), 'rotaplex-api-test-'));
    const config = resolveJwtSecret(
      loadConfig({
        NODE_ENV: 'test',
        DATA_DIR: dataDir,
        MAIL_CATCHER_PORT: '0',
        SEED_DEMO: 'false',
        WEB_DIST_DIR: join(dataDir, 'no-web-app'),
      }),
    );
    const app = await createApp(config, { logger: ['error', 'fatal'] });
    const written: string[] = [];
    const capture = (chunk: unknown) => {
      written.push(String(chunk));
      return true;
    };
    const stdout = jest.spyOn(process.stdout, 'write').mockImplementation(capture);
    const stderr = jest.spyOn(process.stderr, 'write').mockImplementation(capture);
    try {
      const http = () => request(app.getHttpServer());
      const big = JSON.stringify({ email: 'x'.repeat(MAX_JSON_BODY_BYTES) });
      const statuses = [
        (await http().post(api('/auth/login')).set('Content-Type', 'application/json').send(big)).status,
        (await http().post(api('/auth/login')).set('Content-Type', 'text/plain').send('email=x')).status,
        (await http().post(api('/auth/login')).set('Content-Type', 'application/json').send(DEEP_JSON))
          .status,
        (
          await http()
            .post(api('/auth/login'))
            .set('Content-Type', 'application/json; charset=latin1')
            .send('{}')
        ).status,
      ];
      expect(statuses).toEqual([413, 415, 400, 415]);
    } finally {
      stdout.mockRestore();
      stderr.mockRestore();
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    }
    expect(written.filter((line) => /ERROR|Error:|\n\s+at /.test(line))).toEqual([]);
  });
});
