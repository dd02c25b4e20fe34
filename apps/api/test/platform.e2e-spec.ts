import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { WEB_PATHS } from '@rotaplex/contracts';
import { MailCatcherService } from '../src/mail/mail-catcher.service';
import { MailService } from '../src/mail/mail.service';
import { DEMO_ORGANISATION, DEMO_PASSWORD, DEMO_USERS } from '../src/demo/demo-data';
import { caughtMails, linkToken } from './support/mailbox';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

describe('first start, demo data, mail and the web app', () => {
  describe('demo data', () => {
    let dir: string;
    let t: TestApp;
    beforeAll(async () => {
      dir = mkdtempSync(join(tmpdir(), 'rotaplex-demo-'));
      t = await startTestApp({}, dir);
    });
    afterAll(async () => {
      await t.close();
      rmSync(dir, { recursive: true, force: true });
    });

    it('seeds the invented organisation, two units and 30 people, all with the demo password', async () => {
      const [org] = await t.dataSource.query(`SELECT name FROM organisations`);
      expect(org.name).toBe(DEMO_ORGANISATION);
      const units = await t.dataSource.query(`SELECT name, "timeZone" FROM units ORDER BY name`);
      expect(units).toEqual([
        { name: 'Contact Centre North', timeZone: 'Europe/Dublin' },
        { name: 'Ward 7 Acute Medicine', timeZone: 'Europe/London' },
      ]);
      const users = await t.dataSource.query(`SELECT email, role FROM users ORDER BY email`);
      expect(users).toHaveLength(30);
      expect(users).toHaveLength(DEMO_USERS.length);
      expect(users).toEqual(
        expect.arrayContaining([
          { email: 'admin@example.com', role: 'admin' },
          { email: 'manager@example.com', role: 'manager' },
          { email: 'manager2@example.com', role: 'manager' },
          { email: 'staff@example.com', role: 'staff' },
        ]),
      );
      // argon2id encoded hashes, never the password itself
      const hashes = await t.dataSource.query(`SELECT DISTINCT "passwordHash" AS h FROM users`);
      expect(hashes).toHaveLength(1);
      expect(hashes[0].h).toMatch(/^\$argon2id\$v=19\$/);
      expect(hashes[0].h).not.toContain(DEMO_PASSWORD);
      for (const u of DEMO_USERS.filter(
        (x) => x.unit === null || x.email.startsWith('manager') || x.email.startsWith('staff'),
      )) {
        const s = await t.login(u.email);
        expect(s.body.user.role).toBe(u.role);
      }
    });

    it('does not seed twice, and keeps the data across a restart', async () => {
      const before = await t.login('admin@example.com');
      await t
        .http()
        .patch(api('/organisation'))
        .set(bearer(before.token))
        .send({ name: 'Renamed' })
        .expect(200);
      await t.close();
      t = await startTestApp({}, dir);
      expect(await t.dataSource.query(`SELECT CAST(COUNT(*) AS INTEGER) AS n FROM users`)).toEqual([
        { n: 30 },
      ]);
      expect(await t.dataSource.query(`SELECT name FROM organisations`)).toEqual([{ name: 'Renamed' }]);
      // the development JWT secret is kept in DATA_DIR, so a token issued before the restart still works
      await t.http().get(api('/me')).set(bearer(before.token)).expect(200);
    });
  });

  describe('first start without demo data', () => {
    let t: TestApp;
    beforeAll(async () => {
      t = await startTestApp({
        SEED_DEMO: 'false',
        ADMIN_EMAIL: 'Owner@Example.org',
        ORGANISATION_NAME: 'Fernbrook Care',
      });
    });
    afterAll(() => t.close());

    it('creates the organisation and invites the first admin by e-mail', async () => {
      expect(await t.dataSource.query(`SELECT name FROM organisations`)).toEqual([
        { name: 'Fernbrook Care' },
      ]);
      const [mail] = await caughtMails(t);
      expect(mail.to).toEqual(['owner@example.org']);
      const { token } = linkToken(mail.text, WEB_PATHS.acceptInvitation);
      await t
        .http()
        .post(api('/auth/invitations/accept'))
        .send({ token, password: 'owner-password' })
        .expect(204);
      const s = await t.login('owner@example.org', 'owner-password');
      expect(s.body.user.role).toBe('admin');
      expect(s.body.user.organisation.name).toBe('Fernbrook Care');
    });
  });

  describe('mail', () => {
    let catcherApp: TestApp;
    let senderApp: TestApp;
    beforeAll(async () => {
      catcherApp = await startTestApp();
      const port = catcherApp.app.get(MailCatcherService).port;
      // A second instance configured with SMTP_HOST: it starts no catcher and sends over SMTP to the first.
      senderApp = await startTestApp({
        SMTP_HOST: '127.0.0.1',
        SMTP_PORT: String(port),
        SMTP_FROM: 'Rota Desk <rota@example.net>',
      });
    });
    afterAll(async () => {
      await senderApp.close();
      await catcherApp.close();
    });

    it('stores text and HTML of a message received by the catcher', async () => {
      await catcherApp.app.get(MailService).send({
        to: 'someone@example.com',
        subject: 'Cover for Saturday — night shift',
        text: 'Plain body\nline two',
        html: '<p>HTML <b>body</b></p>',
      });
      const [row] = await caughtMails(catcherApp);
      expect(row).toMatchObject({
        subject: 'Cover for Saturday — night shift',
        html: '<p>HTML <b>body</b></p>',
      });
      expect(row.text.trim()).toBe('Plain body\nline two');
      expect(row.to).toEqual(['someone@example.com']);
      expect(row.from).toMatch(/no-reply@rotaplex\.localhost/);
      // Stored encrypted: the file holds neither body.
      const [stored] = await catcherApp.dataSource.query(`SELECT text, html FROM mail_messages`);
      expect(stored.text).toMatch(/^sealed:v1:/);
      expect(stored.html).toMatch(/^sealed:v1:/);
      expect(`${stored.text}${stored.html}`).not.toMatch(/Plain body|HTML/);
    });

    it('with SMTP_HOST set, starts no catcher and delivers to that server', async () => {
      expect(senderApp.app.get(MailCatcherService).enabled).toBe(false);
      expect(() => senderApp.app.get(MailCatcherService).port).toThrow(/not running/);
      const admin = (await senderApp.login('admin@example.com')).token;
      const units = (await senderApp.http().get(api('/units')).set(bearer(admin))).body as { id: string }[];
      await senderApp
        .http()
        .post(api('/users'))
        .set(bearer(admin))
        .send({
          email: 'remote.invitee@example.com',
          displayName: 'Remote Invitee',
          role: 'staff',
          unitIds: [units[0].id],
        })
        .expect(201);
      const rows = await catcherApp.dataSource.query(
        `SELECT "from", subject FROM mail_messages WHERE "to" LIKE '%remote.invitee%'`,
      );
      expect(rows).toEqual([
        { from: '"Rota Desk" <rota@example.net>', subject: expect.stringMatching(/invited/) },
      ]);
      expect(
        await senderApp.dataSource.query(`SELECT CAST(COUNT(*) AS INTEGER) AS n FROM mail_messages`),
      ).toEqual([{ n: 0 }]);
    });
  });

  describe('the built web app', () => {
    let t: TestApp;
    let webDir: string;
    beforeAll(async () => {
      webDir = mkdtempSync(join(tmpdir(), 'rotaplex-web-'));
      mkdirSync(join(webDir, 'assets'));
      writeFileSync(
        join(webDir, 'index.html'),
        '<!doctype html><title>Rotaplex</title><div id="root"></div>',
      );
      writeFileSync(join(webDir, 'assets', 'app.js'), 'console.log("rotaplex")');
      t = await startTestApp({ WEB_DIST_DIR: webDir });
    });
    afterAll(async () => {
      await t.close();
      rmSync(webDir, { recursive: true, force: true });
    });

    it('serves index.html for app pages, files as they are, and keeps /api for the API', async () => {
      for (const page of ['/', '/sign-in', '/admin/users', `${WEB_PATHS.acceptInvitation}?token=abc`]) {
        const res = await t.http().get(page).set('Accept', 'text/html').expect(200);
        expect(res.text).toContain('<div id="root">');
      }
      const js = await t.http().get('/assets/app.js').expect(200);
      expect(js.headers['content-type']).toMatch(/javascript/);
      const apiMiss = await t.http().get(api('/missing')).set('Accept', 'text/html').expect(404);
      expect(apiMiss.body).toMatchObject({ statusCode: 404 });
      await t.http().get('/assets/missing.js').set('Accept', 'application/javascript').expect(404);
    });
  });

  describe('behind a reverse proxy (TRUST_PROXY_HOPS=1)', () => {
    let t: TestApp;
    beforeAll(async () => {
      t = await startTestApp({ TRUST_PROXY_HOPS: '1', LOGIN_RATE_LIMIT: '2' });
    });
    afterAll(() => t.close());

    it('counts sign-in attempts per forwarded client address', async () => {
      const attempt = (ip: string) =>
        t
          .http()
          .post(api('/auth/login'))
          .set('X-Forwarded-For', ip)
          .send({ email: 'staff@example.com', password: 'wrong-password' });
      expect((await attempt('198.51.100.7')).status).toBe(401);
      expect((await attempt('198.51.100.7')).status).toBe(401);
      expect((await attempt('198.51.100.7')).status).toBe(429);
      // another client (documentation address range, RFC 5737) has its own budget
      expect((await attempt('203.0.113.9')).status).toBe(401);
    });
  });
});
