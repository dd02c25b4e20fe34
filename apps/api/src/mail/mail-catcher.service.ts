import { Injectable, Logger, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { simpleParser } from 'mailparser';
import { randomUUID } from 'node:crypto';
import { type AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { Like, Not, Repository } from 'typeorm';
import { AppConfig } from '../config/app-config';
import { mailboxBodyContext, MailBodyCipher, SEALED_PREFIX, UnreadableBodyError } from './mail-body-cipher';
import { MailMessageEntity } from './mail-message.entity';

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

/**
 * The local mail catcher: an SMTP server on the loopback interface that stores every message it
 * receives, so that someone trying Rotaplex locally can open invitation and approval links from
 * the mailbox page. Started only when no SMTP_HOST is configured; nothing leaves the machine.
 * Bodies are stored encrypted (MailBodyCipher), like the outbox's: they carry working links.
 */
@Injectable()
export class MailCatcherService implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger(MailCatcherService.name);
  private server: SMTPServer | null = null;
  private boundPort: number | null = null;

  constructor(
    private readonly config: AppConfig,
    private readonly cipher: MailBodyCipher,
    @InjectRepository(MailMessageEntity) private readonly messages: Repository<MailMessageEntity>,
  ) {}

  get enabled(): boolean {
    return this.config.smtp === null;
  }

  /** The port the catcher listens on (after start). */
  get port(): number {
    if (this.boundPort === null) throw new Error('The mail catcher is not running');
    return this.boundPort;
  }

  async onModuleInit(): Promise<void> {
    await this.sealPlainBodies();
    if (!this.enabled) return;
    await this.start();
  }

  /** The text and HTML of a caught message (a placeholder when it was sealed under another key). */
  readBodies(m: MailMessageEntity): { text: string; html: string | null } {
    try {
      return {
        text: this.cipher.open(m.text, mailboxBodyContext(m.id, 'text')),
        html: m.html === null ? null : this.cipher.open(m.html, mailboxBodyContext(m.id, 'html')),
      };
    } catch (err) {
      if (!(err instanceof UnreadableBodyError)) throw err;
      return { text: `(This message cannot be shown: ${err.message}.)`, html: null };
    }
  }

  /** Encrypts bodies caught before bodies were sealed. */
  private async sealPlainBodies(): Promise<void> {
    const plain = await this.messages.find({
      select: { id: true, text: true, html: true },
      where: { text: Not(Like(`${SEALED_PREFIX}%`)) },
    });
    if (!plain.length) return;
    await this.messages.manager.transaction(async (em) => {
      for (const m of plain) {
        await em.update(
          MailMessageEntity,
          { id: m.id },
          {
            text: this.cipher.seal(m.text, mailboxBodyContext(m.id, 'text')),
            html: m.html === null ? null : this.cipher.seal(m.html, mailboxBodyContext(m.id, 'html')),
          },
        );
      }
    });
    this.logger.log(`Encrypted the bodies of ${plain.length} caught message(s)`);
  }

  /** Whether the catcher is accepting mail now. */
  get running(): boolean {
    return this.server !== null;
  }

  /**
   * Starts listening (on the configured port the first time, on the same port again after a stop,
   * so senders keep their settings). Does nothing when already running.
   */
  async start(): Promise<void> {
    if (!this.enabled) throw new Error('The mail catcher is off: SMTP_HOST is configured');
    if (this.server) return;
    const listenPort = this.boundPort ?? this.config.mailCatcherPort;
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['AUTH', 'STARTTLS'],
      size: MAX_MESSAGE_BYTES,
      logger: false,
      banner: 'Rotaplex local mail catcher',
      onData: (stream, session, callback) => {
        const to = session.envelope.rcptTo.map((r) => r.address);
        simpleParser(stream)
          .then((mail) => {
            const from =
              mail.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : '') ?? '';
            const id = randomUUID();
            return this.messages.insert({
              id,
              messageId: mail.messageId ?? null,
              from: from.slice(0, 500),
              to,
              subject: (mail.subject ?? '(no subject)').slice(0, 1000),
              text: this.cipher.seal(mail.text ?? '', mailboxBodyContext(id, 'text')),
              html:
                typeof mail.html === 'string'
                  ? this.cipher.seal(mail.html, mailboxBodyContext(id, 'html'))
                  : null,
              receivedAt: new Date(),
            });
          })
          // The SMTP reply is sent only after the message is stored, so a sender that got its
          // "250 OK" can read the message from the mailbox straight away.
          .then(
            () => callback(),
            (err: Error) => callback(err),
          );
      },
    });
    server.on('error', (err) => this.logger.error(`Mail catcher error: ${err.message}`));
    await new Promise<void>((resolve, reject) => {
      const onError = (err: Error) =>
        reject(
          new Error(
            `The local mail catcher could not listen on 127.0.0.1:${listenPort} (${err.message}). ` +
              'Set MAIL_CATCHER_PORT to a free port (0 = any) or SMTP_HOST to use a real mail server.',
          ),
        );
      server.server.once('error', onError);
      server.listen(listenPort, '127.0.0.1', () => {
        server.server.off('error', onError);
        resolve();
      });
    });
    this.server = server;
    this.boundPort = (server.server.address() as AddressInfo).port;
    this.logger.log(`Local mail catcher listening on 127.0.0.1:${this.boundPort}`);
  }

  /**
   * Stops accepting mail (senders then get "connection refused"); the port is kept for start().
   * Used by tests of the outbox's retries.
   */
  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  async onApplicationShutdown(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}
