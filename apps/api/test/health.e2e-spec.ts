import { availableParallelism } from 'node:os';
import { api, startTestApp, type TestApp } from './support/test-app';

describe('health and API documents', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  it('GET /api/health answers without a token and checks the database and the solve queue', async () => {
    const res = await t.http().get(api('/health')).expect(200);
    // Without REDIS_URL solves run in this process's pool, one worker thread per core (node:os).
    expect(res.body).toEqual({
      status: 'ok',
      database: 'up',
      version: t.config.version,
      queue: { kind: 'in-process', state: 'up', waiting: 0, active: 0, workers: availableParallelism() },
    });
  });

  it('sets security headers (helmet)', async () => {
    const res = await t.http().get(api('/health'));
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('serves the OpenAPI document listing the routes, with bearer security', async () => {
    const res = await t.http().get(api('/docs-json')).expect(200);
    const doc = res.body as {
      openapi: string;
      paths: Record<string, unknown>;
      components: { securitySchemes: object };
    };
    expect(doc.openapi).toMatch(/^3\./);
    for (const path of [
      '/api/auth/login',
      '/api/me',
      '/api/users',
      '/api/users/{id}',
      '/api/units',
      '/api/organisation',
      '/api/mailbox',
      '/api/health',
    ]) {
      expect(Object.keys(doc.paths)).toContain(path);
    }
    expect(doc.components.securitySchemes).toHaveProperty('bearer');
    const login = (doc.paths['/api/auth/login'] as Record<string, { responses: Record<string, unknown> }>)
      .post;
    expect(JSON.stringify(login.responses['200'])).toContain('#/components/schemas/TokenResponseDto');
    // every operation documents its success answer
    const undocumented = Object.entries(doc.paths).flatMap(([path, ops]) =>
      Object.entries(ops as Record<string, { responses: Record<string, unknown> }>)
        .filter(([, op]) => !Object.keys(op.responses).some((code) => code.startsWith('2')))
        .map(([method]) => `${method} ${path}`),
    );
    expect(undocumented).toEqual([]);
    const html = await t.http().get(api('/docs')).expect(200);
    expect(html.text).toContain('swagger');
  });

  it('answers unknown API paths with a JSON 404', async () => {
    const res = await t.http().get(api('/no-such-route')).expect(404);
    expect(res.body).toMatchObject({ statusCode: 404 });
  });
  // Last: it closes the database under the running app.
  it('reports the database down with 503 when the database is closed', async () => {
    await t.dataSource.destroy();
    const res = await t.http().get(api('/health')).expect(503);
    expect(res.body).toMatchObject({ status: 'error', database: 'down' });
  });
});
