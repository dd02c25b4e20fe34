import { OUTBOX_STATUSES, type OutboxStatus } from '@rotaplex/contracts';
import { Check, Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One e-mail the product sends. Written by MailService.send (in the caller's transaction when it
 * gives one), delivered by the outbox loop with retries and exponential backoff.
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

  @Column({ type: 'text' })
  text!: string;

  @Column({ type: 'text' })
  html!: string;

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
