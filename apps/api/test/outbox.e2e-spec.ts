import { type OutboxMessageDto, type Page } from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { loadConfig, resolveJwtSecret } from '../src/config/app-config';
import { testsOnPostgres } from '../src/database/postgres-cluster';
import { MailBodyCipher, outboxBodyContext } from '../src/mail/mail-body-cipher';
import { MailCatcherService } from '../src/mail/mail-catcher.service';
import { MailService } from '../src/mail/mail.service';
import { OutboxDeliveryService, SENDING_LEASE_MS } from '../src/mail/outbox/outbox-delivery.service';
import { OutboxMessageEntity } from '../src/mail/outbox/outbox-message.entity';
import { OutboxRetentionService } from '../src/mail/outbox/outbox-retention.service';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/** Polls until `check` returns a value other than undefined (the outbox delivers in the background). */
async function until<T>(what: string, check: () => Promise<T | undefined>, timeoutMs = 15_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

const OUTBOX_ENV = {
  OUTBOX_MAX_ATTEMPTS: '3',
  OUTBOX_BASE_DELAY_MS: '150',
  OUTBOX_MAX_DELAY_MS: '600',
  OUTBOX_RETENTION: '2d',
};

const mail = (to: string, subject = `Subject for ${to}`) => ({
  to,
  subject,
  text: `Text for ${to}`,
  html: `<p>HTML for ${to}</p>`,
});

describe('outbox: e-mail through a table with retries (real SMTP to the local catcher)', () => {
  let t: TestApp;
  let admin: string;

  const outboxRow = async (to: string) =>
    (
      (await t.dataSource.query(`SELECT * FROM outbox_messages WHERE "to" = ?`, [to])) as {
        id: string;
        status: string;
        attempts: number;
        lastError: string | null;
        nextAttemptAt: string | Date | null; // UTC text on SQLite, a Date on PostgreSQL
      }[]
    )[0];
  const received = async (to: string) =>
    ((await t.dataSource.query(`SELECT "to" FROM mail_messages WHERE "to" LIKE ?`, [`%${to}%`])) as unknown[])
      .length;

  beforeAll(async () => {
    // The delivery settings are read with the rest of the configuration when the app starts.
    t = await startTestApp(OUTBOX_ENV);
    expect(t.app.get(OutboxDeliveryService).settings).toEqual({
      maxAttempts: 3,
      baseDelayMs: 150,
      maxDelayMs: 600,
      retentionSeconds: 2 * 86_400,
    });
    admin = (await t.login('admin@example.com')).token;
  });
  afterAll(async () => {
    await t?.close();
  });

  it('sends a message queued outside a transaction before send() returns', async () => {
    await t.app.get(MailService).send(mail('direct@example.org'));
    expect(await outboxRow('direct@example.org')).toMatchObject({
      status: 'sent',
      attempts: 1,
      lastError: null,
    });
    expect(await received('direct@example.org')).toBe(1);
  });

  it("queues nothing when the caller's transaction rolls back, and sends only after commit", async () => {
    await expect(
      t.dataSource.transaction(async (em) => {
        await t.app.get(MailService).send(mail('rolled.back@example.org'), em);
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    await t.dataSource.transaction(async (em) => {
      await t.app.get(MailService).send(mail('committed@example.org'), em);
      // Inside the transaction nothing has left yet.
      expect(await received('committed@example.org')).toBe(0);
    });
    await until('committed message', async () =>
      (await outboxRow('committed@example.org'))?.status === 'sent' ? true : undefined,
    );
    expect(await received('committed@example.org')).toBe(1);
    expect(await outboxRow('rolled.back@example.org')).toBeUndefined();
    expect(await received('rolled.back@example.org')).toBe(0);
  });

  it('retries with backoff while the SMTP server is down and gives up after the last attempt', async () => {
    const catcher = t.app.get(MailCatcherService);
    await catcher.stop();
    try {
      const before = Date.now();
      await t.app.get(MailService).send(mail('down@example.org'));
      const first = await outboxRow('down@example.org');
      expect(first).toMatchObject({ status: 'pending', attempts: 1 });
      expect(first.lastError).toMatch(/ECONNREFUSED|connect/i);
      // First retry one base delay (150 ms) after the failure.
      const at = first.nextAttemptAt!;
      const next = (at instanceof Date ? at : new Date(`${at.replace(' ', 'T')}Z`)).getTime();
      expect(next - before).toBeGreaterThanOrEqual(150);
      expect(next - Date.now()).toBeLessThanOrEqual(150);
      const failed = await until('the message to fail', async () => {
        const row = await outboxRow('down@example.org');
        return row.status === 'failed' ? row : undefined;
      });
      expect(failed).toMatchObject({ attempts: 3, nextAttemptAt: null });
      // Given up: no further attempt.
      await new Promise((r) => setTimeout(r, 800));
      expect((await outboxRow('down@example.org')).attempts).toBe(3);

      const list = await t
        .http()
        .get(api('/outbox'))
        .query({ status: 'failed' })
        .set(bearer(admin))
        .expect(200);
      const page = list.body as Page<OutboxMessageDto>;
      expect(page.items.map((m) => m.to)).toContain('down@example.org');
      expect(page.items.every((m) => m.status === 'failed')).toBe(true);
    } finally {
      await catcher.start();
    }
    // An admin retries it once the server is back: delivered once.
    const id = (await outboxRow('down@example.org')).id;
    const retried = await t
      .http()
      .post(api(`/outbox/${id}/retry`))
      .set(bearer(admin))
      .expect(200);
    expect((retried.body as OutboxMessageDto).status).toBe('sent');
    expect(await received('down@example.org')).toBe(1);
    await t
      .http()
      .post(api(`/outbox/${id}/retry`))
      .set(bearer(admin))
      .expect(409);
  });

  it('delivers every message exactly once after the SMTP server comes back', async () => {
    const catcher = t.app.get(MailCatcherService);
    await catcher.stop();
    const recipients = Array.from({ length: 6 }, (_, i) => `burst${i}@example.org`);
    try {
      await t.dataSource.transaction(async (em) => {
        for (const to of recipients) await t.app.get(MailService).send(mail(to), em);
      });
      await until('a failed first attempt of each', async () => {
        const rows = await Promise.all(recipients.map(outboxRow));
        return rows.every((r) => r.attempts >= 1 && r.status === 'pending') ? true : undefined;
      });
    } finally {
      await catcher.start();
    }
    await until('all sent', async () => {
      const rows = await Promise.all(recipients.map(outboxRow));
      return rows.every((r) => r.status === 'sent') ? true : undefined;
    });
    // Two deliveries racing (the loop and an explicit run) never send a row twice.
    await Promise.all([
      t.app.get(OutboxDeliveryService).deliverDue(),
      t.app.get(OutboxDeliveryService).deliverDue(),
    ]);
    await new Promise((r) => setTimeout(r, 500));
    for (const to of recipients) expect(await received(to)).toBe(1);
  });

  it('claims each row once when deliveries race', async () => {
    const catcher = t.app.get(MailCatcherService);
    await catcher.stop();
    const recipients = Array.from({ length: 5 }, (_, i) => `race${i}@example.org`);
    try {
      for (const to of recipients) await t.app.get(MailService).send(mail(to));
    } finally {
      await catcher.start();
    }
    // Make every row due now, then run three deliveries at once beside the loop.
    await t.dataSource.query(
      `UPDATE outbox_messages SET "nextAttemptAt" = '2000-01-01 00:00:00.000' WHERE "to" LIKE 'race%'`,
    );
    const delivery = t.app.get(OutboxDeliveryService);
    await Promise.all([delivery.deliverDue(), delivery.deliverDue(), delivery.deliverDue()]);
    for (const to of recipients) {
      expect(await outboxRow(to)).toMatchObject({ status: 'sent' });
      expect(await received(to)).toBe(1);
    }
  });

  it('deletes sent messages once OUTBOX_RETENTION has passed since sending, and keeps the others', async () => {
    const send = t.app.get(MailService);
    await send.send(mail('old.sent@example.org'));
    await send.send(mail('recent.sent@example.org'));
    const old = await outboxRow('old.sent@example.org');
    expect(old.status).toBe('sent');
    // Sent three days ago: beyond the two days of OUTBOX_RETENTION.
    await t.dataSource
      .getRepository(OutboxMessageEntity)
      .update({ id: old.id }, { sentAt: new Date(Date.now() - 3 * 86_400_000) });
    // A message that failed long ago stays for an admin's retry.
    const catcher = t.app.get(MailCatcherService);
    await catcher.stop();
    try {
      await send.send(mail('old.failed@example.org'));
    } finally {
      await catcher.start();
    }
    await t.dataSource
      .getRepository(OutboxMessageEntity)
      .update(
        { to: 'old.failed@example.org' },
        { status: 'failed', nextAttemptAt: null, createdAt: new Date(Date.now() - 9 * 86_400_000) },
      );
    const failed = await t.dataSource.getRepository(OutboxMessageEntity).countBy({ status: 'failed' });

    expect(await t.app.get(OutboxRetentionService).purgeDelivered()).toBe(1);
    expect(await outboxRow('old.sent@example.org')).toBeUndefined();
    expect((await outboxRow('recent.sent@example.org')).status).toBe('sent');
    expect(await t.dataSource.getRepository(OutboxMessageEntity).countBy({ status: 'failed' })).toBe(failed);
    expect(await t.app.get(OutboxRetentionService).purgeDelivered()).toBe(0);
  });

  it('stores the body encrypted, clears it once sent, and fails at once a body it cannot decrypt', async () => {
    await t.app.get(MailService).send(mail('sealed@example.org'));
    const sent = await t.dataSource.getRepository(OutboxMessageEntity).findOneByOrFail({
      to: 'sealed@example.org',
    });
    expect(sent).toMatchObject({ status: 'sent', body: null });

    // Queued under another JWT_SECRET (the secret changed meanwhile): retrying cannot help.
    const other = new MailBodyCipher(
      resolveJwtSecret(loadConfig({ NODE_ENV: 'test', JWT_SECRET: 'another-secret-'.repeat(4) })),
    );
    const id = randomUUID();
    await t.dataSource.getRepository(OutboxMessageEntity).insert({
      id,
      to: 'other.key@example.org',
      subject: 'Sealed elsewhere',
      body: other.seal(JSON.stringify({ text: 'x', html: 'x' }), outboxBodyContext(id)),
      status: 'pending',
      nextAttemptAt: new Date(),
    });
    await t.app.get(OutboxDeliveryService).deliverDue();
    const row = await outboxRow('other.key@example.org');
    expect(row).toMatchObject({ status: 'failed', attempts: 1, nextAttemptAt: null });
    expect(row.lastError).toMatch(/cannot be decrypted \(JWT_SECRET changed/);
    expect(await received('other.key@example.org')).toBe(0);
  });

  it('lists the outbox for admins only, newest first, paginated and filtered', async () => {
    const manager = (await t.login('manager@example.com')).token;
    await t.http().get(api('/outbox')).set(bearer(manager)).expect(403);
    await t.http().get(api('/outbox')).expect(401);
    const res = await t.http().get(api('/outbox')).query({ pageSize: 2 }).set(bearer(admin)).expect(200);
    const page = res.body as Page<OutboxMessageDto>;
    expect(page.items).toHaveLength(2);
    expect(page.total).toBeGreaterThan(10);
    expect(page.items[0].createdAt >= page.items[1].createdAt).toBe(true);
    const bad = await t.http().get(api('/outbox')).query({ status: 'lost' }).set(bearer(admin)).expect(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/status/);
  });
});

describe('outbox across a restart', () => {
  it('sends after start the messages a previous process left pending', async () => {
    let first: TestApp | null = null;
    let second: TestApp | null = null;
    try {
      first = await startTestApp(OUTBOX_ENV);
      const dataDir = first.dataDir;
      await first.app.get(MailCatcherService).stop();
      await first.app.get(MailService).send(mail('after.restart@example.org'));
      const [row] = await first.dataSource.query(
        `SELECT status, attempts FROM outbox_messages WHERE "to" = ?`,
        ['after.restart@example.org'],
      );
      expect(row).toMatchObject({ status: 'pending', attempts: 1 });
      // Stop the process without deleting its data directory.
      await first.app.close();
      first = null;
      second = await startTestApp(OUTBOX_ENV, dataDir);
      const s = second;
      await until('delivery after restart', async () => {
        const [r] = await s.dataSource.query(`SELECT status FROM outbox_messages WHERE "to" = ?`, [
          'after.restart@example.org',
        ]);
        return r.status === 'sent' ? true : undefined;
      });
      const got = await s.dataSource.query(`SELECT id FROM mail_messages WHERE "to" LIKE ?`, [
        '%after.restart@example.org%',
      ]);
      expect(got).toHaveLength(1);
      await s.close();
      const { rmSync } = await import('node:fs');
      rmSync(dataDir, { recursive: true, force: true });
      second = null;
    } finally {
      await first?.close();
      await second?.close();
    }
  });

  it('sends again a message whose sending lease ran out, and leaves one another instance is sending', async () => {
    const t1 = await startTestApp(OUTBOX_ENV);
    let t2: TestApp | null = null;
    try {
      const cipher = t1.app.get(MailBodyCipher);
      const repo = t1.dataSource.getRepository(OutboxMessageEntity);
      const claimed = async (to: string, leaseEndsInMs: number) => {
        const id = randomUUID();
        await repo.insert({
          id,
          to,
          subject: 'Claimed',
          body: cipher.seal(JSON.stringify({ text: 'x', html: 'x' }), outboxBodyContext(id)),
          status: 'sending',
          attempts: 1,
          nextAttemptAt: new Date(Date.now() + leaseEndsInMs),
        });
      };
      // As a process leaves a message it stopped in the middle of sending...
      await claimed('abandoned@example.org', -1000);
      // ...and as another API instance has it while it sends.
      await claimed('in.flight@example.org', SENDING_LEASE_MS);
      if (testsOnPostgres()) {
        // Another API instance starts on the same database (SQLite: one process per file).
        t2 = await startTestApp(OUTBOX_ENV, t1.dataDir);
      }
      await t1.app.get(OutboxDeliveryService).deliverDue();
      const statusOf = async (to: string) => (await repo.findOneByOrFail({ to })).status;
      await until('the abandoned message sent', async () =>
        (await statusOf('abandoned@example.org')) === 'sent' ? true : undefined,
      );
      // Every catcher of the test writes to the same database.
      const caught = (to: string) =>
        t1.dataSource.query(`SELECT id FROM mail_messages WHERE "to" LIKE ?`, [`%${to}%`]) as Promise<
          unknown[]
        >;
      expect(await caught('abandoned@example.org')).toHaveLength(1);
      expect(await repo.findOneByOrFail({ to: 'in.flight@example.org' })).toMatchObject({
        status: 'sending',
        attempts: 1,
      });
      expect(await caught('in.flight@example.org')).toHaveLength(0);
    } finally {
      await t2?.close();
      await t1.close();
    }
  });
});
