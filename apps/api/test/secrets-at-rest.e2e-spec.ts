import { SWAP_DECISION_WEB_PATH, SWAP_ROUTES as S, WEB_PATHS } from '@rotaplex/contracts';
import Database from 'better-sqlite3';
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import { createApp } from '../src/app';
import { sha256 } from '../src/common/crypto';
import { loadConfig, resolveJwtSecret } from '../src/config/app-config';
import { databaseFiles } from '../src/database/data-files';
import { FIRST_ADMIN_LINK_FILE } from '../src/demo/first-run.service';
import { OutboxDeliveryService } from '../src/mail/outbox/outbox-delivery.service';
import { caughtMails, linkToken, nextMailTo } from './support/mailbox';
import {
  createPeriod,
  findUnit,
  idsByEmail,
  markPublished,
  restOnlyContract,
  shiftTypesByCode,
  WARD_PEOPLE,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

const mode = (path: string) => statSync(path).mode & 0o777;

/**
 * Every text column of every table holding `needle`, read straight from the SQLite file with
 * better-sqlite3 (another connection than the app's: it sees what a copy of the file holds,
 * including what is still in the write-ahead log).
 */
function columnsHolding(databaseFile: string, needle: string): string[] {
  const db = new Database(databaseFile, { readonly: true, fileMustExist: true });
  try {
    const hits: string[] = [];
    const tables = db
      .prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'`)
      .all() as { name: string }[];
    for (const { name } of tables) {
      const columns = db.prepare(`SELECT name FROM pragma_table_info(?)`).all(name) as { name: string }[];
      for (const c of columns) {
        const { n } = db
          .prepare(`SELECT COUNT(*) AS n FROM "${name}" WHERE instr(CAST("${c.name}" AS TEXT), ?) > 0`)
          .get(needle) as { n: number };
        if (n > 0) hits.push(`${name}.${c.name}`);
      }
    }
    return hits;
  } finally {
    db.close();
  }
}

/** Whether the raw bytes of the database file or its -wal file contain `needle`. */
function fileBytesHold(databaseFile: string, needle: string): boolean {
  return databaseFiles(databaseFile)
    .filter((f) => existsSync(f) && !f.endsWith('-shm'))
    .some((f) => readFileSync(f).includes(Buffer.from(needle, 'utf8')));
}

// First: Nest's logger is process-wide, and the apps below start with logging off.
describe('first start without demo data: the first admin link is never logged', () => {
  it('logs where the link is, e-mails it and writes it to a private file in the data directory', async () => {
    const root = mkdtempSync(join(tmpdir(), 'rotaplex-first-admin-'));
    const dataDir = join(root, 'data');
    // Nest's console logger writes to stdout and stderr: read what it prints (printed as usual).
    const out = jest.spyOn(process.stdout, 'write');
    const err = jest.spyOn(process.stderr, 'write');
    const config = resolveJwtSecret(
      loadConfig({
        NODE_ENV: 'test',
        DATA_DIR: dataDir,
        PUBLIC_URL: 'http://rotaplex.test',
        MAIL_CATCHER_PORT: '0',
        SEED_DEMO: 'false',
        ORGANISATION_NAME: 'Larchmere Clinic',
        ADMIN_EMAIL: 'owner@larchmere.example',
        ARGON2_TIME_COST: '1',
        ARGON2_MEMORY_KIB: '1024',
        WEB_DIST_DIR: join(root, 'no-web-app'),
      }),
    );
    const app = await createApp(config, { logger: ['log', 'warn', 'error'] });
    try {
      await app.get(OutboxDeliveryService).deliverDue();
      const printed = [...out.mock.calls, ...err.mock.calls].map((call) => String(call[0]));
      out.mockRestore();
      err.mockRestore();
      const [mail] = await caughtMails({ app, dataSource: app.get(DataSource) });
      const { token } = linkToken(mail.text, WEB_PATHS.acceptInvitation);

      const log = printed.join('');
      expect(log).toMatch(/First admin owner@larchmere\.example invited/);
      expect(log).toContain(FIRST_ADMIN_LINK_FILE);
      expect(log).not.toContain(token);
      const linkFile = join(dataDir, FIRST_ADMIN_LINK_FILE);
      expect(mode(linkFile)).toBe(0o600);
      expect(readFileSync(linkFile, 'utf8')).toContain(token);
      expect(columnsHolding(config.databaseFile, token)).toEqual([]);
      await request(app.getHttpServer())
        .post(api('/auth/invitations/accept'))
        .send({ token, password: 'owner-password' })
        .expect(204);
    } finally {
      out.mockRestore();
      err.mockRestore();
      await app.close();
      rmSync(root, { recursive: true, force: true });
    }
  });
});

/**
 * A copy of the database file (and the logs) must not yield a working link: e-mail bodies are
 * stored encrypted and cleared once sent, tokens only as hashes, the first admin's link never
 * logged, and the data files are private to the server's account. Real app on a real SQLite file,
 * mail over SMTP to the built-in catcher.
 */
describe('no working secret at rest', () => {
  let root: string;
  let t: TestApp;
  let admin: string;
  const seen = new Set<string>();

  beforeAll(async () => {
    root = mkdtempSync(join(tmpdir(), 'rotaplex-secrets-'));
    // A data directory that does not exist yet: the app creates it.
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' }, join(root, 'data'));
    admin = (await t.login('admin@example.com')).token;
  });
  afterAll(async () => {
    await t?.close();
    rmSync(root, { recursive: true, force: true });
  });

  it('creates the data directory 0700 and the database file with its -wal and -shm 0600', () => {
    expect(mode(t.dataDir)).toBe(0o700);
    for (const file of databaseFiles(t.config.databaseFile)) {
      expect([file, existsSync(file)]).toEqual([file, true]);
      expect([file, mode(file).toString(8)]).toEqual([file, '600']);
    }
  });

  it('keeps no invitation, password-reset or swap-link token in any column or in the file bytes', async () => {
    // Invitation
    await t
      .http()
      .post(api('/users'))
      .set(bearer(admin))
      .send({ email: 'kit.marlow@example.com', displayName: 'Kit Marlow', role: 'admin', unitIds: [] })
      .expect(201);
    const invitation = linkToken(
      (await nextMailTo(t, admin, seen, 'kit.marlow@example.com', /invited/)).text,
      WEB_PATHS.acceptInvitation,
    ).token;

    // Password reset
    await t
      .http()
      .post(api('/auth/password-reset/request'))
      .send({ email: 'manager@example.com' })
      .expect(202);
    const reset = linkToken(
      (await nextMailTo(t, admin, seen, 'manager@example.com', /password/i)).text,
      WEB_PATHS.resetPassword,
    ).token;

    // Swap proposal on a published roster: the colleague's decision link
    const manager = (await t.login('manager@example.com')).token;
    const ward = await findUnit(t, manager);
    const period = await createPeriod(t, manager, ward.id, '2030-01-07');
    const shift = await shiftTypesByCode(t, manager, ward.id);
    const staffId = idsByEmail(await restOnlyContract(t, ward.id), WARD_PEOPLE);
    for (const [who, code] of [
      ['a', 'L'],
      ['b', 'E'],
    ] as const) {
      await t.dataSource.manager.insert(AssignmentEntity, {
        rosterPeriodId: period.id,
        staffMemberId: staffId[who],
        date: period.startDate,
        shiftTypeId: shift[code].id,
        pinned: false,
      });
    }
    await markPublished(t, period.id);
    await t
      .http()
      .post(api(S.swaps))
      .set(bearer((await t.login(WARD_PEOPLE.a)).token))
      .send({
        rosterPeriodId: period.id,
        kind: 'swap',
        myDate: period.startDate,
        colleagueStaffMemberId: staffId.b,
        theirDate: period.startDate,
      })
      .expect(201);
    const swapLink = linkToken(
      (await nextMailTo(t, admin, seen, WARD_PEOPLE.b, /asks to swap/)).text,
      SWAP_DECISION_WEB_PATH,
    ).token;
    await t.app.get(OutboxDeliveryService).deliverDue();

    const file = t.config.databaseFile;
    for (const token of [invitation, reset, swapLink]) {
      expect(columnsHolding(file, token)).toEqual([]);
      expect(fileBytesHold(file, token)).toBe(false);
    }
    // The scan sees what is stored: the hashes of the tokens are found where they belong.
    expect(columnsHolding(file, sha256(invitation))).toEqual(['one_time_tokens.tokenHash']);
    expect(columnsHolding(file, sha256(swapLink))).toEqual(['swap_link_tokens.tokenHash']);
    // Sent messages keep no body; the catcher's copies are sealed.
    const outbox = (await t.dataSource.query(
      `SELECT COUNT(*) AS sent, COUNT("body") AS withBody FROM outbox_messages WHERE status = 'sent'`,
    )) as { sent: number; withBody: number }[];
    expect(outbox[0].sent).toBeGreaterThanOrEqual(3);
    expect(outbox[0].withBody).toBe(0);

    // They were working secrets: the invitation link sets a password.
    await t
      .http()
      .post(api('/auth/invitations/accept'))
      .send({ token: invitation, password: 'kit-chosen-password' })
      .expect(204);
  });

  it('after a restart, encrypts bodies stored in clear by an earlier version and narrows file modes', async () => {
    const dataDir = t.dataDir;
    const file = t.config.databaseFile;
    await t.app.close();
    const secret = 'legacy-link-token-0123456789abcdef';
    const db = new Database(file);
    db.prepare(
      `INSERT INTO mail_messages (id, messageId, "from", "to", subject, text, html, receivedAt) VALUES ('legacy-mail', NULL, 'x@example.org', '["y@example.org"]', 'Old mail', ?, ?, '2026-01-01 00:00:00.000')`,
    ).run(`Open ${secret}`, `<a href="${secret}">open</a>`);
    db.prepare(
      `INSERT INTO outbox_messages (id, "to", subject, status, attempts, body) VALUES ('legacy-out', 'y@example.org', 'Old', 'failed', 8, ?)`,
    ).run(JSON.stringify({ text: `Open ${secret}`, html: `<a href="${secret}">open</a>` }));
    db.close();
    chmodSync(file, 0o644); // as an earlier version left it
    t = await startTestApp({ LOGIN_RATE_LIMIT: '1000' }, dataDir);

    expect(columnsHolding(file, secret)).toEqual([]);
    // Not left in free space either (secure_delete), once the log is copied back into the file.
    await t.dataSource.query('PRAGMA wal_checkpoint(TRUNCATE)');
    expect(fileBytesHold(file, secret)).toBe(false);
    expect(mode(file)).toBe(0o600);
    // Still readable through the app, which holds the key.
    const mail = (await caughtMails(t)).find((m) => m.id === 'legacy-mail')!;
    expect(mail.text).toBe(`Open ${secret}`);
    expect(mail.html).toContain(secret);
  });
});
