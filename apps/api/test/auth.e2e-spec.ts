import { JwtService } from '@nestjs/jwt';
import { REFRESH_COOKIE, type TokenResponse } from '@rotaplex/contracts';
import { createHmac } from 'node:crypto';
import { IsNull, Not } from 'typeorm';
import { JWT_AUDIENCE, JWT_ISSUER } from '../src/auth/jwt.strategy';
import { RefreshTokenEntity } from '../src/users/credentials/refresh-token.entity';
import { UserEntity } from '../src/users/user.entity';
import { DEMO_ORGANISATION, DEMO_PASSWORD } from '../src/demo/demo-data';
import {
  api,
  bearer,
  refreshCookieOf,
  setCookieHeader,
  startTestApp,
  type TestApp,
} from './support/test-app';

const cookie = (value: string) => `${REFRESH_COOKIE}=${encodeURIComponent(value)}`;

describe('sign-in, tokens and sessions', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(() => t.close());

  describe('POST /api/auth/login', () => {
    it('signs in a demo user and returns a short-lived token, the user and an httpOnly refresh cookie', async () => {
      const res = await t
        .http()
        .post(api('/auth/login'))
        .send({ email: 'Admin@Example.com ', password: DEMO_PASSWORD });
      expect(res.status).toBe(200);
      const body = res.body as TokenResponse;
      expect(body.expiresIn).toBe(900);
      expect(body.user).toMatchObject({
        email: 'admin@example.com',
        role: 'admin',
        active: true,
        activated: true,
      });
      expect(body.user.permissions).toContain('users:write');
      expect(body.user.organisation.name).toBe(DEMO_ORGANISATION);
      expect(body).not.toHaveProperty('refreshToken');
      const set = setCookieHeader(res);
      expect(set).toMatch(/HttpOnly/i);
      expect(set).toMatch(/SameSite=Strict/i);
      expect(set).toMatch(/Path=\/api\/auth/);
      // JWT header.payload.signature with the expected claims
      const payload = JSON.parse(
        Buffer.from(body.accessToken.split('.')[1], 'base64url').toString(),
      ) as Record<string, unknown>;
      expect(payload).toMatchObject({ sub: body.user.id, role: 'admin', iss: JWT_ISSUER, aud: JWT_AUDIENCE });
      expect((payload['exp'] as number) - (payload['iat'] as number)).toBe(900);
    });

    it('refuses a wrong password and an unknown e-mail with the same 401', async () => {
      const wrong = await t
        .http()
        .post(api('/auth/login'))
        .send({ email: 'manager@example.com', password: 'not-the-password' });
      const unknown = await t
        .http()
        .post(api('/auth/login'))
        .send({ email: 'nobody@example.com', password: 'whatever-pw' });
      expect(wrong.status).toBe(401);
      expect(unknown.status).toBe(401);
      expect(wrong.body.message).toBe(unknown.body.message);
      expect(setCookieHeader(wrong)).toBe('');
    });

    it('answers bad bodies with 400 naming the field', async () => {
      const res = await t.http().post(api('/auth/login')).send({ email: 'not-an-email', password: 'x' });
      expect(res.status).toBe(400);
      expect(res.body.message).toEqual(expect.arrayContaining([expect.stringMatching(/^email /)]));
      const missing = await t.http().post(api('/auth/login')).send({ email: 'admin@example.com' });
      expect(missing.status).toBe(400);
      expect(missing.body.message).toEqual(expect.arrayContaining([expect.stringMatching(/^password /)]));
      const extra = await t
        .http()
        .post(api('/auth/login'))
        .send({ email: 'admin@example.com', password: 'x', admin: true });
      expect(extra.status).toBe(400);
      expect(extra.body.message).toEqual(expect.arrayContaining(['property admin should not exist']));
    });

    it('limits attempts per address and e-mail: the 6th within a minute gets 429, other e-mails are unaffected', async () => {
      const email = 'priya.wendover@example.com';
      for (let i = 0; i < t.config.loginRateLimit; i++) {
        const res = await t.http().post(api('/auth/login')).send({ email, password: 'wrong-password' });
        expect(res.status).toBe(401);
      }
      const limited = await t.http().post(api('/auth/login')).send({ email, password: DEMO_PASSWORD });
      expect(limited.status).toBe(429);
      expect(limited.body.message).toMatch(/Too many attempts/);
      const other = await t
        .http()
        .post(api('/auth/login'))
        .send({ email: 'tomasz.kellaway@example.com', password: DEMO_PASSWORD });
      expect(other.status).toBe(200);
    });
  });

  describe('access tokens', () => {
    it('GET /api/me returns the caller with permissions', async () => {
      const { token } = await t.login('staff@example.com');
      const res = await t.http().get(api('/me')).set(bearer(token)).expect(200);
      expect(res.body).toMatchObject({ email: 'staff@example.com', role: 'staff' });
      expect(res.body.permissions).toEqual(['units:read', 'rosters:read', 'requests:own']);
      expect(res.body.unitIds).toHaveLength(1);
    });

    it('refuses a missing, malformed, forged, tampered, unsigned or expired token with 401', async () => {
      const { token, body } = await t.login('manager@example.com');
      const [h, p, s] = token.split('.');
      const jwt = t.app.get(JwtService);
      const claims = { sub: body.user.id, role: 'manager' };
      const forged = new JwtService({ secret: 'an-attacker-secret-that-is-long-enough!!' }).sign(claims, {
        issuer: JWT_ISSUER,
        audience: JWT_AUDIENCE,
      });
      const tamperedPayload = Buffer.from(
        JSON.stringify({ ...JSON.parse(Buffer.from(p, 'base64url').toString()), role: 'admin' }),
      ).toString('base64url');
      const none = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${p}.`;
      const expired = new JwtService({ secret: t.config.jwtSecret! }).sign(
        { ...claims, exp: Math.floor(Date.now() / 1000) - 60 },
        { issuer: JWT_ISSUER, audience: JWT_AUDIENCE },
      );
      const otherAudience = jwt.sign(claims, { audience: 'someone-else' });
      // HS256 by hand with the right secret but no issuer: RFC 7519 claims checked, not just the signature
      const noIssuerBody = Buffer.from(
        JSON.stringify({ ...claims, aud: JWT_AUDIENCE, exp: 9999999999 }),
      ).toString('base64url');
      const noIssuer = `${h}.${noIssuerBody}.${createHmac('sha256', t.config.jwtSecret!).update(`${h}.${noIssuerBody}`).digest('base64url')}`;

      const cases: Record<string, string | null> = {
        missing: null,
        malformed: 'not-a-jwt',
        forged,
        tampered: `${h}.${tamperedPayload}.${s}`,
        unsigned: none,
        expired,
        otherAudience,
        noIssuer,
      };
      for (const [name, value] of Object.entries(cases)) {
        const req = t.http().get(api('/me'));
        const res = await (value === null ? req : req.set(bearer(value)));
        expect({ name, status: res.status }).toEqual({ name, status: 401 });
      }
      const expiredRes = await t.http().get(api('/me')).set(bearer(expired));
      expect(expiredRes.body.message).toBe('Access token expired');
      // and the genuine token still works
      await t.http().get(api('/me')).set(bearer(token)).expect(200);
    });
  });

  describe('refresh rotation', () => {
    it('rotates the refresh token and refuses the old one, revoking the whole family on reuse', async () => {
      const first = await t.login('hannah.pryce@example.com');
      const r1 = await t
        .http()
        .post(api('/auth/refresh'))
        .set('Cookie', cookie(first.refreshCookie))
        .expect(200);
      const second = refreshCookieOf(r1);
      expect(second).not.toBe('');
      expect(second).not.toBe(first.refreshCookie);
      expect((r1.body as TokenResponse).user.email).toBe('hannah.pryce@example.com');
      await t
        .http()
        .get(api('/me'))
        .set(bearer((r1.body as TokenResponse).accessToken))
        .expect(200);

      // Within the grace period (two tabs refreshing at once) the old token still works...
      const twin = await t
        .http()
        .post(api('/auth/refresh'))
        .set('Cookie', cookie(first.refreshCookie))
        .expect(200);
      expect(refreshCookieOf(twin)).not.toBe(second);
      // ...but after it, reuse of the first token is refused and the whole family is revoked.
      await t.dataSource
        .getRepository(RefreshTokenEntity)
        .update({ replacedAt: Not(IsNull()) }, { replacedAt: new Date(Date.now() - 60_000) });
      const reuse = await t.http().post(api('/auth/refresh')).set('Cookie', cookie(first.refreshCookie));
      expect(reuse.status).toBe(401);
      expect(reuse.body.message).toMatch(/already used/);
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie(second)).expect(401);
      await t
        .http()
        .post(api('/auth/refresh'))
        .set('Cookie', cookie(refreshCookieOf(twin)))
        .expect(401);

      // A separate sign-in (another family) is unaffected.
      const other = await t.login('hannah.pryce@example.com');
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie(other.refreshCookie)).expect(200);
    });

    it('refuses a missing or unknown refresh cookie', async () => {
      await t.http().post(api('/auth/refresh')).expect(401);
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie('made-up-token')).expect(401);
    });

    it('refuses an expired refresh token', async () => {
      const s = await t.login('declan.marsh@example.com');
      const declan = await t.dataSource
        .getRepository(UserEntity)
        .findOneByOrFail({ email: 'declan.marsh@example.com' });
      await t.dataSource
        .getRepository(RefreshTokenEntity)
        .update({ revokedAt: IsNull(), userId: declan.id }, { expiresAt: new Date(Date.now() - 60_000) });
      const res = await t.http().post(api('/auth/refresh')).set('Cookie', cookie(s.refreshCookie));
      expect(res.status).toBe(401);
      expect(res.body.message).toMatch(/expired/);
    });

    it('logout revokes the refresh token and clears the cookie', async () => {
      const s = await t.login('grace.holloway@example.com');
      const out = await t.http().post(api('/auth/logout')).set('Cookie', cookie(s.refreshCookie)).expect(204);
      expect(setCookieHeader(out)).toMatch(new RegExp(`^${REFRESH_COOKIE}=;`));
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie(s.refreshCookie)).expect(401);
      // logging out twice, or without a cookie, is harmless
      await t.http().post(api('/auth/logout')).expect(204);
    });
  });

  describe('POST /api/me/password', () => {
    it('changes the password, keeps this session, ends the others', async () => {
      const email = 'beth.lindqvist@example.com';
      const here = await t.login(email);
      const elsewhere = await t.login(email);
      await t
        .http()
        .post(api('/me/password'))
        .set(bearer(here.token))
        .set('Cookie', cookie(here.refreshCookie))
        .send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-new-long-password' })
        .expect(204);
      await t.http().post(api('/auth/login')).send({ email, password: DEMO_PASSWORD }).expect(401);
      await t.login(email, 'a-new-long-password');
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie(here.refreshCookie)).expect(200);
      await t.http().post(api('/auth/refresh')).set('Cookie', cookie(elsewhere.refreshCookie)).expect(401);
    });

    it('refuses a wrong current password or a short new one with 400 naming the field', async () => {
      const { token } = await t.login('callum.reeves@example.com');
      const wrong = await t
        .http()
        .post(api('/me/password'))
        .set(bearer(token))
        .send({ currentPassword: 'nope-nope', newPassword: 'long-enough-pw' });
      expect(wrong.status).toBe(400);
      expect(wrong.body.message).toMatch(/^currentPassword/);
      const short = await t
        .http()
        .post(api('/me/password'))
        .set(bearer(token))
        .send({ currentPassword: DEMO_PASSWORD, newPassword: 'short' });
      expect(short.status).toBe(400);
      expect(short.body.message).toEqual([expect.stringMatching(/^newPassword must be 8 to 128 characters/)]);
      await t.login('callum.reeves@example.com'); // unchanged
    });
  });
});
