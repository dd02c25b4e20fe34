import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { API_ROUTES, REFRESH_COOKIE, type TokenResponse } from '@rotaplex/contracts';
import { apiRequest, refreshSession, setApiOrigin } from './client';
import { ApiRequestError } from './errors';
import { session } from './session';

/**
 * The client against a real HTTP server on a loopback port. The server plays the API's token
 * rules (RFC 6750: a missing or expired bearer token gets 401) with tokens it issues itself.
 */
interface Fake {
  server: Server;
  validToken: string;
  refreshCalls: number;
  refreshWorks: boolean;
  seenAuth: string[];
  /** Content-Type and body length of each request, by method and URL. */
  sent: Record<string, { type: string | undefined; length: string | undefined }>;
}

const me = {
  id: 'u1',
  email: 'a@example.com',
  displayName: 'A',
  role: 'admin',
  unitIds: [],
  active: true,
  activated: true,
  createdAt: '2026-01-01T00:00:00Z',
  permissions: [],
  organisation: { id: 'o1', name: 'Org' },
} as unknown as TokenResponse['user'];

function json(res: ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}

async function start(): Promise<Fake> {
  const fake: Fake = {
    server: createServer(),
    validToken: 'token-2',
    refreshCalls: 0,
    refreshWorks: true,
    seenAuth: [],
    sent: {},
  };
  fake.server.on('request', (req: IncomingMessage, res: ServerResponse) => {
    fake.sent[`${req.method} ${req.url}`] = {
      type: req.headers['content-type'],
      length: req.headers['content-length'],
    };
    if (req.url === `/api${API_ROUTES.auth.refresh}`) {
      fake.refreshCalls += 1;
      // Answer late, so concurrent callers overlap with the refresh in flight.
      setTimeout(() => {
        if (!fake.refreshWorks)
          return json(res, 401, { statusCode: 401, error: 'Unauthorized', message: 'Session ended' });
        json(res, 200, { accessToken: fake.validToken, expiresIn: 900, user: me });
      }, 50);
      return;
    }
    fake.seenAuth.push(req.headers.authorization ?? '');
    if (req.headers.authorization !== `Bearer ${fake.validToken}`) {
      return json(res, 401, { statusCode: 401, error: 'Unauthorized', message: 'Unauthorized' });
    }
    if (req.url?.startsWith('/api/bad')) {
      return json(res, 400, { statusCode: 400, error: 'Bad Request', message: ['name should not be empty'] });
    }
    json(res, 200, { ok: true, url: req.url });
  });
  await new Promise<void>((resolve) => fake.server.listen(0, '127.0.0.1', resolve));
  setApiOrigin(`http://127.0.0.1:${(fake.server.address() as AddressInfo).port}`);
  return fake;
}

describe('fetch client', () => {
  let fake: Fake;
  beforeEach(async () => {
    fake = await start();
    session.signedIn({ accessToken: 'token-1-expired', expiresIn: 900, user: me });
  });
  afterEach(async () => {
    await new Promise((resolve) => fake.server.close(resolve));
  });

  it('refreshes once for a burst of expired requests and retries each with the new token', async () => {
    const results = await Promise.all([
      apiRequest<{ url: string }>('/one'),
      apiRequest<{ url: string }>('/two', { query: { q: 'a b', empty: '' } }),
      apiRequest<{ url: string }>('/three'),
    ]);
    expect(results.map((r) => r.url)).toEqual(['/api/one', '/api/two?q=a+b', '/api/three']);
    expect(fake.refreshCalls).toBe(1);
    expect(session.getAccessToken()).toBe('token-2');
    expect(fake.seenAuth.filter((a) => a === 'Bearer token-2')).toHaveLength(3);
  });

  it('ends the session when the refresh is refused', async () => {
    fake.refreshWorks = false;
    await expect(apiRequest('/one')).rejects.toBeInstanceOf(ApiRequestError);
    expect(session.getState()).toMatchObject({ status: 'signedOut', endedBecause: 'expired' });
    expect(session.getAccessToken()).toBeNull();
  });

  it('throws the API messages of a failed request', async () => {
    session.signedIn({ accessToken: 'token-2', expiresIn: 900, user: me });
    const error = await apiRequest('/bad', { method: 'POST', body: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiRequestError);
    expect((error as ApiRequestError).status).toBe(400);
    expect((error as ApiRequestError).messages).toEqual(['name should not be empty']);
    expect(fake.refreshCalls).toBe(0);
  });

  it('restores a session from the refresh cookie alone', async () => {
    session.signedOut();
    expect(await refreshSession()).toBe(true);
    expect(session.getState().status).toBe('signedIn');
    expect(REFRESH_COOKIE).toBeTruthy();
  });

  it('names a Content-Type only when it sends a JSON body (the API refuses a typed body that is not JSON)', async () => {
    session.signedOut();
    await refreshSession();
    await apiRequest('/action', { method: 'POST' });
    await apiRequest('/json', { method: 'POST', body: { name: 'x' } });
    expect(fake.sent[`POST /api${API_ROUTES.auth.refresh}`]).toEqual({ type: undefined, length: '0' });
    expect(fake.sent['POST /api/action']).toEqual({ type: undefined, length: '0' });
    expect(fake.sent['POST /api/json']).toEqual({ type: 'application/json', length: '12' });
  });
});
