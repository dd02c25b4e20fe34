import { BadRequestException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import { OutboxMessageEntity } from './outbox/outbox-message.entity';
import { OutboxDeliveryService } from './outbox/outbox-delivery.service';
import { MailBodyCipher, outboxBodyContext } from './mail-body-cipher';

export interface OutgoingMail {
  to: string;
  subject: string;
  /** Plain-text body (always sent). */
  text: string;
  /** HTML body (always sent beside the text). */
  html: string;
}

const MAX_ADDRESS_LENGTH = 320;
const MAX_SUBJECT_LENGTH = 1000;

/**
 * The one way the product sends e-mail. `send` only writes the message to the outbox table; the
 * outbox loop delivers it (SMTP_HOST when configured, otherwise the local mail catcher) with
 * retries and backoff, so a failed SMTP send loses nothing.
 *
 * Give `em` when the message belongs to a change made in a transaction: the message is then queued
 * in that transaction (it exists only if the change commits) and delivered after the commit.
 * Without `em` the message is queued at once and a first delivery attempt is made before `send`
 * returns (a failure is not thrown: the message stays in the outbox and is retried).
 *
 * The body is stored encrypted (MailBodyCipher): e-mails carry working links, and a copy of the
 * database file must not yield one. It is decrypted at send time and cleared once sent.
 */
@Injectable()
export class MailService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly delivery: OutboxDeliveryService,
    private readonly cipher: MailBodyCipher,
  ) {}

  async send(mail: OutgoingMail, em?: EntityManager): Promise<void> {
    const to = mail.to.trim();
    if (!to || to.length > MAX_ADDRESS_LENGTH || !/^[^\s@]+@[^\s@]+$/.test(to)) {
      throw new BadRequestException(`to: "${mail.to}" is not an e-mail address`);
    }
    const id = randomUUID();
    await (em ?? this.dataSource.manager).insert(OutboxMessageEntity, {
      id,
      to,
      subject: mail.subject.slice(0, MAX_SUBJECT_LENGTH),
      body: this.cipher.seal(JSON.stringify({ text: mail.text, html: mail.html }), outboxBodyContext(id)),
      status: 'pending',
      attempts: 0,
      nextAttemptAt: new Date(),
      lastError: null,
      sentAt: null,
    });
    if (em) this.delivery.wakeAfterCommit(em);
    else await this.delivery.deliverNow(id);
  }
}
