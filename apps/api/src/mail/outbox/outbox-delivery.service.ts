import { Injectable, Logger, type OnApplicationBootstrap, type OnModuleDestroy } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { createTransport, type Transporter } from 'nodemailer';
import { type EntityManager, Like, Not, type QueryRunner, Repository } from 'typeorm';
import { sqliteUtc } from '../../common/dates';
import { AppConfig, type OutboxSettings } from '../../config/app-config';
import { MailBodyCipher, outboxBodyContext, SEALED_PREFIX } from '../mail-body-cipher';
import { MailCatcherService } from '../mail-catcher.service';
import { OutboxMessageEntity } from './outbox-message.entity';
import { backoffDelayMs } from './outbox-settings';

/** Longest sleep of the loop when nothing is due (it also wakes on every new message). */
const IDLE_POLL_MS = 30_000;
const MAX_ERROR_LENGTH = 2000;
/**
 * A claimed message's lease: its nextAttemptAt while it is "sending". A send ends well within it
 * (the transport's timeouts add up to under a minute), so a message still "sending" after its
 * lease was left by a process that stopped, and any instance sends it again.
 */
export const SENDING_LEASE_MS = 5 * 60_000;

/**
 * Delivers the outbox: one loop that sends every due pending message over SMTP (the configured
 * server, or the local mail catcher), one message at a time. A message is claimed (pending to
 * sending, checked by the affected row count) before it is sent, so no message is sent twice by
 * this process; a failure schedules the next attempt with exponential backoff, and after the last
 * allowed attempt the message is marked failed. Pending messages left by a previous process are
 * sent after start.
 */
