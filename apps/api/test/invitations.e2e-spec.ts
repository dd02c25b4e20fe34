import { type UserDto, WEB_PATHS } from '@rotaplex/contracts';
import { latestMailTo, linkToken } from './support/mailbox';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/** One second ago as UTC date-time text, which both SQLite (TypeORM's format) and PostgreSQL (sessions in UTC) read as that instant. */
const secondAgo = () => new Date(Date.now() - 1000).toISOString().replace('T', ' ').replace('Z', '');

describe('invitations and password reset by e-mail (real SMTP to the local catcher)', () => {
  let t: TestApp;
  let admin: string;
  let wardId: string;
  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    const units = await t.http().get(api('/units')).set(bearer(admin)).expect(200);
    wardId = (units.body as { id: string; name: string }[]).find((u) => u.name.startsWith('Ward'))!.id;
  });
  afterAll(() => t.close());

  const invite = (email: string, extra: Record<string, unknown> = {}) =>
    t
      .http()
      .post(api('/users'))
      .set(bearer(admin))
      .send({ email, displayName: 'Jo Newcombe', role: 'staff', unitIds: [wardId], ...extra });

  it('invites a user: stored without password, e-mail with a single-use link arrives, link sets the password once', async () => {
    const res = await invite('Jo.Newcombe@Example.com').expect(201);
    const user = res.body as UserDto;
    expect(user).toMatchObject({
      email: 'jo.newcombe@example.com',
      role: 'staff',
      activated: false,
      active: true,
      unitIds: [wardId],
    });

    const mail = await latestMailTo(t, admin, 'jo.newcombe@example.com');
    expect(mail).not.toBeNull();
    expect(mail!.subject).toMatch(/invited to Rotaplex/);
    expect(mail!.html).toContain('Set your password');
    const { url, token } = linkToken(mail!.text, WEB_PATHS.acceptInvitation);
    expect(url.startsWith(`http://rotaplex.test${WEB_PATHS.acceptInvitation}?token=`)).toBe(true);

    // only a hash is stored
    const stored = await t.dataSource.query(`SELECT "tokenHash" FROM one_time_tokens WHERE "userId" = ?`, [
      user.id,
    ]);
    expect(stored).toHaveLength(1);
    expect(stored[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(stored[0].tokenHash).not.toContain(token);

    // cannot sign in before accepting
    await t
      .http()
      .post(api('/auth/login'))
      .send({ email: 'jo.newcombe@example.com', password: 'anything-at-all' })
      .expect(401);

    const short = await t.http().post(api('/auth/invitations/accept')).send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.message).toEqual([expect.stringMatching(/^password must be 8 to 128/)]);

    await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token, password: 'jo-chosen-password' })
      .expect(204);
    const again = await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token, password: 'another-password' });
    expect(again.status).toBe(400);
    expect(again.body.message).toMatch(/already been used/);

    const signedIn = await t.login('jo.newcombe@example.com', 'jo-chosen-password');
    expect(signedIn.body.user.activated).toBe(true);
    await t.login('jo.newcombe@example.com', 'jo-chosen-password'); // the second password did not take
  });

  it('refuses an expired invitation link', async () => {
    await invite('late.reader@example.com').expect(201);
    const { token } = linkToken(
      (await latestMailTo(t, admin, 'late.reader@example.com'))!.text,
      WEB_PATHS.acceptInvitation,
    );
    await t.dataSource.query(
      `UPDATE one_time_tokens SET "expiresAt" = ? WHERE "userId" = (SELECT id FROM users WHERE email = ?)`,
      [secondAgo(), 'late.reader@example.com'],
    );
    const res = await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token, password: 'long-enough-pw' });
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/expired/);
  });

  it('refuses a made-up token', async () => {
    const res = await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token: 'made-up', password: 'long-enough-pw' });
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/^token: /);
  });

  it('resending an invitation retires the earlier link', async () => {
    const created = (await invite('twice.invited@example.com').expect(201)).body as UserDto;
    const first = linkToken(
      (await latestMailTo(t, admin, 'twice.invited@example.com'))!.text,
      WEB_PATHS.acceptInvitation,
    );
    await t
      .http()
      .post(api(`/users/${created.id}/invitation`))
      .set(bearer(admin))
      .expect(202);
    const second = linkToken(
      (await latestMailTo(t, admin, 'twice.invited@example.com'))!.text,
      WEB_PATHS.acceptInvitation,
    );
    expect(second.token).not.toBe(first.token);
    await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token: first.token, password: 'long-enough-pw' })
      .expect(400);
    await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token: second.token, password: 'long-enough-pw' })
      .expect(204);
    // once accepted, resending makes no sense
    await t
      .http()
      .post(api(`/users/${created.id}/invitation`))
      .set(bearer(admin))
      .expect(409);
  });

  it('refuses a duplicate e-mail with 409 and unknown units with 400 naming unitIds, sending nothing', async () => {
    const dup = await invite('staff@example.com');
    expect(dup.status).toBe(409);
    const bad = await invite('ghost.unit@example.com', { unitIds: ['6f1c1d3e-0a4b-4c2d-9e8f-1a2b3c4d5e6f'] });
    expect(bad.status).toBe(400);
    expect(bad.body.message).toMatch(/^unitIds /);
    expect(await latestMailTo(t, admin, 'ghost.unit@example.com')).toBeNull();
    const rows = await t.dataSource.query(`SELECT id FROM users WHERE email = 'ghost.unit@example.com'`);
    expect(rows).toEqual([]);
  });

  it('validates the invitation body naming each field', async () => {
    const res = await t
      .http()
      .post(api('/users'))
      .set(bearer(admin))
      .send({ email: 'x', role: 'boss', unitIds: 'ward' });
    expect(res.status).toBe(400);
    const msgs = res.body.message as string[];
    for (const field of ['email', 'displayName', 'role', 'unitIds']) {
      expect(msgs.some((m) => m.startsWith(`${field} `) || m.includes(`in ${field} `))).toBe(true);
    }
  });

  describe('password reset', () => {
    it('answers 202 whether or not the e-mail exists, and mails only real accounts', async () => {
      await t
        .http()
        .post(api('/auth/password-reset/request'))
        .send({ email: 'nobody.here@example.com' })
        .expect(202);
      expect(await latestMailTo(t, admin, 'nobody.here@example.com')).toBeNull();
      await t
        .http()
        .post(api('/auth/password-reset/request'))
        .send({ email: 'owen.treharne@example.com' })
        .expect(202);
      const mail = await latestMailTo(t, admin, 'owen.treharne@example.com');
      expect(mail!.subject).toBe('Reset your Rotaplex password');
    });

    it('sets a new password once, ends existing sessions, and refuses the old password', async () => {
      const email = 'ines.moreau@example.com';
      const session = await t.login(email);
      await t.http().post(api('/auth/password-reset/request')).send({ email }).expect(202);
      const { token } = linkToken((await latestMailTo(t, admin, email))!.text, WEB_PATHS.resetPassword);
      await t
        .http()
        .post(api('/auth/password-reset/confirm'))
        .send({ token, password: 'fresh-password-1' })
        .expect(204);
      await t
        .http()
        .post(api('/auth/password-reset/confirm'))
        .send({ token, password: 'fresh-password-2' })
        .expect(400);
      await t.http().post(api('/auth/login')).send({ email, password: 'rotaplex-demo' }).expect(401);
      await t.login(email, 'fresh-password-1');
      await t
        .http()
        .post(api('/auth/refresh'))
        .set('Cookie', `rotaplex_refresh=${encodeURIComponent(session.refreshCookie)}`)
        .expect(401);
    });

    it('refuses an expired reset link', async () => {
      const email = 'kwame.asante@example.com';
      await t.http().post(api('/auth/password-reset/request')).send({ email }).expect(202);
      const { token } = linkToken((await latestMailTo(t, admin, email))!.text, WEB_PATHS.resetPassword);
      await t.dataSource.query(
        `UPDATE one_time_tokens SET "expiresAt" = ? WHERE purpose = 'password-reset'`,
        [secondAgo()],
      );
      const res = await t
        .http()
        .post(api('/auth/password-reset/confirm'))
        .send({ token, password: 'fresh-password-1' });
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(/expired/);
    });

    it('an invitation token is not a reset token', async () => {
      await invite('cross.purpose@example.com').expect(201);
      const { token } = linkToken(
        (await latestMailTo(t, admin, 'cross.purpose@example.com'))!.text,
        WEB_PATHS.acceptInvitation,
      );
      await t
        .http()
        .post(api('/auth/password-reset/confirm'))
        .send({ token, password: 'fresh-password-1' })
        .expect(400);
    });
  });
});
