import { OUTBOX_STATUSES, type OutboxStatus } from '@rotaplex/contracts';
import { Check, Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One e-mail the product sends. Written by MailService.send (in the caller's transaction when it
 * gives one), delivered by the outbox loop with retries and exponential backoff. The body is
 * stored encrypted and cleared after delivery; a sent row is deleted after OUTBOX_RETENTION.
 */
@Entity('outbox_messages')
@Check('CHK_outbox_messages_status', `"status" IN (${OUTBOX_STATUSES.map((s) => `'${s}'`).join(', ')})`)
@Index('IDX_outbox_messages_status_next', ['status', 'nextAttemptAt'])
export class OutboxMessageEntity {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar', length: 320 })
  to!: string;

  @Column({ type: 'varchar', length: 1000 })
  subject!: string;

  /**
   * The text and HTML bodies as JSON, sealed by MailBodyCipher (AES-256-GCM, bound to the row id):
   * they carry working links. Null once the message was sent.
   */
  @Column({ type: 'text', nullable: true })
  body!: string | null;

  @Column({ type: 'varchar', length: 16, default: 'pending' })
  status!: OutboxStatus;

  /** Delivery attempts made so far. */
  @Column({ type: 'integer', default: 0 })
  attempts!: number;

  /** When a pending message is due next; null once sent or failed. */
  @Column({ type: 'datetime', nullable: true })
  nextAttemptAt!: Date | null;

  @Column({ type: 'text', nullable: true })
  lastError!: string | null;

  @CreateDateColumn({ type: 'datetime' })
  createdAt!: Date;

  @Column({ type: 'datetime', nullable: true })
  sentAt!: Date | null;
}