@Injectable()
export class OutboxDeliveryService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger(OutboxDeliveryService.name);
  /** Attempts and retry delays (AppConfig.outbox, from the OUTBOX_* variables). */
  readonly settings: OutboxSettings;
  private transporter: Transporter | null = null;
  private running = false;
  private loopDone: Promise<void> | null = null;
  private wakeLoop: (() => void) | null = null;
  private wakeRequested = false;
  private readonly inFlight = new Set<Promise<unknown>>();
  /** Connections whose open transaction queued a message: the loop wakes when it commits. */
  private readonly wakeOnCommit = new WeakSet<QueryRunner>();

  constructor(
    private readonly config: AppConfig,
    private readonly catcher: MailCatcherService,
    private readonly cipher: MailBodyCipher,
    @InjectRepository(OutboxMessageEntity) private readonly messages: Repository<OutboxMessageEntity>,
  ) {
    this.settings = config.outbox;
    messages.manager.connection.subscribers.push({
      afterTransactionCommit: (e) => {
        if (e.queryRunner && !e.queryRunner.isTransactionActive && this.wakeOnCommit.delete(e.queryRunner))
          this.wake();
      },
      afterTransactionRollback: (e) => {
        if (e.queryRunner && !e.queryRunner.isTransactionActive) this.wakeOnCommit.delete(e.queryRunner);
      },
    });
  }

  async onApplicationBootstrap(): Promise<void> {
    await this.sealPlainBodies();
    // A message still "sending" was claimed by a process that stopped before recording the outcome:
    // whether the server got it is unknown, so it is sent again (at least once across a crash).
    // On SQLite this process is the only one, so every such message is; on PostgreSQL other API
    // instances may be sending theirs right now, so only those whose lease has run out are.
    const shared = this.messages.manager.connection.options.type === 'postgres';
    const left = shared
      ? await this.reclaimAbandoned()
      : ((await this.messages.update({ status: 'sending' }, { status: 'pending', nextAttemptAt: new Date() }))
          .affected ?? 0);
    if (left) this.logger.warn(`${left} message(s) interrupted by a stop will be sent again`);
    this.running = true;
    this.loopDone = this.loop();
  }

  async onModuleDestroy(): Promise<void> {
    this.running = false;
    this.wake();
    await this.loopDone;
    await Promise.allSettled([...this.inFlight]);
    this.transporter?.close();
    this.transporter = null;
  }

  /**
   * Encrypts bodies still stored in clear (messages queued before bodies were sealed, which the
   * migration kept as JSON for unsent messages only).
   */
  private async sealPlainBodies(): Promise<void> {
    const plain = await this.messages.find({
      select: { id: true, body: true },
      where: { body: Not(Like(`${SEALED_PREFIX}%`)) },
    });
    if (!plain.length) return;
    await this.messages.manager.transaction(async (em) => {
      for (const m of plain) {
        await em.update(
          OutboxMessageEntity,
          { id: m.id },
          { body: this.cipher.seal(m.body!, outboxBodyContext(m.id)) },
        );
      }
    });
    this.logger.log(`Encrypted the bodies of ${plain.length} message(s) queued before bodies were sealed`);
  }

  /**
   * Wakes the loop once the transaction `em` runs in has committed (at once outside a
   * transaction). On SQLite the loop's query would wait for that transaction anyway; on PostgreSQL
   * it runs on another connection and would not see the message before the commit.
   */
  wakeAfterCommit(em: EntityManager): void {
    const runner = em.queryRunner;
    if (runner?.isTransactionActive) this.wakeOnCommit.add(runner);
    else this.wake();
  }

  /** Asks the loop to look for due messages now (new message, or a retry by an admin). */
  wake(): void {
    this.wakeRequested = true;
    this.wakeLoop?.();
  }

  /**
   * Tries to send one pending message straight away (used when a message is queued outside a
   * transaction, so the caller's e-mail usually leaves before its response). Never throws: a
   * failure is recorded on the message and retried by the loop.
   */
  async deliverNow(id: string): Promise<void> {
    if (!this.running) return;
    const work = this.deliverOne(id).catch((err: Error) =>
      this.logger.error(`Outbox delivery of ${id} failed: ${err.message}`),
    );
    this.track(work);
    await work;
    this.wake(); // let the loop schedule a retry if this attempt failed
  }

  /** Makes messages whose "sending" lease ran out (their process stopped mid-send) pending again; returns how many. */
  async reclaimAbandoned(): Promise<number> {
    const result = await this.messages
      .createQueryBuilder()
      .update(OutboxMessageEntity)
      .set({ status: 'pending', nextAttemptAt: new Date() })
      .where(`status = 'sending' AND "nextAttemptAt" < :now`, { now: sqliteUtc(new Date()) })
      .execute();
    return result.affected ?? 0;
  }

  /** Sends every message that is due now and waits for it and for deliveries already under way (tests use it). */
  async deliverDue(): Promise<number> {
    await this.reclaimAbandoned();
    let sent = 0;
    for (;;) {
      const due = await this.messages
        .createQueryBuilder('m')
        .select(['m.id'])
        .where(`m.status = 'pending' AND m.nextAttemptAt <= :now`, { now: sqliteUtc(new Date()) })
        .orderBy('m.nextAttemptAt', 'ASC')
        .addOrderBy('m.createdAt', 'ASC')
        .take(20)
        .getMany();
      if (due.length === 0) {
        // Deliveries started elsewhere (the loop, an immediate send) finish before this returns.
        await Promise.allSettled([...this.inFlight]);
        return sent;
      }
      for (const { id } of due) {
        const work = this.deliverOne(id);
        this.track(work);
        if (await work) sent++;
      }
    }
  }

  private track(work: Promise<unknown>): void {
    this.inFlight.add(work);
    void work.finally(() => this.inFlight.delete(work));
  }

  private async loop(): Promise<void> {
    while (this.running) {
      this.wakeRequested = false;
      try {
        await this.deliverDue();
      } catch (err) {
        if (this.running) this.logger.error(`Outbox loop: ${(err as Error).message}`);
      }
      if (!this.running) break;
      let waitMs = IDLE_POLL_MS;
      try {
        const next = await this.messages
          .createQueryBuilder('m')
          .select('MIN(m.nextAttemptAt)', 'next')
          .where(`m.status = 'pending'`)
          .getRawOne<{ next: string | Date | null }>();
        if (next?.next) {
          // SQLite answers UTC text, PostgreSQL a Date.
          const at =
            next.next instanceof Date
              ? next.next.getTime()
              : new Date(`${next.next.replace(' ', 'T')}Z`).getTime();
          waitMs = Math.min(Math.max(at - Date.now(), 0), IDLE_POLL_MS);
        }
      } catch (err) {
        if (this.running) this.logger.error(`Outbox loop: ${(err as Error).message}`);
      }
      if (this.wakeRequested || !this.running) continue;
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, waitMs);
        timer.unref();
        this.wakeLoop = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      this.wakeLoop = null;
    }
  }

  /** Claims, sends and records one message; false when another delivery had it or it failed. */
  private async deliverOne(id: string): Promise<boolean> {
    const claim = await this.messages
      .createQueryBuilder()
      .update(OutboxMessageEntity)
      .set({
        status: 'sending',
        attempts: () => '"attempts" + 1',
        nextAttemptAt: new Date(Date.now() + SENDING_LEASE_MS),
      })
      .where(`id = :id AND status = 'pending'`, { id })
      .execute();
    if (claim.affected !== 1) return false;
    const m = await this.messages.findOneByOrFail({ id });
    let body: { text: string; html: string };
    try {
      body = JSON.parse(this.cipher.open(m.body ?? '', outboxBodyContext(m.id))) as typeof body;
    } catch (err) {
      // Retrying cannot help (another key, or changed bytes): give up at once, say why.
      const message = (err as Error).message;
      await this.messages.update({ id }, { status: 'failed', nextAttemptAt: null, lastError: message });
      this.logger.error(`"${m.subject}" to ${m.to} not sent: ${message}`);
      return false;
    }
    try {
      await this.transport().sendMail({
        from: this.config.mailFrom,
        to: m.to,
        subject: m.subject,
        text: body.text,
        html: body.html,
        // Stable per outbox row, so a receiver can spot a copy sent again after a crash.
        messageId: `<${m.id}@outbox.rotaplex>`,
      });
    } catch (err) {
      const message = ((err as Error).message || String(err)).slice(0, MAX_ERROR_LENGTH);
      const giveUp = m.attempts >= this.settings.maxAttempts;
      const delay = backoffDelayMs(m.attempts, this.settings);
      await this.messages.update(
        { id },
        giveUp
          ? { status: 'failed', nextAttemptAt: null, lastError: message }
          : { status: 'pending', nextAttemptAt: new Date(Date.now() + delay), lastError: message },
      );
      this.logger.warn(
        giveUp
          ? `"${m.subject}" to ${m.to} failed after ${m.attempts} attempt(s): ${message}`
          : `"${m.subject}" to ${m.to} failed (attempt ${m.attempts}), retry in ${delay} ms: ${message}`,
      );
      return false;
    }
    // The body (with its links) is not kept once sent; the row stays listed until OUTBOX_RETENTION.
    await this.messages.update(
      { id },
      { status: 'sent', sentAt: new Date(), nextAttemptAt: null, body: null },
    );
    this.logger.log(`Sent "${m.subject}" to ${m.to}`);
    return true;
  }

  private transport(): Transporter {
    if (this.transporter) return this.transporter;
    const smtp = this.config.smtp;
    const timeouts = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 };
    this.transporter = smtp
      ? createTransport({
          host: smtp.host,
          port: smtp.port,
          secure: smtp.secure,
          auth: smtp.user && smtp.pass ? { user: smtp.user, pass: smtp.pass } : undefined,
          ...timeouts,
        })
      : createTransport({
          host: '127.0.0.1',
          port: this.catcher.port,
          secure: false,
          ignoreTLS: true,
          ...timeouts,
        });
    return this.transporter;
  }
}
